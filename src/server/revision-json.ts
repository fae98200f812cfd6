import type { revisions } from '~/db/schema';
import type { PmNode } from '~/lib/doc/types';

export interface AuthorJson {
  id: string | null;
  name: string;
}

export const FORMER_MEMBER = 'a former member';

export function authorJson(id: string | null, name: string | null | undefined): AuthorJson {
  return { id, name: name ?? FORMER_MEMBER };
}

/**
 * A revision as the JSON routes describe it. `doc` is included when given (one revision, the
 * current one on a conflict) and left out of history lists, which stay small.
 */
export function revisionJson(row: Omit<typeof revisions.$inferSelect, 'doc'>, author: AuthorJson, doc?: PmNode) {
  return {
    number: row.number,
    summary: row.summary,
    author,
    createdAt: row.createdAt,
    restoredFrom: row.restoredFrom,
    ...(doc ? { doc, plainText: row.plainText } : {}),
  };
}

export type RevisionJson = ReturnType<typeof revisionJson>;
