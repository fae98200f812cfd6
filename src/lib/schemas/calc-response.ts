/**
 * Body of POST /api/calc/response: a sample rate, a chain of filters and optional frequencies.
 * Lists are measured before their items are parsed, a filter at or above Nyquist is refused, and
 * every message names the filter by its position so a person can find it in a long chain.
 */
import { z } from 'zod';
import { FILTER_TYPES, LIMITS, type FilterSpec } from '~/lib/acoustics';
import { formatNumber } from '~/lib/acoustics/guards';
import { outOfRange, shown } from './calc-params';
import { XoverWaySchema } from './processor-blocks';
import { BLOCK_LIMITS } from '~/lib/doc/blocks/block-data';

const FAMILIES = ['butterworth', 'linkwitz-riley'] as const;
const FILTER_KEYS = ['type', 'freq', 'gain', 'q', 'slope', 'family'];
const EXAMPLE_FILTER = '{"type":"peaking","freq":1000,"gain":-3,"q":1.4}';
const EXAMPLE_WAY = '[{"lowPass":{"family":"linkwitz-riley","slope":24,"freq":90},"highPass":null,"gain":0,"polarity":"normal","delayMs":4.1}]';

/** A crossover way as a page's crossover block stores it; the name is optional here. */
const CalcWaySchema = XoverWaySchema.extend({ name: XoverWaySchema.shape.name.optional() });

/** "Filter 2: " for a path inside filters[1], nothing at the top level. */
function where(path: readonly PropertyKey[] | undefined): string {
  return path && path[0] === 'filters' && typeof path[1] === 'number' ? `Filter ${path[1] + 1}: ` : '';
}

function describe(input: unknown): string {
  if (typeof input === 'number') return Number.isNaN(input) ? 'not a number' : 'a number too large to be real';
  if (typeof input === 'string') return `the text ${shown(input)} (send numbers without quotes)`;
  return input === undefined ? 'nothing' : input === null ? 'null' : typeof input;
}

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

function jsonNumber(name: string, what: string) {
  return z.number({
    error: (issue) =>
      issue.input === undefined
        ? capitalised(`${where(issue.path)}give ${name} (${what}).`)
        : capitalised(`${where(issue.path)}${name} must be a finite number (${what}); got ${describe(issue.input)}.`),
  });
}

/** An array whose length is checked before any item is parsed. */
function boundedList<T extends z.ZodType>(item: T, max: number, name: string, example: string) {
  return z
    .unknown()
    .transform((value, ctx) => {
      const fail = (message: string) => {
        ctx.issues.push({ code: 'custom', message, input: Array.isArray(value) ? `[${value.length} items]` : value });
        return z.NEVER;
      };
      if (value === undefined) return fail(`Give ${name} as a list, e.g. "${name}": ${example}.`);
      if (!Array.isArray(value)) return fail(`${name} must be a list, e.g. "${name}": ${example}.`);
      if (value.length > max) return fail(`${name} can hold at most ${max} entries; got ${value.length}. Send fewer.`);
      return value as unknown[];
    })
    .pipe(z.array(item));
}

const FilterSchema = z.strictObject(
  {
    type: z.enum(FILTER_TYPES, {
      error: (issue) =>
        `${where(issue.path)}${issue.input === undefined ? 'give a type' : `the type ${shown(issue.input)} is not known`}; type must be one of ${FILTER_TYPES.join(', ')}.`,
    }),
    freq: jsonNumber('freq', 'the filter frequency in Hz'),
    gain: jsonNumber('gain', 'dB').optional(),
    q: jsonNumber('q', 'the filter Q').optional(),
    slope: jsonNumber('slope', 'dB/octave for crossovers, the shelf slope S for shelves').optional(),
    family: z
      .enum(FAMILIES, { error: (issue) => `${where(issue.path)}family must be one of ${FAMILIES.join(', ')}; got ${shown(issue.input)}.` })
      .optional(),
  },
  {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `${where(issue.path)}unknown field ${issue.keys.map((k) => `"${k}"`).join(', ')}; a filter has only ${FILTER_KEYS.join(', ')}.`
        : `${where(issue.path)}each filter must be an object like ${EXAMPLE_FILTER}.`,
  },
);

type Ctx = { issues: { push: (issue: { code: 'custom'; message: string; path: PropertyKey[]; input: unknown }) => void } };

/** Checks the parts that depend on the sample rate and the filter type; returns false after the first problem. */
function checkFilter(ctx: Ctx, filter: FilterSpec, index: number, sampleRate: number): boolean {
  const label = (field: string) => `Filter ${index + 1} (${filter.type}): ${field}`;
  const problem = (field: keyof FilterSpec, message: string | undefined) => {
    if (message) ctx.issues.push({ code: 'custom', message, path: ['filters', index, field], input: filter[field] });
    return !message;
  };
  const nyquist = sampleRate / 2;
  const top = BLOCK_LIMITS.maxFractionOfFs * sampleRate;
  const nyquistHint = `At ${formatNumber(sampleRate)} Hz sampling a filter must sit below 0.49 × the sample rate: closer to ${formatNumber(nyquist)} Hz (half the sample rate) a digital filter no longer behaves as its settings say, and nothing exists above it. Lower freq or raise sampleRate.`;
  if (!problem('freq', outOfRange(filter.freq, { min: LIMITS.frequencyHz.min, max: top, maxExclusive: true }, label('freq'), 'Hz', nyquistHint))) return false;
  const isShelf = filter.type === 'lowshelf' || filter.type === 'highshelf';
  const isCrossover = filter.type === 'crossover-low' || filter.type === 'crossover-high';
  if ((filter.type === 'peaking' || isShelf) && filter.gain !== undefined) {
    if (!problem('gain', outOfRange(filter.gain, LIMITS.gainDb, label('gain'), 'dB'))) return false;
  }
  if (!isCrossover && filter.q !== undefined && !problem('q', outOfRange(filter.q, LIMITS.q, label('q'), ''))) return false;
  if (isShelf && filter.slope !== undefined) {
    return problem('slope', outOfRange(filter.slope, LIMITS.shelfSlope, label('slope S'), '', 'S = 1 is the steepest slope that stays monotonic; for a steeper shelf give a q instead.'));
  }
  if (isCrossover) {
    const family = filter.family ?? 'linkwitz-riley';
    const slopes: readonly number[] = LIMITS.crossoverSlopesDbPerOctave[family];
    const slope = filter.slope ?? 24;
    if (!slopes.includes(slope)) {
      return problem('slope', `${label('slope')} must be one of ${slopes.join(', ')} dB/octave for ${family}; got ${formatNumber(slope)}.`);
    }
  }
  return true;
}

export const ResponseBodySchema = z
  .strictObject(
    {
      sampleRate: jsonNumber('sampleRate', "the processor's sample rate in Hz, e.g. 48000"),
      filters: boundedList(FilterSchema, LIMITS.maxFilters, 'filters', `[${EXAMPLE_FILTER}]`),
      freqs: boundedList(jsonNumber('freqs', 'each a frequency in Hz'), LIMITS.maxResponsePoints, 'freqs', '[100, 1000, 10000]').optional(),
      ways: boundedList(CalcWaySchema, BLOCK_LIMITS.maxWays, 'ways', EXAMPLE_WAY).optional(),
    },
    {
      error: (issue) =>
        issue.code === 'unrecognized_keys'
          ? `Unknown field ${issue.keys.map((k) => `"${k}"`).join(', ')} in the body; send sampleRate, filters and optionally freqs and ways.`
          : `Send a JSON object like {"sampleRate":48000,"filters":[${EXAMPLE_FILTER}]}.`,
    },
  )
  .transform((body, ctx) => {
    const rate = outOfRange(body.sampleRate, LIMITS.sampleRateHz, 'sampleRate', 'Hz', 'Common rates are 44100, 48000 and 96000 Hz.');
    if (rate) {
      ctx.issues.push({ code: 'custom', message: rate, path: ['sampleRate'], input: body.sampleRate });
      return z.NEVER;
    }
    const filters = body.filters as FilterSpec[];
    for (const [i, filter] of filters.entries()) if (!checkFilter(ctx, filter, i, body.sampleRate)) return z.NEVER;
    const nyquist = body.sampleRate / 2;
    for (const [i, f] of (body.freqs ?? []).entries()) {
      const message = outOfRange(f, { min: LIMITS.frequencyHz.min, max: nyquist }, `Frequency ${i + 1} in freqs`, 'Hz', 'The top of the range is half the sample rate.');
      if (message) {
        ctx.issues.push({ code: 'custom', message, path: ['freqs'], input: f });
        return z.NEVER;
      }
    }
    for (const [i, way] of (body.ways ?? []).entries()) {
      for (const side of ['highPass', 'lowPass'] as const) {
        const edge = way[side];
        if (edge && edge.freq >= BLOCK_LIMITS.maxFractionOfFs * body.sampleRate) {
          ctx.issues.push({ code: 'custom', message: `Way ${i + 1}, ${side}: freq must be below 0.49 × the sample rate (${formatNumber(BLOCK_LIMITS.maxFractionOfFs * body.sampleRate)} Hz); nearer half the sample rate a digital filter no longer behaves as set.`, path: ['ways', i, side, 'freq'], input: edge.freq });
          return z.NEVER;
        }
      }
    }
    return { sampleRate: body.sampleRate, filters, freqs: body.freqs, ways: body.ways };
  });

export type ResponseBody = z.infer<typeof ResponseBodySchema>;
