/**
 * The difference of two measured traces (e.g. after − before a retune), at the frequencies of
 * the first, over the band both cover. The second trace is interpolated linearly in dB against
 * log frequency, the axis both are drawn on, so the difference of two smooth curves stays smooth.
 */
import type { Trace } from './parse-trace';

/** Magnitude of `trace` at `hz` by linear interpolation in dB over log f; null outside its span. */
export function magnitudeAt(trace: Pick<Trace, 'freqHz' | 'magnitudeDb'>, hz: number): number | null {
  const f = trace.freqHz;
  if (!(hz >= f[0] && hz <= f[f.length - 1])) return null;
  let lo = 0;
  let hi = f.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (f[mid] <= hz) lo = mid;
    else hi = mid;
  }
  if (f[lo] === hz || lo === hi) return trace.magnitudeDb[lo];
  const t = Math.log(hz / f[lo]) / Math.log(f[hi] / f[lo]);
  return trace.magnitudeDb[lo] + t * (trace.magnitudeDb[hi] - trace.magnitudeDb[lo]);
}

/** `a − b` in dB at a's frequencies where b is also measured. */
export function traceDifference(a: Pick<Trace, 'freqHz' | 'magnitudeDb'>, b: Pick<Trace, 'freqHz' | 'magnitudeDb'>): { freqHz: number[]; magnitudeDb: number[] } {
  const freqHz: number[] = [];
  const magnitudeDb: number[] = [];
  for (let i = 0; i < a.freqHz.length; i++) {
    const other = magnitudeAt(b, a.freqHz[i]);
    if (other === null) continue;
    freqHz.push(a.freqHz[i]);
    magnitudeDb.push(a.magnitudeDb[i] - other);
  }
  return { freqHz, magnitudeDb };
}
