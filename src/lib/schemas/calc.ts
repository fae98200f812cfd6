/**
 * Request schemas for the /api/calc/* routes (see docs: HTTP interface, calculators table).
 * Every range comes from the acoustics LIMITS, so a route refuses exactly what the math refuses,
 * and each refusal is a sentence naming the parameter, its unit and an example that works.
 */
import { z } from 'zod';
import { LIMITS, octavesFromQ, type BandInput, type BandFraction } from '~/lib/acoustics';
import { checkRange, choiceParam, numberListParam, numberParam, shown, type Bounds } from './calc-params';
import { HUMIDITY_HINT, distanceBounds, humidityParam, tempUnitParam, temperatureBounds, temperatureParam, toCelsius, toMeters, unitParam } from './calc-common';
export { ResponseBodySchema, type ResponseBody } from './calc-response';
export * from './calc-second';

const optional = <T extends z.ZodType>(schema: T) => schema.optional();

// ---------------------------------------------------------------------------------------------

/** Octave widths allowed: those whose Q stays inside LIMITS.q, rounded inward to readable bounds. */
export const OCTAVES_BOUNDS: Bounds = {
  min: Math.ceil(octavesFromQ(LIMITS.q.max) * 1000) / 1000,
  max: Math.floor(octavesFromQ(LIMITS.q.min) * 100) / 100,
};

export const BandQuerySchema = z
  .object({
    q: optional(numberParam('q', 'the quality factor Q', '1.41')),
    octaves: optional(numberParam('octaves', 'the bandwidth in octaves', '1', true)),
    f0: optional(numberParam('f0', 'the centre frequency in Hz', '1000')),
    low: optional(numberParam('low', 'the lower −3 dB frequency in Hz', '707')),
    high: optional(numberParam('high', 'the upper −3 dB frequency in Hz', '1414')),
  })
  .transform((v, ctx): BandInput => {
    const fail = (message: string, field?: string) => {
      ctx.issues.push({ code: 'custom', message, path: field ? [field] : [], input: v });
      return z.NEVER;
    };
    const hz = LIMITS.frequencyHz;
    for (const key of ['f0', 'low', 'high'] as const) {
      if (v[key] !== undefined && !checkRange(ctx, v[key], hz, key, 'Hz')) return z.NEVER;
    }
    if (v.q !== undefined && !checkRange(ctx, v.q, LIMITS.q, 'q', '')) return z.NEVER;
    if (v.octaves !== undefined && !checkRange(ctx, v.octaves, OCTAVES_BOUNDS, 'octaves', 'octaves')) return z.NEVER;
    const hasEdges = v.low !== undefined || v.high !== undefined;
    const widths = Number(v.q !== undefined) + Number(v.octaves !== undefined);
    if (hasEdges) {
      if (widths > 0 || v.f0 !== undefined) {
        return fail('Give either the edges (low and high) or a width (q or octaves, with f0), not both: the edges already fix the band.');
      }
      if (v.low === undefined || v.high === undefined) {
        return fail(`Give both low and high (the −3 dB points in Hz), e.g. low=707&high=1414.`, v.low === undefined ? 'low' : 'high');
      }
      if (!(v.high > v.low)) return fail(`high (${v.high} Hz) must be above low (${v.low} Hz); swap them or widen the band.`, 'high');
      return { low: v.low, high: v.high };
    }
    if (widths === 2) return fail('Give q or octaves, not both: each one fixes the other.');
    if (widths === 0) {
      return fail(
        v.f0 !== undefined
          ? 'f0 alone does not fix a band; add q or octaves, e.g. f0=1000&q=1.41.'
          : 'Describe the band with q, octaves, f0 with q or octaves, or low with high (Hz), e.g. q=1.41 or low=707&high=1414.',
      );
    }
    const width = v.q !== undefined ? { q: v.q } : { octaves: v.octaves as number };
    return v.f0 !== undefined ? { f0: v.f0, ...width } : width;
  });

const fractionParam = z
  .string({ error: (i) => (i.input === undefined ? 'Give fraction: 1, 3, 6, 12 or 24 (bands 1/1 to 1/24 octave wide), e.g. fraction=3.' : 'fraction must be text.') })
  .transform((raw, ctx) => {
    const text = raw.trim().replace(/^1\//, '');
    const b = Number(text);
    if (/^\d{1,2}$/.test(text) && (LIMITS.bandFractions as readonly number[]).includes(b)) return b as BandFraction;
    ctx.issues.push({ code: 'custom', message: `fraction must be one of ${LIMITS.bandFractions.join(', ')} (1/b octave); got ${shown(raw)}.`, input: raw });
    return z.NEVER;
  });

export const BandsQuerySchema = z
  .object({
    fraction: fractionParam,
    from: optional(numberParam('from', 'the lowest frequency in Hz', '20')),
    to: optional(numberParam('to', 'the highest frequency in Hz', '20000')),
  })
  .transform((v, ctx) => {
    const from = v.from ?? 20;
    const to = v.to ?? 20_000;
    if (!checkRange(ctx, from, LIMITS.frequencyHz, 'from', 'Hz') || !checkRange(ctx, to, LIMITS.frequencyHz, 'to', 'Hz')) return z.NEVER;
    if (to < from) {
      ctx.issues.push({ code: 'custom', message: `to (${to} Hz) must not be below from (${from} Hz); swap them.`, path: ['to'], input: to });
      return z.NEVER;
    }
    return { fraction: v.fraction, from, to };
  });

const NOTE_TEXT = /^[A-Ga-g](?:#|♯|b|♭)?-?\d{1,2}$/;

export const NoteQuerySchema = z
  .object({
    freq: optional(numberParam('freq', 'the frequency in Hz', '440')),
    note: optional(z.string({ error: 'note must be text, e.g. note=A4.' }).max(8, 'note is too long; write a note like A4, C#3 or Eb2.')),
    a4: optional(numberParam('a4', 'the tuning reference A4 in Hz', '440')),
  })
  .transform((v, ctx): { freq: number; a4: number } | { note: string; a4: number } => {
    const a4 = v.a4 ?? 440;
    if (!checkRange(ctx, a4, LIMITS.a4Hz, 'a4', 'Hz')) return z.NEVER;
    const fail = (message: string, field: string) => {
      ctx.issues.push({ code: 'custom', message, path: [field], input: v });
      return z.NEVER;
    };
    if ((v.freq === undefined) === (v.note === undefined)) {
      return fail('Give either freq (Hz) or note (e.g. A4, C#3 — write # as %23 in a link), not both and not neither.', v.freq === undefined ? 'freq' : 'note');
    }
    if (v.freq !== undefined) return checkRange(ctx, v.freq, LIMITS.frequencyHz, 'freq', 'Hz') ? { freq: v.freq, a4 } : z.NEVER;
    const note = (v.note as string).trim();
    if (!NOTE_TEXT.test(note)) {
      return fail(`note must be a letter A–G, an optional # or b, and an octave number, e.g. A4, C#3 or Eb2 (write # as %23 in a link); got ${shown(note)}.`, 'note');
    }
    return { note, a4 };
  });

export const SplSumQuerySchema = z
  .object({
    levels: numberListParam('levels', 'Level', LIMITS.maxLevels, '94,91,88'),
    mode: choiceParam('mode', ['incoherent', 'coherent']).default('incoherent'),
    phases: optional(numberListParam('phases', 'Phase', LIMITS.maxLevels, '0,90,180')),
  })
  .transform((v, ctx) => {
    for (const [i, level] of v.levels.entries()) {
      if (!checkRange(ctx, level, LIMITS.levelDb, 'levels', 'dB', '', `Level ${i + 1} in levels`)) return z.NEVER;
    }
    if (v.phases !== undefined) {
      const fail = (message: string) => {
        ctx.issues.push({ code: 'custom', message, path: ['phases'], input: v.phases });
        return z.NEVER;
      };
      if (v.mode !== 'coherent') return fail('phases only apply to a coherent sum; add mode=coherent or leave phases out.');
      if (v.phases.length !== v.levels.length) return fail(`Give one phase per level: levels has ${v.levels.length} values but phases has ${v.phases.length}.`);
      for (const [i, phase] of v.phases.entries()) {
        if (!checkRange(ctx, phase, LIMITS.phaseDeg, 'phases', '°', '', `Phase ${i + 1} in phases`)) return z.NEVER;
      }
    }
    return v;
  });

export const DistanceQuerySchema = z
  .object({
    level: numberParam('level', 'the measured level in dB', '100'),
    from: numberParam('from', 'the distance where the level was measured', '10'),
    to: numberParam('to', 'the new distance', '20'),
    source: choiceParam('source', ['point', 'line']).default('point'),
    unit: unitParam,
  })
  .transform((v, ctx) => {
    const bounds = distanceBounds(v.unit, true);
    const hint = 'A level is only defined some distance away from the source.';
    if (!checkRange(ctx, v.level, LIMITS.levelDb, 'level', 'dB')) return z.NEVER;
    if (!checkRange(ctx, v.from, bounds, 'from', v.unit, hint) || !checkRange(ctx, v.to, bounds, 'to', v.unit, hint)) return z.NEVER;
    return { ...v, fromMeters: toMeters(v.from, v.unit), toMeters: toMeters(v.to, v.unit) };
  });

export const BackgroundQuerySchema = z
  .object({
    total: numberParam('total', 'the level measured with the source running, in dB', '96'),
    background: numberParam('background', 'the level with the source off, in dB', '88'),
  })
  .transform((v, ctx) =>
    checkRange(ctx, v.total, LIMITS.levelDb, 'total', 'dB') && checkRange(ctx, v.background, LIMITS.levelDb, 'background', 'dB') ? v : z.NEVER,
  );

export const WeightingQuerySchema = z
  .object({
    freq: numberParam('freq', 'the frequency in Hz', '1000'),
    curve: choiceParam('curve', ['A', 'C', 'Z'], 'upper'),
  })
  .transform((v, ctx) => (checkRange(ctx, v.freq, LIMITS.frequencyHz, 'freq', 'Hz') ? v : z.NEVER));

export const ExposureQuerySchema = z
  .object({
    level: numberParam('level', 'the A-weighted level in dBA', '94'),
    standard: choiceParam('standard', ['niosh', 'osha', 'eu']),
  })
  .transform((v, ctx) =>
    checkRange(ctx, v.level, LIMITS.exposureLevelDba, 'level', 'dBA', 'Below 70 dBA no rule here sets a daily limit; above 140 dB any exposure risks immediate harm.')
      ? v
      : z.NEVER,
  );

export const DelayQuerySchema = z
  .object({
    distance: numberParam('distance', 'the distance sound travels', '25'),
    unit: unitParam,
    temp: optional(temperatureParam),
    tempUnit: tempUnitParam,
    rate: optional(numberParam('rate', 'the sample rate in Hz', '48000')),
    rh: optional(humidityParam),
  })
  .transform((v, ctx) => {
    const temp = v.temp ?? (v.tempUnit === 'F' ? 68 : 20);
    if (!checkRange(ctx, v.distance, distanceBounds(v.unit), 'distance', v.unit, 'Measure distances as positive numbers.')) return z.NEVER;
    if (!checkRange(ctx, temp, temperatureBounds(v.tempUnit), 'temp', `°${v.tempUnit}`, 'Enter the air temperature where the audience is.')) return z.NEVER;
    if (v.rate !== undefined && !checkRange(ctx, v.rate, LIMITS.sampleRateHz, 'rate', 'Hz', 'Common rates are 44100, 48000 and 96000 Hz.')) return z.NEVER;
    if (v.rh !== undefined && !checkRange(ctx, v.rh, LIMITS.relativeHumidityPercent, 'rh', '%', HUMIDITY_HINT)) return z.NEVER;
    return { ...v, temp, distanceMeters: toMeters(v.distance, v.unit), temperatureCelsius: toCelsius(temp, v.tempUnit) };
  });

export const AlignQuerySchema = z
  .object({
    main: numberParam('main', 'the distance from the main loudspeaker to the listener', '30'),
    fill: numberParam('fill', 'the distance from the fill loudspeaker to the listener', '8'),
    unit: unitParam,
    temp: optional(temperatureParam),
    tempUnit: tempUnitParam,
    offset: optional(numberParam('offset', 'the precedence offset in ms', '5')),
    latency: optional(numberParam('latency', 'how many ms later the fill’s signal path is', '0')),
    rh: optional(humidityParam),
  })
  .transform((v, ctx) => {
    const temp = v.temp ?? (v.tempUnit === 'F' ? 68 : 20);
    const offset = v.offset ?? 0;
    const hint = 'Measure both paths to the same listening position.';
    if (!checkRange(ctx, v.main, distanceBounds(v.unit), 'main', v.unit, hint) || !checkRange(ctx, v.fill, distanceBounds(v.unit), 'fill', v.unit, hint)) return z.NEVER;
    if (!checkRange(ctx, temp, temperatureBounds(v.tempUnit), 'temp', `°${v.tempUnit}`)) return z.NEVER;
    if (!checkRange(ctx, offset, LIMITS.precedenceOffsetMs, 'offset', 'ms', '5–10 ms is common practice.')) return z.NEVER;
    const latency = v.latency ?? 0;
    if (!checkRange(ctx, latency, LIMITS.latencyMs, 'latency', 'ms', 'Give the extra latency of the fill’s path (wireless link, extra processor), or 0.')) return z.NEVER;
    if (v.rh !== undefined && !checkRange(ctx, v.rh, LIMITS.relativeHumidityPercent, 'rh', '%', HUMIDITY_HINT)) return z.NEVER;
    return { ...v, temp, offset, latency, mainMeters: toMeters(v.main, v.unit), fillMeters: toMeters(v.fill, v.unit), temperatureCelsius: toCelsius(temp, v.tempUnit) };
  });

export type BandQuery = z.infer<typeof BandQuerySchema>;
export type BandsQuery = z.infer<typeof BandsQuerySchema>;
export type NoteQuery = z.infer<typeof NoteQuerySchema>;
export type SplSumQuery = z.infer<typeof SplSumQuerySchema>;
export type DistanceQuery = z.infer<typeof DistanceQuerySchema>;
export type BackgroundQuery = z.infer<typeof BackgroundQuerySchema>;
export type WeightingQuery = z.infer<typeof WeightingQuerySchema>;
export type ExposureQuery = z.infer<typeof ExposureQuerySchema>;
export type DelayQuery = z.infer<typeof DelayQuerySchema>;
export type AlignQuery = z.infer<typeof AlignQuerySchema>;
