import type { ReactNode } from 'react';

interface Props {
  label: string;
  onClick: () => void;
  active?: boolean;
  disabled?: boolean;
  children: ReactNode;
  testId?: string;
}

/** A toolbar button: at least 44 px square, with its state announced, not only coloured. */
export function ToolButton({ label, onClick, active, disabled, children, testId }: Props) {
  return (
    <button
      type="button"
      title={label}
      aria-label={label}
      aria-pressed={active === undefined ? undefined : active}
      disabled={disabled}
      data-testid={testId}
      // Keeps the text selection in the editor when the button is pressed.
      onMouseDown={(e) => e.preventDefault()}
      onClick={onClick}
      className={`inline-flex min-h-11 min-w-11 items-center justify-center rounded-md px-2 text-sm font-semibold disabled:opacity-40 ${
        active ? 'bg-accent text-accent-fg' : 'hover:bg-sunken'
      }`}
    >
      {children}
    </button>
  );
}
