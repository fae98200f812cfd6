import { and, desc, eq, or } from 'drizzle-orm';
import { isFileId } from '~/lib/file-url';
import { rm } from 'node:fs/promises';
import { files, pages, users } from '~/db/schema';
import type { FileView, PageRef } from '~/lib/schemas/file';
import { recordAudit } from '~/server/audit';
import { getDb, writeTx, type Reader, type Tx } from '~/server/db';
import { HttpError } from '~/server/http';
import type { SessionUser } from '~/server/session';
import { fileUsage } from './file-usage';
import { ensureStorageReady } from './storage-sweep';
import { storedPath } from './storage-paths';

export type FileRow = typeof files.$inferSelect;

export const FILE_NOT_FOUND = 'There is no such file, or you may not see it.';

export function toFileView(row: FileRow, extra: { page: PageRef | null; usedBy: PageRef[]; uploadedBy: string | null }): FileView {
  const isImage = row.mime.startsWith('image/');
  const url = `/files/${row.id}`;
  return {
    id: row.id,
    kind: isImage ? 'image' : row.mime.startsWith('text/plain') ? 'trace' : 'pdf',
    mime: row.mime,
    originalName: row.originalName,
    caption: row.caption,
    sizeBytes: row.sizeBytes,
    width: row.width,
    height: row.height,
    url,
    displayUrl: isImage && row.displayName ? `${url}/display` : null,
    thumbUrl: isImage && row.thumbName ? `${url}/thumb` : null,
    page: extra.page,
    usedBy: extra.usedBy,
    uploadedBy: extra.uploadedBy,
    createdAt: row.createdAt.toISOString(),
    missing: row.missing,
  };
}

async function selectViews(db: Reader, venueId: string, fileId?: string): Promise<FileView[]> {
  const rows = await db
    .select({ file: files, pageSlug: pages.slug, pageTitle: pages.title, uploader: users.name })
    .from(files)
    .leftJoin(pages, eq(pages.id, files.pageId))
    .leftJoin(users, eq(users.id, files.uploadedBy))
    .where(fileId ? and(eq(files.venueId, venueId), eq(files.id, fileId)) : eq(files.venueId, venueId))
    .orderBy(desc(files.createdAt), files.id);
  const usage = await fileUsage(db, venueId);
  return rows.map((r) =>
    toFileView(r.file, {
      page: r.pageSlug && r.pageTitle ? { slug: r.pageSlug, title: r.pageTitle } : null,
      usedBy: usage.get(r.file.id) ?? [],
      uploadedBy: r.uploader,
    }),
  );
}

/** A venue's files, newest first, each with the pages that show it. */
export async function listVenueFiles(venueId: string): Promise<FileView[]> {
  await ensureStorageReady();
  return selectViews(await getDb(), venueId);
}

export async function loadVenueFile(venueId: string, fileId: string | undefined): Promise<FileView> {
  if (!isFileId(fileId)) throw new HttpError(404, FILE_NOT_FOUND);
  const [view] = await selectViews(await getDb(), venueId, fileId);
  if (!view) throw new HttpError(404, FILE_NOT_FOUND);
  return view;
}

async function lockedRow(tx: Tx, venueId: string, fileId: string | undefined): Promise<FileRow> {
  if (!isFileId(fileId)) throw new HttpError(404, FILE_NOT_FOUND);
  const [row] = await tx.select().from(files).where(and(eq(files.venueId, venueId), eq(files.id, fileId))).limit(1);
  if (!row) throw new HttpError(404, FILE_NOT_FOUND);
  return row;
}

export async function updateCaption(venueId: string, fileId: string | undefined, caption: string, actor: SessionUser): Promise<FileView> {
  const id = await writeTx(async (tx) => {
    const row = await lockedRow(tx, venueId, fileId);
    if (row.caption === caption) return row.id;
    await tx.update(files).set({ caption }).where(eq(files.id, row.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'file.caption', targetType: 'file', targetId: row.id, detail: { name: row.originalName, from: row.caption, to: caption } });
    return row.id;
  });
  return loadVenueFile(venueId, id);
}

/**
 * Deletes a file's row and, when no other row shares the same content, its bytes. A file a
 * page still shows is only deleted when the caller confirms; otherwise 409 names the pages.
 * The bytes go only after the row's removal has committed: a crash before the commit keeps row
 * and bytes together, a crash after it leaves bytes no row names, which the start-up sweep removes.
 */
export async function deleteFile(venueId: string, fileId: string | undefined, actor: SessionUser, confirmed: boolean): Promise<{ usedBy: PageRef[] }> {
  await ensureStorageReady();
  const { usedBy, names } = await writeTx(async (tx) => {
    const row = await lockedRow(tx, venueId, fileId);
    const usedBy = (await fileUsage(tx, venueId)).get(row.id) ?? [];
    if (usedBy.length && !confirmed) {
      const names = usedBy.map((p) => `“${p.title}”`).join(', ');
      throw new HttpError(409, `This file is shown on ${names}. Deleting it leaves a gap there; confirm to delete it anyway.`, undefined, { usedBy });
    }
    await tx.delete(files).where(eq(files.id, row.id));
    await recordAudit(tx, {
      venueId,
      actorId: actor.id,
      action: 'file.delete',
      targetType: 'file',
      targetId: row.id,
      detail: { name: row.originalName, caption: row.caption, mime: row.mime, usedBy: usedBy.map((p) => p.slug) },
    });
    return { usedBy, names: [row.storageName, row.displayName, row.thumbName].filter((n): n is string => !!n) };
  });
  await removeUnreferenced(names);
  return { usedBy };
}

/**
 * Removes stored bytes no row names. It runs as its own turn of the write queue because uploads
 * publish their bytes inside theirs: an upload of the same content cannot slip in between the
 * check and the removal. Nothing here writes to the database, so a crash loses nothing.
 */
async function removeUnreferenced(names: string[]): Promise<void> {
  if (!names.length) return;
  await writeTx(async (tx) => {
    for (const name of names) {
      const [shared] = await tx
        .select({ id: files.id })
        .from(files)
        .where(or(eq(files.storageName, name), eq(files.displayName, name), eq(files.thumbName, name)))
        .limit(1);
      if (!shared) await rm(storedPath(name), { force: true });
    }
  });
}
