import { useState } from 'react';
import { formatDateTime } from '~/lib/format-date';
import type { RevisionSummary } from '~/lib/api-types';
import type { OlderRevisions } from './use-older-revisions';

interface Props {
  revisions: RevisionSummary[];
  current: number;
  mayRestore: boolean;
  restoring: number | null;
  onCompare: (older: number, newer: number) => void;
  onRestore: (n: number) => void;
  older: OlderRevisions;
}

/**
 * The revisions loaded so far, newest first, with compare and (for those who may edit) restore,
 * and a button for the next older page until revision 1 is shown.
 */
export function RevisionList({ revisions, current, mayRestore, restoring, onCompare, onRestore, older }: Props) {
  const [confirming, setConfirming] = useState<number | null>(null);
  return (
    <>
    <ol className="divide-y divide-line rounded-lg border border-line bg-surface" data-testid="revision-list">
      {revisions.map((r) => (
        <li key={r.number} className="flex flex-wrap items-center gap-x-4 gap-y-2 p-3" data-testid={`revision-${r.number}`}>
          <div className="min-w-0 flex-1 basis-60">
            <p className="font-semibold">
              Revision {r.number}
              {r.number === current && <span className="ml-2 rounded bg-accent-soft px-1.5 py-0.5 text-xs text-accent">current</span>}
              {r.restoredFrom !== null && <span className="ml-2 text-xs font-normal text-muted">restored from {r.restoredFrom}</span>}
            </p>
            <p className="text-sm text-muted">
              {r.author.name} · <time dateTime={r.createdAt}>{formatDateTime(r.createdAt)}</time>
            </p>
            {r.summary && <p className="mt-0.5 text-sm">“{r.summary}”</p>}
          </div>
          <div className="flex flex-wrap gap-2">
            {r.number > 1 && (
              <button type="button" className="min-h-11 rounded-md border border-line px-3 text-sm hover:bg-sunken" onClick={() => onCompare(r.number - 1, r.number)}>
                Changes in {r.number}
              </button>
            )}
            {mayRestore && r.number !== current && confirming !== r.number && (
              <button type="button" className="min-h-11 rounded-md border border-line px-3 text-sm hover:bg-sunken" onClick={() => setConfirming(r.number)} data-testid={`restore-${r.number}`}>
                Restore…
              </button>
            )}
            {confirming === r.number && (
              <span className="flex flex-wrap items-center gap-2 rounded-md bg-warn-soft p-1 text-sm">
                <span className="px-1">Make revision {r.number} the current text again?</span>
                <button
                  type="button"
                  disabled={restoring !== null}
                  className="min-h-11 rounded-md bg-accent px-3 font-semibold text-accent-fg disabled:opacity-50"
                  onClick={() => {
                    onRestore(r.number);
                    setConfirming(null);
                  }}
                  data-testid={`restore-confirm-${r.number}`}
                >
                  Restore
                </button>
                <button type="button" className="min-h-11 rounded-md px-3 hover:bg-surface" onClick={() => setConfirming(null)}>
                  Keep as is
                </button>
              </span>
            )}
          </div>
        </li>
      ))}
    </ol>
    {older.error && <p className="mt-2 text-danger">{older.error}</p>}
    {older.nextBefore !== null && (
      <button
        type="button"
        className="mt-3 min-h-11 rounded-md border border-line px-3 text-sm hover:bg-sunken disabled:opacity-50"
        disabled={older.loading}
        onClick={older.loadMore}
        data-testid="older-revisions"
      >
        {older.loading ? 'Loading older revisions…' : 'Older revisions'}
      </button>
    )}
    </>
  );
}
