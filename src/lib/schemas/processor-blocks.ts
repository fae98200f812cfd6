/**
 * Server-side checks of the processor blocks a page may hold (EQ, crossover, delay), shared with
 * POST /api/calc/response for crossover ways. A refusal is one sentence naming the block, the band
 * or way, and the field: "EQ block "Mains": band 3, frequency must be …".
 */
import { z } from 'zod';
import { COOKBOOK_TYPES, LIMITS, POLARITIES } from '~/lib/acoustics';
import { BLOCK_LIMITS, CROSSOVER_BLOCK, DELAY_BLOCK, EQ_BLOCK, isShelf, type ProcessorBlockType } from '~/lib/doc/blocks/block-data';

const FIELD_WORDS: Record<string, string> = {
  freq: 'frequency (Hz)',
  gain: 'gain (dB)',
  q: 'Q (or slope S on a shelf)',
  on: 'on/off',
  type: 'type',
  family: 'filter family',
  slope: 'slope (dB/octave)',
  highPass: 'high-pass',
  lowPass: 'low-pass',
  polarity: 'polarity',
  delayMs: 'delay (ms)',
  name: 'name',
  label: 'description',
  note: 'note',
  sampleRate: 'sample rate',
  outputGain: 'output gain (dB)',
  bands: 'bands',
  ways: 'ways',
  rows: 'outputs',
  temperature: 'temperature',
  tempUnit: 'temperature unit',
  mode: 'distance-or-time choice',
  distance: 'distance',
  unit: 'distance unit',
  timeMs: 'time (ms)',
  latencyMs: 'latency (ms)',
  offsetMs: 'precedence offset (ms)',
};

const ITEM_WORDS: Record<string, string> = { bands: 'band', ways: 'way', rows: 'output' };

const finite = (min: number, max: number, what: string) =>
  z
    .number({ error: (issue) => `must be a number (${what}); got ${describe(issue.input)}` })
    .refine(Number.isFinite, { message: `must be a finite number (${what})` })
    .refine((v) => v >= min && v <= max, { message: `must be from ${min} to ${max} (${what})` });

function describe(input: unknown): string {
  if (typeof input === 'number') return Number.isNaN(input) ? 'not a number' : 'a number too large';
  if (typeof input === 'string') return `the text ${JSON.stringify(input.length > 20 ? `${input.slice(0, 20)}…` : input)}`;
  return input === undefined ? 'nothing' : input === null ? 'null' : typeof input;
}

const text = (max: number) => z.string({ error: 'must be text' }).max(max, { message: `must be at most ${max} characters` });
const polarity = z.enum(POLARITIES, { error: 'must be normal or inverted' });
const sampleRate = z.union(BLOCK_LIMITS.sampleRates.map((r) => z.literal(r)) as unknown as [z.ZodLiteral<number>, z.ZodLiteral<number>], {
  error: `must be one of ${BLOCK_LIMITS.sampleRates.join(', ')} Hz`,
});
const frequency = finite(LIMITS.frequencyHz.min, LIMITS.frequencyHz.max, 'Hz');

export const EqBandSchema = z.strictObject(
  {
    type: z.enum(COOKBOOK_TYPES, { error: `must be one of ${COOKBOOK_TYPES.join(', ')}` }),
    freq: frequency,
    gain: finite(LIMITS.gainDb.min, LIMITS.gainDb.max, 'dB'),
    q: finite(LIMITS.q.min, LIMITS.q.max, 'Q; on a shelf the slope S'),
    on: z.boolean({ error: 'must be true or false' }),
  },
  { error: 'must be an object with type, freq, gain, q and on' },
);

export const XoverEdgeSchema = z
  .strictObject(
    {
      family: z.enum(['butterworth', 'linkwitz-riley'], { error: 'must be butterworth or linkwitz-riley (Bessel is not offered)' }),
      slope: z.number({ error: 'must be a number of dB/octave' }),
      freq: frequency,
    },
    { error: 'must be an object with family, slope and freq, or null' },
  )
  .superRefine((edge, ctx) => {
    const slopes: readonly number[] = LIMITS.crossoverSlopesDbPerOctave[edge.family];
    if (!slopes.includes(edge.slope)) ctx.addIssue({ code: 'custom', path: ['slope'], message: `must be one of ${slopes.join(', ')} dB/octave for ${edge.family}` });
  });

export const XoverWaySchema = z.strictObject(
  {
    name: text(BLOCK_LIMITS.nameChars),
    highPass: XoverEdgeSchema.nullable(),
    lowPass: XoverEdgeSchema.nullable(),
    gain: finite(LIMITS.gainDb.min, LIMITS.gainDb.max, 'dB'),
    polarity,
    delayMs: finite(LIMITS.delayMs.min, LIMITS.delayMs.max, 'ms'),
  },
  { error: 'must be an object with name, highPass, lowPass, gain, polarity and delayMs' },
);

/** A list measured before its items are looked at, so 10,000 bands cost nothing. */
function bounded<T extends z.ZodType>(item: T, min: number, max: number, noun: string) {
  return z
    .unknown()
    .superRefine((value, ctx) => {
      if (!Array.isArray(value)) ctx.addIssue({ code: 'custom', message: `must be a list of ${noun}s` });
      else if (value.length < min || value.length > max) ctx.addIssue({ code: 'custom', message: `must hold ${min} to ${max} ${noun}s; got ${value.length}` });
    })
    .pipe(z.array(item));
}

/** Refuses a frequency at or above 0.49·fs for every item that has one. */
function nyquistCheck(fs: number, freq: number, path: (string | number)[], ctx: z.RefinementCtx) {
  const top = BLOCK_LIMITS.maxFractionOfFs * fs;
  if (freq >= top) {
    ctx.addIssue({
      code: 'custom',
      path,
      message: `must be below ${Math.floor(top)} Hz (0.49 × the ${fs} Hz sample rate): that close to Nyquist a digital filter no longer behaves as set; got ${freq}`,
    });
  }
}

export const EqBlockSchema = z
  .strictObject({
    label: text(BLOCK_LIMITS.labelChars),
    sampleRate,
    bands: bounded(EqBandSchema, 0, BLOCK_LIMITS.maxBands, 'band'),
    outputGain: finite(BLOCK_LIMITS.outputGainDb.min, BLOCK_LIMITS.outputGainDb.max, 'dB'),
    polarity,
    note: text(BLOCK_LIMITS.noteChars),
  })
  .superRefine((block, ctx) => {
    block.bands.forEach((band, i) => {
      nyquistCheck(block.sampleRate, band.freq, ['bands', i, 'freq'], ctx);
      if (isShelf(band.type) && band.q > LIMITS.shelfSlope.max) {
        ctx.addIssue({ code: 'custom', path: ['bands', i, 'q'], message: `is a shelf slope S here and must be from ${LIMITS.shelfSlope.min} to 1 (1 is the steepest that stays monotonic)` });
      }
    });
  });

export const CrossoverBlockSchema = z
  .strictObject({
    label: text(BLOCK_LIMITS.labelChars),
    sampleRate,
    ways: bounded(XoverWaySchema, BLOCK_LIMITS.minWays, BLOCK_LIMITS.maxWays, 'way'),
    note: text(BLOCK_LIMITS.noteChars),
  })
  .superRefine((block, ctx) => {
    block.ways.forEach((way, i) => {
      if (way.highPass) nyquistCheck(block.sampleRate, way.highPass.freq, ['ways', i, 'highPass', 'freq'], ctx);
      if (way.lowPass) nyquistCheck(block.sampleRate, way.lowPass.freq, ['ways', i, 'lowPass', 'freq'], ctx);
    });
  });

export const DelayRowSchema = z.strictObject(
  {
    name: text(BLOCK_LIMITS.nameChars),
    mode: z.enum(['distance', 'time'], { error: 'must be distance or time' }),
    distance: finite(0, 6_500, 'm or ft'),
    unit: z.enum(['m', 'ft'], { error: 'must be m or ft' }),
    timeMs: finite(LIMITS.delayMs.min, LIMITS.delayMs.max, 'ms'),
    latencyMs: finite(0, 1_000, 'ms'),
    offsetMs: finite(LIMITS.precedenceOffsetMs.min, LIMITS.precedenceOffsetMs.max, 'ms'),
  },
  { error: 'must be an object with name, mode, distance, unit, timeMs, latencyMs and offsetMs' },
);

export const DelayBlockSchema = z
  .strictObject({
    label: text(BLOCK_LIMITS.labelChars),
    sampleRate,
    temperature: z.number({ error: 'must be a number' }),
    tempUnit: z.enum(['C', 'F'], { error: 'must be C or F' }),
    rows: bounded(DelayRowSchema, 1, BLOCK_LIMITS.maxDelayRows, 'output'),
    note: text(BLOCK_LIMITS.noteChars),
  })
  .superRefine((block, ctx) => {
    const c = block.tempUnit === 'F' ? ((block.temperature - 32) * 5) / 9 : block.temperature;
    if (!Number.isFinite(c) || c < LIMITS.temperatureCelsius.min || c > LIMITS.temperatureCelsius.max) {
      ctx.addIssue({ code: 'custom', path: ['temperature'], message: `must be from ${LIMITS.temperatureCelsius.min} to ${LIMITS.temperatureCelsius.max} °C (air a PA works in)` });
    }
    block.rows.forEach((row, i) => {
      const meters = row.unit === 'ft' ? row.distance * 0.3048 : row.distance;
      if (meters > LIMITS.distanceMeters.max) ctx.addIssue({ code: 'custom', path: ['rows', i, 'distance'], message: `must be at most ${LIMITS.distanceMeters.max} m` });
    });
  });

export const PROCESSOR_BLOCK_SCHEMAS: Record<ProcessorBlockType, z.ZodType> = {
  [EQ_BLOCK]: EqBlockSchema,
  [CROSSOVER_BLOCK]: CrossoverBlockSchema,
  [DELAY_BLOCK]: DelayBlockSchema,
};

const BLOCK_WORDS: Record<ProcessorBlockType, string> = { [EQ_BLOCK]: 'EQ block', [CROSSOVER_BLOCK]: 'Crossover block', [DELAY_BLOCK]: 'Delay block' };

/** "band 3, frequency (Hz)" for ['bands', 2, 'freq']. */
export function describePath(path: readonly PropertyKey[]): string {
  const words: string[] = [];
  for (let i = 0; i < path.length; i++) {
    const key = path[i];
    const next = path[i + 1];
    if (typeof key === 'string' && typeof next === 'number' && ITEM_WORDS[key]) {
      words.push(`${ITEM_WORDS[key]} ${next + 1}`);
      i++;
    } else if (typeof key === 'string') {
      words.push(FIELD_WORDS[key] ?? key);
    }
  }
  return words.join(', ');
}

/** The first problem with a block's attributes as one sentence, or null when they are fine. */
export function processorBlockProblem(type: ProcessorBlockType, attrs: unknown): string | null {
  const result = PROCESSOR_BLOCK_SCHEMAS[type].safeParse(attrs);
  if (result.success) return null;
  const issue = result.error.issues[0]!;
  const label = typeof (attrs as { label?: unknown } | null)?.label === 'string' ? ` "${((attrs as { label: string }).label).slice(0, 40)}"` : '';
  const where = describePath(issue.path);
  return `${BLOCK_WORDS[type]}${label}: ${where ? `${where} ` : ''}${issue.message}.`;
}
