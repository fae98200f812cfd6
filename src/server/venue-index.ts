import { and, asc, count, eq, sql } from 'drizzle-orm';
import { pages } from '~/db/schema';
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

/** Page and advance-sheet counts per section of a venue. */
export async function sectionCounts(venueId: string): Promise<Map<string, { pages: number; inAdvance: number }>> {
  const db = await getDb();
  const rows = await db
    .select({ sectionId: pages.sectionId, pages: count(), inAdvance: sql<number>`sum(${pages.inAdvance})` })
    .from(pages)
    .where(eq(pages.venueId, venueId))
    .groupBy(pages.sectionId);
  return new Map(rows.map((r) => [r.sectionId, { pages: r.pages, inAdvance: Number(r.inAdvance ?? 0) }]));
}

/** The first pages of every section, by title, at most PREVIEW_PER_SECTION each. */
export async function sectionPreviews(venueId: string): Promise<Map<string, IndexPage[]>> {
  const db = await getDb();
  const ranked = db
    .select({ ...columns, sectionId: pages.sectionId, n: sql<number>`row_number() over (partition by ${pages.sectionId} order by ${pages.title}, ${pages.slug})`.as('n') })
    .from(pages)
    .where(eq(pages.venueId, venueId))
    .as('ranked');
  const rows = await db.select().from(ranked).where(sql`${ranked.n} <= ${PREVIEW_PER_SECTION}`).orderBy(asc(ranked.n));
  const bySection = new Map<string, IndexPage[]>();
  for (const r of rows) {
    const list = bySection.get(r.sectionId) ?? [];
    list.push({ slug: r.slug, title: r.title, currentRevision: r.currentRevision, updatedAt: new Date(Number(r.updatedAt)), inAdvance: Boolean(r.inAdvance) });
    bySection.set(r.sectionId, list);
  }
  return bySection;
}

/** One section's pages by title, SECTION_PAGE_SIZE at a time (`page` counts from 1). */
export async function sectionPagesAt(venueId: string, sectionId: string, page: number): Promise<IndexPage[]> {
  const db = await getDb();
  return db
    .select(columns)
    .from(pages)
    .where(and(eq(pages.venueId, venueId), eq(pages.sectionId, sectionId)))
    .orderBy(asc(pages.title), asc(pages.slug))
    .limit(SECTION_PAGE_SIZE)
    .offset((page - 1) * SECTION_PAGE_SIZE);
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
