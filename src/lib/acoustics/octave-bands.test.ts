import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  NOMINAL_OCTAVE_HZ,
  NOMINAL_THIRD_OCTAVE_HZ,
  OCTAVE_RATIO_G,
  bandEdgesHz,
  exactMidbandHz,
  nominalMidbandHz,
  octaveBands,
  type BandFraction,
} from './octave-bands';

const RUN = { seed: 20261202, numRuns: 500 };

// IEC 61260-1:2014 / ISO 266:1997 preferred one-third-octave frequencies, 25 Hz … 20 kHz (as printed in
// the standards and transcribed independently in python-acoustics' NOMINAL_THIRD_OCTAVE_CENTER_FREQUENCIES).
const IEC_THIRD_OCTAVE_25_TO_20K = [
  25, 31.5, 40, 50, 63, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630, 800, 1000, 1250, 1600, 2000, 2500, 3150, 4000,
  5000, 6300, 8000, 10000, 12500, 16000, 20000,
];
// The same standards' preferred octave frequencies.
const IEC_OCTAVE_31_5_TO_16K = [31.5, 63, 125, 250, 500, 1000, 2000, 4000, 8000, 16000];

describe('exact midbands (IEC 61260-1:2014 eq. 2 and 3, G = 10^(3/10), fr = 1000 Hz)', () => {
  it('G is 10^0.3 ≈ 1.99526 (IEC 61260-1 base-ten octave ratio)', () => {
    expect(OCTAVE_RATIO_G).toBeCloseTo(1.99526231, 8);
  });

  it('odd b: fm = 1000·G^(x/b)', () => {
    expect(exactMidbandHz(0, 3)).toBe(1000);
    expect(exactMidbandHz(-17, 3)).toBeCloseTo(1000 * 10 ** -1.7, 9); // the band labelled 20 Hz: 19.953 Hz
    expect(exactMidbandHz(1, 1)).toBeCloseTo(1995.262315, 5);
    expect(exactMidbandHz(-15, 3)).toBeCloseTo(31.6227766, 6); // labelled 31.5 Hz
  });

  it('even b: fm = 1000·G^((2x+1)/(2b)), so no band sits on 1 kHz', () => {
    expect(exactMidbandHz(0, 6)).toBeCloseTo(1000 * 10 ** (0.3 / 12), 9); // 1059.25 Hz
    expect(exactMidbandHz(-1, 6)).toBeCloseTo(1000 * 10 ** (-0.3 / 12), 9); // 944.06 Hz
    expect(exactMidbandHz(0, 24)).toBeCloseTo(1000 * 10 ** (0.3 / 48), 9);
  });

  it('the 1 kHz octave edges are 707.9 and 1412.5 Hz (IEC 61260-1 eq. 4 and 5: fm·G^(∓1/2))', () => {
    const { low, high } = bandEdgesHz(1000, 1);
    expect(low).toBeCloseTo(707.946, 3);
    expect(high).toBeCloseTo(1412.538, 3);
  });

  it('adjacent bands share an edge and the edges are G^(1/b) apart (property)', () => {
    // Indices chosen so every midband stays within 1 Hz … 100 kHz (G^(x/b) from 10^-3 to about 10^2).
    const bandAndIndex = fc
      .constantFrom<BandFraction>(1, 3, 6, 12, 24)
      .chain((b) => fc.tuple(fc.constant(b), fc.integer({ min: -9 * b, max: 5 * b })));
    fc.assert(
      fc.property(bandAndIndex, ([b, x]) => {
        const fm = exactMidbandHz(x, b);
        const here = bandEdgesHz(fm, b);
        const next = bandEdgesHz(exactMidbandHz(x + 1, b), b);
        expect(here.high / next.low).toBeCloseTo(1, 12);
        expect(here.high / here.low).toBeCloseTo(OCTAVE_RATIO_G ** (1 / b), 12);
        expect(Math.sqrt(here.low * here.high) / fm).toBeCloseTo(1, 12);
      }),
      RUN,
    );
  });
});

describe('nominal midbands', () => {
  it('1/3 octave, 20 Hz–20 kHz, is the standard 31-band list (IEC 61260-1 Annex E / ISO 266)', () => {
    const bands = octaveBands(3, 20, 20_000);
    expect(bands.map((b) => b.nominal)).toEqual([20, ...IEC_THIRD_OCTAVE_25_TO_20K]);
  });

  it('1/1 octave, 20 Hz–20 kHz, is 31.5 Hz … 16 kHz (IEC 61260-1 Annex E / ISO 266)', () => {
    expect(octaveBands(1).map((b) => b.nominal)).toEqual(IEC_OCTAVE_31_5_TO_16K);
  });

  it('the exported tables extend the standard lists to 10 Hz … 40 kHz and agree with the computed labels', () => {
    expect(NOMINAL_THIRD_OCTAVE_HZ.slice(4, 34)).toEqual(IEC_THIRD_OCTAVE_25_TO_20K);
    NOMINAL_THIRD_OCTAVE_HZ.forEach((f, i) => expect(nominalMidbandHz(i - 20, 3)).toBe(f));
    NOMINAL_OCTAVE_HZ.forEach((f, i) => expect(nominalMidbandHz(i - 7, 1)).toBe(f));
    expect(NOMINAL_OCTAVE_HZ.slice(2, 12)).toEqual(IEC_OCTAVE_31_5_TO_16K);
  });

  it('1/6, 1/12, 1/24: three significant digits for a leading 1–4, two for 5–9 (IEC 61260-1 Annex E, from memory)', () => {
    // exact 1059.25 Hz → 1060; exact 5308.8 Hz (1000·10^(0.3·29/12)) → 5300; exact 1883.6 → 1880.
    expect(nominalMidbandHz(0, 6)).toBe(1060);
    expect(exactMidbandHz(14, 6)).toBeCloseTo(5308.84, 1);
    expect(nominalMidbandHz(14, 6)).toBe(5300);
    expect(nominalMidbandHz(5, 6)).toBe(1880);
    expect(nominalMidbandHz(-1, 6)).toBe(940);
    expect(nominalMidbandHz(0, 12)).toBe(1030);
    expect(nominalMidbandHz(0, 24)).toBe(1010);
  });

  it('nominal labels stay within 3 % of the exact midband for every fraction (property)', () => {
    fc.assert(
      fc.property(fc.constantFrom<BandFraction>(1, 3, 6, 12, 24), fc.integer({ min: -150, max: 100 }), (b, x) => {
        const ratio = nominalMidbandHz(x, b) / exactMidbandHz(x, b);
        expect(Math.abs(ratio - 1)).toBeLessThan(0.03);
      }),
      RUN,
    );
  });
});

describe('octaveBands', () => {
  it('includes the band labelled 20 Hz although its exact midband is 19.95 Hz (decision, documented)', () => {
    const first = octaveBands(3, 20, 20_000)[0]!;
    expect(first.nominal).toBe(20);
    expect(first.exact).toBeLessThan(20);
  });

  it('returns edges that enclose the exact midband', () => {
    for (const band of octaveBands(12, 100, 200)) {
      expect(band.low).toBeLessThan(band.exact);
      expect(band.high).toBeGreaterThan(band.exact);
    }
  });

  it('has b bands per octave', () => {
    expect(octaveBands(24, 1000, 2000 * 0.999).length).toBe(24);
  });

  it('refuses an unknown fraction, a reversed range and 0 Hz', () => {
    expect(() => octaveBands(2 as BandFraction)).toThrow(/one of 1, 3, 6, 12, 24/);
    expect(() => octaveBands(3, 20_000, 20)).toThrow(/swap/);
    expect(() => octaveBands(3, 0, 20)).toThrow(RangeError);
    expect(() => octaveBands(3, Number.NaN, 20)).toThrow(RangeError);
  });
});
