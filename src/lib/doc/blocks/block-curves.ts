/**
 * The numbers behind a processor block's plot and table, computed by the acoustics library: shared
 * by the server render, the editor's live curve and the history's before/after overlay.
 */
import {
  celsiusFromFahrenheit,
  delayMs,
  digitalHalfGainWidth,
  logFrequencyGrid,
  metersFromFeet,
  octavesFromQ,
  phaseAboveFloor,
  prototypeDepartureDb,
  analogPrototypeDb,
  cascadeResponse,
  waysResponse,
  type FilterSpec,
} from '~/lib/acoustics';
import { F_MAX, F_MIN } from '~/lib/plot/frequency-axis';
import { hasGain, isShelf, type CrossoverBlockAttrs, type DelayBlockAttrs, type DelayRow, type EqBand, type EqBlockAttrs } from './block-data';

/** Points per curve: smooth at any width, cheap enough to redraw on every keystroke. */
const POINTS = 240;

export function plotGrid(sampleRate: number): number[] {
  return logFrequencyGrid(F_MIN, Math.min(F_MAX, sampleRate / 2), POINTS);
}

export function bandSpec(band: EqBand): FilterSpec {
  const spec: FilterSpec = { type: band.type, freq: band.freq };
  if (hasGain(band.type)) spec.gain = band.gain;
  if (isShelf(band.type)) spec.slope = band.q;
  else spec.q = band.q;
  return spec;
}

export interface EqCurves {
  freqs: number[];
  total: number[];
  phase: (number | null)[];
  /** One per band that is on, in band order. */
  parts: { index: number; values: number[] }[];
  /** Analog prototypes of the bands the sample rate bends by more than half a dB. */
  prototypes: { index: number; values: number[] }[];
}

const PROTOTYPE_DEPARTURE_DB = 0.5;

export function eqCurves(block: EqBlockAttrs): EqCurves {
  const freqs = plotGrid(block.sampleRate);
  const on = block.bands.map((b, index) => ({ b, index })).filter(({ b }) => b.on);
  const whole = cascadeResponse(on.map(({ b }) => bandSpec(b)), freqs, block.sampleRate);
  const flip = block.polarity === 'inverted' ? 180 : 0;
  const total = whole.magnitudeDb.map((m) => m + block.outputGain);
  const phase = whole.phaseDeg.map((p, i) => phaseAboveFloor(total[i]!, ((p + flip + 540) % 360) - 180));
  const parts = on.map(({ b, index }) => ({ index, values: cascadeResponse([bandSpec(b)], freqs, block.sampleRate).magnitudeDb }));
  const prototypes = on
    .filter(({ b }) => prototypeDepartureDb(cookbookBand(b), block.sampleRate) > PROTOTYPE_DEPARTURE_DB)
    .map(({ b, index }) => ({
      index,
      values: analogPrototypeDb(cookbookBand(b), freqs),
    }));
  return { freqs, total, phase, parts, prototypes };
}

function cookbookBand(b: EqBand) {
  return { type: b.type, freq: b.freq, gain: hasGain(b.type) ? b.gain : undefined, q: isShelf(b.type) ? undefined : b.q, shelfSlope: isShelf(b.type) ? b.q : undefined };
}

export interface BandWidths {
  /** Width in octaves that the Q stands for (analog prototype, half-power or half-gain per the cookbook). */
  nominalOctaves: number | null;
  /** A bell's real width between half-gain points at the block's sample rate. */
  digitalOctaves: number | null;
}

/** Octave widths to show beside a band (bells and the Q-defined passes; shelves have a slope instead). */
export function bandWidths(band: EqBand, sampleRate: number): BandWidths {
  if (isShelf(band.type)) return { nominalOctaves: null, digitalOctaves: null };
  const nominalOctaves = octavesFromQ(band.q);
  const digitalOctaves = band.type === 'peaking' && band.gain !== 0 ? digitalHalfGainWidth(cookbookBand(band), sampleRate).octaves : null;
  return { nominalOctaves, digitalOctaves };
}

export interface CrossoverCurves {
  freqs: number[];
  ways: number[][];
  sum: number[];
  sumPhase: (number | null)[];
}

export function crossoverCurves(block: CrossoverBlockAttrs): CrossoverCurves {
  const freqs = plotGrid(block.sampleRate);
  const r = waysResponse(
    block.ways.map((w) => ({ highPass: w.highPass, lowPass: w.lowPass, gainDb: w.gain, polarity: w.polarity, delayMs: w.delayMs })),
    freqs,
    block.sampleRate,
  );
  return { freqs, ways: r.ways.map((w) => w.magnitudeDb), sum: r.sum.magnitudeDb, sumPhase: r.sum.phaseDeg };
}

export interface DelayResult {
  /** Time of flight (or the time typed), ms. */
  flightMs: number;
  /** What to set on the processor: flight + offset − latency, never below 0. */
  setMs: number;
  samples: number;
  /** How much the flight time changes if the air is 10 °C colder / warmer. */
  driftColdMs: number;
  driftWarmMs: number;
  /** The latency is larger than the delay asked for: the output cannot be made early by delay. */
  clipped: boolean;
}

/**
 * Flight time d/c(T) at the block's temperature (speed of sound per `speedOfSound`, ideal gas), plus
 * the precedence offset, minus the path's own latency; samples at the block's rate, unrounded.
 * A time typed directly does not drift with temperature.
 */
export function delayResult(row: DelayRow, block: Pick<DelayBlockAttrs, 'temperature' | 'tempUnit' | 'sampleRate'>): DelayResult {
  const celsius = block.tempUnit === 'F' ? celsiusFromFahrenheit(block.temperature) : block.temperature;
  const meters = row.unit === 'ft' ? metersFromFeet(row.distance) : row.distance;
  const flight = (c: number) => (row.mode === 'time' ? row.timeMs : delayMs(meters, c));
  const flightMs = flight(celsius);
  const wanted = flightMs + row.offsetMs - row.latencyMs;
  const setMs = Math.max(0, wanted);
  return {
    flightMs,
    setMs,
    samples: (setMs * block.sampleRate) / 1000,
    driftColdMs: flight(Math.max(-60, celsius - 10)) - flightMs,
    driftWarmMs: flight(Math.min(60, celsius + 10)) - flightMs,
    clipped: wanted < 0,
  };
}
