/**
 * What the three processor blocks store in a page (node attributes), the limits they live within,
 * and a fresh block of each kind. Plain types, so the editor, the server and the diff share them
 * without shipping a validator to the browser.
 */
import type { CookbookType, CrossoverFamily, Polarity } from '~/lib/acoustics';

export const EQ_BLOCK = 'eqBlock';
export const CROSSOVER_BLOCK = 'crossoverBlock';
export const DELAY_BLOCK = 'delayBlock';
export const PROCESSOR_BLOCKS = [EQ_BLOCK, CROSSOVER_BLOCK, DELAY_BLOCK] as const;
export type ProcessorBlockType = (typeof PROCESSOR_BLOCKS)[number];

export const BLOCK_LIMITS = {
  /** The sample rates processors run at. */
  sampleRates: [44_100, 48_000, 88_200, 96_000, 192_000],
  maxBands: 32,
  minWays: 2,
  maxWays: 4,
  maxDelayRows: 32,
  /** A filter this close to Nyquist no longer behaves like its analog description; above it is refused. */
  maxFractionOfFs: 0.49,
  labelChars: 120,
  nameChars: 60,
  noteChars: 2000,
  outputGainDb: { min: -40, max: 20 },
  /** Measured traces one EQ or crossover block may carry. */
  maxTraces: 8,
  traceTextChars: 60,
  traceOffsetDb: { min: -200, max: 200 },
} as const;

/** 1/N-octave smoothing of a drawn trace; 0 draws it as measured. */
export const TRACE_SMOOTHINGS = [0, 3, 6, 12] as const;
export type TraceSmoothing = (typeof TRACE_SMOOTHINGS)[number];

/**
 * A measured trace attached to a block: a venue file of kind "trace" (see src/lib/traces), with
 * what the engineer wrote about it. The measurement itself stays in the file, not in the page.
 */
export type TraceRef = {
  fileId: string;
  /** "before retune", "after", "mix position"… */
  label: string;
  /** ISO date (YYYY-MM-DD) of the measurement, or empty. */
  date: string;
  /** Where the microphone was. */
  position: string;
  /** dB added to the trace to line it up with the computed curve. */
  offsetDb: number;
  smoothing: TraceSmoothing;
};

/** Two attached traces drawn with their difference (after − before). */
export type TraceCompare = { before: string; after: string };

/** Band types in the cookbook's words; "peaking" is the bell. */
export type BandType = CookbookType;

export type EqBand = {
  type: BandType;
  freq: number;
  /** dB; bells and shelves only. */
  gain: number;
  /** Q, or for shelves the cookbook slope S. */
  q: number;
  on: boolean;
};

export type EqBlockAttrs = {
  label: string;
  sampleRate: number;
  bands: EqBand[];
  outputGain: number;
  polarity: Polarity;
  note: string;
  /** Absent on blocks saved before traces existed. */
  traces?: TraceRef[];
  compare?: TraceCompare | null;
};

export type XoverEdge = {
  family: CrossoverFamily;
  slope: number;
  freq: number;
};

export type XoverWay = {
  name: string;
  highPass: XoverEdge | null;
  lowPass: XoverEdge | null;
  gain: number;
  polarity: Polarity;
  delayMs: number;
};

export type CrossoverBlockAttrs = {
  label: string;
  sampleRate: number;
  ways: XoverWay[];
  note: string;
  traces?: TraceRef[];
  compare?: TraceCompare | null;
};

export type DelayRow = {
  name: string;
  /** Distance to the alignment point, or a time typed directly. */
  mode: 'distance' | 'time';
  distance: number;
  unit: 'm' | 'ft';
  timeMs: number;
  /** ms this output's path is already later than the reference (processing, network). */
  latencyMs: number;
  /** ms added so the reference arrives first (precedence). */
  offsetMs: number;
};

export type DelayBlockAttrs = {
  label: string;
  sampleRate: number;
  temperature: number;
  tempUnit: 'C' | 'F';
  rows: DelayRow[];
  note: string;
};

export const BAND_TYPE_LABELS: Record<BandType, string> = {
  peaking: 'Bell',
  lowshelf: 'Low shelf',
  highshelf: 'High shelf',
  lowpass: 'Low-pass',
  highpass: 'High-pass',
  bandpass: 'Band-pass',
  notch: 'Notch',
  allpass: 'All-pass',
};

export const hasGain = (type: BandType) => type === 'peaking' || type === 'lowshelf' || type === 'highshelf';
export const isShelf = (type: BandType) => type === 'lowshelf' || type === 'highshelf';

export function newBand(freq = 1000): EqBand {
  return { type: 'peaking', freq, gain: 0, q: 1.41, on: true };
}

export function newEqBlock(): EqBlockAttrs {
  return { label: 'Mains EQ', sampleRate: 48_000, bands: [newBand(250), newBand(2500)], outputGain: 0, polarity: 'normal', note: '', traces: [], compare: null };
}

export function newCrossoverBlock(): CrossoverBlockAttrs {
  const edge: XoverEdge = { family: 'linkwitz-riley', slope: 24, freq: 90 };
  return {
    label: 'Sub / main crossover',
    sampleRate: 48_000,
    ways: [
      { name: 'Sub', highPass: null, lowPass: { ...edge }, gain: 0, polarity: 'normal', delayMs: 0 },
      { name: 'Main', highPass: { ...edge }, lowPass: null, gain: 0, polarity: 'normal', delayMs: 0 },
    ],
    note: '',
    traces: [],
    compare: null,
  };
}

export function newTraceRef(fileId: string, label = ''): TraceRef {
  return { fileId, label, date: '', position: '', offsetDb: 0, smoothing: 6 };
}

/** The traces of a block, whichever block and whenever it was saved. */
export function blockTraces(attrs: { traces?: TraceRef[] } | null | undefined): TraceRef[] {
  return Array.isArray(attrs?.traces) ? attrs.traces : [];
}

export function newDelayRow(name = 'Fill'): DelayRow {
  return { name, mode: 'distance', distance: 10, unit: 'm', timeMs: 0, latencyMs: 0, offsetMs: 0 };
}

export function newDelayBlock(): DelayBlockAttrs {
  return { label: 'Delays', sampleRate: 48_000, temperature: 20, tempUnit: 'C', rows: [newDelayRow('Front fill')], note: '' };
}
