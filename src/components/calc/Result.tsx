import type { ReactNode } from 'react';
import type { Outcome } from './attempt';
import CopyLink from './CopyLink';

interface Props<T> {
  outcome: Outcome<T>;
  children: (value: T) => ReactNode;
  testId?: string;
  /** Offer "copy link" under the answer (off for small results that share one panel's link). */
  share?: boolean;
}

/** The answer area: the result when the inputs make sense, otherwise the reason in plain words. */
export default function Result<T>({ outcome, children, testId, share = true }: Props<T>) {
  return (
    <div data-testid={testId} aria-live="polite" className="rounded-lg bg-sunken p-3">
      {outcome.ok ? (
        <>
          {children(outcome.value)}
          {share && <CopyLink />}
        </>
      ) : (
        <p className="text-base text-warn" role="status">
          {outcome.message}
        </p>
      )}
    </div>
  );
}

interface FigureProps {
  label: string;
  value: string;
  unit?: string;
  big?: boolean;
  testId?: string;
}

/** One labelled number in a result. */
export function Figure({ label, value, unit, big = false, testId }: FigureProps) {
  return (
    <div className="min-w-0">
      <div className="text-xs uppercase tracking-wide text-muted">{label}</div>
      <div className={`${big ? 'text-3xl font-bold' : 'text-xl font-semibold'} tabular-nums`} data-testid={testId}>
        {value}
        {unit && <span className="ml-1 text-base font-medium text-muted">{unit}</span>}
      </div>
    </div>
  );
}
