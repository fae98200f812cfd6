import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { butterworthSectionQs, crossoverSections, usualHighPolarity, type CrossoverFamily } from './crossover';
import { cascadeComplexResponse } from './biquad-response';
import { cascadeResponse, type FilterSpec } from './filter-response';

const RUN = { seed: 20261202, numRuns: 500 };
const dB = (h: { re: number; im: number }) => 20 * Math.log10(Math.hypot(h.re, h.im));
/** Difference of two angles in degrees, folded to [0, 180]. */
const angleGap = (a: number, b: number) => Math.abs((((a - b) % 360) + 540) % 360 - 180);

describe('Butterworth section Qs (Williams & Taylor, Electronic Filter Design Handbook, pole tables; from memory)', () => {
  it('order 2: 0.7071; order 3: 1.0 plus a first-order section', () => {
    expect(butterworthSectionQs(2)).toEqual({ firstOrder: false, qs: [expect.closeTo(0.7071, 4)] });
    const third = butterworthSectionQs(3);
    expect(third.firstOrder).toBe(true);
    expect(third.qs[0]!).toBeCloseTo(1, 12);
  });
  it('order 4: 1.3066 and 0.5412', () => {
    const { qs } = butterworthSectionQs(4);
    expect(qs[0]!).toBeCloseTo(1.3066, 4);
    expect(qs[1]!).toBeCloseTo(0.5412, 4);
  });
  it('order 6: 1.9319, 0.7071, 0.5176', () => {
    const { qs } = butterworthSectionQs(6);
    [1.9319, 0.7071, 0.5176].forEach((q, i) => expect(qs[i]!).toBeCloseTo(q, 4));
  });
  it('order 8: 2.5629, 0.9000, 0.6013, 0.5098', () => {
    const { qs } = butterworthSectionQs(8);
    [2.5629, 0.9, 0.6013, 0.5098].forEach((q, i) => expect(qs[i]!).toBeCloseTo(q, 4));
  });
  it('refuses orders it does not build', () => {
    expect(() => butterworthSectionQs(0)).toThrow(RangeError);
    expect(() => butterworthSectionQs(2.5)).toThrow(RangeError);
    expect(() => butterworthSectionQs(9)).toThrow(RangeError);
  });
});

// SciPy 1.17.1, scipy.signal.butter(..., output='sos') and sosfreqz at [100, 1000, 2000, 5000, 15000] Hz,
// computed outside this project (LR = the Butterworth sos stacked twice). Magnitudes in dB, phases in degrees.
const FREQS = [100, 1000, 2000, 5000, 15_000];
const SCIPY: { name: string; spec: FilterSpec; fs: number; db: number[]; deg: number[] }[] = [
  {
    name: 'Butterworth 24 dB/oct high-pass, 2 kHz, 44.1 kHz',
    spec: { type: 'crossover-high', freq: 2000, slope: 24, family: 'butterworth' },
    fs: 44_100,
    db: [-104.318022609, -24.276023235, -3.010299957, -0.002120003, -6e-9],
    deg: [-7.437993133, -77.528771847, 180.0, 59.039380561, 11.805363718],
  },
  {
    name: 'Butterworth 18 dB/oct low-pass, 500 Hz, 48 kHz',
    spec: { type: 'crossover-low', freq: 500, slope: 18, family: 'butterworth' },
    fs: 48_000,
    db: [-0.000277369, -18.156645674, -36.264750054, -60.944856599, -99.604422186],
    deg: [-23.070197643, 150.183336992, 118.808690145, 101.068408955, 92.506764733],
  },
  {
    name: 'Linkwitz-Riley 24 dB/oct low-pass, 1200 Hz, 96 kHz',
    spec: { type: 'crossover-low', freq: 1200, slope: 24, family: 'linkwitz-riley' },
    fs: 96_000,
    db: [-0.000418015, -3.416671081, -18.834545526, -49.905063087, -90.694137264],
    deg: [-13.528932774, -150.905407549, 105.842278313, 39.268107398, 11.933642735],
  },
  {
    name: 'Linkwitz-Riley 48 dB/oct high-pass, 80 Hz, 48 kHz',
    spec: { type: 'crossover-high', freq: 80, slope: 48, family: 'linkwitz-riley' },
    fs: 48_000,
    db: [-1.34711103, -1.4e-8, 0, 0, 0],
    deg: [-88.283400436, 23.942536932, 11.911909503, 4.619006417, 1.047632299],
  },
  {
    name: 'Butterworth 48 dB/oct low-pass, 3 kHz, 48 kHz',
    spec: { type: 'crossover-low', freq: 3000, slope: 48, family: 'butterworth' },
    fs: 48_000,
    db: [0, -8.4e-8, -0.005885279, -37.139955223, -140.231300305],
    deg: [-9.66484773, -98.060342825, 153.153312712, -179.756169985, 39.115127651],
  },
];

describe('crossover sides match SciPy\'s Butterworth designs', () => {
  for (const ref of SCIPY) {
    it(ref.name, () => {
      const r = cascadeResponse([ref.spec], FREQS, ref.fs);
      r.magnitudeDb.forEach((m, i) => expect(Math.abs(m - ref.db[i]!)).toBeLessThan(1e-6));
      r.phaseDeg.forEach((p, i) => expect(angleGap(p, ref.deg[i]!)).toBeLessThan(1e-6));
    });
  }
});

describe('crossover points', () => {
  const sampleRates = [44_100, 48_000, 96_000];
  for (const slope of [12, 24, 36, 48]) {
    it(`Linkwitz-Riley ${slope}: both sides −6.02 dB at the crossover (Linkwitz 1976)`, () => {
      for (const fs of sampleRates) {
        for (const side of ['low', 'high'] as const) {
          const h = cascadeComplexResponse(crossoverSections(side, 'linkwitz-riley', slope, 1000, fs), 1000, fs);
          expect(dB(h)).toBeCloseTo(-6.0206, 4);
        }
      }
    });
  }
  for (const slope of [6, 12, 18, 24, 36, 48]) {
    it(`Butterworth ${slope}: both sides −3.01 dB at the crossover`, () => {
      for (const fs of sampleRates) {
        for (const side of ['low', 'high'] as const) {
          const h = cascadeComplexResponse(crossoverSections(side, 'butterworth', slope, 250, fs), 250, fs);
          expect(dB(h)).toBeCloseTo(-3.0103, 4);
        }
      }
    });
  }

  it('far from the crossover each side falls at its nominal slope (Butterworth asymptote n·6 dB/oct)', () => {
    for (const slope of [12, 24, 48]) {
      const sections = crossoverSections('low', 'butterworth', slope, 100, 96_000);
      const drop = dB(cascadeComplexResponse(sections, 1600, 96_000)) - dB(cascadeComplexResponse(sections, 3200, 96_000));
      expect(drop).toBeCloseTo(slope, 0);
    }
  });
});

describe('Linkwitz-Riley sum is flat (Linkwitz, JAES 24(1) 1976)', () => {
  it('low + high = 0 dB ± 0.01 at any frequency, for random crossovers, slopes and sample rates (property)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(44_100, 48_000, 88_200, 96_000, 192_000),
        fc.constantFrom(12, 24, 36, 48),
        fc.double({ min: 20, max: 20_000, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (fs, slope, crossoverHz, where) => {
          const fc0 = Math.min(crossoverHz, 0.45 * fs);
          const f = 10 * (fs / 2 / 10) ** where; // log-uniform from 10 Hz to Nyquist
          const low = cascadeComplexResponse(crossoverSections('low', 'linkwitz-riley', slope, fc0, fs), f, fs);
          const high = cascadeComplexResponse(crossoverSections('high', 'linkwitz-riley', slope, fc0, fs), f, fs);
          // The high side wired as the crossover is usually wired: inverted for LR12 and LR36.
          const sign = usualHighPolarity('linkwitz-riley', slope) === 'inverted' ? -1 : 1;
          expect(Math.abs(dB({ re: low.re + sign * high.re, im: low.im + sign * high.im }))).toBeLessThan(0.01);
        },
      ),
      RUN,
    );
  });

  it('LR12 and LR36 sides come out normal; wired normal/normal they null at the crossover, so the advice is to invert the high side', () => {
    expect(usualHighPolarity('linkwitz-riley', 12)).toBe('inverted');
    expect(usualHighPolarity('linkwitz-riley', 36)).toBe('inverted');
    expect(usualHighPolarity('linkwitz-riley', 24)).toBe('normal');
    expect(usualHighPolarity('linkwitz-riley', 48)).toBe('normal');
    expect(usualHighPolarity('butterworth', 12)).toBe('normal');
    const low = cascadeComplexResponse(crossoverSections('low', 'linkwitz-riley', 12, 1000, 48_000), 1000, 48_000);
    const high = cascadeComplexResponse(crossoverSections('high', 'linkwitz-riley', 12, 1000, 48_000), 1000, 48_000);
    // Nothing inverted silently: the in-phase sum nulls (Linkwitz 1976, odd-order LR), the difference is flat.
    expect(dB({ re: low.re + high.re, im: low.im + high.im })).toBeLessThan(-100);
    expect(Math.abs(dB({ re: low.re - high.re, im: low.im - high.im }))).toBeLessThan(0.01);
  });

  it('LR24 low side is two cookbook Butterworth Q = 0.7071 sections', () => {
    const sections = crossoverSections('low', 'linkwitz-riley', 24, 500, 48_000);
    expect(sections).toHaveLength(2);
    expect(sections[0]).toEqual(sections[1]);
  });
});

describe('hostile crossover inputs', () => {
  it('refuses slopes a family does not have, unknown families, Nyquist and 0 Hz', () => {
    expect(() => crossoverSections('low', 'linkwitz-riley', 18, 100, 48_000)).toThrow(/12, 24, 36, 48/);
    expect(() => crossoverSections('low', 'bessel' as CrossoverFamily, 24, 100, 48_000)).toThrow(/family/);
    expect(() => crossoverSections('low', 'butterworth', 24, 24_000, 48_000)).toThrow(/half the sample rate/);
    expect(() => crossoverSections('low', 'butterworth', 24, 0, 48_000)).toThrow(RangeError);
    expect(() => crossoverSections('middle' as never, 'butterworth', 24, 100, 48_000)).toThrow(/side/);
  });
});
