import { sql } from 'drizzle-orm';
import { MATCH_CLOSE, MATCH_OPEN, snippetHtml, snippetParts } from '~/lib/doc/marked-snippet';
import { toFtsQuery } from '~/lib/doc/search-query';
import { getDb } from './db';
import { readableVenueCondition } from './guard';
import type { SessionUser } from './session';

interface HitRow {
  venueSlug: string;
  venueName: string;
  pageSlug: string;
  pageTitle: string;
  sectionSlug: string;
  sectionTitle: string;
  updatedAt: number;
  markedTitle: string;
  markedBody: string;
}

/** Most hits one search answers: the results page shows this many, suggestions fewer. */
export const SEARCH_PAGE_LIMIT = 50;

/** BM25 with a title match counting ten times a body match. */
const RANKING = 'bm25(10.0, 1.0)';
const SNIPPET_TOKENS = 14;

/**
 * Full-text search over the current text of the pages this person may read. The access filter
 * is part of the SQL, so a page of another venue is never read, ranked or counted. The query
 * string is rebuilt by toFtsQuery, so nothing typed is ever FTS5 syntax.
 */
export async function searchPages(user: SessionUser, q: string, limit = 20) {
  const match = toFtsQuery(q);
  if (!match) return [];
  const db = await getDb();
  // Archived pages are out of the book, so out of search too.
  const readable = sql`${readableVenueCondition(user, sql`p.venue_id`)} AND p.archived_at IS NULL`;
  // ORDER BY rank with the ranking given through `rank MATCH` lets FTS5 hand rows over best
  // first, so the joins, the access filter and snippet() run only until the page is full.
  const rows = await db.all<HitRow>(sql`
    SELECT v.slug AS venueSlug, v.name AS venueName, p.slug AS pageSlug, p.title AS pageTitle,
           s.slug AS sectionSlug, s.title AS sectionTitle, p.updated_at AS updatedAt,
           highlight(pages_fts, 0, ${MATCH_OPEN}, ${MATCH_CLOSE}) AS markedTitle,
           snippet(pages_fts, 1, ${MATCH_OPEN}, ${MATCH_CLOSE}, '…', ${SNIPPET_TOKENS}) AS markedBody
    FROM pages_fts
    JOIN page_search_keys k ON k.id = pages_fts.rowid
    JOIN pages p ON p.id = k.page_id
    JOIN venues v ON v.id = p.venue_id
    JOIN sections s ON s.id = p.section_id
    WHERE pages_fts MATCH ${match} AND pages_fts.rank MATCH ${RANKING} AND ${readable}
    ORDER BY pages_fts.rank
    LIMIT ${limit}`);
  return rows.map((r) => ({
    venue: { slug: r.venueSlug, name: r.venueName },
    page: { slug: r.pageSlug, title: r.pageTitle },
    section: { slug: r.sectionSlug, title: r.sectionTitle },
    url: `/venues/${r.venueSlug}/${r.pageSlug}`,
    updatedAt: new Date(Number(r.updatedAt)),
    titleParts: snippetParts(r.markedTitle ?? r.pageTitle),
    snippet: snippetHtml(r.markedBody ?? ''),
    snippetParts: snippetParts(r.markedBody ?? ''),
  }));
}

export type SearchHit = Awaited<ReturnType<typeof searchPages>>[number];
