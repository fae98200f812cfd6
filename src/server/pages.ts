import { and, eq, like, or, sql } from 'drizzle-orm';
import { pages, revisions, sections, users } from '~/db/schema';
import type { PageJson } from '~/lib/api-types';
import type { PmNode } from '~/lib/doc/types';
import type { PageCreate } from '~/lib/schemas/page';
import { slugify } from '~/lib/slug';
import { recordAudit } from './audit';
import { getDb, writeTx, type Reader, type Tx } from './db';
import type { Db } from '~/db/client';
import { can, type Action, type VenueAccess } from '~/lib/permissions';
import { loadVenue, requirePermission, requireUser, type RequestPrincipal } from './guard';
import { HttpError } from './http';
import { checkDocOrThrow } from './page-doc';
import { assertOwnFileRefs } from './page-file-refs';
import { reindexPage } from './search-index';
import { FORMER_MEMBER, revisionJson } from './revision-json';
import type { SessionUser } from './session';

const PAGE_NOT_FOUND = 'There is no such page in this venue.';

/** Page slugs that would be shadowed by a fixed route under /venues/:venue/. */
export const RESERVED_PAGE_SLUGS = new Set(['new', 'sections', 'files', 'advance', 'members', 'audit', 'settings', 'history', 'edit', 'search', 'changes', 'print', 'archived']);

/** A page of a venue with its current revision, document parsed; 404 when the slug is not a page of this venue. */
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
    revision: row.revision ? { ...row.revision, authorName: row.authorName ?? FORMER_MEMBER, doc: JSON.parse(row.revision.doc) as PmNode } : null,
  };
}

/** The read view's query, built once: it runs on every page read. */
let readingQuery: ReturnType<typeof buildReadingQuery> | undefined;

function buildReadingQuery(db: Db) {
  return db
    .select({
      page: pages,
      sectionSlug: sections.slug,
      sectionTitle: sections.title,
      revisionId: revisions.id,
      revisionNumber: revisions.number,
      summary: revisions.summary,
      createdAt: revisions.createdAt,
      authorName: users.name,
    })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .leftJoin(revisions, and(eq(revisions.pageId, pages.id), eq(revisions.number, pages.currentRevision)))
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(pages.venueId, sql.placeholder('venueId')), eq(pages.slug, sql.placeholder('slug'))))
    .limit(1)
    .prepare();
}

/**
 * A page of a venue and what the read view says of its current revision, without the document:
 * the body comes from the rendered-revision cache, which asks for the document (revisionDoc)
 * only when it misses. 404 as above.
 */
export async function loadPageForReading(venueId: string, pageSlug: string | undefined) {
  if (!pageSlug || pageSlug.length > 100) throw new HttpError(404, PAGE_NOT_FOUND);
  readingQuery ??= buildReadingQuery(await getDb());
  const row = (await readingQuery.all({ venueId, slug: pageSlug }))[0];
  if (!row) throw new HttpError(404, PAGE_NOT_FOUND);
  return {
    page: row.page,
    section: { slug: row.sectionSlug, title: row.sectionTitle },
    revision:
      row.revisionId !== null && row.revisionNumber !== null && row.createdAt !== null
        ? { id: row.revisionId, number: row.revisionNumber, summary: row.summary ?? '', createdAt: row.createdAt, authorName: row.authorName ?? FORMER_MEMBER }
        : null,
  };
}

/** The stored JSON text of one revision's document. */
export async function revisionDoc(revisionId: string): Promise<string> {
  const db = await getDb();
  const [row] = await db.select({ doc: revisions.doc }).from(revisions).where(eq(revisions.id, revisionId)).limit(1);
  if (!row) throw new HttpError(404, PAGE_NOT_FOUND);
  return row.doc;
}

export type LoadedPage = Awaited<ReturnType<typeof loadPageWithCurrent>>;

/** The page as the JSON routes describe it (GET /api/venues/:venue/pages/:page). */
export function pageJson(page: typeof pages.$inferSelect, section: { slug: string; title: string }): PageJson<Date> {
  return {
    id: page.id,
    slug: page.slug,
    title: page.title,
    section,
    currentRevision: page.currentRevision,
    inAdvance: page.inAdvance,
    createdAt: page.createdAt,
    updatedAt: page.updatedAt,
  };
}

export type PageRow = typeof pages.$inferSelect;

/** The page of this venue with that slug, read through `db` (the database or a write's `tx`). */
export async function pageBySlug(db: Reader, venueId: string, pageSlug: string | undefined): Promise<PageRow | undefined> {
  if (!pageSlug || pageSlug.length > 100) return undefined;
  const [page] = await db.select().from(pages).where(and(eq(pages.venueId, venueId), eq(pages.slug, pageSlug))).limit(1);
  return page;
}

/** Just the page row, for routes that need its id (history, one revision, a save); 404 when absent. */
export async function findPage(venueId: string, pageSlug: string | undefined, db?: Reader): Promise<PageRow> {
  const page = await pageBySlug(db ?? (await getDb()), venueId, pageSlug);
  if (!page) throw new HttpError(404, PAGE_NOT_FOUND);
  return page;
}

/** The section of this venue with that slug, inside a write; a 400 naming the field otherwise. */
export async function sectionInTx(tx: Tx, venueId: string, sectionSlug: string) {
  const [section] = await tx.select().from(sections).where(and(eq(sections.venueId, venueId), eq(sections.slug, sectionSlug))).limit(1);
  if (!section) throw new HttpError(400, `This venue has no section "${sectionSlug.slice(0, 60)}"; choose one of its sections.`, 'section');
  return section;
}

/** A free slug for a new page: the asked-for one (409 when taken) or the title's, numbered if needed. */
async function freePageSlug(tx: Tx, venueId: string, title: string, asked?: string): Promise<string> {
  let base = asked ?? (slugify(title) || 'page');
  if (RESERVED_PAGE_SLUGS.has(base)) {
    if (asked) throw new HttpError(400, `"${asked}" is kept for a screen of Throwline; choose another slug.`, 'slug');
    base = `${base}-page`;
  }
  const taken = new Set(
    (await tx.select({ slug: pages.slug }).from(pages).where(and(eq(pages.venueId, venueId), or(eq(pages.slug, base), like(pages.slug, `${base}-%`))))).map((r) => r.slug),
  );
  if (!taken.has(base)) return base;
  if (asked) throw new HttpError(409, `A page with the slug "${asked}" exists already in this venue; choose another.`, 'slug');
  for (let n = 2; n < 1000; n++) if (!taken.has(`${base}-${n}`)) return `${base}-${n}`;
  throw new HttpError(409, 'Too many pages share this title; give the page a different title.', 'title');
}

/** Creates a page with its first revision, in one transaction with its audit event. */
export async function createPage(venueId: string, input: PageCreate, actor: SessionUser) {
  const { doc, plainText } = checkDocOrThrow(input.doc);
  const summary = input.summary ?? '';
  return writeTx(async (tx) => {
    const section = await sectionInTx(tx, venueId, input.section);
    await assertOwnFileRefs(tx, venueId, doc);
    const slug = await freePageSlug(tx, venueId, input.title, input.slug);
    const now = new Date();
    const [page] = await tx
      .insert(pages)
      .values({ venueId, sectionId: section.id, slug, title: input.title, currentRevision: 1, createdAt: now, updatedAt: now })
      .returning();
    const [revision] = await tx
      .insert(revisions)
      .values({ pageId: page.id, number: 1, doc: JSON.stringify(doc), plainText, summary, authorId: actor.id, createdAt: now })
      .returning();
    await reindexPage(tx, page.id);
    await recordAudit(tx, {
      venueId,
      actorId: actor.id,
      action: 'page.create',
      targetType: 'page',
      targetId: page.id,
      detail: { slug, title: input.title, section: section.slug, revision: 1, summary },
    });
    return {
      page: pageJson(page, { slug: section.slug, title: section.title }),
      revision: revisionJson(revision, { id: actor.id, name: actor.name }, doc),
    };
  });
}

/** Loads one page of a venue for the routes about one page; 404 when the slug is not one of its pages. */
export type PageLoader<T extends { page: PageRow }> = (venueId: string, pageSlug: string | undefined) => Promise<T>;

/** Just the page row (history, one revision, a save). */
export const loadPageRow: PageLoader<{ page: PageRow }> = async (venueId, pageSlug) => ({ page: await findPage(venueId, pageSlug) });

/**
 * `load`, then the rule for archived pages: out of the book, so for anyone who may not restore
 * one it does not exist. The one place the rule is applied: guardPage (JSON routes) and
 * guardPageView (screens) both load through here.
 */
export async function loadPageFor<T extends { page: PageRow }>(
  reader: { venue: { id: string }; user: SessionUser; access: VenueAccess },
  pageSlug: string | undefined,
  load: PageLoader<T>,
): Promise<T> {
  const loaded = await load(reader.venue.id, pageSlug);
  if (loaded.page.archivedAt && !can(reader.user, 'page.edit', reader.access)) throw new HttpError(404, PAGE_NOT_FOUND);
  return loaded;
}

/** 401 → 404 (venue, then page) → 403 for routes about one page; `load` says what else to read with it. */
export async function guardPage<T extends { page: PageRow } = { page: PageRow }>(
  user: RequestPrincipal,
  venueSlug: string | undefined,
  pageSlug: string | undefined,
  action: Action,
  load: PageLoader<T> = loadPageRow as unknown as PageLoader<T>,
) {
  const signedIn = requireUser(user);
  const ctx = await loadVenue(signedIn, venueSlug);
  const loaded = await loadPageFor({ ...ctx, user: signedIn }, pageSlug, load);
  requirePermission(signedIn, action, ctx.access);
  return { ...ctx, user: signedIn, ...loaded };
}
