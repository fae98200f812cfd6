/**
 * Fractional-octave smoothing of a measured magnitude response.
 *
 * Each point is replaced by the power average of every point whose frequency lies within
 * ±1/(2N) octave of it, i.e. in [f·2^(−1/2N), f·2^(+1/2N)], a window one 1/N octave wide centred
 * (geometrically) on f. Power, not dB, is averaged, because a deep narrow notch carries little
 * energy and should not drag the smoothed curve down as far as a dB average would (common
 * practice in room measurement; the window is the constant-relative-bandwidth idea of
 * IEC 61260-1 applied point by point).
 */
import type { Trace } from './parse-trace';

export type SmoothingFraction = 3 | 6 | 12;
export const SMOOTHING_FRACTIONS: readonly SmoothingFraction[] = [3, 6, 12];

/** Power-averaged 1/N-octave smoothing; O(n) with two pointers over the rising frequencies. */
export function smoothMagnitudeDb(freqHz: readonly number[], magnitudeDb: readonly number[], fraction: SmoothingFraction): number[] {
  if (!SMOOTHING_FRACTIONS.includes(fraction)) {
    throw new RangeError(`Smoothing must be 1/3, 1/6 or 1/12 octave; got 1/${String(fraction)}.`);
  }
  if (freqHz.length !== magnitudeDb.length) throw new RangeError('Frequencies and magnitudes must be the same length.');
  const n = freqHz.length;
  const halfWidth = 2 ** (1 / (2 * fraction));
  // Prefix sums of linear power let each window's mean be read in O(1).
  const prefix = new Float64Array(n + 1);
  for (let i = 0; i < n; i++) prefix[i + 1] = prefix[i] + 10 ** (magnitudeDb[i] / 10);
  const out = new Array<number>(n);
  let lo = 0;
  let hi = 0;
  for (let i = 0; i < n; i++) {
    const low = freqHz[i] / halfWidth;
    const high = freqHz[i] * halfWidth;
    while (freqHz[lo] < low) lo++;
    if (hi < i) hi = i;
    while (hi + 1 < n && freqHz[hi + 1] <= high) hi++;
    const mean = (prefix[hi + 1] - prefix[lo]) / (hi - lo + 1);
    out[i] = 10 * Math.log10(mean);
  }
  return out;
}

/** The trace with its magnitude smoothed (phase and coherence are left as measured). */
export function smoothTrace(trace: Trace, fraction: SmoothingFraction): Trace {
  return { ...trace, magnitudeDb: smoothMagnitudeDb(trace.freqHz, trace.magnitudeDb, fraction) };
}
