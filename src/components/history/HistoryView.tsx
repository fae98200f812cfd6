import { useState } from 'react';
import useSWR from 'swr';
import { ApiError, fetcher } from '~/components/api/client';
import { historyKey, restoreRevision, type HistoryAnswer } from '~/components/api/revisions';
import { DiffView } from './DiffView';
import { RevisionList } from './RevisionList';
import { useOlderRevisions } from './use-older-revisions';

export interface HistoryViewProps {
  venue: string;
  page: string;
  mayRestore: boolean;
  /** The list as the server rendered it, shown until SWR has fetched a fresh one. */
  initial: HistoryAnswer;
  /** The history page the server rendered starts below this revision (null: the newest). */
  before?: number | null;
}

type Message = { kind: 'ok' | 'error'; text: string } | null;

/** A page's history: pick two revisions, read the word-level diff, restore an old one. */
export default function HistoryView({ venue, page, mayRestore, initial, before = null }: HistoryViewProps) {
  const { data, error, mutate } = useSWR<HistoryAnswer, ApiError>(historyKey(venue, page, before), fetcher, { fallbackData: initial });
  const older = useOlderRevisions(venue, page, data?.nextBefore ?? null);
  const revisions = older.after(data?.revisions ?? []);
  const current = data?.page.currentRevision ?? 0;
  const [pair, setPair] = useState<{ older: number; newer: number } | null>(current > 1 ? { older: current - 1, newer: current } : null);
  const [restoring, setRestoring] = useState<number | null>(null);
  const [message, setMessage] = useState<Message>(null);

  async function restore(n: number) {
    setRestoring(n);
    setMessage(null);
    try {
      const { revision } = await restoreRevision(venue, page, n, current);
      setMessage({ kind: 'ok', text: `Revision ${n} is the current text again, saved as revision ${revision.number}.` });
      setPair({ older: current, newer: revision.number });
    } catch (err) {
      setMessage({ kind: 'error', text: err instanceof ApiError ? err.error : 'Nothing was restored. Try again.' });
    }
    setRestoring(null);
    await mutate();
  }

  const options = revisions.map((r) => (
    <option key={r.number} value={r.number}>
      Revision {r.number} — {r.author.name}
    </option>
  ));

  return (
    <div className="space-y-6" data-testid="history">
      <div aria-live="polite">
        {message && (
          <p className={`rounded-md p-3 ${message.kind === 'ok' ? 'bg-accent-soft' : 'bg-warn-soft text-danger'}`} data-testid="history-message">
            {message.text}
          </p>
        )}
        {error && <p className="text-danger">{error.error}</p>}
      </div>
      {revisions.length > 1 && (
        <section aria-labelledby="tl-compare">
          <h2 id="tl-compare" className="text-lg font-bold">
            Compare
          </h2>
          <div className="mt-2 flex flex-wrap items-end gap-3">
            <label className="text-sm font-semibold">
              From
              <select
                className="mt-1 block min-h-11 rounded-md border border-line bg-surface px-2 font-normal"
                value={pair?.older ?? ''}
                onChange={(e) => setPair({ older: Number(e.target.value), newer: pair?.newer ?? current })}
                data-testid="compare-from"
              >
                {options}
              </select>
            </label>
            <label className="text-sm font-semibold">
              To
              <select
                className="mt-1 block min-h-11 rounded-md border border-line bg-surface px-2 font-normal"
                value={pair?.newer ?? ''}
                onChange={(e) => setPair({ older: pair?.older ?? 1, newer: Number(e.target.value) })}
                data-testid="compare-to"
              >
                {options}
              </select>
            </label>
          </div>
          {/* Room reserved for the comparison, so the revision list below does not jump when it loads. */}
          <div className="mt-3 min-h-[min(70vh,32rem)]">{pair && <DiffView venue={venue} page={page} older={pair.older} newer={pair.newer} />}</div>
        </section>
      )}
      <section aria-labelledby="tl-revisions">
        <h2 id="tl-revisions" className="mb-2 text-lg font-bold">
          All revisions
        </h2>
        <RevisionList
          revisions={revisions}
          current={current}
          mayRestore={mayRestore}
          restoring={restoring}
          onCompare={(older, newer) => setPair({ older, newer })}
          onRestore={restore}
          older={older}
        />
      </section>
    </div>
  );
}
