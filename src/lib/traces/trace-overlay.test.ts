import { describe, expect, it } from 'vitest';
import { traceOverlay } from './trace-overlay';

const freqHz = Array.from({ length: 1000 }, (_, i) => 20 * 1000 ** (i / 999));

describe('traceOverlay', () => {
  it('moves the trace by the level offset, at the plot resolution', () => {
    const o = traceOverlay({ freqHz, magnitudeDb: freqHz.map(() => 80) }, { offsetDb: -80, bins: 100 });
    expect(o.freqs).toHaveLength(100);
    for (const v of o.strong) expect(v).toBeCloseTo(0, 9);
    expect(o.faint.every((v) => v === null)).toBe(true);
  });

  it('draws low-coherence stretches faint, joined to their strong neighbours', () => {
    const coherence = freqHz.map((f) => (f < 100 ? 0.2 : 0.95));
    const o = traceOverlay({ freqHz, magnitudeDb: freqHz.map(() => 0), coherence }, { bins: 50 });
    const firstStrong = o.strong.findIndex((v) => v !== null);
    expect(firstStrong).toBeGreaterThan(0);
    expect(o.strong.slice(0, firstStrong).every((v) => v === null)).toBe(true);
    expect(o.faint[firstStrong]).not.toBeNull(); // the join
    expect(o.faint[firstStrong + 1]).toBeNull();
  });

  it('smooths before thinning: a 1/3-octave smoothing of a narrow dip is shallower than the dip', () => {
    const magnitudeDb = freqHz.map((f) => (Math.abs(Math.log2(f / 1000)) < 0.02 ? -30 : 0));
    const raw = traceOverlay({ freqHz, magnitudeDb }, { bins: 480 });
    const smooth = traceOverlay({ freqHz, magnitudeDb }, { bins: 480, smoothing: 3 });
    const minOf = (xs: (number | null)[]) => Math.min(...xs.filter((x): x is number => x !== null));
    expect(minOf(smooth.strong)).toBeGreaterThan(minOf(raw.strong));
    expect(minOf(smooth.strong)).toBeLessThan(0);
  });
});
