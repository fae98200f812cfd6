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
} as const;

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
  return { label: 'Mains EQ', sampleRate: 48_000, bands: [newBand(250), newBand(2500)], outputGain: 0, polarity: 'normal', note: '' };
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
  };
}

export function newDelayRow(name = 'Fill'): DelayRow {
  return { name, mode: 'distance', distance: 10, unit: 'm', timeMs: 0, latencyMs: 0, offsetMs: 0 };
}

export function newDelayBlock(): DelayBlockAttrs {
  return { label: 'Delays', sampleRate: 48_000, temperature: 20, tempUnit: 'C', rows: [newDelayRow('Front fill')], note: '' };
}
