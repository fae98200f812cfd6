/**
 * Reading a number the way a person typed it. Shared by the calculator routes (through their
 * schemas) and the calculator islands, which cannot afford to ship zod to a phone.
 */

/** Plain decimal notation only: no hex (0x10), no "Infinity", no thousands separators. */
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d{1,4})?$/;

/** Longest single number accepted, so nobody parses a 100 kB "number". */
export const MAX_NUMBER_CHARS = 32;

export type NumberProblem = 'empty' | 'syntax' | 'infinite';

/**
 * A finite number from decimal text, or the reason it is not one. With `decimalComma`, a lone
 * comma counts as the decimal point (phones in many locales offer only a comma on the keypad);
 * the routes leave it off because their lists are comma-separated.
 */
export function parseDecimal(raw: string, decimalComma = false): number | NumberProblem {
  let text = raw.trim();
  if (text === '') return 'empty';
  if (decimalComma && !text.includes('.') && text.split(',').length === 2) text = text.replace(',', '.');
  if (text.length > MAX_NUMBER_CHARS || !DECIMAL.test(text)) return 'syntax';
  const n = Number(text);
  return Number.isFinite(n) ? n : 'infinite';
}

/** "1/3", " 2 / 3 ": a simple fraction of two plain decimals, as widths are written in the trade. */
const FRACTION = /^\s*([+]?(?:\d+(?:\.\d*)?|\.\d+))\s*\/\s*((?:\d+(?:\.\d*)?|\.\d+))\s*$/;

/** `parseDecimal`, but also a fraction such as 1/3 or 2/3 (a zero denominator is a syntax problem). */
export function parseDecimalOrFraction(raw: string, decimalComma = false): number | NumberProblem {
  const match = raw.length <= 2 * MAX_NUMBER_CHARS + 1 ? FRACTION.exec(decimalComma ? raw.replace(/,/g, '.') : raw) : null;
  if (!match) return parseDecimal(raw, decimalComma);
  const denominator = Number(match[2]);
  if (!(denominator > 0)) return 'syntax';
  const n = Number(match[1]) / denominator;
  return Number.isFinite(n) ? n : 'infinite';
}
