import type { HistoryAnswer, RestoreAnswer, RevisionAnswer } from '~/lib/api-types';
import { request } from './client';
import { pageApi } from './pages';

export type { HistoryAnswer, RevisionAnswer };

/** SWR key of a page's history (GET, newest first), from below revision `before` when given. */
export function historyKey(venue: string, page: string, before?: number | null): string {
  return `${pageApi(venue, page)}/revisions${before ? `?before=${before}` : ''}`;
}

/** SWR key of one revision with its text. */
export function revisionKey(venue: string, page: string, n: number): string {
  return `${historyKey(venue, page)}/${n}`;
}

/** A new revision equal to revision n; refused with 409 when `baseRevision` is no longer current. */
export function restoreRevision(venue: string, page: string, n: number, baseRevision: number): Promise<RestoreAnswer> {
  return request<RestoreAnswer>(`${revisionKey(venue, page, n)}/restore`, {
    method: 'POST',
    body: { baseRevision },
    unreachable: 'Could not reach Throwline; nothing was restored. Try again.',
  });
}
