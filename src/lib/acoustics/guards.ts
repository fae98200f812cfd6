/**
 * Input checks shared by the acoustics functions. Every refusal is a RangeError whose message
 * says what was wrong and what to enter instead, so a route can pass it straight to the person.
 * (No published source: these are this project's conventions.)
 */
import type { NumericRange } from './limits';

/** Shows a number the way a person typed it, without 17 digits of float noise. */
export function formatNumber(value: unknown): string {
  if (typeof value !== 'number') return value === undefined ? 'nothing' : `"${String(value)}"`;
  if (Number.isNaN(value)) return 'not a number';
  if (!Number.isFinite(value)) return value > 0 ? 'infinity' : 'minus infinity';
  // 12 significant digits: enough that a bound never rounds onto a typed value next to it
  // (6561.67979 ft, not 6561.68), few enough to hide binary float noise.
  return String(Number(value.toPrecision(12)));
}

function withUnit(value: string, unit: string): string {
  return unit ? `${value} ${unit}` : value;
}

/** Refuses anything that is not a finite number (NaN, ±Infinity, strings, undefined). */
export function requireFinite(value: unknown, label: string, unit = ''): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${label} must be a finite number${unit ? ` in ${unit}` : ''}; got ${formatNumber(value)}.`);
  }
  return value;
}

export interface RangeOptions {
  /** Refuse the minimum itself (for quantities that must be strictly positive). */
  minExclusive?: boolean;
  /** Refuse the maximum itself (for frequencies that must stay below Nyquist). */
  maxExclusive?: boolean;
  /** A sentence appended to the message that tells the person what to do. */
  hint?: string;
}

/**
 * "The temperature must be at least -60 °C and at most 60 °C; got -300 °C." — or undefined when
 * `n` is inside. The one sentence for a number out of range, for the math and the route schemas.
 */
export function rangeMessage(n: number, range: NumericRange, label: string, unit = '', options: RangeOptions = {}): string | undefined {
  const tooLow = options.minExclusive ? n <= range.min : n < range.min;
  const tooHigh = options.maxExclusive ? n >= range.max : n > range.max;
  if (!tooLow && !tooHigh) return undefined;
  const low = `${options.minExclusive ? 'above' : 'at least'} ${withUnit(formatNumber(range.min), unit)}`;
  const high = `${options.maxExclusive ? 'below' : 'at most'} ${withUnit(formatNumber(range.max), unit)}`;
  const hint = options.hint ? ` ${options.hint}` : '';
  return `${label} must be ${low} and ${high}; got ${withUnit(formatNumber(n), unit)}.${hint}`;
}

/** Refuses a number outside `range`, naming the range and the unit in the message. */
export function requireInRange(
  value: unknown,
  range: NumericRange,
  label: string,
  unit = '',
  options: RangeOptions = {},
): number {
  const n = requireFinite(value, label, unit);
  const message = rangeMessage(n, range, label, unit, options);
  if (message) throw new RangeError(message);
  return n;
}

/** Refuses zero, negatives and non-finite numbers. */
export function requirePositive(value: unknown, label: string, unit = '', hint?: string): number {
  const n = requireFinite(value, label, unit);
  if (n <= 0) {
    throw new RangeError(`${label} must be greater than 0${unit ? ` ${unit}` : ''}; got ${withUnit(formatNumber(n), unit)}.${hint ? ` ${hint}` : ''}`);
  }
  return n;
}

/** Refuses a non-array, an empty one when `minLength` ≥ 1, and one longer than `maxLength`. */
export function requireArray(value: unknown, label: string, minLength: number, maxLength: number): unknown[] {
  if (!Array.isArray(value)) throw new RangeError(`${label} must be a list; got ${formatNumber(value)}.`);
  if (value.length < minLength) {
    throw new RangeError(`${label} needs at least ${minLength} ${minLength === 1 ? 'entry' : 'entries'}; got ${value.length}.`);
  }
  if (value.length > maxLength) {
    throw new RangeError(`${label} can have at most ${maxLength} entries; got ${value.length}. Split the work into smaller lists.`);
  }
  return value;
}

/** Refuses a value that is not one of `allowed`, listing the choices. */
export function requireOneOf<T extends string | number>(value: unknown, allowed: readonly T[], label: string): T {
  if (!(allowed as readonly unknown[]).includes(value)) {
    throw new RangeError(`${label} must be one of ${allowed.join(', ')}; got ${formatNumber(value)}.`);
  }
  return value as T;
}

/**
 * Refuses a computed result that overflowed or underflowed out of meaning (±Infinity, NaN, or 0 where
 * the quantity must be positive), so extreme but technically valid inputs end in a sentence, not NaN.
 */
export function requireComputed(value: number, message: string, mustBePositive = false): number {
  if (!Number.isFinite(value) || (mustBePositive && !(value > 0))) throw new RangeError(message);
  return value;
}
