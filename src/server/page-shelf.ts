import { and, desc, eq, isNotNull } from 'drizzle-orm';
import { pages, sections } from '~/db/schema';
import { recordAudit } from './audit';
import { getDb, writeTx } from './db';
import { HttpError } from './http';
import { pageBySlug, sectionInTx } from './pages';
import type { SessionUser } from './session';

/**
 * Archiving takes a page out of the book (the venue home, search, the advance sheet, recent
 * changes) without losing it: its revisions, files and place on the advance sheet are kept, and
 * restoring puts it back exactly as it was. An archived page is read-only until restored. Moving
 * a page to another section changes where the book lists it, not what it says: no revision, and
 * `updated_at` (which means "time of the newest revision", see recentChanges) is left alone.
 */

const PAGE_NOT_FOUND = 'There is no such page in this venue.';

export interface ShelfAnswer {
  page: { slug: string; archivedAt: Date | null; section: { slug: string; title: string } };
}

async function answerFor(pageId: string): Promise<ShelfAnswer> {
  const db = await getDb();
  const [row] = await db
    .select({ slug: pages.slug, archivedAt: pages.archivedAt, sectionSlug: sections.slug, sectionTitle: sections.title })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .where(eq(pages.id, pageId))
    .limit(1);
  return { page: { slug: row.slug, archivedAt: row.archivedAt, section: { slug: row.sectionSlug, title: row.sectionTitle } } };
}

/** Archives (`archived` true) or restores a page. Asking for the state it is in changes nothing. */
export async function setPageArchived(venueId: string, pageSlug: string | undefined, archived: boolean, actor: SessionUser): Promise<ShelfAnswer> {
  const pageId = await writeTx(async (tx) => {
    const page = await pageBySlug(tx, venueId, pageSlug);
    if (!page) throw new HttpError(404, PAGE_NOT_FOUND);
    if ((page.archivedAt !== null) === archived) return page.id;
    await tx.update(pages).set({ archivedAt: archived ? new Date() : null }).where(eq(pages.id, page.id));
    await recordAudit(tx, {
      venueId,
      actorId: actor.id,
      action: archived ? 'page.archive' : 'page.unarchive',
      targetType: 'page',
      targetId: page.id,
      detail: { slug: page.slug, title: page.title },
    });
    return page.id;
  });
  return answerFor(pageId);
}

/** Moves a live page to another section of its venue; 400 naming `section` for an unknown one. */
export async function movePage(venueId: string, pageSlug: string | undefined, sectionSlug: string, actor: SessionUser): Promise<ShelfAnswer> {
  const pageId = await writeTx(async (tx) => {
    const page = await pageBySlug(tx, venueId, pageSlug);
    if (!page) throw new HttpError(404, PAGE_NOT_FOUND);
    if (page.archivedAt) throw new HttpError(409, 'This page is archived; restore it before moving it.');
    const section = await sectionInTx(tx, venueId, sectionSlug);
    if (section.id === page.sectionId) return page.id;
    const [from] = await tx.select({ slug: sections.slug }).from(sections).where(eq(sections.id, page.sectionId)).limit(1);
    await tx.update(pages).set({ sectionId: section.id }).where(eq(pages.id, page.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'page.move', targetType: 'page', targetId: page.id, detail: { slug: page.slug, from: from?.slug ?? null, to: section.slug } });
    return page.id;
  });
  return answerFor(pageId);
}

/** The venue's archived pages, most recently archived first, for the archive screen. */
export async function listArchivedPages(venueId: string) {
  const db = await getDb();
  return db
    .select({ slug: pages.slug, title: pages.title, archivedAt: pages.archivedAt, section: sections.title, currentRevision: pages.currentRevision })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .where(and(eq(pages.venueId, venueId), isNotNull(pages.archivedAt)))
    .orderBy(desc(pages.archivedAt))
    .limit(500);
}
