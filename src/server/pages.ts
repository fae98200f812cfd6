import { and, eq } from 'drizzle-orm';
import { pages, revisions, sections, users } from '../db/schema';
import type { PmNode } from '../lib/doc/types';
import { getDb } from './db';
import { HttpError } from './http';

const PAGE_NOT_FOUND = 'There is no such page in this venue.';

/** A page of a venue with its current revision; 404 when the slug is not a page of this venue. */
export async function loadPageWithCurrent(venueId: string, pageSlug: string | undefined) {
  if (!pageSlug || pageSlug.length > 100) throw new HttpError(404, PAGE_NOT_FOUND);
  const db = await getDb();
  const rows = await db
    .select({
      page: pages,
      sectionSlug: sections.slug,
      sectionTitle: sections.title,
      revision: revisions,
      authorName: users.name,
    })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .leftJoin(revisions, and(eq(revisions.pageId, pages.id), eq(revisions.number, pages.currentRevision)))
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(pages.venueId, venueId), eq(pages.slug, pageSlug)))
    .limit(1);
  const row = rows[0];
  if (!row) throw new HttpError(404, PAGE_NOT_FOUND);
  return {
    page: row.page,
    section: { slug: row.sectionSlug, title: row.sectionTitle },
    revision: row.revision
      ? { ...row.revision, doc: JSON.parse(row.revision.doc) as PmNode, authorName: row.authorName ?? 'a former member' }
      : null,
  };
}
