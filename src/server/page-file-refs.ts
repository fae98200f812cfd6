import { and, eq, inArray } from 'drizzle-orm';
import { files } from '~/db/schema';
import { fileRefsInDoc, type FileRef } from '~/lib/doc/file-refs';
import type { PmNode } from '~/lib/doc/types';
import type { Tx } from './db';
import { HttpError } from './http';

/** Where ids are looked up in one query; well under SQLite's bound-parameter limit. */
const LOOKUP_CHUNK = 500;

function quoted(label: string): string {
  const flat = label.replace(/\s+/g, ' ').trim();
  return flat ? `“${flat.length > 60 ? `${flat.slice(0, 57)}…` : flat}” ` : '';
}

/** What is being saved: a new text, or an old revision brought back. */
export type RefContext = { restoring?: number };

function refused(ref: FileRef, problem: 'missing' | 'pdf' | 'not-trace', { restoring }: RefContext): HttpError {
  const thing = ref.kind === 'photo' ? `the photo ${quoted(ref.label)}(${ref.url})` : ref.kind === 'trace' ? `the trace ${quoted(ref.label)}(${ref.url})` : `the link ${quoted(ref.label)}to ${ref.url}`;
  let sentence: string;
  if (problem === 'not-trace') {
    sentence = `${restoring ? `Revision ${restoring} attaches` : 'A block attaches'} ${quoted(ref.label)}(${ref.url}) as a measured trace, but that file is not a trace; upload the measurement as text columns and attach that.`;
  } else if (problem === 'pdf') {
    sentence = `${restoring ? `Revision ${restoring} shows` : 'The page shows'} ${quoted(ref.label)}(${ref.url}) as a photo, but that file is a PDF; add it as a link instead.`;
  } else if (restoring) {
    sentence = `Revision ${restoring} has ${thing}, which is not a file of this venue any more; restore another revision, or edit the page and add the file again.`;
  } else {
    sentence = `${thing[0].toUpperCase()}${thing.slice(1)} is not a file of this venue; upload it here first, or remove it from the page.`;
  }
  return new HttpError(400, sentence, 'doc');
}

/**
 * Refuses a document that points at a file which is not a stored file of this venue. Runs inside
 * the save's write transaction, so a file deleted a moment earlier cannot slip through. A file of
 * another venue and an id that does not exist get the same answer: the check must not tell anyone
 * which ids exist elsewhere.
 */
export async function assertOwnFileRefs(tx: Tx, venueId: string, doc: PmNode, context: RefContext = {}): Promise<void> {
  const refs = fileRefsInDoc(doc);
  if (refs.length === 0) return;
  const ids = [...new Set(refs.map((r) => r.fileId))];
  const found = new Map<string, string>();
  for (let i = 0; i < ids.length; i += LOOKUP_CHUNK) {
    const rows = await tx
      .select({ id: files.id, mime: files.mime })
      .from(files)
      .where(and(eq(files.venueId, venueId), inArray(files.id, ids.slice(i, i + LOOKUP_CHUNK))));
    for (const row of rows) found.set(row.id, row.mime);
  }
  for (const ref of refs) {
    const mime = found.get(ref.fileId);
    if (mime === undefined) throw refused(ref, 'missing', context);
    if (ref.kind === 'photo' && !mime.startsWith('image/')) throw refused(ref, 'pdf', context);
    if (ref.kind === 'trace' && !mime.startsWith('text/plain')) throw refused(ref, 'not-trace', context);
  }
}
