interface Option {
  value: string;
  label: string;
}

interface Props {
  label: string;
  options: readonly Option[];
  value: string;
  onChange: (value: string) => void;
  testId?: string;
}

/** A row of large toggle buttons (units, modes): one tap, no menu to open in the dark. */
export default function Choice({ label, options, value, onChange, testId }: Props) {
  return (
    <div role="group" aria-label={label} data-testid={testId} className="flex min-w-0 flex-col gap-1">
      <span className="text-sm font-medium text-muted" aria-hidden="true">
        {label}
      </span>
      <div className="flex flex-wrap gap-1 rounded-lg bg-sunken p-1">
        {options.map((option) => (
          <button
            key={option.value}
            type="button"
            aria-pressed={option.value === value}
            onClick={() => onChange(option.value)}
            className={`min-h-11 min-w-[max(2.75rem,min-content)] flex-1 rounded-md px-2 text-base font-semibold sm:px-3 ${
              option.value === value ? 'bg-accent text-accent-fg' : 'text-fg hover:bg-surface'
            }`}
          >
            {option.label}
          </button>
        ))}
      </div>
    </div>
  );
}
