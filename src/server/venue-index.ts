import { and, asc, count, eq, isNull, sql } from 'drizzle-orm';
import { pages } from '~/db/schema';
import type { Db } from '~/db/client';
import { getDb } from './db';

/**
 * The venue home lists every section, but a section of thousands of pages would make a page of
 * megabytes: each section shows its first PREVIEW_PER_SECTION pages (by title) and links to a
 * paged list of the rest. Counts come from the database, not from loading every row.
 */
export const PREVIEW_PER_SECTION = 50;
export const SECTION_PAGE_SIZE = 200;

export interface IndexPage {
  slug: string;
  title: string;
  currentRevision: number;
  updatedAt: Date;
  inAdvance: boolean;
}

const columns = {
  slug: pages.slug,
  title: pages.title,
  currentRevision: pages.currentRevision,
  updatedAt: pages.updatedAt,
  inAdvance: pages.inAdvance,
};

/** Archived pages are kept with their history but are not part of the book. */
const live = (venueId: string) => and(eq(pages.venueId, venueId), isNull(pages.archivedAt));

/** Page and advance-sheet counts per section of a venue. */
export async function sectionCounts(venueId: string): Promise<Map<string, { pages: number; inAdvance: number }>> {
  const db = await getDb();
  const rows = await db
    .select({ sectionId: pages.sectionId, pages: count(), inAdvance: sql<number>`sum(${pages.inAdvance})` })
    .from(pages)
    .where(live(venueId))
    .groupBy(pages.sectionId);
  return new Map(rows.map((r) => [r.sectionId, { pages: r.pages, inAdvance: Number(r.inAdvance ?? 0) }]));
}

/**
 * The first pages of each section, by title, at most PREVIEW_PER_SECTION each. When every
 * section fits its preview (most venues: a few dozen pages), that is simply every live page, in
 * one query. Otherwise one small query per non-empty section, each read straight off the
 * (venue, section, title) index, rather than ranking every page of the venue (23 ms at 10,000
 * pages). `counts` is sectionCounts' answer from the same request.
 */
export async function sectionPreviews(
  venueId: string,
  sectionIds: string[],
  counts: Map<string, { pages: number }>,
): Promise<Map<string, IndexPage[]>> {
  const pagesIn = (sectionId: string) => counts.get(sectionId)?.pages ?? 0;
  const bySection = new Map<string, IndexPage[]>(sectionIds.map((id) => [id, []]));
  if (sectionIds.every((id) => pagesIn(id) <= PREVIEW_PER_SECTION)) {
    venuePagesQuery ??= buildVenuePagesQuery(await getDb());
    for (const { sectionId, ...page } of await venuePagesQuery.all({ venueId })) bySection.get(sectionId)?.push(page);
    return bySection;
  }
  for (const sectionId of sectionIds) {
    if (pagesIn(sectionId) > 0) bySection.set(sectionId, await sectionPagesAt(venueId, sectionId, 1, PREVIEW_PER_SECTION));
  }
  return bySection;
}

let venuePagesQuery: ReturnType<typeof buildVenuePagesQuery> | undefined;

function buildVenuePagesQuery(db: Db) {
  return db
    .select({ ...columns, sectionId: pages.sectionId })
    .from(pages)
    .where(and(eq(pages.venueId, sql.placeholder('venueId')), isNull(pages.archivedAt)))
    .orderBy(asc(pages.title), asc(pages.slug))
    .prepare();
}

/** Built once: the venue home runs it for each section too big for the one-query path. */
let sectionPagesQuery: ReturnType<typeof buildSectionPagesQuery> | undefined;

function buildSectionPagesQuery(db: Db) {
  return db
    .select(columns)
    .from(pages)
    .where(and(eq(pages.venueId, sql.placeholder('venueId')), isNull(pages.archivedAt), eq(pages.sectionId, sql.placeholder('sectionId'))))
    .orderBy(asc(pages.title), asc(pages.slug))
    .limit(sql.placeholder('size'))
    .offset(sql.placeholder('offset'))
    .prepare();
}

/** One section's pages by title, `size` at a time (`page` counts from 1). */
export async function sectionPagesAt(venueId: string, sectionId: string, page: number, size = SECTION_PAGE_SIZE): Promise<IndexPage[]> {
  sectionPagesQuery ??= buildSectionPagesQuery(await getDb());
  return sectionPagesQuery.all({ venueId, sectionId, size, offset: (page - 1) * size });
}

/** `?section=…&page=…` from the address; anything odd falls back to the overview. */
export function sectionQuery(url: URL): { section: string | null; page: number } {
  const section = url.searchParams.get('section');
  const page = Number(url.searchParams.get('page') ?? '1');
  return {
    section: section && section.length <= 100 ? section : null,
    page: Number.isInteger(page) && page >= 1 && page <= 100_000 ? page : 1,
  };
}
