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

  it('equal paths and no offset need no delay: delayOn none (API contract)', () => {
    expect(fillDelayMs({ mainMeters: 12, fillMeters: 12 })).toEqual({ delayMs: 0, delayOn: 'none', fillLagMs: 0, pathDifferenceMeters: 0 });
  });

  it('main 5 m, fill 9 m, 10 ms offset: the fill already lags 11.66 ms, so no delay is needed (issue 13; c = 343.2 m/s, Kinsler et al.)', () => {
    const r = fillDelayMs({ mainMeters: 5, fillMeters: 9, precedenceOffsetMs: 10 });
    expect(r.delayOn).toBe('none');
    expect(r.delayMs).toBe(0);
    expect(r.fillLagMs).toBeCloseTo((4 / 343.2146) * 1000, 3);
  });

  it('main 10 m, fill 12 m and no offset: the main waits 5.827 ms (issue 13: the API named the main without saying so)', () => {
    const r = fillDelayMs({ mainMeters: 10, fillMeters: 12 });
    expect(r.delayOn).toBe('main');
    expect(r.delayMs).toBeCloseTo((2 / 343.2146) * 1000, 3);
  });

  it('a fill path 3 ms later (wireless link) needs 3 ms less delay (time of flight plus latency, definition)', () => {
    const plain = fillDelayMs({ mainMeters: 30, fillMeters: 10, precedenceOffsetMs: 5 }).delayMs;
    expect(fillDelayMs({ mainMeters: 30, fillMeters: 10, precedenceOffsetMs: 5, latencyMs: 3 }).delayMs).toBeCloseTo(plain - 3, 12);
    expect(() => fillDelayMs({ mainMeters: 30, fillMeters: 10, latencyMs: -1 })).toThrow(/latency/);
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
          if (r.delayOn === 'none') {
            // No delay: the fill already lands between the offset and the precedence window after the main.
            expect(fillArrival - mainArrival).toBeGreaterThanOrEqual(offset - 1e-6);
            expect(fillArrival - mainArrival).toBeLessThanOrEqual(Math.max(offset, 20) + 1e-6);
          } else {
            expect(fillArrival - mainArrival).toBeCloseTo(offset, 5);
          }
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
