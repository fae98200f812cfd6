import { and, eq, inArray } from 'drizzle-orm';
import { files } from '~/db/schema';
import { getDb } from '~/server/db';

/** Of these file ids, the ones this venue can still serve (a row exists and its bytes are on disk). */
export async function availableFileIds(venueId: string, ids: Iterable<string>): Promise<Set<string>> {
  const wanted = [...ids].slice(0, 500);
  if (!wanted.length) return new Set();
  const db = await getDb();
  const rows = await db
    .select({ id: files.id })
    .from(files)
    .where(and(eq(files.venueId, venueId), eq(files.missing, false), inArray(files.id, wanted)));
  return new Set(rows.map((r) => r.id));
}

