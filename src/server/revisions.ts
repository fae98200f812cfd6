import { and, desc, eq, lt } from 'drizzle-orm';
import { pages, revisions, sections, users } from '~/db/schema';
import type { PmNode } from '~/lib/doc/types';
import type { PageSave, RestoreRequest } from '~/lib/schemas/page';
import { recordAudit } from './audit';
import { getDb, writeTx, type Reader, type Tx } from './db';
import { HttpError } from './http';
import { checkDocOrThrow } from './page-doc';
import { assertOwnFileRefs } from './page-file-refs';
import { reindexPage } from './search-index';
import { findPage, pageJson, sectionInTx, type PageRow } from './pages';
import { authorJson, revisionJson } from './revision-json';
import type { SessionUser } from './session';

/** Revisions per history page unless the caller asks for another size (1 to 500). */
export const HISTORY_PAGE_SIZE = 100;
export const HISTORY_MAX_PAGE_SIZE = 500;

/** Parses ":n" from a URL; anything that is not a plain positive number is simply not found. */
export function revisionNumberParam(raw: string | undefined): number {
  if (!raw || !/^[1-9]\d{0,8}$/.test(raw)) throw new HttpError(404, 'There is no such revision of this page.');
  return Number(raw);
}

/** Revision `number` of a page with its author's name, through `db` (the database or a write's `tx`). */
async function revisionRow(db: Reader, pageId: string, number: number) {
  const [row] = await db
    .select({ revision: revisions, authorName: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(revisions.pageId, pageId), eq(revisions.number, number)))
    .limit(1);
  return row;
}

/** The 409 answer: what the person's save was refused for, with the revision that won. */
async function conflict(tx: Tx, page: PageRow, base: number): Promise<HttpError> {
  const row = await revisionRow(tx, page.id, page.currentRevision);
  const current = row
    ? revisionJson(row.revision, authorJson(row.revision.authorId, row.authorName), JSON.parse(row.revision.doc) as PmNode)
    : null;
  const who = current ? ` (revision ${current.number}, by ${current.author.name})` : '';
  return new HttpError(
    409,
    `Someone else saved this page${who} after the revision you started from (${base}). Nothing was overwritten: compare the two versions, then save again.`,
    undefined,
    { current },
  );
}

/** An archived page keeps its history as it is; it takes no new revision until restored. */
const ARCHIVED = 'This page is archived; restore it before changing it.';

interface Append {
  page: PageRow;
  idempotencyKey?: string;
  doc: string;
  plainText: string;
  summary: string;
  actor: SessionUser;
  restoredFrom?: number;
  pageChanges?: Partial<Pick<typeof pages.$inferInsert, 'title' | 'sectionId'>>;
}

/** Adds the next revision and points the page at it; its search row follows in the same transaction. */
async function appendRevision(tx: Tx, a: Append) {
  const number = a.page.currentRevision + 1;
  const now = new Date();
  const [revision] = await tx
    .insert(revisions)
    .values({ pageId: a.page.id, number, doc: a.doc, plainText: a.plainText, summary: a.summary, authorId: a.actor.id, restoredFrom: a.restoredFrom ?? null, idempotencyKey: a.idempotencyKey ?? null, createdAt: now })
    .returning();
  const [page] = await tx
    .update(pages)
    .set({ ...a.pageChanges, currentRevision: number, updatedAt: now })
    .where(and(eq(pages.id, a.page.id), eq(pages.currentRevision, a.page.currentRevision)))
    .returning();
  // The queue makes this unreachable; the guard in WHERE keeps the invariant if that ever changes.
  if (!page) throw new HttpError(409, 'The page changed while saving; reload and save again.');
  await reindexPage(tx, page.id);
  return { revision, page };
}

/** The answer of a save: the page as it now is and the revision the save made. */
async function saveAnswer(tx: Tx, page: PageRow, revision: typeof revisions.$inferSelect, author: { id: string | null; name: string | null }) {
  const [sec] = await tx.select({ slug: sections.slug, title: sections.title }).from(sections).where(eq(sections.id, page.sectionId));
  return { page: pageJson(page, sec), revision: revisionJson(revision, authorJson(author.id, author.name)) };
}

/**
 * A save retried with the Idempotency-Key of one that already landed (its answer lost to a
 * dropped connection) gets that save's answer again instead of a 409 against itself. The key
 * belongs to one person and one text: anything else reusing it is refused.
 */
async function replayed(tx: Tx, page: PageRow, key: string, doc: string, actor: SessionUser) {
  const [row] = await tx
    .select({ revision: revisions, authorName: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(and(eq(revisions.pageId, page.id), eq(revisions.idempotencyKey, key)))
    .limit(1);
  if (!row) return null;
  if (row.revision.authorId !== actor.id || row.revision.doc !== doc) {
    throw new HttpError(422, 'This Idempotency-Key was already used for a different save; send a new key with each new save.');
  }
  return saveAnswer(tx, page, row.revision, { id: row.revision.authorId, name: row.authorName });
}

/**
 * Saves a new revision when `baseRevision` is still the current one: read, compare, insert,
 * point the page at it, index it and audit it, all in ONE write transaction. Under any burst of
 * saves on the same base exactly one succeeds; the others get a 409 carrying the winner. A save
 * with an `idempotencyKey` that already landed answers as it did the first time.
 */
export async function saveRevision(venueId: string, pageSlug: string | undefined, input: PageSave, actor: SessionUser, idempotencyKey?: string) {
  const { doc, plainText } = checkDocOrThrow(input.doc);
  const docText = JSON.stringify(doc);
  const summary = input.summary ?? '';
  return writeTx(async (tx) => {
    const current = await findPage(venueId, pageSlug, tx);
    if (current.archivedAt) throw new HttpError(409, ARCHIVED);
    if (idempotencyKey) {
      const earlier = await replayed(tx, current, idempotencyKey, docText, actor);
      if (earlier) return earlier;
    }
    // A document pointing at another venue's file, or at none, is bad input whatever the base.
    await assertOwnFileRefs(tx, venueId, doc);
    if (current.currentRevision !== input.baseRevision) throw await conflict(tx, current, input.baseRevision);
    const section = input.section ? await sectionInTx(tx, venueId, input.section) : null;
    const titleChanged = input.title !== undefined && input.title !== current.title;
    const sectionChanged = section !== null && section.id !== current.sectionId;
    const { revision, page } = await appendRevision(tx, {
      page: current,
      idempotencyKey,
      doc: docText,
      plainText,
      summary,
      actor,
      pageChanges: { ...(titleChanged ? { title: input.title } : {}), ...(sectionChanged ? { sectionId: section.id } : {}) },
    });
    await recordAudit(tx, {
      venueId,
      actorId: actor.id,
      action: 'page.save',
      targetType: 'page',
      targetId: page.id,
      detail: {
        slug: page.slug,
        revision: revision.number,
        baseRevision: input.baseRevision,
        summary,
        ...(titleChanged ? { title: { from: current.title, to: page.title } } : {}),
        ...(sectionChanged ? { section: section.slug } : {}),
      },
    });
    return saveAnswer(tx, page, revision, actor);
  });
}

/** A restore is a new revision with the text of revision n, marked as restored from it. */
export async function restoreRevision(venueId: string, pageSlug: string | undefined, n: number, input: RestoreRequest, actor: SessionUser) {
  return writeTx(async (tx) => {
    const current = await findPage(venueId, pageSlug, tx);
    if (current.archivedAt) throw new HttpError(409, ARCHIVED);
    if (input.baseRevision !== undefined && current.currentRevision !== input.baseRevision) throw await conflict(tx, current, input.baseRevision);
    const old = await revisionRow(tx, current.id, n);
    if (!old) throw new HttpError(404, `This page has no revision ${n}.`);
    if (n === current.currentRevision) throw new HttpError(400, `Revision ${n} is the current text already; there is nothing to restore.`);
    await assertOwnFileRefs(tx, venueId, JSON.parse(old.revision.doc) as PmNode, { restoring: n });
    const summary = input.summary || `Restored revision ${n}`;
    const { revision, page } = await appendRevision(tx, { page: current, doc: old.revision.doc, plainText: old.revision.plainText, summary, actor, restoredFrom: n });
    await recordAudit(tx, {
      venueId,
      actorId: actor.id,
      action: 'page.restore',
      targetType: 'page',
      targetId: page.id,
      detail: { slug: page.slug, revision: revision.number, restoredFrom: n, summary },
    });
    return { revision: revisionJson(revision, authorJson(actor.id, actor.name)) };
  });
}

/**
 * One page of a page's history, newest first, without the documents: the revisions numbered
 * below `before` (all when unset). `nextBefore` is where the next, older page starts, or null
 * when revision 1 is on this one, so no revision is ever out of reach of the list.
 */
export async function listRevisions(pageId: string, opts: { before?: number; limit?: number } = {}) {
  const limit = opts.limit ?? HISTORY_PAGE_SIZE;
  const db = await getDb();
  const rows = await db
    .select({ revision: revisions, authorName: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(opts.before === undefined ? eq(revisions.pageId, pageId) : and(eq(revisions.pageId, pageId), lt(revisions.number, opts.before)))
    .orderBy(desc(revisions.number))
    .limit(limit + 1);
  const more = rows.length > limit;
  const shown = more ? rows.slice(0, limit) : rows;
  return {
    revisions: shown.map((r) => revisionJson(r.revision, authorJson(r.revision.authorId, r.authorName))),
    nextBefore: more ? shown[shown.length - 1].revision.number : null,
  };
}

/** One revision with its document and plain text; 404 when the page has no such number. */
export async function getRevision(pageId: string, number: number) {
  const row = await revisionRow(await getDb(), pageId, number);
  if (!row) throw new HttpError(404, `This page has no revision ${number}.`);
  return revisionJson(row.revision, authorJson(row.revision.authorId, row.authorName), JSON.parse(row.revision.doc) as PmNode);
}
