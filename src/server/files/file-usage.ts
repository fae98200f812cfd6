import { and, eq, like } from 'drizzle-orm';
import { pages, revisions } from '~/db/schema';
import { fileIdsInDoc } from '~/lib/doc/file-refs';
import type { PmNode } from '~/lib/doc/types';
import type { PageRef } from '~/lib/schemas/file';
import type { Reader } from '~/server/db';

/**
 * For each file id of a venue, the pages whose current revision shows or links to it, in
 * page-title order. "Uses" is fileRefsInDoc's: a page whose text only mentions an address is not
 * listed. The LIKE only narrows the rows read; the document decides.
 */
export async function fileUsage(db: Reader, venueId: string): Promise<Map<string, PageRef[]>> {
  const rows = await db
    .select({ slug: pages.slug, title: pages.title, doc: revisions.doc })
    .from(pages)
    .innerJoin(revisions, and(eq(revisions.pageId, pages.id), eq(revisions.number, pages.currentRevision)))
    .where(and(eq(pages.venueId, venueId), like(revisions.doc, '%/files/%')))
    .orderBy(pages.title);
  const usage = new Map<string, PageRef[]>();
  for (const row of rows) {
    for (const id of fileIdsInDoc(JSON.parse(row.doc) as PmNode)) {
      const list = usage.get(id) ?? [];
      list.push({ slug: row.slug, title: row.title });
      usage.set(id, list);
    }
  }
  return usage;
}
