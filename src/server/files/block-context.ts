/**
 * What the read view needs to draw a page's processor blocks beyond the document itself: which
 * measured traces they attach, and where each block's computed curve downloads.
 */

/**
 * Trace ids attached to blocks, read from the stored JSON text without parsing it (the read
 * cache exists to avoid that). Only a TraceRef has a "fileId" key; typed text containing those
 * characters is stored with its quotes escaped, so it cannot match.
 */
export function traceIdsInDocText(docJson: string): Set<string> {
  const ids = new Set<string>();
  for (const m of docJson.matchAll(/"fileId":"([A-Za-z0-9_-]{1,80})"/g)) ids.add(m[1]!);
  return ids;
}

export function curveHrefFor(venueSlug: string, pageSlug: string): (n: number) => string {
  return (n) => `/venues/${encodeURIComponent(venueSlug)}/${encodeURIComponent(pageSlug)}/curves/${n}.txt`;
}
