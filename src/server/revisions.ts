import { and, desc, eq } from 'drizzle-orm';
import { pages, revisions, sections, users } from '~/db/schema';
import type { PmNode } from '~/lib/doc/types';
import type { PageSave, RestoreRequest } from '~/lib/schemas/page';
import { recordAudit } from './audit';
import { getDb, writeTx, type Reader, type Tx } from './db';
import { HttpError } from './http';
import { checkDocOrThrow } from './page-doc';
import { assertOwnFileRefs } from './page-file-refs';
import { findPage, pageJson, sectionInTx, type PageRow } from './pages';
import { authorJson, revisionJson } from './revision-json';
import type { SessionUser } from './session';

const MAX_HISTORY = 1000;

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

interface Append {
  page: PageRow;
  doc: string;
  plainText: string;
  summary: string;
  actor: SessionUser;
  restoredFrom?: number;
  pageChanges?: Partial<Pick<typeof pages.$inferInsert, 'title' | 'sectionId'>>;
}

/** Adds the next revision and points the page at it; the FTS triggers follow in the same transaction. */
async function appendRevision(tx: Tx, a: Append) {
  const number = a.page.currentRevision + 1;
  const now = new Date();
  const [revision] = await tx
    .insert(revisions)
    .values({ pageId: a.page.id, number, doc: a.doc, plainText: a.plainText, summary: a.summary, authorId: a.actor.id, restoredFrom: a.restoredFrom ?? null, createdAt: now })
    .returning();
  const [page] = await tx
    .update(pages)
    .set({ ...a.pageChanges, currentRevision: number, updatedAt: now })
    .where(and(eq(pages.id, a.page.id), eq(pages.currentRevision, a.page.currentRevision)))
    .returning();
  // The queue makes this unreachable; the guard in WHERE keeps the invariant if that ever changes.
  if (!page) throw new HttpError(409, 'The page changed while saving; reload and save again.');
  return { revision, page };
}

/**
 * Saves a new revision when `baseRevision` is still the current one: read, compare, insert,
 * point the page at it, index it and audit it, all in ONE write transaction. Under any burst of
 * saves on the same base exactly one succeeds; the others get a 409 carrying the winner.
 */
export async function saveRevision(venueId: string, pageSlug: string | undefined, input: PageSave, actor: SessionUser) {
  const { doc, plainText } = checkDocOrThrow(input.doc);
  const summary = input.summary ?? '';
  return writeTx(async (tx) => {
    const current = await findPage(venueId, pageSlug, tx);
    // A document pointing at another venue's file, or at none, is bad input whatever the base.
    await assertOwnFileRefs(tx, venueId, doc);
    if (current.currentRevision !== input.baseRevision) throw await conflict(tx, current, input.baseRevision);
    const section = input.section ? await sectionInTx(tx, venueId, input.section) : null;
    const titleChanged = input.title !== undefined && input.title !== current.title;
    const sectionChanged = section !== null && section.id !== current.sectionId;
    const { revision, page } = await appendRevision(tx, {
      page: current,
      doc: JSON.stringify(doc),
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
    const [sec] = await tx.select({ slug: sections.slug, title: sections.title }).from(sections).where(eq(sections.id, page.sectionId));
    return { page: pageJson(page, sec), revision: revisionJson(revision, authorJson(actor.id, actor.name)) };
  });
}

/** A restore is a new revision with the text of revision n, marked as restored from it. */
export async function restoreRevision(venueId: string, pageSlug: string | undefined, n: number, input: RestoreRequest, actor: SessionUser) {
  return writeTx(async (tx) => {
    const current = await findPage(venueId, pageSlug, tx);
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

/** The history of a page, newest first, without the documents. */
export async function listRevisions(pageId: string) {
  const db = await getDb();
  const rows = await db
    .select({ revision: revisions, authorName: users.name })
    .from(revisions)
    .leftJoin(users, eq(users.id, revisions.authorId))
    .where(eq(revisions.pageId, pageId))
    .orderBy(desc(revisions.number))
    .limit(MAX_HISTORY);
  return rows.map((r) => revisionJson(r.revision, authorJson(r.revision.authorId, r.authorName)));
}

/** One revision with its document and plain text; 404 when the page has no such number. */
export async function getRevision(pageId: string, number: number) {
  const row = await revisionRow(await getDb(), pageId, number);
  if (!row) throw new HttpError(404, `This page has no revision ${number}.`);
  return revisionJson(row.revision, authorJson(row.revision.authorId, row.authorName), JSON.parse(row.revision.doc) as PmNode);
}
