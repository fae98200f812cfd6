import { describe, expect, it } from 'vitest';
import { levelAtDistance } from './distance-loss';

describe('levelAtDistance', () => {
  it('point source loses 6.02 dB per doubling of distance (inverse-square law; ISO 9613-2 eq. 7)', () => {
    const { levelDb, changeDb } = levelAtDistance(100, 1, 2, 'point');
    expect(changeDb).toBeCloseTo(-6.0206, 4);
    expect(levelDb).toBeCloseTo(93.9794, 4);
  });

  it('point source loses 20 dB per tenfold distance (20·log10 10)', () => {
    expect(levelAtDistance(110, 1, 10).changeDb).toBeCloseTo(-20, 12);
  });

  it('line source loses 3.01 dB per doubling (cylindrical spreading, 10·log10 2)', () => {
    expect(levelAtDistance(100, 10, 20, 'line').changeDb).toBeCloseTo(-3.0103, 4);
  });

  it('moving closer raises the level: 4 m → 1 m is +12.04 dB for a point source', () => {
    expect(levelAtDistance(90, 4, 1).changeDb).toBeCloseTo(12.0412, 4);
  });

  it('refuses zero and negative distances with a reason, and unknown source types', () => {
    expect(() => levelAtDistance(100, 0, 2)).toThrow(/some distance away/);
    expect(() => levelAtDistance(100, 1, -2)).toThrow(RangeError);
    expect(() => levelAtDistance(100, 1, Number.POSITIVE_INFINITY)).toThrow(RangeError);
    expect(() => levelAtDistance(100, 1, 2, 'plane' as never)).toThrow(/point, line/);
    expect(() => levelAtDistance(Number.NaN, 1, 2)).toThrow(RangeError);
  });
});
