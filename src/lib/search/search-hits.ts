import { snippetHtml, snippetParts } from '~/lib/doc/marked-snippet';
import { markAll, markedSnippet, type MatchQuery } from './mark-matches';

/** One row of the search query (src/server/page-search.ts), as the database answers it. */
export interface HitRow {
  /** 0 when every match was ranked; else the smallest index rowid that was. */
  rankFloor: number;
  venueSlug: string;
  venueName: string;
  pageSlug: string;
  pageTitle: string;
  sectionSlug: string;
  sectionTitle: string;
  updatedAt: number;
  body: string | null;
}

export interface SearchHit {
  venue: { slug: string; name: string };
  page: { slug: string; title: string };
  section: { slug: string; title: string };
  url: string;
  updatedAt: Date;
  titleParts: ReturnType<typeof snippetParts>;
  snippet: string;
  snippetParts: ReturnType<typeof snippetParts>;
}

export interface SearchResult {
  hits: SearchHit[];
  /** True when the query matched more pages than are ranked and only the newest were. */
  recentOnly: boolean;
}

/**
 * The rows as hits a person reads: title and snippet with the query's terms marked. Nothing
 * here touches the database or the request, so it can run in the search thread beside the
 * query (it is most of a search's CPU after SQLite) as well as anywhere else.
 */
export function searchResultOf(rows: HitRow[], query: MatchQuery): SearchResult {
  return { hits: rows.map((r) => hitOf(r, query)), recentOnly: rows.some((r) => Number(r.rankFloor) > 0) };
}

function hitOf(r: HitRow, query: MatchQuery): SearchHit {
  const markedBody = markedSnippet(r.body ?? '', query);
  return {
    venue: { slug: r.venueSlug, name: r.venueName },
    page: { slug: r.pageSlug, title: r.pageTitle },
    section: { slug: r.sectionSlug, title: r.sectionTitle },
    url: `/venues/${r.venueSlug}/${r.pageSlug}`,
    updatedAt: new Date(Number(r.updatedAt)),
    titleParts: snippetParts(markAll(r.pageTitle, query)),
    snippet: snippetHtml(markedBody),
    snippetParts: snippetParts(markedBody),
  };
}
