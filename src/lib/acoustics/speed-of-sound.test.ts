import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { speedOfSound } from './speed-of-sound';

const RUN = { seed: 20261202, numRuns: 500 };

describe('speedOfSound (ideal gas, c = 331.3·√(1 + T/273.15))', () => {
  it('is 331.3 m/s at 0 °C (the ideal-gas reference value)', () => {
    expect(speedOfSound(0)).toBe(331.3);
  });

  it('is 343.2 m/s at 20 °C within 0.1 (widely printed value for dry air, from memory)', () => {
    expect(Math.abs(speedOfSound(20) - 343.2)).toBeLessThan(0.1);
    expect(speedOfSound()).toBe(speedOfSound(20));
  });

  it('is about 349.0 m/s at 30 °C and 325.1 m/s at −10 °C (same formula, tabulated in acoustics texts; from memory)', () => {
    expect(Math.abs(speedOfSound(30) - 349.0)).toBeLessThan(0.1);
    expect(Math.abs(speedOfSound(-10) - 325.1)).toBeLessThan(0.1);
  });

  it('rises with temperature (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -60, max: 59.9, noNaN: true }), fc.double({ min: 0.01, max: 10, noNaN: true }), (t, dt) => {
        expect(speedOfSound(Math.min(t + dt, 60))).toBeGreaterThan(speedOfSound(t));
      }),
      RUN,
    );
  });

  it('refuses −300 °C, NaN, Infinity and a sauna, saying what to enter', () => {
    expect(() => speedOfSound(-300)).toThrow(/temperature must be at least -60 °C.*got -300 °C/);
    expect(() => speedOfSound(Number.NaN)).toThrow(/finite number/);
    expect(() => speedOfSound(Number.POSITIVE_INFINITY)).toThrow(RangeError);
    expect(() => speedOfSound(90)).toThrow(RangeError);
  });
});
