import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { COHERENT_CANCELLATION_FLOOR_DB, coherentSum, incoherentSum } from './spl-sum';

const RUN = { seed: 20261202, numRuns: 500 };
const levels = fc.array(fc.double({ min: -50, max: 200, noNaN: true }), { minLength: 1, maxLength: 64 });

describe('incoherentSum (10·log10 Σ 10^(L/10); Kinsler et al., Fundamentals of Acoustics)', () => {
  it('two equal sources add 3.01 dB: 100 + 100 = 103.01 dB', () => {
    expect(incoherentSum([100, 100])).toBeCloseTo(103.0103, 4);
  });

  it('three equal sources add 4.77 dB (10·log10 3)', () => {
    expect(incoherentSum([90, 90, 90])).toBeCloseTo(94.7712, 4);
  });

  it('a source 10 dB quieter adds 0.41 dB (common practice "decibel addition" table: +0.4 dB)', () => {
    expect(incoherentSum([100, 90])).toBeCloseTo(100.4139, 4);
  });

  it('a single level is itself', () => {
    expect(incoherentSum([87.3])).toBeCloseTo(87.3, 12);
  });

  it('never drops below the loudest source nor exceeds it by more than 10·log10(n) (property)', () => {
    fc.assert(
      fc.property(levels, (ls) => {
        const sum = incoherentSum(ls);
        const loudest = Math.max(...ls);
        expect(sum).toBeGreaterThanOrEqual(loudest - 1e-9);
        expect(sum).toBeLessThanOrEqual(loudest + 10 * Math.log10(ls.length) + 1e-9);
      }),
      RUN,
    );
  });

  it('does not depend on the order of the levels (property)', () => {
    fc.assert(
      fc.property(levels, (ls) => {
        expect(incoherentSum([...ls].reverse())).toBeCloseTo(incoherentSum(ls), 9);
      }),
      RUN,
    );
  });

  it('refuses an empty list, more than 64 levels, NaN and Infinity', () => {
    expect(() => incoherentSum([])).toThrow(/at least 1/);
    expect(() => incoherentSum(new Array(65).fill(90))).toThrow(/at most 64/);
    expect(() => incoherentSum([90, Number.NaN])).toThrow(/Level 2/);
    expect(() => incoherentSum([Number.POSITIVE_INFINITY])).toThrow(RangeError);
    expect(() => incoherentSum([300])).toThrow(/at most 200 dB/);
  });
});

describe('coherentSum (20·log10|Σ p·e^{jφ}|; superposition of pressures)', () => {
  it('two equal sources in phase add 6.02 dB', () => {
    expect(coherentSum([100, 100])).toBeCloseTo(106.0206, 4);
    expect(coherentSum([100, 100], [0, 0])).toBeCloseTo(106.0206, 4);
  });

  it('two equal sources 90° apart add like power: +3.01 dB', () => {
    expect(coherentSum([100, 100], [0, 90])).toBeCloseTo(103.0103, 4);
  });

  it('two equal sources 120° apart sum to one of them (|1 + e^{j120°}| = 1)', () => {
    expect(coherentSum([100, 100], [0, 120])).toBeCloseTo(100, 9);
  });

  it('100 dB and 94 dB in opposite polarity leave 93.96 dB (20·log10(1 − 10^(−6/20)))', () => {
    expect(coherentSum([100, 94], [0, 180])).toBeCloseTo(100 + 20 * Math.log10(1 - 10 ** (-6 / 20)), 9);
  });

  it('two equal sources 180° apart answer the documented floor, 120 dB below the loudest, not −Infinity (decision)', () => {
    expect(COHERENT_CANCELLATION_FLOOR_DB).toBe(120);
    expect(coherentSum([100, 100], [0, 180])).toBe(-20);
    expect(coherentSum([100, 100], [90, -90])).toBe(-20);
    expect(Number.isFinite(coherentSum([0, 0], [0, 180]))).toBe(true);
  });

  it('is never above the in-phase sum nor below the floor (property)', () => {
    fc.assert(
      fc.property(
        levels.chain((ls) => fc.tuple(fc.constant(ls), fc.array(fc.double({ min: -360, max: 360, noNaN: true }), { minLength: ls.length, maxLength: ls.length }))),
        ([ls, phases]) => {
          const sum = coherentSum(ls, phases);
          expect(sum).toBeLessThanOrEqual(coherentSum(ls) + 1e-9);
          expect(sum).toBeGreaterThanOrEqual(Math.max(...ls) - COHERENT_CANCELLATION_FLOOR_DB - 1e-9);
        },
      ),
      RUN,
    );
  });

  it('refuses a phase list of the wrong length and phases outside ±360°', () => {
    expect(() => coherentSum([90, 90], [0])).toThrow(/one phase per level/);
    expect(() => coherentSum([90, 90], [0, 720])).toThrow(/Phase 2/);
    expect(() => coherentSum([90, 90], [0, Number.NaN])).toThrow(RangeError);
  });
});
