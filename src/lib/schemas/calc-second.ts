/**
 * Request schemas for the second round of calculator routes (sub-top, level, wavelength, comb,
 * impedance, max-spl, dose, leq, air, sub-array). Ranges come from the acoustics LIMITS; every
 * refusal names the parameter and shows a value that works.
 */
import { z } from 'zod';
import { LIMITS } from '~/lib/acoustics';
import { checkRange, choiceParam, numberListParam, numberParam, shown, type Bounds } from './calc-params';
import { HUMIDITY_HINT, distanceBounds, humidityParam, tempUnitParam, temperatureBounds, temperatureParam, toCelsius, toMeters, unitParam } from './calc-common';

const optional = <T extends z.ZodType>(schema: T) => schema.optional();
type Ctx = Parameters<typeof checkRange>[0];

const air = { temp: optional(temperatureParam), tempUnit: tempUnitParam, rh: optional(humidityParam) };

/** °C from temp + tempUnit (default 20 °C / 68 °F), checked in the unit typed; undefined after an issue. */
function airOf(v: { temp?: number; tempUnit: 'C' | 'F'; rh?: number }, ctx: Ctx): { temperatureCelsius: number; rh?: number } | undefined {
  const temp = v.temp ?? (v.tempUnit === 'F' ? 68 : 20);
  if (!checkRange(ctx, temp, temperatureBounds(v.tempUnit), 'temp', `°${v.tempUnit}`, 'Enter the air temperature where the audience is.')) return undefined;
  if (v.rh !== undefined && !checkRange(ctx, v.rh, LIMITS.relativeHumidityPercent, 'rh', '%', HUMIDITY_HINT)) return undefined;
  return { temperatureCelsius: toCelsius(temp, v.tempUnit), rh: v.rh };
}

const HZ: Bounds = LIMITS.frequencyHz;

export const SubTopQuerySchema = z
  .object({
    freq: numberParam('freq', 'the crossover frequency in Hz', '80'),
    phase: numberParam('phase', 'how many degrees the sub lags the top at the crossover', '180'),
  })
  .transform((v, ctx) =>
    checkRange(ctx, v.freq, HZ, 'freq', 'Hz') && checkRange(ctx, v.phase, LIMITS.measuredPhaseDeg, 'phase', '°', 'Negative when the sub leads.') ? v : z.NEVER,
  );

const SIGNAL_UNITS = ['dBu', 'dBV', 'V', 'dBFS', 'W'] as const;

export const LevelQuerySchema = z
  .object({
    value: numberParam('value', 'the level or voltage', '4'),
    unit: z.preprocess(
      (u) => (typeof u === 'string' ? SIGNAL_UNITS.find((x) => x.toLowerCase() === u.trim().toLowerCase()) ?? u : u),
      z.enum(SIGNAL_UNITS, { error: (i) => (i.input === undefined ? `Give unit: one of ${SIGNAL_UNITS.join(', ')}.` : `unit must be one of ${SIGNAL_UNITS.join(', ')}; got ${shown(i.input)}.`) }),
    ),
    fullScaleDbu: optional(numberParam('fullScaleDbu', 'the dBu level of 0 dBFS on the console', '24')),
    ohms: optional(numberParam('ohms', 'the load in ohms', '8')),
  })
  .transform((v, ctx) => {
    const fullScaleDbu = v.fullScaleDbu ?? 24;
    if (!checkRange(ctx, fullScaleDbu, LIMITS.fullScaleDbu, 'fullScaleDbu', 'dBu', 'Many digital consoles use +18 or +24 dBu.')) return z.NEVER;
    if (v.ohms !== undefined && !checkRange(ctx, v.ohms, LIMITS.loadOhms, 'ohms', 'Ω')) return z.NEVER;
    const range = v.unit === 'V' ? LIMITS.volts : v.unit === 'W' ? LIMITS.watts : LIMITS.signalDb;
    if (!checkRange(ctx, v.value, range, 'value', v.unit)) return z.NEVER;
    if (v.unit === 'W' && v.ohms === undefined) {
      ctx.issues.push({ code: 'custom', message: 'Watts need a load: add ohms (e.g. ohms=8) to convert power to a voltage.', path: ['ohms'], input: v });
      return z.NEVER;
    }
    return { ...v, fullScaleDbu };
  });

export const WavelengthQuerySchema = z.object({ freq: numberParam('freq', 'the frequency in Hz', '100'), ...air }).transform((v, ctx) => {
  if (!checkRange(ctx, v.freq, HZ, 'freq', 'Hz')) return z.NEVER;
  const a = airOf(v, ctx);
  return a ? { freq: v.freq, ...a } : z.NEVER;
});

export const CombQuerySchema = z
  .object({
    delayMs: optional(numberParam('delayMs', 'the time between the two arrivals in ms', '1')),
    distance: optional(numberParam('distance', 'the difference between the two paths', '0.34')),
    unit: unitParam,
    upTo: optional(numberParam('upTo', 'the highest frequency to list, in Hz', '20000')),
    ...air,
  })
  .transform((v, ctx) => {
    if ((v.delayMs === undefined) === (v.distance === undefined)) {
      ctx.issues.push({ code: 'custom', message: 'Give either delayMs (the time between the arrivals) or distance (the path difference), e.g. delayMs=1.', path: [v.delayMs === undefined ? 'delayMs' : 'distance'], input: v });
      return z.NEVER;
    }
    const upTo = v.upTo ?? 20_000;
    if (!checkRange(ctx, upTo, HZ, 'upTo', 'Hz')) return z.NEVER;
    const a = airOf(v, ctx);
    if (!a) return z.NEVER;
    const hint = 'Two arrivals at the same moment do not comb.';
    if (v.delayMs !== undefined) return checkRange(ctx, v.delayMs, { ...LIMITS.delayMs, minExclusive: true }, 'delayMs', 'ms', hint) ? { delayMs: v.delayMs, upTo, ...a } : z.NEVER;
    if (!checkRange(ctx, v.distance as number, distanceBounds(v.unit, true), 'distance', v.unit, hint)) return z.NEVER;
    return { distanceMeters: toMeters(v.distance as number, v.unit), upTo, ...a };
  });

export const ImpedanceQuerySchema = z
  .object({
    ohms: numberListParam('ohms', 'Impedance', LIMITS.maxBoxes, '8,8'),
    wiring: choiceParam('wiring', ['parallel', 'series']),
    minLoad: optional(numberParam('minLoad', 'the amplifier’s minimum load in ohms', '4')),
  })
  .transform((v, ctx) => {
    for (const [i, r] of v.ohms.entries()) if (!checkRange(ctx, r, LIMITS.loadOhms, 'ohms', 'Ω', '', `Impedance ${i + 1} in ohms`)) return z.NEVER;
    if (v.minLoad !== undefined && !checkRange(ctx, v.minLoad, LIMITS.loadOhms, 'minLoad', 'Ω', 'Amplifiers usually state 2, 4 or 8 Ω.')) return z.NEVER;
    return v;
  });

export const MaxSplQuerySchema = z
  .object({
    sensitivity: numberParam('sensitivity', 'the sensitivity in dB SPL at 1 m', '100'),
    sensitivityRef: z.preprocess((x) => (typeof x === 'string' ? x.trim().toUpperCase() : x), z.enum(['1W', '2.83V'], { error: (i) => `sensitivityRef must be 1W or 2.83V; got ${shown(i.input)}.` })).default('1W'),
    power: numberParam('power', 'the amplifier power per box in watts', '1000'),
    distance: numberParam('distance', 'the distance to the listener', '32'),
    boxes: optional(numberParam('boxes', 'the number of boxes', '2')),
    ohms: optional(numberParam('ohms', 'the nominal impedance in ohms', '8')),
    unit: unitParam,
  })
  .transform((v, ctx) => {
    if (!checkRange(ctx, v.sensitivity, LIMITS.sensitivityDb, 'sensitivity', 'dB')) return z.NEVER;
    if (!checkRange(ctx, v.power, LIMITS.powerWatts, 'power', 'W')) return z.NEVER;
    if (!checkRange(ctx, v.distance, distanceBounds(v.unit, true), 'distance', v.unit)) return z.NEVER;
    const boxes = v.boxes ?? 1;
    if (!checkRange(ctx, boxes, { min: 1, max: LIMITS.maxBoxes }, 'boxes', '') || !Number.isInteger(boxes)) {
      if (Number.isInteger(boxes) === false) ctx.issues.push({ code: 'custom', message: `boxes must be a whole number from 1 to ${LIMITS.maxBoxes}; got ${boxes}.`, path: ['boxes'], input: boxes });
      return z.NEVER;
    }
    if (v.ohms !== undefined && !checkRange(ctx, v.ohms, LIMITS.loadOhms, 'ohms', 'Ω')) return z.NEVER;
    if (v.sensitivityRef === '2.83V' && v.ohms === undefined) {
      ctx.issues.push({ code: 'custom', message: 'A 2.83 V sensitivity needs the nominal impedance: add ohms, e.g. ohms=8.', path: ['ohms'], input: v });
      return z.NEVER;
    }
    return { ...v, boxes, distanceMeters: toMeters(v.distance, v.unit) };
  });

const SEGMENTS_MAX_CHARS = LIMITS.maxSegments * 40;
const SEGMENT = /^\s*([+-]?\d+(?:\.\d+)?)\s*:\s*(\d+(?:\.\d+)?|\d*\.\d+)\s*$/;

export const DoseQuerySchema = z
  .object({
    segments: z
      .string({ error: (i) => (i.input === undefined ? 'Give segments as dBA:hours pairs separated by commas, e.g. segments=95:2,90:4.' : 'segments must be text such as 95:2,90:4.') })
      .transform((raw, ctx) => {
        const fail = (message: string) => {
          ctx.issues.push({ code: 'custom', message, input: raw.slice(0, 40) });
          return z.NEVER;
        };
        if (raw.length > SEGMENTS_MAX_CHARS) return fail(`segments is too long: give at most ${LIMITS.maxSegments} dBA:hours pairs, e.g. segments=95:2,90:4.`);
        const parts = raw.split(',');
        if (parts.length > LIMITS.maxSegments) return fail(`segments can hold at most ${LIMITS.maxSegments} pairs; got ${parts.length}.`);
        const list: { levelDba: number; hours: number }[] = [];
        for (const [i, part] of parts.entries()) {
          const m = SEGMENT.exec(part);
          if (!m) return fail(`Segment ${i + 1} must be a level and hours like 95:2 (95 dBA for 2 hours); got ${shown(part)}.`);
          list.push({ levelDba: Number(m[1]), hours: Number(m[2]) });
        }
        return list;
      }),
    standard: choiceParam('standard', ['osha', 'niosh', 'eu']),
  })
  .transform((v, ctx) => {
    let total = 0;
    for (const [i, s] of v.segments.entries()) {
      if (!checkRange(ctx, s.levelDba, LIMITS.levelDb, 'segments', 'dBA', '', `The level of segment ${i + 1}`)) return z.NEVER;
      if (!checkRange(ctx, s.hours, LIMITS.segmentHours, 'segments', 'h', '', `The time of segment ${i + 1}`)) return z.NEVER;
      total += s.hours;
    }
    if (total > 24 + 1e-9) {
      ctx.issues.push({ code: 'custom', message: `The segments add up to ${Number(total.toFixed(4))} h, more than a day; check the times.`, path: ['segments'], input: total });
      return z.NEVER;
    }
    return v;
  });

export const LeqQuerySchema = z
  .object({
    levels: numberListParam('levels', 'Reading', LIMITS.maxReadings, '98,101,97'),
    limit: optional(numberParam('limit', 'the limit to compare with, in dB', '100')),
  })
  .transform((v, ctx) => {
    for (const [i, l] of v.levels.entries()) if (!checkRange(ctx, l, LIMITS.levelDb, 'levels', 'dB', '', `Reading ${i + 1} in levels`)) return z.NEVER;
    if (v.limit !== undefined && !checkRange(ctx, v.limit, LIMITS.levelDb, 'limit', 'dB')) return z.NEVER;
    return v;
  });

export const AirQuerySchema = z
  .object({ freq: numberParam('freq', 'the frequency in Hz', '4000'), distance: numberParam('distance', 'the length of the throw', '50'), unit: unitParam, ...air })
  .transform((v, ctx) => {
    if (!checkRange(ctx, v.freq, HZ, 'freq', 'Hz')) return z.NEVER;
    if (!checkRange(ctx, v.distance, distanceBounds(v.unit), 'distance', v.unit)) return z.NEVER;
    const a = airOf(v, ctx);
    return a ? { freq: v.freq, distanceMeters: toMeters(v.distance, v.unit), temperatureCelsius: a.temperatureCelsius, rh: a.rh ?? 50, unit: v.unit } : z.NEVER;
  });

export const SubArrayQuerySchema = z
  .object({ freq: numberParam('freq', 'the frequency to steer in Hz', '60'), kind: choiceParam('kind', ['end-fire', 'gradient']), temp: optional(temperatureParam), tempUnit: tempUnitParam })
  .transform((v, ctx) => {
    if (!checkRange(ctx, v.freq, { min: 10, max: 500 }, 'freq', 'Hz', 'Directional sub arrays work in the subwoofer band; 40–100 Hz is usual.')) return z.NEVER;
    const a = airOf(v, ctx);
    return a ? { freq: v.freq, kind: v.kind, temperatureCelsius: a.temperatureCelsius } : z.NEVER;
  });
