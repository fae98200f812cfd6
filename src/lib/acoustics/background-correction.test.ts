import { describe, expect, it } from 'vitest';
import { backgroundCorrection } from './background-correction';

// K1 = −10·lg(1 − 10^(−0.1·ΔL)) is ISO 3744:2010's background noise correction (from memory); the 3 dB
// minimum margin is ISO 3746 / common practice.
describe('backgroundCorrection', () => {
  it('a 10 dB margin removes 0.46 dB', () => {
    expect(backgroundCorrection(90, 80)).toBeCloseTo(89.5424, 4);
  });

  it('a 6 dB margin removes 1.26 dB (the ISO 3744 engineering-grade minimum margin, from memory)', () => {
    expect(90 - backgroundCorrection(90, 84)).toBeCloseTo(1.2563, 4);
  });

  it('a 3 dB margin, the smallest accepted, removes 3.02 dB', () => {
    expect(90 - backgroundCorrection(90, 87)).toBeCloseTo(3.0206, 4);
  });

  it('a 60 dB margin removes almost nothing without rounding to exactly zero', () => {
    const corrected = backgroundCorrection(100, 40);
    expect(corrected).toBeLessThan(100);
    expect(100 - corrected).toBeCloseTo(4.3429e-6, 9);
  });

  it('refuses a margin below 3 dB and a background above the total, saying what to do', () => {
    expect(() => backgroundCorrection(80, 78)).toThrow(/at least 3 dB below the total.*measure again/);
    expect(() => backgroundCorrection(80, 85)).toThrow(RangeError);
    expect(() => backgroundCorrection(80, 80)).toThrow(RangeError);
    expect(() => backgroundCorrection(Number.NaN, 40)).toThrow(RangeError);
  });
});
