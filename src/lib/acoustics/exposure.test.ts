import { describe, expect, it } from 'vitest';
import { EXPOSURE_CAUTION, nioshRecommendedHours, oshaPermissibleHours } from './exposure';

describe('oshaPermissibleHours — 29 CFR 1910.95 Table G-16', () => {
  // Rows the formula reproduces exactly.
  const exact: [number, number][] = [[90, 8], [95, 4], [100, 2], [105, 1], [110, 0.5], [115, 0.25]];
  for (const [level, hours] of exact) {
    it(`${level} dBA → ${hours} h (Table G-16)`, () => expect(oshaPermissibleHours(level)).toBeCloseTo(hours, 12));
  }
  // Rows Table G-16 prints rounded (Appendix A Table A-1 gives 6.1, 3.0, 1.5).
  const rounded: [number, number][] = [[92, 6], [97, 3], [102, 1.5]];
  for (const [level, hours] of rounded) {
    it(`${level} dBA → about ${hours} h (Table G-16, rounded in the table)`, () => {
      expect(Math.abs(oshaPermissibleHours(level) - hours)).toBeLessThan(0.1);
    });
  }
});

describe('nioshRecommendedHours — NIOSH 98-126 ch. 1', () => {
  const rows: [number, number][] = [[85, 8], [88, 4], [91, 2], [94, 1], [97, 0.5], [100, 0.25]];
  for (const [level, hours] of rows) {
    it(`${level} dBA → ${hours * 60} min (NIOSH 98-126, Table 1-1)`, () => expect(nioshRecommendedHours(level)).toBeCloseTo(hours, 12));
  }
  it('is stricter than OSHA at every level above 85 dBA', () => {
    for (let level = 85.5; level <= 140; level += 0.5) {
      expect(nioshRecommendedHours(level)).toBeLessThan(oshaPermissibleHours(level));
    }
  });
});

describe('exposure inputs and caution', () => {
  it('the caution says these are estimates and that a meter and the local rule decide', () => {
    expect(EXPOSURE_CAUTION).toMatch(/estimate/);
    expect(EXPOSURE_CAUTION).toMatch(/calibrated/);
    expect(EXPOSURE_CAUTION).toMatch(/country/);
  });

  it('refuses levels outside 70–140 dB(A), NaN and Infinity', () => {
    expect(() => oshaPermissibleHours(60)).toThrow(/70 dB\(A\)/);
    expect(() => nioshRecommendedHours(150)).toThrow(RangeError);
    expect(() => oshaPermissibleHours(Number.NaN)).toThrow(RangeError);
    expect(() => nioshRecommendedHours(Number.NEGATIVE_INFINITY)).toThrow(RangeError);
  });
});
