/**
 * Building blocks for the calculator schemas: query-string numbers, lists and choices that refuse
 * anything a person did not mean (NaN, Infinity, 1e309, hex, empty strings) with a sentence that
 * names the parameter and shows a working example.
 */
import { z } from 'zod';
import { rangeMessage } from '~/lib/acoustics/guards';
import { MAX_NUMBER_CHARS, parseDecimal, parseDecimalOrFraction, type NumberProblem } from './decimal';

export { MAX_NUMBER_CHARS, parseDecimal, type NumberProblem };

/** Shows what was sent, shortened, so an error message never echoes a huge string. */
export function shown(raw: unknown): string {
  const text = String(raw);
  return JSON.stringify(text.length > 24 ? `${text.slice(0, 24)}…` : text);
}

/** The sentence for a number that could not be read. */
export function numberProblemMessage(problem: NumberProblem, name: string, what: string, example: string, raw: string): string {
  if (problem === 'empty') return `${name} is empty; enter ${what} as a number, e.g. ${name}=${example}.`;
  if (problem === 'infinite') return `${name} is too large to be ${what}; got ${shown(raw)}. Enter a number such as ${example}.`;
  return `${name} must be a plain decimal number such as ${example} (${what}); got ${shown(raw)}.`;
}

/**
 * A required query-string number: present, decimal, finite. Its physical range is checked by the
 * object schema, because the range depends on the unit chosen beside it (m/ft, °C/°F).
 */
export function numberParam(name: string, what: string, example: string, allowFraction = false) {
  return z
    .string({
      error: (issue) =>
        issue.input === undefined ? `Give ${name} (${what}), e.g. ${name}=${example}.` : `${name} must be a number such as ${example}.`,
    })
    .transform((raw, ctx) => {
      const n = allowFraction ? parseDecimalOrFraction(raw) : parseDecimal(raw);
      if (typeof n === 'number') return n;
      const message = numberProblemMessage(n, name, what, example, raw);
      ctx.issues.push({ code: 'custom', message: allowFraction && n === 'syntax' ? message.replace(/\(([^)]*)\)/, '($1, or a fraction like 1/3)') : message, input: raw });
      return z.NEVER;
    });
}

/** A closed range for messages and checks; `minExclusive` for quantities that must be above the bound. */
export interface Bounds {
  min: number;
  max: number;
  minExclusive?: boolean;
  maxExclusive?: boolean;
}

/** "temp must be at least -60 °C and at most 60 °C; got -300 °C." — or undefined when `value` is inside. */
export function outOfRange(value: number, bounds: Bounds, name: string, unit: string, hint = ''): string | undefined {
  return rangeMessage(value, bounds, name, unit, { minExclusive: bounds.minExclusive, maxExclusive: bounds.maxExclusive, hint: hint || undefined });
}

/** Adds an issue at path [name] when `value` is outside `bounds`; true when it was inside. `label` names it in the sentence. */
export function checkRange(
  ctx: { issues: { push: (issue: { code: 'custom'; message: string; path: PropertyKey[]; input: unknown }) => void } },
  value: number,
  bounds: Bounds,
  name: string,
  unit: string,
  hint = '',
  label = name,
): boolean {
  const message = outOfRange(value, bounds, label, unit, hint);
  if (message) ctx.issues.push({ code: 'custom', message, path: [name], input: value });
  return !message;
}

/**
 * A comma-separated list of numbers, at most `maxItems` long. The text length is checked before
 * anything is split, so a 200,000-item list costs one comparison, not 200,000 parses.
 */
export function numberListParam(name: string, itemLabel: string, maxItems: number, example: string) {
  const maxChars = maxItems * (MAX_NUMBER_CHARS + 1);
  return z
    .string({
      error: (issue) =>
        issue.input === undefined
          ? `Give ${name} as numbers separated by commas, e.g. ${name}=${example}.`
          : `${name} must be numbers separated by commas, e.g. ${name}=${example}.`,
    })
    .transform((raw, ctx) => {
      const fail = (message: string) => {
        ctx.issues.push({ code: 'custom', message, input: raw.length > 40 ? `${raw.slice(0, 40)}…` : raw });
        return z.NEVER;
      };
      if (raw.length > maxChars) {
        return fail(`${name} is too long (${raw.length} characters): give at most ${maxItems} values separated by commas, e.g. ${name}=${example}.`);
      }
      const parts = raw.split(',');
      if (parts.length > maxItems) return fail(`${name} can hold at most ${maxItems} values; got ${parts.length}. Split the work into smaller lists.`);
      const values: number[] = [];
      for (const [i, part] of parts.entries()) {
        const n = parseDecimal(part);
        if (n === 'empty') return fail(`${name} has an empty entry at position ${i + 1}; remove the extra comma or fill it in.`);
        if (n === 'infinite') return fail(`${itemLabel} ${i + 1} in ${name} is too large to be real; got ${shown(part)}. Enter a number such as ${example.split(',')[0]}.`);
        if (n === 'syntax') return fail(`${itemLabel} ${i + 1} in ${name} must be a plain decimal number such as ${example.split(',')[0]}; got ${shown(part)}.`);
        values.push(n);
      }
      return values;
    });
}

/**
 * One of a fixed set of words. Case is folded (`ft`, `FT`), because a shared link typed by hand
 * should not fail on capitals; the message lists every choice.
 */
export function choiceParam<const T extends readonly [string, ...string[]]>(name: string, allowed: T, fold: 'lower' | 'upper' = 'lower') {
  return z.preprocess(
    (v) => (typeof v === 'string' ? (fold === 'lower' ? v.trim().toLowerCase() : v.trim().toUpperCase()) : v),
    z.enum(allowed, {
      error: (issue) =>
        issue.input === undefined
          ? `Give ${name}: one of ${allowed.join(', ')}.`
          : `${name} must be one of ${allowed.join(', ')}; got ${shown(issue.input)}.`,
    }),
  );
}
