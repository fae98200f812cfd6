import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { fillDelayMs } from './fill-delay';
import { speedOfSound } from './speed-of-sound';

const RUN = { seed: 20261202, numRuns: 500 };

describe('fillDelayMs ((main − fill)/c·1000 + offset)', () => {
  it('a front fill 20 m closer than the main waits 58.27 ms at 20 °C (ideal-gas c = 343.2 m/s)', () => {
    const result = fillDelayMs({ mainMeters: 30, fillMeters: 10 });
    expect(result.delayOn).toBe('fill');
    expect(result.delayMs).toBeCloseTo((20 / 343.2146) * 1000, 3);
    expect(result.pathDifferenceMeters).toBe(20);
  });

  it('adds the precedence offset so the main arrives first (Haas 1972; 5–10 ms common practice)', () => {
    const base = fillDelayMs({ mainMeters: 30, fillMeters: 10 }).delayMs;
    expect(fillDelayMs({ mainMeters: 30, fillMeters: 10, precedenceOffsetMs: 10 }).delayMs).toBeCloseTo(base + 10, 12);
  });

  it('equal paths and no offset need no delay, reported on the fill', () => {
    expect(fillDelayMs({ mainMeters: 12, fillMeters: 12 })).toEqual({ delayMs: 0, delayOn: 'fill', pathDifferenceMeters: 0 });
  });

  it('when the fill is farther than the main, answers the delay the MAIN would need (decision)', () => {
    const result = fillDelayMs({ mainMeters: 10, fillMeters: 30, temperatureCelsius: 20, precedenceOffsetMs: 5 });
    expect(result.delayOn).toBe('main');
    expect(result.delayMs).toBeCloseTo((20 / speedOfSound(20)) * 1000 - 5, 12);
  });

  it('never answers a negative delay, and the arrivals work out (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 2000, noNaN: true }),
        fc.double({ min: 0, max: 2000, noNaN: true }),
        fc.double({ min: -60, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 50, noNaN: true }),
        (main, fill, t, offset) => {
          const r = fillDelayMs({ mainMeters: main, fillMeters: fill, temperatureCelsius: t, precedenceOffsetMs: offset });
          expect(r.delayMs).toBeGreaterThanOrEqual(0);
          const c = speedOfSound(t);
          const mainArrival = (main / c) * 1000 + (r.delayOn === 'main' ? r.delayMs : 0);
          const fillArrival = (fill / c) * 1000 + (r.delayOn === 'fill' ? r.delayMs : 0);
          expect(fillArrival - mainArrival).toBeCloseTo(offset, 6);
        },
      ),
      RUN,
    );
  });

  it('refuses negative distances, NaN, −300 °C, a negative offset and a missing input', () => {
    expect(() => fillDelayMs({ mainMeters: -1, fillMeters: 3 })).toThrow(/main distance/);
    expect(() => fillDelayMs({ mainMeters: 10, fillMeters: Number.NaN })).toThrow(/fill distance/);
    expect(() => fillDelayMs({ mainMeters: 10, fillMeters: 3, temperatureCelsius: -300 })).toThrow(/temperature/);
    expect(() => fillDelayMs({ mainMeters: 10, fillMeters: 3, precedenceOffsetMs: -5 })).toThrow(/precedence offset/);
    expect(() => fillDelayMs(undefined as never)).toThrow(RangeError);
  });
});
