import { and, eq, like } from 'drizzle-orm';
import type { ResultSet } from '@libsql/client';
import type { BaseSQLiteDatabase } from 'drizzle-orm/sqlite-core';
import { pages, revisions } from '~/db/schema';
import type * as schema from '~/db/schema';
import type { PageRef } from '~/lib/schemas/file';

/** The database or a transaction: reads that must also work inside `writeTx`. */
export type Reader = BaseSQLiteDatabase<'async', ResultSet, typeof schema>;

const FILE_URL = /\/files\/([A-Za-z0-9_-]{1,80})(?=[/"?#\s\\]|$)/g;

/** Ids of this instance's files that a stored document points at (images and links alike). */
export function fileIdsInDoc(docJson: string): Set<string> {
  const ids = new Set<string>();
  for (const match of docJson.matchAll(FILE_URL)) ids.add(match[1]);
  return ids;
}

/** For each file id of a venue, the pages whose current revision uses it, in page-title order. */
export async function fileUsage(db: Reader, venueId: string): Promise<Map<string, PageRef[]>> {
  const rows = await db
    .select({ slug: pages.slug, title: pages.title, doc: revisions.doc })
    .from(pages)
    .innerJoin(revisions, and(eq(revisions.pageId, pages.id), eq(revisions.number, pages.currentRevision)))
    .where(and(eq(pages.venueId, venueId), like(revisions.doc, '%/files/%')))
    .orderBy(pages.title);
  const usage = new Map<string, PageRef[]>();
  for (const row of rows) {
    for (const id of fileIdsInDoc(row.doc)) {
      const list = usage.get(id) ?? [];
      list.push({ slug: row.slug, title: row.title });
      usage.set(id, list);
    }
  }
  return usage;
}
