import { describe, expect, it } from 'vitest';
import { aWeightingDb, cWeightingDb, weightingDb, zWeightingDb } from './weighting';

// IEC 61672-1:2013 Table 3: A and C weightings at the one-third-octave bands 10 Hz … 20 kHz, rounded to
// 0.1 dB and computed by the standard at the EXACT base-10 midbands 1000·10^(n/10) — from memory, and
// matching the table transcribed independently in python-acoustics (data/iec_61672_1_2013.csv).
const TABLE_3: [n: number, nominalHz: number, a: number, c: number][] = [
  [-20, 10, -70.4, -14.3], [-19, 12.5, -63.4, -11.2], [-18, 16, -56.7, -8.5], [-17, 20, -50.5, -6.2],
  [-16, 25, -44.7, -4.4], [-15, 31.5, -39.4, -3.0], [-14, 40, -34.6, -2.0], [-13, 50, -30.2, -1.3],
  [-12, 63, -26.2, -0.8], [-11, 80, -22.5, -0.5], [-10, 100, -19.1, -0.3], [-9, 125, -16.1, -0.2],
  [-8, 160, -13.4, -0.1], [-7, 200, -10.9, 0.0], [-6, 250, -8.6, 0.0], [-5, 315, -6.6, 0.0],
  [-4, 400, -4.8, 0.0], [-3, 500, -3.2, 0.0], [-2, 630, -1.9, 0.0], [-1, 800, -0.8, 0.0],
  [0, 1000, 0.0, 0.0], [1, 1250, 0.6, 0.0], [2, 1600, 1.0, -0.1], [3, 2000, 1.2, -0.2],
  [4, 2500, 1.3, -0.3], [5, 3150, 1.2, -0.5], [6, 4000, 1.0, -0.8], [7, 5000, 0.5, -1.3],
  [8, 6300, -0.1, -2.0], [9, 8000, -1.1, -3.0], [10, 10000, -2.5, -4.4], [11, 12500, -4.3, -6.2],
  [12, 16000, -6.6, -8.5], [13, 20000, -9.3, -11.2],
];
// Half the table's 0.1 dB rounding step, plus 0.0001 dB because the 160 Hz A entry sits on a rounding
// tie (the formula gives −13.34996 dB, printed as −13.4).
const ROUNDING = 0.0501;

describe('A and C weighting against IEC 61672-1:2013 Table 3', () => {
  for (const [n, nominal, a, c] of TABLE_3) {
    const exact = 1000 * 10 ** (n / 10);
    it(`${nominal} Hz: A ${a} dB, C ${c} dB (IEC 61672-1 Table 3)`, () => {
      expect(Math.abs(aWeightingDb(exact) - a)).toBeLessThanOrEqual(ROUNDING);
      expect(Math.abs(cWeightingDb(exact) - c)).toBeLessThanOrEqual(ROUNDING);
    });
  }

  it('Table 3 is computed at the exact midbands: at the nominal 31.5 Hz the formula gives −39.52 dB, not −39.4', () => {
    // So callers labelling a 1/3-octave analyser must weight at the exact midband (octave-bands.ts `exact`).
    expect(aWeightingDb(31.5)).toBeCloseTo(-39.52, 2);
    expect(Math.abs(aWeightingDb(1000 * 10 ** -1.5) - -39.4)).toBeLessThanOrEqual(ROUNDING);
  });

  it('A and C are 0 dB at 1 kHz to within the rounding of A1000 = −2.000 and C1000 = −0.062 (IEC 61672-1 Annex E)', () => {
    expect(Math.abs(aWeightingDb(1000))).toBeLessThan(0.001);
    expect(Math.abs(cWeightingDb(1000))).toBeLessThan(0.001);
  });

  it('Z is 0 dB everywhere and weightingDb dispatches', () => {
    expect(zWeightingDb(31.5)).toBe(0);
    expect(weightingDb('Z', 16000)).toBe(0);
    expect(weightingDb('A', 1000)).toBe(aWeightingDb(1000));
    expect(weightingDb('C', 63)).toBe(cWeightingDb(63));
  });

  it('refuses 0 Hz, negative, NaN and unknown curves', () => {
    expect(() => aWeightingDb(0)).toThrow(/positive frequencies/);
    expect(() => cWeightingDb(-100)).toThrow(RangeError);
    expect(() => zWeightingDb(Number.NaN)).toThrow(RangeError);
    expect(() => weightingDb('B' as never, 1000)).toThrow(/A, C, Z/);
  });
});
