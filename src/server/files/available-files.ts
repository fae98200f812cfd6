import { and, eq, inArray } from 'drizzle-orm';
import { files } from '~/db/schema';
import { getDb } from '~/server/db';

/** A servable file's pixel size, when it is an image (null for other files). */
export interface FileSize {
  width: number | null;
  height: number | null;
}

/**
 * Of these file ids, the ones this venue can still serve (a row exists and its bytes are on disk),
 * with their pixel size, so the read view can give each photo its intrinsic size and the page
 * does not jump as photos arrive.
 */
export async function availableFiles(venueId: string, ids: Iterable<string>): Promise<Map<string, FileSize>> {
  const wanted = [...ids].slice(0, 500);
  if (!wanted.length) return new Map();
  const db = await getDb();
  const rows = await db
    .select({ id: files.id, width: files.width, height: files.height })
    .from(files)
    .where(and(eq(files.venueId, venueId), eq(files.missing, false), inArray(files.id, wanted)));
  return new Map(rows.map((r) => [r.id, { width: r.width, height: r.height }]));
}

/** Of these file ids, the ones this venue can still serve. */
export async function availableFileIds(venueId: string, ids: Iterable<string>): Promise<Set<string>> {
  return new Set((await availableFiles(venueId, ids)).keys());
}
