import { useId } from 'react';

interface Props {
  label: string;
  value: string;
  onChange: (value: string) => void;
  /** Shown inside the field's right edge (Hz, dB, m…). */
  unit?: string;
  /** A short line under the field. */
  hint?: string;
  /** The value may be negative: phone decimal keypads have no minus key, so a ± key sits beside the field. */
  signed?: boolean;
  testId?: string;
}

/** The typed text with its sign flipped, keeping whatever else was typed (so "12." stays "−12."). */
export function flipSign(text: string): string {
  const trimmed = text.trim();
  if (trimmed.startsWith('-') || trimmed.startsWith('−')) return trimmed.slice(1);
  return `-${trimmed.startsWith('+') ? trimmed.slice(1) : trimmed}`;
}

/**
 * A large labelled number box: typed text is kept as-is so "12." or "-" survive mid-typing. Always the
 * decimal keypad (inputmode=decimal); signed fields get a ± key, because that keypad has no minus on
 * most phones and the full text keyboard is slow to use one-handed.
 */
export default function NumberField({ label, value, onChange, unit, hint, signed = false, testId }: Props) {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-muted">
        {label}
      </label>
      <div className="flex gap-1">
      <div className="relative min-w-0 flex-1">
        <input
          id={id}
          data-testid={testId}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          enterKeyHint="done"
          value={value}
          onChange={(event) => onChange(event.target.value)}
          className="h-12 w-full rounded-lg border border-line bg-sunken px-3 pr-12 text-lg tabular-nums text-fg outline-none focus-visible:border-focus"
        />
        {unit && <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm text-muted">{unit}</span>}
      </div>
      {signed && (
        <button
          type="button"
          aria-label={`Change the sign of ${label}`}
          data-testid={testId ? `${testId}-sign` : undefined}
          onClick={() => onChange(flipSign(value))}
          className="h-12 w-11 shrink-0 rounded-lg border border-line text-lg font-semibold"
        >
          ±
        </button>
      )}
      </div>
      {hint && <p className="text-xs text-muted">{hint}</p>}
    </div>
  );
}
