import type { SearchAnswer, SearchHit } from '~/lib/api-types';

export type { SearchAnswer, SearchHit };

/** SWR key of a search; null (nothing to fetch) for an empty query. */
export function searchKey(q: string): string | null {
  return q ? `/api/search?q=${encodeURIComponent(q)}` : null;
}
