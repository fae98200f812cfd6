/**
 * What the read view needs to draw a page's processor blocks beyond the document itself: the
 * measured traces they attach (of this venue only), and where each block's curve downloads.
 */
import type { BlockContext } from '~/lib/doc/render-blocks';
import type { PmNode } from '~/lib/doc/types';
import { fileRefsInDoc } from '~/server/page-file-refs';
import { loadVenueTraces } from './trace-data';

export async function blockContextFor(venue: { id: string; slug: string }, pageSlug: string, doc: PmNode): Promise<BlockContext> {
  const ids = fileRefsInDoc(doc).filter((r) => r.kind === 'trace').map((r) => r.fileId);
  return {
    traces: await loadVenueTraces(venue.id, ids),
    curveHref: (n) => `/venues/${encodeURIComponent(venue.slug)}/${encodeURIComponent(pageSlug)}/curves/${n}.txt`,
  };
}
