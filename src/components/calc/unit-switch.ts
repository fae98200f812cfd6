import { lengthFromMeters, lengthToMeters, temperatureFromCelsius, temperatureToCelsius } from '~/lib/acoustics';
import { parseDecimal } from '~/lib/schemas/decimal';

/** Rewrites a typed value into another unit; text that is not a number yet is left alone. */
export function convertText(text: string, convert: (value: number) => number, digits = 2): string {
  const n = parseDecimal(text, true);
  if (typeof n !== 'number') return text;
  return String(Number(convert(n).toFixed(digits)));
}

/** The field's value in the new unit: typed in the other unit, converted through the one unit module. */
export const lengthTo = (unit: string) => (value: number) => (unit === 'ft' ? lengthFromMeters(value, 'ft') : lengthToMeters(value, 'ft'));
export const temperatureTo = (unit: string) => (value: number) => (unit === 'F' ? temperatureFromCelsius(value, 'F') : temperatureToCelsius(value, 'F'));
export const toMeters = lengthToMeters;
export const fromMeters = lengthFromMeters;

export const SAMPLE_RATES = [
  { value: '44100', label: '44.1 kHz' },
  { value: '48000', label: '48 kHz' },
  { value: '88200', label: '88.2 kHz' },
  { value: '96000', label: '96 kHz' },
  { value: '192000', label: '192 kHz' },
] as const;
