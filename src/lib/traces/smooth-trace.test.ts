import { describe, expect, it } from 'vitest';
import { smoothMagnitudeDb } from './smooth-trace';
import { traceDifference, magnitudeAt } from './trace-difference';
import { binForPlot } from './plot-bins';
import { traceToText } from './trace-text';
import { parseTrace } from './parse-trace';

// Hand-worked example (worked out on paper for this test, not taken from a tool):
// (10^−0.6 = 0.2511886, 10^0.3 = 1.9952623.) Points 100, 105, 112, 125, 140, 160 Hz at 0, −6, 0, +3, 0, −10 dB; 1/3-octave smoothing, so each
// window spans f·2^(∓1/6) = f/1.122462 … f·1.122462.
//  f = 100: [89.09, 112.25] holds 100, 105, 112 → 10·log10((1 + 10^−0.6 + 1)/3) = −1.24709 dB
//  f = 112: [99.78, 125.72] holds 100, 105, 112, 125 → 10·log10((1 + 10^−0.6 + 1 + 10^0.3)/4) = +0.25964 dB
//  f = 160: [142.54, 179.59] holds only 160 → −10 dB (a lone point stays as measured)
const F = [100, 105, 112, 125, 140, 160];
const M = [0, -6, 0, 3, 0, -10];

describe('smoothMagnitudeDb (power average over ±1/(2N) octave)', () => {
  it('matches the hand-worked 1/3-octave example', () => {
    const s = smoothMagnitudeDb(F, M, 3);
    expect(s[0]).toBeCloseTo(-1.24709, 4);
    expect(s[2]).toBeCloseTo(0.25964, 4);
    expect(s[5]).toBeCloseTo(-10, 10);
  });

  it('agrees with a direct (quadratic) evaluation of the definition on a long random trace', () => {
    let seed = 7;
    const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);
    const f: number[] = [];
    const m: number[] = [];
    let hz = 20;
    for (let i = 0; i < 2000; i++) {
      hz *= 1 + rand() * 0.01;
      f.push(hz);
      m.push(rand() * 40 - 20);
    }
    for (const n of [3, 6, 12] as const) {
      const fast = smoothMagnitudeDb(f, m, n);
      const k = 2 ** (1 / (2 * n));
      for (const i of [0, 1, 500, 1234, 1999]) {
        const inside = m.filter((_, j) => f[j] >= f[i] / k && f[j] <= f[i] * k);
        const direct = 10 * Math.log10(inside.reduce((a, db) => a + 10 ** (db / 10), 0) / inside.length);
        expect(fast[i]).toBeCloseTo(direct, 9);
      }
    }
  });

  it('leaves a flat response flat and refuses other widths', () => {
    expect(smoothMagnitudeDb([10, 20, 40, 80], [-3, -3, -3, -3], 6)).toEqual([-3, -3, -3, -3].map((x) => expect.closeTo(x, 12)));
    expect(() => smoothMagnitudeDb(F, M, 5 as never)).toThrow(/1\/3, 1\/6 or 1\/12/);
  });
});

describe('traceDifference and magnitudeAt', () => {
  it('interpolates in dB over log frequency: halfway between 100 and 400 Hz on the log axis is 200 Hz', () => {
    expect(magnitudeAt({ freqHz: [100, 400], magnitudeDb: [0, -6] }, 200)).toBeCloseTo(-3, 12);
    expect(magnitudeAt({ freqHz: [100, 400], magnitudeDb: [0, -6] }, 50)).toBeNull();
  });

  it('gives after − before over the band both cover', () => {
    const before = { freqHz: [100, 200, 400], magnitudeDb: [0, 2, 4] };
    const after = { freqHz: [50, 100, 200, 800], magnitudeDb: [9, 1, 1, 9] };
    expect(traceDifference(after, before)).toEqual({ freqHz: [100, 200], magnitudeDb: [1, -1] });
  });
});

describe('binForPlot', () => {
  it('thins 100,000 points to at most one per bin, power-averaging each bin', () => {
    const n = 100_000;
    const freqHz = Array.from({ length: n }, (_, i) => 20 * 1000 ** (i / (n - 1)));
    const trace = { freqHz, magnitudeDb: freqHz.map(() => -6), coherence: freqHz.map(() => 0.5) };
    const pts = binForPlot(trace, 20, 20_000, 400);
    expect(pts.length).toBe(400);
    for (const p of pts) {
      expect(p.db).toBeCloseTo(-6, 9);
      expect(p.coherence).toBeCloseTo(0.5, 9);
    }
  });

  it('averages power, not dB, inside a bin', () => {
    const pts = binForPlot({ freqHz: [1000, 1001], magnitudeDb: [0, -100] }, 20, 20_000, 10);
    expect(pts).toHaveLength(1);
    expect(pts[0].db).toBeCloseTo(10 * Math.log10(0.5 * (1 + 1e-10)), 9);
  });
});

describe('traceToText', () => {
  it('writes columns the parser reads back to the same values', () => {
    const trace = { freqHz: [20, 1000.5], magnitudeDb: [-3.25, 1], phaseDeg: [12.5, -90], coherence: [1, 0.25] };
    const text = traceToText(trace, 'after retune\n# injected');
    expect(text.split('\n')[0]).toBe('# after retune # injected');
    expect(parseTrace(text)).toEqual(trace);
  });
});
