import { describe, expect, it } from 'vitest';
import { celsiusFromFahrenheit, fahrenheitFromCelsius, feetFromMeters, metersFromFeet } from './unit-conversions';

describe('feet ↔ metres (1 ft = 0.3048 m exactly, NIST SP 811)', () => {
  it('1 ft is 0.3048 m and 100 ft is 30.48 m', () => {
    expect(metersFromFeet(1)).toBe(0.3048);
    expect(metersFromFeet(100)).toBeCloseTo(30.48, 12);
  });
  it('1 m is 3.28084 ft', () => {
    expect(feetFromMeters(1)).toBeCloseTo(3.280839895, 9);
  });
  it('refuses negative and non-finite lengths', () => {
    expect(() => metersFromFeet(-1)).toThrow(/must not be negative/);
    expect(() => feetFromMeters(Number.NaN)).toThrow(RangeError);
  });
});

describe('Fahrenheit ↔ Celsius (NIST SP 811)', () => {
  it('32 °F = 0 °C, 212 °F = 100 °C, 68 °F = 20 °C, −40 = −40', () => {
    expect(celsiusFromFahrenheit(32)).toBe(0);
    expect(celsiusFromFahrenheit(212)).toBe(100);
    expect(celsiusFromFahrenheit(68)).toBeCloseTo(20, 12);
    expect(celsiusFromFahrenheit(-40)).toBe(-40);
    expect(fahrenheitFromCelsius(-40)).toBe(-40);
    expect(fahrenheitFromCelsius(37)).toBeCloseTo(98.6, 12);
  });
  it('refuses temperatures below absolute zero (−459.67 °F, −273.15 °C)', () => {
    expect(() => celsiusFromFahrenheit(-500)).toThrow(/below absolute zero/);
    expect(() => fahrenheitFromCelsius(-300)).toThrow(/below absolute zero/);
    expect(() => fahrenheitFromCelsius(Number.POSITIVE_INFINITY)).toThrow(RangeError);
  });
});
