import { METERS_PER_FOOT } from '~/lib/acoustics';
import { parseDecimal } from '~/lib/schemas/decimal';

/** Rewrites a typed value into another unit; text that is not a number yet is left alone. */
export function convertText(text: string, convert: (value: number) => number, digits = 2): string {
  const n = parseDecimal(text, true);
  if (typeof n !== 'number') return text;
  return String(Number(convert(n).toFixed(digits)));
}

export const lengthTo = (unit: string) => (value: number) => (unit === 'ft' ? value / METERS_PER_FOOT : value * METERS_PER_FOOT);
export const temperatureTo = (unit: string) => (value: number) => (unit === 'F' ? (value * 9) / 5 + 32 : ((value - 32) * 5) / 9);
export const toMeters = (value: number, unit: string) => (unit === 'ft' ? value * METERS_PER_FOOT : value);
export const fromMeters = (meters: number, unit: string) => (unit === 'ft' ? meters / METERS_PER_FOOT : meters);

export const SAMPLE_RATES = [
  { value: '44100', label: '44.1 kHz' },
  { value: '48000', label: '48 kHz' },
  { value: '88200', label: '88.2 kHz' },
  { value: '96000', label: '96 kHz' },
  { value: '192000', label: '192 kHz' },
] as const;
