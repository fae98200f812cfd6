import { useEffect, useId, useState } from 'react';
import { parseDecimal } from '~/lib/schemas/decimal';

interface Props {
  label: string;
  value: number;
  /** A sentence when the number cannot be used, else null. */
  check: (n: number) => string | null;
  onCommit: (n: number) => void;
  unit?: string;
  testId?: string;
  /** Hides the label visually (tables with column headers); screen readers still hear it. */
  compact?: boolean;
}

/**
 * A number typed as text (decimal keyboard on phones, comma accepted as the decimal point). A value
 * that fails its check stays in the field with the reason beside it; the block keeps its last good value.
 */
export function NumberCell({ label, value, check, onCommit, unit, testId, compact }: Props) {
  const [text, setText] = useState(String(value));
  const [error, setError] = useState<string | null>(null);
  const id = useId();
  useEffect(() => {
    // Follows outside changes (undo, reorder) unless the person is mid-way through a bad value.
    if (error === null && Number(text.replace(',', '.')) !== value) setText(String(value));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  function change(next: string) {
    setText(next);
    const n = parseDecimal(next, true);
    const problem = typeof n === 'number' ? check(n) : `Enter ${label.toLowerCase()} as a number.`;
    setError(problem);
    if (problem === null && typeof n === 'number') onCommit(n);
  }
  return (
    <label className="flex min-w-0 flex-col text-xs font-semibold" htmlFor={id}>
      <span className={compact ? 'sr-only' : ''}>
        {label}
        {unit ? ` (${unit})` : ''}
      </span>
      <input
        id={id}
        type="text"
        inputMode="decimal"
        autoComplete="off"
        value={text}
        onChange={(e) => change(e.target.value)}
        aria-invalid={error !== null}
        aria-describedby={error ? `${id}-err` : undefined}
        data-testid={testId}
        className={`min-h-11 w-full rounded-md border bg-surface px-2 text-base font-normal tabular-nums ${error ? 'border-danger' : 'border-line'}`}
      />
      {error && (
        <span id={`${id}-err`} role="alert" className="mt-0.5 font-normal text-danger" data-testid={testId && `${testId}-error`}>
          {error}
        </span>
      )}
    </label>
  );
}

export const rangeCheck = (what: string, min: number, max: number, unit = '') => (n: number) =>
  n < min || n > max ? `${what} must be from ${min} to ${max}${unit ? ` ${unit}` : ''}.` : null;
