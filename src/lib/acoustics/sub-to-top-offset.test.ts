import { describe, expect, it } from 'vitest';
import { msToPhaseDeg, periodMs, phaseToMs, subToTopOffset } from './sub-to-top-offset';

// Δt = Δφ/360/f and T = 1/f: definitions of phase and period.
describe('crossover timing', () => {
  it('one period at 100 Hz is 10 ms, at 80 Hz 12.5 ms', () => {
    expect(periodMs(100)).toBe(10);
    expect(periodMs(80)).toBe(12.5);
  });

  it('90° at 100 Hz is 2.5 ms, and back', () => {
    expect(phaseToMs(90, 100)).toBe(2.5);
    expect(msToPhaseDeg(2.5, 100)).toBe(90);
    expect(phaseToMs(-180, 100)).toBe(-5);
  });

  it('a sub lagging 90° at an 80 Hz crossover needs the top delayed by 3.125 ms', () => {
    expect(subToTopOffset(80, 90)).toEqual({ periodMs: 12.5, offsetMs: 3.125, delayOn: 'top' });
  });

  it('a sub leading the top means the sub is delayed instead', () => {
    expect(subToTopOffset(100, -45)).toEqual({ periodMs: 10, offsetMs: 1.25, delayOn: 'sub' });
  });

  it('refuses 0 Hz, NaN and phases beyond ±360°', () => {
    expect(() => periodMs(0)).toThrow(RangeError);
    expect(() => subToTopOffset(Number.NaN, 0)).toThrow(/crossover frequency/);
    expect(() => phaseToMs(400, 100)).toThrow(/phase difference/);
  });
});
