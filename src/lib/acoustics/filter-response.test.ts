import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cascadeResponse, chainComplexResponse, filterSections, type FilterSpec } from './filter-response';
import { biquadResponse } from './biquad-response';
import { designBiquad } from './biquad';
import { logFrequencyGrid } from './frequency-grid';
import { wrapPhaseDeg } from './wrap-phase';

const RUN = { seed: 20261202, numRuns: 500 };
const FS = 48_000;

describe('cascadeResponse', () => {
  it('an empty chain is a wire: 0 dB and 0°', () => {
    expect(cascadeResponse([], [20, 1000, 24_000], FS)).toEqual({ freqs: [20, 1000, 24_000], magnitudeDb: [0, 0, 0], phaseDeg: [0, 0, 0] });
  });

  it('one filter answers what its biquad answers', () => {
    const spec: FilterSpec = { type: 'peaking', freq: 2500, gain: -4.5, q: 3 };
    const c = designBiquad({ type: 'peaking', frequencyHz: 2500, gainDb: -4.5, q: 3, sampleRateHz: FS });
    const r = cascadeResponse([spec], [100, 2500, 9000], FS);
    r.freqs.forEach((f, i) => {
      const single = biquadResponse(c, f, FS);
      expect(r.magnitudeDb[i]!).toBeCloseTo(single.magnitudeDb, 10);
      expect(r.phaseDeg[i]!).toBeCloseTo(single.phaseDeg, 10);
    });
  });

  it('gains add in dB: two +6 dB peaks at the same f0 give +12 dB there (cookbook peaking gain at f0)', () => {
    const peak: FilterSpec = { type: 'peaking', freq: 1000, gain: 6, q: 1.4 };
    expect(cascadeResponse([peak, peak], [1000], FS).magnitudeDb[0]!).toBeCloseTo(12, 9);
  });

  it('shelves take slope as the cookbook S when q is absent, q when given', () => {
    const viaSlope = filterSections({ type: 'lowshelf', freq: 120, gain: 6, slope: 0.5 }, FS)[0];
    const cookbook = designBiquad({ type: 'lowshelf', frequencyHz: 120, gainDb: 6, shelfSlope: 0.5, sampleRateHz: FS });
    expect(viaSlope).toEqual(cookbook);
    const viaQ = filterSections({ type: 'lowshelf', freq: 120, gain: 6, slope: 0.5, q: 2 }, FS)[0];
    expect(viaQ).toEqual(designBiquad({ type: 'lowshelf', frequencyHz: 120, gainDb: 6, q: 2, sampleRateHz: FS }));
  });

  it('crossovers default to Linkwitz-Riley 24 dB/oct', () => {
    const r = cascadeResponse([{ type: 'crossover-low', freq: 100 }], [100], FS);
    expect(r.magnitudeDb[0]!).toBeCloseTo(-6.0206, 4);
    expect(filterSections({ type: 'crossover-high', freq: 100 }, FS)).toHaveLength(2);
  });

  it('LR24 low + high chains sum flat through chainComplexResponse (Linkwitz 1976)', () => {
    for (const f of logFrequencyGrid(10, 24_000, 64)) {
      const low = chainComplexResponse([{ type: 'crossover-low', freq: 90 }], f, FS);
      const high = chainComplexResponse([{ type: 'crossover-high', freq: 90 }], f, FS);
      expect(Math.abs(20 * Math.log10(Math.hypot(low.re + high.re, low.im + high.im)))).toBeLessThan(0.01);
    }
  });

  it('keeps every magnitude finite and every phase in (−180, 180] for random chains (property)', () => {
    const filter = fc.record({
      type: fc.constantFrom<FilterSpec['type']>('peaking', 'lowshelf', 'highshelf', 'lowpass', 'highpass', 'bandpass', 'notch', 'allpass', 'crossover-low', 'crossover-high'),
      freq: fc.double({ min: 20, max: 20_000, noNaN: true }),
      gain: fc.double({ min: -24, max: 24, noNaN: true }),
      q: fc.double({ min: 0.3, max: 20, noNaN: true }),
    });
    fc.assert(
      fc.property(fc.array(filter, { maxLength: 8 }), (filters) => {
        const r = cascadeResponse(filters, logFrequencyGrid(10, 24_000, 32), FS);
        for (const m of r.magnitudeDb) expect(Number.isFinite(m)).toBe(true);
        for (const p of r.phaseDeg) {
          expect(p).toBeGreaterThan(-180);
          expect(p).toBeLessThanOrEqual(180);
        }
      }),
      { ...RUN, numRuns: 200 },
    );
  });

  it('answers finite values across the whole LIMITS domain, including 1 Hz filters at 384 kHz and f0 near Nyquist (property)', () => {
    const anySpec = (fs: number) =>
      fc.oneof(
        fc.record({
          type: fc.constantFrom<FilterSpec['type']>('peaking', 'lowshelf', 'highshelf', 'lowpass', 'highpass', 'bandpass', 'notch', 'allpass'),
          freq: fc.double({ min: 1, max: fs / 2, maxExcluded: true, noNaN: true }),
          gain: fc.double({ min: -40, max: 40, noNaN: true }),
          q: fc.option(fc.double({ min: 0.1, max: 100, noNaN: true }), { nil: undefined }),
          slope: fc.double({ min: 0.1, max: 1, noNaN: true }),
        }),
        fc.record({
          type: fc.constantFrom<FilterSpec['type']>('crossover-low', 'crossover-high'),
          freq: fc.double({ min: 1, max: fs / 2, maxExcluded: true, noNaN: true }),
          family: fc.constant<'linkwitz-riley'>('linkwitz-riley'),
          slope: fc.constantFrom(12, 24, 36, 48),
        }),
        fc.record({
          type: fc.constantFrom<FilterSpec['type']>('crossover-low', 'crossover-high'),
          freq: fc.double({ min: 1, max: fs / 2, maxExcluded: true, noNaN: true }),
          family: fc.constant<'butterworth'>('butterworth'),
          slope: fc.constantFrom(6, 12, 18, 24, 36, 48),
        }),
      );
    const scenario = fc
      .constantFrom(8_000, 44_100, 48_000, 96_000, 384_000)
      .chain((fs) =>
        fc.tuple(
          fc.constant(fs),
          fc.array(anySpec(fs), { minLength: 1, maxLength: 32 }),
          fc.array(fc.double({ min: 1, max: fs / 2, noNaN: true }), { minLength: 1, maxLength: 16 }),
        ),
      );
    fc.assert(
      fc.property(scenario, ([fs, filters, freqs]) => {
        const r = cascadeResponse(filters as FilterSpec[], freqs, fs);
        for (const m of r.magnitudeDb) expect(Number.isFinite(m)).toBe(true);
        for (const p of r.phaseDeg) expect(Number.isFinite(p)).toBe(true);
        const h = chainComplexResponse(filters as FilterSpec[], freqs[0]!, fs);
        expect(Number.isFinite(h.re) && Number.isFinite(h.im)).toBe(true);
      }),
      { ...RUN, numRuns: 300 },
    );
  });

  it('a notch exactly on a grid point reports a finite floor, not −Infinity', () => {
    const r = cascadeResponse([{ type: 'notch', freq: 1000, q: 5 }], [1000], FS);
    expect(Number.isFinite(r.magnitudeDb[0])).toBe(true);
    expect(r.magnitudeDb[0]!).toBeLessThan(-200);
  });

  it('refuses frequencies above Nyquist, too many filters and unknown types, naming the filter', () => {
    expect(() => cascadeResponse([], [1000, 30_000], FS)).toThrow(/Response frequency 2.*half the sample rate/);
    expect(() => cascadeResponse([], [0], FS)).toThrow(RangeError);
    expect(() => cascadeResponse([], [], FS)).toThrow(/at least 1/);
    expect(() => cascadeResponse([{ type: 'lowpass', freq: 100 }, { type: 'peaking', freq: 25_000, gain: 3 }], [1000], FS)).toThrow(
      /^Filter 2: .*below 24000 Hz/,
    );
    expect(() => cascadeResponse([{ type: 'wah' as never, freq: 100 }], [1000], FS)).toThrow(/Filter 1: The filter type must be one of/);
    expect(() => cascadeResponse(new Array(33).fill({ type: 'lowpass', freq: 100 }), [1000], FS)).toThrow(/at most 32/);
    expect(() => cascadeResponse([{ type: 'crossover-low', freq: 100, slope: 30 }], [1000], FS)).toThrow(/slope/);
    expect(() => cascadeResponse([{ type: 'peaking', freq: Number.NaN }], [1000], FS)).toThrow(RangeError);
    expect(() => cascadeResponse([], [1000], 0)).toThrow(/sample rate/);
  });
});

describe('logFrequencyGrid', () => {
  it('spans exactly from → to with a constant ratio', () => {
    const grid = logFrequencyGrid(10, 24_000, 100);
    expect(grid).toHaveLength(100);
    expect(grid[0]).toBe(10);
    expect(grid[99]).toBe(24_000);
    const step = grid[1]! / grid[0]!;
    for (let i = 1; i < grid.length; i++) expect(grid[i]! / grid[i - 1]!).toBeCloseTo(step, 10);
  });

  it('defaults to 10 Hz … 24 kHz', () => {
    const grid = logFrequencyGrid();
    expect(grid[0]).toBe(10);
    expect(grid[grid.length - 1]).toBe(24_000);
  });

  it('refuses one point, reversed ranges and 0 Hz', () => {
    expect(() => logFrequencyGrid(10, 24_000, 1)).toThrow(/number of points/);
    expect(() => logFrequencyGrid(1000, 100, 10)).toThrow(/swap/);
    expect(() => logFrequencyGrid(0, 100, 10)).toThrow(RangeError);
    expect(() => logFrequencyGrid(10, 100, 2.5)).toThrow(RangeError);
  });
});

describe('wrapPhaseDeg ((−180, 180], principal argument)', () => {
  it('wraps the edges the right way', () => {
    expect(wrapPhaseDeg(180)).toBe(180);
    expect(wrapPhaseDeg(-180)).toBe(180);
    expect(wrapPhaseDeg(540)).toBe(180);
    expect(wrapPhaseDeg(-190)).toBe(170);
    expect(wrapPhaseDeg(359)).toBe(-1);
    expect(wrapPhaseDeg(0)).toBe(0);
  });
  it('always lands in (−180, 180] and differs by whole turns (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (p) => {
        const w = wrapPhaseDeg(p);
        expect(w).toBeGreaterThan(-180);
        expect(w).toBeLessThanOrEqual(180);
        const turns = (p - w) / 360;
        expect(Math.abs(turns - Math.round(turns))).toBeLessThan(1e-6);
      }),
      RUN,
    );
  });
  it('refuses NaN', () => {
    expect(() => wrapPhaseDeg(Number.NaN)).toThrow(RangeError);
  });
});
