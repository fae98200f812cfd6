import { and, asc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { pages, revisions, sections, users } from '~/db/schema';
import { isCheckStale } from '~/lib/check-staleness';
import { fileIdsInDoc, traceIdsIn } from '~/lib/doc/file-refs';
import { loadVenueTraces } from './files/trace-data';
import { renderDocHtml } from '~/lib/doc/render-html';
import { fileIdOfUrl } from '~/lib/file-url';
import type { PmNode } from '~/lib/doc/types';
import { recordAudit } from './audit';
import { getDb, writeTx } from './db';
import { availableFiles } from './files/available-files';
import { HttpError } from './http';
import type { VenueRow } from './guard';
import type { SessionUser } from './session';

const PAGE_NOT_FOUND = 'There is no such page in this venue.';

async function advanceRows(venueId: string) {
  const db = await getDb();
  const checker = sql<string | null>`(select ${users.name} from ${users} where ${users.id} = ${pages.checkedBy})`;
  return db
    .select({
      id: pages.id,
      slug: pages.slug,
      title: pages.title,
      sectionSlug: sections.slug,
      sectionTitle: sections.title,
      revision: pages.currentRevision,
      updatedAt: pages.updatedAt,
      checkedAt: pages.checkedAt,
      checkedByName: checker,
      doc: revisions.doc,
    })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .leftJoin(revisions, and(eq(revisions.pageId, pages.id), eq(revisions.number, pages.currentRevision)))
    .where(and(eq(pages.venueId, venueId), eq(pages.inAdvance, true), isNull(pages.archivedAt)))
    .orderBy(asc(pages.advancePosition), asc(pages.title));
}

export interface SheetOptions {
  /** Where images are fetched from; the guest view passes its pass-scoped route. */
  imageUrl?: (src: string) => string;
  now?: Date;
}

/** The advance sheet in order, each page rendered, with its on-site check and the files it uses. */
export async function loadAdvanceSheet(venue: VenueRow, options: SheetOptions = {}) {
  const rows = await advanceRows(venue.id);
  const now = options.now ?? new Date();
  const docs = rows.map((r) => (r.doc ? (JSON.parse(r.doc) as PmNode) : null));
  const refs = docs.map((doc) => (doc ? fileIdsInDoc(doc) : new Set<string>()));
  const available = await availableFiles(venue.id, new Set(refs.flatMap((ids) => [...ids])));
  const traceIds = new Set(docs.flatMap((doc) => (doc ? traceIdsIn(doc) : [])));
  const traces = await loadVenueTraces(venue.id, [...traceIds].filter((id) => available.has(id)));
  const fileUrl = (id: string) => (options.imageUrl ? options.imageUrl(`/files/${id}`) : `/files/${id}`);
  return rows.map((r, i) => {
    const doc = docs[i];
    const fileIds = [...refs[i]].filter((id) => available.has(id));
    return {
      slug: r.slug,
      title: r.title,
      section: { slug: r.sectionSlug, title: r.sectionTitle },
      revision: r.revision,
      updatedAt: r.updatedAt,
      checkedAt: r.checkedAt,
      checkedBy: r.checkedAt ? (r.checkedByName ?? 'a former member') : null,
      checkStale: isCheckStale(r.sectionSlug, r.checkedAt, now, venue.checkStaleMonths),
      fileIds,
      html: doc ? renderDocHtml(doc, { isImageAvailable: (src) => available.has(fileIdOfUrl(src) ?? ''), imageSize: (src) => available.get(fileIdOfUrl(src) ?? ''), idPrefix: `${r.slug}-`, imageUrl: options.imageUrl, blockContext: { traces, fileUrl } }) : '',
    };
  });
}

export type SheetPage = Awaited<ReturnType<typeof loadAdvanceSheet>>[number];

/** Whether a file of this venue is used by a page on its advance sheet (what a guest may fetch). */
export async function isAdvanceFile(venueId: string, fileId: string): Promise<boolean> {
  const rows = await advanceRows(venueId);
  // Each photo of the sheet a guest loads asks this; a doc whose text lacks the id cannot use the
  // file, so only the others are parsed (and the parse, not the substring, decides).
  return rows.some((r) => r.doc !== null && r.doc.includes(fileId) && fileIdsInDoc(JSON.parse(r.doc) as PmNode).has(fileId));
}

/** Every live page with whether it is on the sheet, for the manager's selection screen. */
export async function listSelectablePages(venueId: string) {
  const db = await getDb();
  return db
    .select({ slug: pages.slug, title: pages.title, section: sections.title, inAdvance: pages.inAdvance, advancePosition: pages.advancePosition })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .where(and(eq(pages.venueId, venueId), isNull(pages.archivedAt)))
    .orderBy(asc(sections.position), asc(pages.title));
}

/** Sets which pages form the sheet and their order, all at once; an unknown slug changes nothing. */
export async function setAdvanceSelection(venueId: string, slugs: string[], actor: SessionUser) {
  if (new Set(slugs).size !== slugs.length) throw new HttpError(400, 'A page appears twice in the list; name each page once.', 'pages');
  return writeTx(async (tx) => {
    const found = slugs.length
      ? await tx.select({ id: pages.id, slug: pages.slug }).from(pages).where(and(eq(pages.venueId, venueId), isNull(pages.archivedAt), inArray(pages.slug, slugs)))
      : [];
    const bySlug = new Map(found.map((p) => [p.slug, p.id]));
    const missing = slugs.find((s) => !bySlug.has(s));
    if (missing) throw new HttpError(400, `There is no page "${missing}" in this venue; remove it from the list.`, 'pages');
    await tx.update(pages).set({ inAdvance: false, advancePosition: 0 }).where(eq(pages.venueId, venueId));
    for (const [position, slug] of slugs.entries()) {
      await tx.update(pages).set({ inAdvance: true, advancePosition: position }).where(eq(pages.id, bySlug.get(slug)!));
    }
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'advance.select', targetType: 'venue', targetId: venueId, detail: { pages: slugs } });
    return slugs;
  });
}

/** The switch on one page: on puts it at the end of the sheet, off takes it out. */
export async function setPageInAdvance(venueId: string, pageSlug: string | undefined, included: boolean, actor: SessionUser) {
  if (!pageSlug || pageSlug.length > 100) throw new HttpError(404, PAGE_NOT_FOUND);
  return writeTx(async (tx) => {
    const [page] = await tx.select().from(pages).where(and(eq(pages.venueId, venueId), eq(pages.slug, pageSlug), isNull(pages.archivedAt))).limit(1);
    if (!page) throw new HttpError(404, PAGE_NOT_FOUND);
    if (page.inAdvance === included) return { inAdvance: included };
    const [{ last }] = await tx.select({ last: sql<number>`coalesce(max(${pages.advancePosition}), -1)` }).from(pages).where(and(eq(pages.venueId, venueId), eq(pages.inAdvance, true)));
    await tx.update(pages).set({ inAdvance: included, advancePosition: included ? Number(last) + 1 : 0 }).where(eq(pages.id, page.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: included ? 'advance.add' : 'advance.remove', targetType: 'page', targetId: page.id, detail: { slug: page.slug } });
    return { inAdvance: included };
  });
}

/** "Checked on site": who and when, without a new revision. */
export async function markChecked(venueId: string, pageSlug: string | undefined, actor: SessionUser) {
  if (!pageSlug || pageSlug.length > 100) throw new HttpError(404, PAGE_NOT_FOUND);
  return writeTx(async (tx) => {
    const [page] = await tx.select().from(pages).where(and(eq(pages.venueId, venueId), eq(pages.slug, pageSlug))).limit(1);
    if (!page) throw new HttpError(404, PAGE_NOT_FOUND);
    const checkedAt = new Date();
    await tx.update(pages).set({ checkedAt, checkedBy: actor.id }).where(eq(pages.id, page.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'page.check', targetType: 'page', targetId: page.id, detail: { slug: page.slug } });
    return { checkedAt, checkedBy: actor.name };
  });
}
