/**
 * A measured trace made ready to draw over a block's computed curve: thinned to the plot's
 * resolution, optionally smoothed, moved by the engineer's level offset, and split where the
 * coherence is low so that part can be drawn faint (a low-coherence reading is mostly room and
 * noise, not the system; common practice is to read it with caution, not to hide it).
 */
import type { Trace } from './parse-trace';
import { binForPlot } from './plot-bins';
import { smoothMagnitudeDb, type SmoothingFraction } from './smooth-trace';

export const DEFAULT_COHERENCE_THRESHOLD = 0.5;

export interface TraceOverlayOptions {
  offsetDb?: number;
  /** 0 for none, else 1/N octave. */
  smoothing?: 0 | SmoothingFraction;
  coherenceThreshold?: number;
  fromHz?: number;
  toHz?: number;
  bins?: number;
}

export interface TraceOverlay {
  freqs: number[];
  /** Level where the reading is trustworthy; null where it is drawn faint instead. */
  strong: (number | null)[];
  /** Level where coherence is below the threshold; null elsewhere. */
  faint: (number | null)[];
}

export function traceOverlay(trace: Trace, options: TraceOverlayOptions = {}): TraceOverlay {
  const { offsetDb = 0, smoothing = 0, coherenceThreshold = DEFAULT_COHERENCE_THRESHOLD, fromHz = 20, toHz = 20_000, bins = 480 } = options;
  // Smoothing is computed on the full-resolution trace, then thinned: thinning first would
  // change what "1/6 octave" averages over.
  const magnitudeDb = smoothing ? smoothMagnitudeDb(trace.freqHz, trace.magnitudeDb, smoothing) : trace.magnitudeDb;
  const points = binForPlot({ ...trace, magnitudeDb }, fromHz, toHz, bins);
  const freqs = points.map((p) => p.hz);
  const level = points.map((p) => p.db + offsetDb);
  const low = points.map((p) => p.coherence !== undefined && p.coherence < coherenceThreshold);
  const strong: (number | null)[] = level.map((v, i) => (low[i] ? null : v));
  // A faint run shares its end points with the strong neighbours, so the line stays unbroken.
  const faint: (number | null)[] = level.map((v, i) => (low[i] || low[i - 1] || low[i + 1] ? v : null));
  return { freqs, strong, faint };
}
