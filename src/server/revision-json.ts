import type { revisions } from '~/db/schema';
import type { Author, RevisionSummary, RevisionWithDoc } from '~/lib/api-types';
import type { PmNode } from '~/lib/doc/types';

export const FORMER_MEMBER = 'a former member';

export function authorJson(id: string | null, name: string | null | undefined): Author {
  return { id, name: name ?? FORMER_MEMBER };
}

type RevisionRow = Omit<typeof revisions.$inferSelect, 'doc'>;

/**
 * A revision as the JSON routes describe it. `doc` is included when given (one revision, the
 * current one on a conflict) and left out of history lists, which stay small.
 */
export function revisionJson(row: RevisionRow, author: Author): RevisionSummary<Date>;
export function revisionJson(row: RevisionRow, author: Author, doc: PmNode): RevisionWithDoc<Date>;
export function revisionJson(row: RevisionRow, author: Author, doc?: PmNode): RevisionSummary<Date> | RevisionWithDoc<Date> {
  const summary: RevisionSummary<Date> = { number: row.number, summary: row.summary, author, createdAt: row.createdAt, restoredFrom: row.restoredFrom };
  return doc ? { ...summary, doc, plainText: row.plainText } : summary;
}
