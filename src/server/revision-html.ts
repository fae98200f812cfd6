import { LRUCache } from 'lru-cache';
import type { PmNode } from '~/lib/doc/types';
import { fileIdsInDoc, traceIdsIn } from '~/lib/doc/file-refs';
import { renderDocHtml } from '~/lib/doc/render-html';
import { headingOutline, type OutlineEntry } from '~/lib/doc/heading-outline';
import { fileIdOfUrl } from '~/lib/file-url';
import { availableFiles, type FileSize } from './files/available-files';
import { curveHrefFor } from './files/block-context';
import { loadVenueTraces } from './files/trace-data';

/**
 * The read view's body HTML, cached. A revision never changes after it is written, so its HTML
 * depends only on the revision id, the venue and page slugs (the curve download links), and on
 * which of the files it shows (photos, measured traces) can still be served; the
 * set of files it points at is found once per revision, their availability is read from the
 * database on every request and must match the entry's. A save or restore makes a new
 * revision id, a deleted or vanished file changes the set: either misses the cache, in this
 * process or any other, so nothing stale is ever served. Entries are only an optimisation, and
 * bounded by total size (least recently used go first).
 */
const MAX_CACHED_CHARS = 16 * 1024 * 1024;

interface Entry {
  /** The files the revision points at, found once by the one definition (fileIdsInDoc). */
  referenced: Set<string>;
  /** Which of them were servable when `html` was rendered. */
  availableKey: string;
  html: string;
  /** The headings, for the contents list above a long page. */
  outline: OutlineEntry[];
}

export interface RenderedRevision {
  html: string;
  outline: OutlineEntry[];
  /** Names exactly what `html` was made from (revision, address, servable files): equal versions, equal HTML. */
  version: string;
}


/**
 * `loadDoc` reads the revision's stored JSON text; it is called only on a miss, so a cached read
 * never moves the document (often the largest column in the database) out of SQLite.
 */
export async function revisionHtml(venue: { id: string; slug: string }, pageSlug: string, revisionId: string, loadDoc: () => Promise<string>): Promise<RenderedRevision> {
  const venueId = venue.id;
  const key = `${revisionId}|${venue.slug}/${pageSlug}`;
  const hit = cache.get(key);
  let parsed: PmNode | undefined;
  const referenced = hit?.referenced ?? fileIdsInDoc((parsed = JSON.parse(await loadDoc()) as PmNode));
  const available = referenced.size ? await availableFiles(venueId, referenced) : new Map<string, FileSize>();
  const availableKey = [...available.keys()].sort().join(',');
  if (hit && hit.availableKey === availableKey) {
    return { html: hit.html, outline: hit.outline, version: `${key}#${availableKey}` };
  }
  parsed ??= JSON.parse(await loadDoc()) as PmNode;
  const traceIds = traceIdsIn(parsed).filter((id) => available.has(id));
  const traces = await loadVenueTraces(venueId, traceIds);
  // Found once: the renderer numbers the headings from it and the contents list shows it.
  const outline = headingOutline(parsed);
  const html = renderDocHtml(parsed, {
    outline,
    isImageAvailable: (src) => available.has(fileIdOfUrl(src) ?? ''),
    imageSize: (src) => available.get(fileIdOfUrl(src) ?? ''),
    blockContext: { traces, curveHref: curveHrefFor(venue.slug, pageSlug) },
  });
  // An entry over an eighth of the bound is simply not kept.
  cache.set(key, { referenced, availableKey, html, outline });
  return { html, outline, version: `${key}#${availableKey}` };
}

const sizeOf = (id: string, e: Entry) => e.html.length + id.length + e.availableKey.length + e.outline.reduce((n, h) => n + h.text.length + h.id.length, 0);

const cache = new LRUCache<string, Entry>({ maxSize: MAX_CACHED_CHARS, maxEntrySize: MAX_CACHED_CHARS / 8, sizeCalculation: (entry, key) => sizeOf(key, entry) });
