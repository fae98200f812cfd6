import type { PmNode } from '~/lib/doc/types';
import { renderDocHtml } from '~/lib/doc/render-html';
import { availableFileIds, fileIdOfUrl } from './files/available-files';
import { fileIdsInDoc } from './files/file-usage';
import { curveHrefFor, traceIdsInDocText } from './files/block-context';
import { loadVenueTraces } from './files/trace-data';

/**
 * The read view's body HTML, cached. A revision never changes after it is written, so its HTML
 * depends only on the revision id, the venue and page slugs (the curve download links), and on
 * which of the files it shows (photos, measured traces) can still be served; all
 * are read from the database on every request and form the key. A save or restore makes a new
 * revision id, a deleted or vanished file changes the set: either misses the cache, in this
 * process or any other, so nothing stale is ever served. Entries are only an optimisation, and
 * bounded by total size (least recently used go first).
 */
const MAX_CACHED_CHARS = 16 * 1024 * 1024;
const cache = new Map<string, string>();
let cachedChars = 0;

export interface StoredRevision {
  id: string;
  /** The stored JSON text of the document. */
  doc: string;
}

export async function revisionHtml(venue: { id: string; slug: string }, pageSlug: string, revision: StoredRevision): Promise<string> {
  const traceIds = traceIdsInDocText(revision.doc);
  const referenced = new Set([...fileIdsInDoc(revision.doc), ...traceIds]);
  const available = referenced.size ? await availableFileIds(venue.id, referenced) : new Set<string>();
  const key = `${revision.id}|${venue.slug}/${pageSlug}|${[...available].sort().join(',')}`;
  const hit = cache.get(key);
  if (hit !== undefined) {
    // Re-inserting moves it to the young end of the Map's order.
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const traces = await loadVenueTraces(venue.id, [...traceIds].filter((id) => available.has(id)));
  const html = renderDocHtml(JSON.parse(revision.doc) as PmNode, {
    isImageAvailable: (src) => available.has(fileIdOfUrl(src)),
    blockContext: { traces, curveHref: curveHrefFor(venue.slug, pageSlug) },
  });
  remember(key, html);
  return html;
}

function remember(key: string, html: string): void {
  if (html.length > MAX_CACHED_CHARS / 8) return;
  cache.set(key, html);
  cachedChars += html.length + key.length;
  for (const [oldKey, oldHtml] of cache) {
    if (cachedChars <= MAX_CACHED_CHARS) break;
    cache.delete(oldKey);
    cachedChars -= oldHtml.length + oldKey.length;
  }
}
