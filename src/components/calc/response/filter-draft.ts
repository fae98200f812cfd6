import { FILTER_TYPES, LIMITS, type FilterSpec } from '~/lib/acoustics';
import { num } from '~/components/calc/attempt';

/** One filter as typed: text fields, so half-typed numbers survive and the URL stays faithful. */
export interface FilterDraft {
  type: string;
  freq: string;
  gain: string;
  q: string;
  slope: string;
  family: string;
}

const FIELDS = ['type', 'freq', 'gain', 'q', 'slope', 'family'] as const;

/** In the link: fields joined by "_", filters by "*" — both left alone by URL encoding. */
const FIELD_SEP = '_';
const FILTER_SEP = '*';

export const DEFAULT_CHAIN = 'crossover-high_80___24_linkwitz-riley*peaking_250_-3_1.4*highshelf_8000_-2__1';

export type FilterKind = 'bell' | 'shelf' | 'pass' | 'crossover';

export function kindOf(type: string): FilterKind {
  if (type === 'peaking') return 'bell';
  if (type === 'lowshelf' || type === 'highshelf') return 'shelf';
  if (type === 'crossover-low' || type === 'crossover-high') return 'crossover';
  return 'pass';
}

/** Removes the characters the link uses as separators, so typing can never split a filter. */
export const clean = (text: string) => text.replace(/[_*]/g, '');

export function decodeFilters(text: string): FilterDraft[] {
  if (text.trim() === '') return [];
  return text
    .split(FILTER_SEP)
    .slice(0, LIMITS.maxFilters)
    .map((chunk) => {
      const parts = chunk.split(FIELD_SEP);
      return Object.fromEntries(FIELDS.map((field, i) => [field, parts[i] ?? ''])) as unknown as FilterDraft;
    });
}

export function encodeFilters(filters: readonly FilterDraft[]): string {
  return filters.map((f) => FIELDS.map((field) => f[field]).join(FIELD_SEP).replace(/_+$/, '')).join(FILTER_SEP);
}

/** Sensible values for the fields a new type needs, keeping what still means the same thing. */
export function retype(draft: FilterDraft, type: string): FilterDraft {
  const kind = kindOf(type);
  const wasKind = kindOf(draft.type);
  return {
    type,
    freq: draft.freq,
    gain: kind === 'bell' || kind === 'shelf' ? draft.gain || '0' : '',
    q: kind === 'bell' || kind === 'pass' ? draft.q || '0.71' : '',
    slope: kind === wasKind ? draft.slope : kind === 'crossover' ? '24' : kind === 'shelf' ? '1' : '',
    family: kind === 'crossover' ? draft.family || 'linkwitz-riley' : '',
  };
}

/** The spec the acoustics code takes; a field that is not a number throws a RangeError for the person. */
export function toSpec(draft: FilterDraft, index: number): FilterSpec {
  const label = (what: string) => `${what} of filter ${index + 1}`;
  if (!(FILTER_TYPES as readonly string[]).includes(draft.type)) {
    throw new RangeError(`Filter ${index + 1}: pick a type from the list.`);
  }
  const kind = kindOf(draft.type);
  const spec: FilterSpec = { type: draft.type as FilterSpec['type'], freq: num(draft.freq, label('the frequency')) };
  if (kind === 'bell' || kind === 'shelf') spec.gain = num(draft.gain, label('the gain'));
  if (kind === 'bell' || kind === 'pass') spec.q = num(draft.q, label('the Q'));
  if (kind === 'shelf' || kind === 'crossover') spec.slope = num(draft.slope, label('the slope'));
  if (kind === 'crossover') spec.family = draft.family === 'butterworth' ? 'butterworth' : 'linkwitz-riley';
  return spec;
}
