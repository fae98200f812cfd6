import { sql } from 'drizzle-orm';
import { toSearchQuery } from '~/lib/doc/search-query';
import type { SearchResult } from '~/lib/search/search-hits';
import { readableVenueCondition } from './guard';
import { searchOffLoop } from './search-reader';
import type { SessionUser } from './session';

export type { SearchHit, SearchResult } from '~/lib/search/search-hits';

/** Most hits one results page shows; suggestions ask for fewer. */
export const SEARCH_PAGE_LIMIT = 20;
/** How far the results page lets a person page: the best 200 matches, then "add a word". */
export const SEARCH_MAX_OFFSET = 180;

/** BM25 with a title match counting ten times a body match. */
const RANKING = 'bm25(10.0, 1.0)';
/**
 * How many matches a query ranks at most: the most recently indexed ones (index rowids grow as
 * pages are created). Ranking costs per match, and a word on thousands of pages (in 9,000 of a
 * 10,000-page venue) took 12 ms of ranking alone; among its newest 1,000 pages it takes 3. A
 * query matching fewer pages is ranked whole, as before; one that was not says so (`recentOnly`).
 */
export const RANKED_MATCHES_MAX = 1000;
/** Enough of a page's text to find the first hit in for the snippet; the rest stays in the database. */
const SNIPPET_SOURCE_CHARS = 8_000;

/**
 * Full-text search over the current text of the pages this person may read. The access filter
 * is part of the SQL, so a page of another venue is never read, ranked or counted. The query
 * string is rebuilt by toSearchQuery, so nothing typed is ever FTS5 syntax. Snippets are cut
 * from the original text (the index holds the joined spellings too), with the hits marked by
 * the same reading of the words that built the index.
 */
export async function searchPages(user: SessionUser, q: string, limit = 20, offset = 0): Promise<SearchResult> {
  const query = toSearchQuery(q);
  if (!query) return { hits: [], recentOnly: false };
  // Archived pages are out of the book, so out of search too.
  const readable = sql`${readableVenueCondition(user, sql`p.venue_id`)} AND p.archived_at IS NULL`;
  const readableP2 = sql`${readableVenueCondition(user, sql`p2.venue_id`)} AND p2.archived_at IS NULL`;
  // The index rowid of the RANKED_MATCHES_MAX-th newest readable match (0 when there are fewer):
  // a rowid range is a constraint FTS5 itself applies, so it ranks only the rows above it.
  const rankFloor = sql`coalesce((
      SELECT f.rowid FROM pages_fts f
      JOIN page_search_keys k2 ON k2.id = f.rowid
      JOIN pages p2 ON p2.id = k2.page_id
      WHERE f.pages_fts MATCH ${query.match} AND ${readableP2}
      ORDER BY f.rowid DESC LIMIT 1 OFFSET ${RANKED_MATCHES_MAX - 1}), 0)`;
  // ORDER BY rank with the ranking given through `rank MATCH` lets FTS5 hand rows over best
  // first, so the joins and the access filter run only until the page is full. The query and the
  // marking of its hits run off the event loop: a broad one must not hold up everyone else's
  // requests. The rankFloor column is 0 when every match was ranked (see RANKED_MATCHES_MAX).
  return searchOffLoop(
    sql`
    SELECT v.slug AS venueSlug, v.name AS venueName, p.slug AS pageSlug, p.title AS pageTitle,
           s.slug AS sectionSlug, s.title AS sectionTitle, p.updated_at AS updatedAt,
           substr(r.plain_text, 1, ${SNIPPET_SOURCE_CHARS}) AS body, ${rankFloor} AS rankFloor
    FROM pages_fts
    JOIN page_search_keys k ON k.id = pages_fts.rowid
    JOIN pages p ON p.id = k.page_id
    JOIN venues v ON v.id = p.venue_id
    JOIN sections s ON s.id = p.section_id
    LEFT JOIN revisions r ON r.page_id = p.id AND r.number = p.current_revision
    WHERE pages_fts MATCH ${query.match} AND pages_fts.rank MATCH ${RANKING} AND ${readable} AND pages_fts.rowid >= ${rankFloor}
    ORDER BY pages_fts.rank
    LIMIT ${limit} OFFSET ${Math.min(Math.max(0, offset), SEARCH_MAX_OFFSET)}`,
    query,
  );
}
