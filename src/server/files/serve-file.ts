import { open } from 'node:fs/promises';
import { Readable } from 'node:stream';
import { eq } from 'drizzle-orm';
import { files, venues } from '~/db/schema';
import { withExtension } from '~/lib/file-name';
import { isFileId } from '~/lib/file-url';
import { FILE_VARIANTS, type FileVariant } from '~/lib/schemas/file';
import { getDb } from '~/server/db';
import { isGuest, type Guest } from '~/lib/permissions';
import { isAdvanceFile } from '~/server/advance';
import { loadVenue, requirePermission, requireUser, type RequestPrincipal } from '~/server/guard';
import { HttpError } from '~/server/http';
import type { SessionUser } from '~/server/session';
import { contentDisposition } from './content-disposition';
import { FILE_NOT_FOUND, type FileRow } from './file-records';
import { ensureStorageReady } from './storage-sweep';
import { storedPath } from './storage-paths';

/**
 * The file row, for people who may read its venue. A file of a venue the person is not a member
 * of answers exactly like a file that does not exist.
 */
export async function loadReadableFile(principal: RequestPrincipal, fileId: string | undefined): Promise<FileRow> {
  const signedIn: SessionUser | Guest = isGuest(principal) ? principal : requireUser(principal);
  if (!isFileId(fileId)) throw new HttpError(404, FILE_NOT_FOUND);
  const db = await getDb();
  const [found] = await db.select({ file: files, venueSlug: venues.slug }).from(files).innerJoin(venues, eq(venues.id, files.venueId)).where(eq(files.id, fileId)).limit(1);
  if (!found) throw new HttpError(404, FILE_NOT_FOUND);
  let access;
  try {
    ({ access } = await loadVenue(signedIn, found.venueSlug));
  } catch (err) {
    if (err instanceof HttpError && err.status === 404) throw new HttpError(404, FILE_NOT_FOUND);
    throw err;
  }
  if (isGuest(signedIn)) {
    // A guest may fetch exactly the files the advance sheet shows, nothing else of the venue.
    requirePermission(signedIn, 'advance.read', access);
    if (!(await isAdvanceFile(found.file.venueId, found.file.id))) throw new HttpError(404, FILE_NOT_FOUND);
    return found.file;
  }
  requirePermission(signedIn, 'venue.read', access);
  return found.file;
}

export function parseVariant(raw: string | undefined): FileVariant {
  if (raw && (FILE_VARIANTS as readonly string[]).includes(raw)) return raw as FileVariant;
  throw new HttpError(404, 'There is no such size of this file; use original, display or thumb.');
}

const EXT_FOR_MIME: Record<string, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp', 'application/pdf': 'pdf', 'text/plain; charset=utf-8': 'txt', 'application/json': 'json' };

/**
 * The stored bytes with headers that keep a browser from guessing: the type we decided,
 * nosniff, a download name per RFC 6266, and a year of private caching (the names are
 * content-derived, so the bytes behind a URL never change).
 */
export async function fileResponse(row: FileRow, variant: FileVariant, request: Request, download: boolean): Promise<Response> {
  await ensureStorageReady();
  const name = variant === 'original' ? row.storageName : variant === 'display' ? row.displayName : row.thumbName;
  if (!name) throw new HttpError(404, 'This file has only its original (PDFs and traces have no display size or thumbnail).');
  const mime = variant === 'original' ? row.mime : name.endsWith('.json') ? 'application/json' : 'image/webp';
  const etag = `"${name}"`;
  const headers: Record<string, string> = {
    'content-type': mime,
    'x-content-type-options': 'nosniff',
    'cache-control': 'private, max-age=31536000, immutable',
    etag,
    'content-disposition': contentDisposition(download ? 'attachment' : 'inline', downloadName(row, variant, mime)),
  };
  // Images never need script or plugins; a PDF keeps the site policy so the browser's viewer works.
  if (mime.startsWith('image/')) headers['content-security-policy'] = "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox";
  if (request.headers.get('if-none-match')?.split(',').some((t) => t.trim() === etag)) {
    return new Response(null, { status: 304, headers });
  }
  let handle;
  try {
    handle = await open(storedPath(name), 'r');
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') {
      throw new HttpError(404, "This file's bytes are missing from the server's storage; upload it again.");
    }
    throw err;
  }
  const { size } = await handle.stat();
  headers['content-length'] = String(size);
  if (request.method === 'HEAD') {
    await handle.close();
    return new Response(null, { status: 200, headers });
  }
  const body = Readable.toWeb(handle.createReadStream({ autoClose: true })) as ReadableStream<Uint8Array>;
  return new Response(body, { status: 200, headers });
}

function downloadName(row: FileRow, variant: FileVariant, mime: string): string {
  const ext = EXT_FOR_MIME[mime] ?? 'bin';
  const stem = variant === 'original' ? row.originalName : `${withExtension(row.originalName, '')}-${variant}`;
  const lower = stem.toLowerCase();
  const hasExt = lower.endsWith(`.${ext}`) || (ext === 'jpg' && lower.endsWith('.jpeg'));
  return hasExt ? stem : withExtension(stem, ext);
}
