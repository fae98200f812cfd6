import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { delayMs, distanceFromMs, msToSamples, samplesToMs } from './delay';
import { speedOfSound } from './speed-of-sound';

const RUN = { seed: 20261202, numRuns: 500 };

describe('delayMs / distanceFromMs', () => {
  it('sound covers about 343 m in one second at 20 °C (ideal-gas speed)', () => {
    expect(delayMs(343.2, 20)).toBeCloseTo(1000, 0);
  });

  it('is about 2.91 ms per metre at 20 °C (common practice rule of thumb: "3 ms per metre")', () => {
    expect(delayMs(1, 20)).toBeCloseTo(2.9136, 3);
  });

  it('is about 0.88 ms per foot at 20 °C (common practice: "about 1 ms per foot")', () => {
    expect(delayMs(0.3048, 20)).toBeCloseTo(0.888, 3);
  });

  it('distanceFromMs inverts delayMs', () => {
    expect(distanceFromMs(delayMs(57.5, 12), 12)).toBeCloseTo(57.5, 10);
    expect(distanceFromMs(1000, 0)).toBeCloseTo(331.3, 10);
  });

  it('grows with distance and shrinks as the air warms (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1999, noNaN: true }),
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        fc.double({ min: -60, max: 59, noNaN: true }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (d, dd, t, dt) => {
          expect(delayMs(d + dd, t)).toBeGreaterThan(delayMs(d, t));
          // Distances near the smallest float give delays that round to the same number; a millimetre is plenty.
          if (d >= 0.001) expect(delayMs(d, t + dt)).toBeLessThan(delayMs(d, t));
        },
      ),
      RUN,
    );
  });

  it('uses the same speed as speedOfSound', () => {
    expect(delayMs(100, -5)).toBeCloseTo((100 / speedOfSound(-5)) * 1000, 12);
  });
});

describe('msToSamples / samplesToMs (n = t·fs)', () => {
  it('1 ms is 48 samples at 48 kHz and 44.1 samples at 44.1 kHz', () => {
    expect(msToSamples(1, 48_000)).toBe(48);
    expect(msToSamples(1, 44_100)).toBeCloseTo(44.1, 12);
    expect(samplesToMs(48, 48_000)).toBe(1);
    expect(samplesToMs(96, 96_000)).toBe(1);
  });
  it('round-trips (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 10_000, noNaN: true }), fc.constantFrom(44_100, 48_000, 96_000, 192_000), (ms, fs) => {
        expect(samplesToMs(msToSamples(ms, fs), fs)).toBeCloseTo(ms, 8);
      }),
      RUN,
    );
  });
});

describe('hostile delay inputs', () => {
  it('refuses negative distances, NaN, Infinity, −300 °C and silly sample rates', () => {
    expect(() => delayMs(-1)).toThrow(/at least 0 m/);
    expect(() => delayMs(Number.NaN)).toThrow(RangeError);
    expect(() => delayMs(Number.POSITIVE_INFINITY)).toThrow(RangeError);
    expect(() => delayMs(10, -300)).toThrow(/temperature/);
    expect(() => msToSamples(1, 0)).toThrow(/sample rate/);
    expect(() => msToSamples(-1, 48_000)).toThrow(RangeError);
    expect(() => samplesToMs(-1, 48_000)).toThrow(RangeError);
    expect(() => distanceFromMs(Number.NaN)).toThrow(RangeError);
  });
});
