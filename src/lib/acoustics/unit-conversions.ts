/** Imperial ↔ metric conversions a delay calculation needs. */
import { formatNumber, requireComputed, requireFinite } from './guards';

/** One international foot in metres, exact (NIST SP 811, 2008, Appendix B.8, appendix number from memory; the 1959 international yard and pound agreement). */
export const METERS_PER_FOOT = 0.3048;

/** Absolute zero in °F (−273.15 °C × 9/5 + 32). */
export const ABSOLUTE_ZERO_FAHRENHEIT = -459.67;
/** Absolute zero in °C (SI Brochure, 9th ed., BIPM 2019). */
export const ABSOLUTE_ZERO_CELSIUS = -273.15;

function requireLength(value: unknown, unit: string): number {
  const n = requireFinite(value, 'The length', unit);
  if (n < 0) throw new RangeError(`The length must not be negative; got ${formatNumber(n)} ${unit}. Enter a distance as a positive number.`);
  return n;
}

/** Feet to metres: m = ft × 0.3048 exactly (NIST SP 811, 2008, Appendix B). */
export function metersFromFeet(feet: number): number {
  return requireLength(feet, 'ft') * METERS_PER_FOOT;
}

/** Metres to feet: ft = m / 0.3048 (NIST SP 811, 2008, Appendix B). */
export function feetFromMeters(meters: number): number {
  return requireComputed(requireLength(meters, 'm') / METERS_PER_FOOT, 'That length is too large to convert; check the number.');
}

/** °F to °C: C = (F − 32) × 5/9 (NIST SP 811, 2008, §4.2.1.1 and Appendix B.8; sections from memory). Refuses temperatures below absolute zero. */
export function celsiusFromFahrenheit(temperatureFahrenheit: number): number {
  const f = requireFinite(temperatureFahrenheit, 'The temperature', '°F');
  if (f < ABSOLUTE_ZERO_FAHRENHEIT) {
    throw new RangeError(`${formatNumber(f)} °F is below absolute zero (${ABSOLUTE_ZERO_FAHRENHEIT} °F); check the temperature and its unit.`);
  }
  return requireComputed(((f - 32) * 5) / 9, 'That temperature is too large to convert; check the number.');
}

/** °C to °F: F = C × 9/5 + 32 (NIST SP 811, 2008; as above). Refuses temperatures below absolute zero. */
export function fahrenheitFromCelsius(temperatureCelsius: number): number {
  const c = requireFinite(temperatureCelsius, 'The temperature', '°C');
  if (c < ABSOLUTE_ZERO_CELSIUS) {
    throw new RangeError(`${formatNumber(c)} °C is below absolute zero (${ABSOLUTE_ZERO_CELSIUS} °C); check the temperature and its unit.`);
  }
  return requireComputed((c * 9) / 5 + 32, 'That temperature is too large to convert; check the number.');
}
