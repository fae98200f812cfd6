import { useId } from 'react';

interface Props {
  label: string;
  value: string;
  onChange: (value: string) => void;
  /** Shown inside the field's right edge (Hz, dB, m…). */
  unit?: string;
  /** A short line under the field. */
  hint?: string;
  /** Allow a minus sign on phone keypads that hide it in "decimal" mode. */
  signed?: boolean;
  testId?: string;
}

/** A large labelled number box: typed text is kept as-is so "12." or "-" survive mid-typing. */
export default function NumberField({ label, value, onChange, unit, hint, signed = false, testId }: Props) {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-muted">
        {label}
      </label>
      <div className="relative">
        <input
          id={id}
          data-testid={testId}
          type="text"
          inputMode={signed ? 'text' : 'decimal'}
          autoComplete="off"
          spellCheck={false}
          enterKeyHint="done"
          value={value}
          onChange={(event) => onChange(event.target.value)}
          className="h-12 w-full rounded-lg border border-line bg-sunken px-3 pr-12 text-lg tabular-nums text-fg outline-none focus-visible:border-focus"
        />
        {unit && <span className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm text-muted">{unit}</span>}
      </div>
      {hint && <p className="text-xs text-muted">{hint}</p>}
    </div>
  );
}
