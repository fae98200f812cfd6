import { gzipSync } from 'node:zlib';
import { LRUCache } from 'lru-cache';
import { acceptsGzip } from '~/cli/anonymous-page-cache.mjs';

/**
 * Whole rendered pages, kept by a key that spells out everything the page's HTML was made from.
 *
 * A page opts in by computing its key from what it read on this request (the person, their role,
 * the rows it shows, the version of any cached body) and calling `cachedPageResponse(key)`; on a
 * miss it sets `locals.renderKey` and renders as usual, and the middleware keeps the result. As
 * every input is read again on every request and is part of the key, a save, a restore, a role
 * change or a renamed person makes a different key: a stale page cannot be found, only a fresh
 * one rendered. Entries are an optimisation, per process, and bounded by size (oldest use first).
 *
 * What this saves is Astro rendering the layout and the page, and gzip packing it: on a page read
 * that was about half of the request's CPU.
 */
const MAX_CACHED_BYTES = 8 * 1024 * 1024;

interface CachedPage {
  /** The response's own headers as the app produced them (content type, page policy). */
  headers: [string, string][];
  plain: Uint8Array<ArrayBuffer>;
  gzip: Uint8Array<ArrayBuffer>;
}

const sizeOf = (key: string, page: CachedPage) => key.length + page.plain.byteLength + page.gzip.byteLength;

const pages = new LRUCache<string, CachedPage>({ maxSize: MAX_CACHED_BYTES, maxEntrySize: MAX_CACHED_BYTES / 16, sizeCalculation: (page, key) => sizeOf(key, page) });

/** A key from the page's inputs, in order; any JSON-able values. */
export function renderKeyOf(...inputs: unknown[]): string {
  return JSON.stringify(inputs);
}

/**
 * The key of a calculator page or guide for a signed-in person, or null for any other address.
 * Those pages are made from the build, the address and the header's person only (signed out,
 * they are the same for everyone and kept in the HTTP layer instead).
 */
export function calculatorPageKey(url: URL, method: string, user: { id: string; name: string; email: string; isAdmin: boolean } | null): string | null {
  if (method !== 'GET' || !user || !/^\/calc(\/|$)/.test(url.pathname) || url.pathname.endsWith('.json')) return null;
  return renderKeyOf('calc', url.pathname + url.search, [user.id, user.name, user.email, user.isAdmin]);
}

/** The kept page for `key` as a fresh Response for this request, or null. */
export function cachedPageResponse(key: string, request: Request): Response | null {
  const page = pages.get(key);
  if (!page) return null;
  const headers = new Headers(page.headers);
  headers.set('vary', 'Accept-Encoding');
  const packed = acceptsGzip(request.headers.get('accept-encoding') ?? undefined);
  if (packed) headers.set('content-encoding', 'gzip');
  const body = packed ? page.gzip : page.plain;
  headers.set('content-length', String(body.byteLength));
  return new Response(body, { status: 200, headers });
}

/** Keeps a rendered 200 HTML response under `key`; hands back an equal response to send. */
export async function keepRenderedPage(key: string, response: Response): Promise<Response> {
  if (response.status !== 200 || !/^text\/html\b/i.test(response.headers.get('content-type') ?? '') || response.headers.has('set-cookie')) return response;
  const plain = new Uint8Array(await response.arrayBuffer());
  const headers = [...response.headers.entries()].filter(([name]) => name !== 'content-length' && name !== 'content-encoding');
  // One too big for the bound is simply not kept.
  pages.set(key, { headers, plain, gzip: new Uint8Array(gzipSync(plain)) });
  return new Response(plain, { status: response.status, statusText: response.statusText, headers: response.headers });
}
