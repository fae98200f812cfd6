import { useCallback, useRef, useState } from 'react';
import { ApiError, request } from '~/components/api/client';
import { historyKey } from '~/components/api/revisions';
import type { HistoryAnswer, RevisionSummary } from '~/lib/api-types';

export interface OlderRevisions {
  /** The first page's revisions followed by the older ones loaded so far, each number once. */
  after: (first: RevisionSummary[]) => RevisionSummary[];
  /** Where the next page starts; null once revision 1 is loaded. */
  nextBefore: number | null;
  loading: boolean;
  error: string | null;
  loadMore: () => void;
}

/**
 * Older pages of a history, fetched one at a time on request. The newest page stays with SWR
 * (it changes on every save); older pages do not change, so they are kept as loaded.
 */
export function useOlderRevisions(venue: string, page: string, firstNextBefore: number | null): OlderRevisions {
  const [loaded, setLoaded] = useState<RevisionSummary[]>([]);
  const [cursor, setCursor] = useState<number | null | undefined>(undefined);
  const [loading, setLoading] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const nextBefore = cursor === undefined ? firstNextBefore : cursor;
  // Revisions are never removed, so every one seen stays listed: when a save slides the newest
  // page up, the ones that slid off it stay between it and the older pages, with no gap.
  const seen = useRef(new Map<number, RevisionSummary>());

  const loadMore = useCallback(() => {
    if (nextBefore === null || loading) return;
    setLoading(true);
    setError(null);
    request<HistoryAnswer>(historyKey(venue, page, nextBefore))
      .then((answer) => {
        setLoaded((prev) => [...prev, ...answer.revisions]);
        setCursor(answer.nextBefore);
      })
      .catch((err: unknown) => setError(err instanceof ApiError ? err.error : 'Could not load older revisions. Try again.'))
      .finally(() => setLoading(false));
  }, [venue, page, nextBefore, loading]);

  const after = (first: RevisionSummary[]) => {
    for (const r of [...loaded, ...first]) seen.current.set(r.number, r);
    return [...seen.current.values()].sort((a, b) => b.number - a.number);
  };
  return { after, nextBefore, loading, error, loadMore };
}
