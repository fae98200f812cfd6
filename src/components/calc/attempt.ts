import { parseDecimal, parseDecimalOrFraction } from '~/lib/schemas/decimal';

export type Outcome<T> = { ok: true; value: T } | { ok: false; message: string };

/** Thrown for a field that does not hold a usable number; shown like the math's own refusals. */
class InputProblem extends RangeError {}

/** The number in a typed field, or an InputProblem naming the field. Accepts a decimal comma. */
export function num(text: string | undefined, label: string, allowFraction = false): number {
  const n = allowFraction ? parseDecimalOrFraction(text ?? '', true) : parseDecimal(text ?? '', true);
  if (n === 'empty') throw new InputProblem(`Enter ${label}.`);
  if (n === 'syntax') throw new InputProblem(`${label[0].toUpperCase()}${label.slice(1)} must be a number, like ${allowFraction ? '0.5 or 1/3' : '12.5'}.`);
  if (n === 'infinite') throw new InputProblem(`${label[0].toUpperCase()}${label.slice(1)} is too large.`);
  return n;
}

/**
 * Runs a calculation on typed input. The acoustics functions refuse bad input with a RangeError
 * whose message is written for the person, so it is shown as it is; anything else is a bug.
 */
export function attempt<T>(work: () => T): Outcome<T> {
  try {
    return { ok: true, value: work() };
  } catch (err) {
    if (err instanceof RangeError) return { ok: false, message: err.message };
    throw err;
  }
}
