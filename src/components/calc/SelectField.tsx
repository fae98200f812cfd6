import { useId } from 'react';

interface Props {
  label: string;
  value: string;
  options: readonly { value: string; label: string }[];
  onChange: (value: string) => void;
  testId?: string;
}

/** A large native select; a value from a link that is not in the list is kept and shown as typed. */
export default function SelectField({ label, value, options, onChange, testId }: Props) {
  const id = useId();
  const all = options.some((o) => o.value === value) ? options : [...options, { value, label: value }];
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-muted">
        {label}
      </label>
      <select
        id={id}
        data-testid={testId}
        value={value}
        onChange={(event) => onChange(event.target.value)}
        className="h-12 w-full rounded-lg border border-line bg-sunken px-3 text-lg text-fg"
      >
        {all.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}
