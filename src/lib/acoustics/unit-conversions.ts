/** Imperial ↔ metric conversions a delay calculation needs. */
import { formatNumber, requireComputed, requireFinite, requireInRange } from './guards';
import { LIMITS } from './limits';

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

/** Length units a person may type. */
export type LengthUnit = 'm' | 'ft';
/** Temperature units a person may type. */
export type TemperatureUnit = 'C' | 'F';

/**
 * Plain conversions without checks, for bounds and for rewriting a field when its unit is toggled.
 * The one home of these factors: the maths, the route schemas and the islands all call these
 * (NIST SP 811, 2008, Appendix B: 1 ft = 0.3048 m exactly, °F = °C × 9/5 + 32).
 */
const TOO_LARGE = 'That number is too large to convert; check it.';
export function lengthToMeters(value: number, unit: LengthUnit | string): number {
  const n = requireFinite(value, 'The length', unit === 'ft' ? 'ft' : 'm');
  return unit === 'ft' ? n * METERS_PER_FOOT : n;
}
export function lengthFromMeters(meters: number, unit: LengthUnit | string): number {
  const n = requireFinite(meters, 'The length', 'm');
  return unit === 'ft' ? requireComputed(n / METERS_PER_FOOT, TOO_LARGE) : n;
}
export function temperatureToCelsius(value: number, unit: TemperatureUnit | string): number {
  const n = requireFinite(value, 'The temperature', unit === 'F' ? '°F' : '°C');
  return unit === 'F' ? requireComputed(((n - 32) * 5) / 9, TOO_LARGE) : n;
}
export function temperatureFromCelsius(celsius: number, unit: TemperatureUnit | string): number {
  const n = requireFinite(celsius, 'The temperature', '°C');
  return unit === 'F' ? requireComputed((n * 9) / 5 + 32, TOO_LARGE) : n;
}

/** A metric range expressed in the unit the person typed, so a refusal speaks that unit. */
export function lengthRangeIn(unit: LengthUnit | string, range: { min: number; max: number }): { min: number; max: number } {
  if (typeof range !== 'object' || range === null) throw new RangeError('The range must have a minimum and a maximum (min, max).');
  return { min: lengthFromMeters(range.min, unit), max: lengthFromMeters(range.max, unit) };
}

/** A °C range expressed in the unit the person typed. */
export function temperatureRangeIn(unit: TemperatureUnit | string, range: { min: number; max: number }): { min: number; max: number } {
  if (typeof range !== 'object' || range === null) throw new RangeError('The range must have a minimum and a maximum (min, max).');
  return { min: temperatureFromCelsius(range.min, unit), max: temperatureFromCelsius(range.max, unit) };
}

/**
 * An air temperature typed in `unit`, checked against LIMITS.temperatureCelsius expressed in that
 * same unit (so 150 °F is refused as "at most 140 °F; got 150 °F", never in °C), returned in °C.
 */
export function celsiusFromTyped(value: number, unit: TemperatureUnit | string): number {
  const symbol = unit === 'F' ? '°F' : '°C';
  const typed = requireInRange(value, temperatureRangeIn(unit, LIMITS.temperatureCelsius), 'The temperature', symbol, {
    hint: 'Enter the air temperature where the audience is.',
  });
  return temperatureToCelsius(typed, unit);
}

/** A distance typed in `unit`, checked against LIMITS.distanceMeters in that unit, returned in metres. */
export function metersFromTyped(value: number, unit: LengthUnit | string, label = 'The distance', minExclusive = false): number {
  const typed = requireInRange(value, lengthRangeIn(unit, LIMITS.distanceMeters), label, unit === 'ft' ? 'ft' : 'm', { minExclusive });
  return lengthToMeters(typed, unit);
}
