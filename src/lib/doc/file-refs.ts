import { fileIdOfUrl } from '~/lib/file-url';
import { blockTraces, CROSSOVER_BLOCK, EQ_BLOCK, type TraceRef } from './blocks/block-data';
import type { PmNode } from './types';

/** One place a page document points at a stored file: a photo, a link to /files/…, or a measured trace on a block. */
export interface FileRef {
  kind: 'photo' | 'link' | 'trace';
  fileId: string;
  url: string;
  /** What the person sees: the photo's description or the link's text. */
  label: string;
}

/**
 * Every file reference in a document, in reading order: image sources, and link targets that
 * are paths on this site under /files/. Words in the text that merely look like a file address
 * are not references, and neither are links to other hosts. This is THE definition of "a page
 * uses this file": the save check, the files screen and the read view all ask it.
 */
export function fileRefsInDoc(doc: PmNode): FileRef[] {
  const refs: FileRef[] = [];
  const add = (kind: FileRef['kind'], url: unknown, label: string) => {
    const fileId = fileIdOfUrl(url);
    if (fileId) refs.push({ kind, fileId, url: url as string, label });
  };
  // Validated documents are shallow (see DOC_LIMITS), but a loop keeps this safe on any input.
  const stack: PmNode[] = [doc];
  while (stack.length) {
    const node = stack.pop()!;
    if (node.type === 'image') add('photo', node.attrs?.src, typeof node.attrs?.alt === 'string' ? node.attrs.alt : '');
    for (const mark of node.marks ?? []) if (mark.type === 'link') add('link', mark.attrs?.href, node.text ?? '');
    // Measured traces attached to EQ and crossover blocks are files the page shows too.
    if (node.type === EQ_BLOCK || node.type === CROSSOVER_BLOCK) {
      for (const t of blockTraces(node.attrs as { traces?: TraceRef[] })) {
        if (typeof t?.fileId === 'string') add('trace', `/files/${t.fileId}`, typeof t.label === 'string' ? t.label : '');
      }
    }
    if (node.content) for (let i = node.content.length - 1; i >= 0; i--) stack.push(node.content[i]);
  }
  return refs;
}

/** The ids of the files a document shows or links to. */
export function fileIdsInDoc(doc: PmNode): Set<string> {
  return new Set(fileRefsInDoc(doc).map((r) => r.fileId));
}

/** The ids of the measured traces a document's blocks attach. */
export function traceIdsIn(doc: PmNode): string[] {
  return fileRefsInDoc(doc).filter((r) => r.kind === 'trace').map((r) => r.fileId);
}
