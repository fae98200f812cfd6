// A small shared cache in front of the app for pages rendered for nobody in particular.
//
// A calculator page marks itself with `x-throwline-offline: anonymous` when it was rendered for a
// signed-out visitor (src/components/calc/offline-header.ts): such a page depends on nothing but
// the build and its address, which is also why the service worker may keep it. Rendering it
// again for every signed-out visitor cost ~3 ms of React and Astro work, a fifth of what a
// static file costs to send; this keeps the first rendering (and its gzip, packed once) and
// answers later signed-out requests for the same address from memory. A request carrying a
// session cookie or an Authorization header always reaches the app, so nobody signed in ever
// sees a page rendered for someone else, and nothing unmarked is ever kept. The build cannot
// change under a running process, so entries never go stale; they are bounded in count and size.
import { gzipSync } from 'node:zlib';
import { LRUCache } from 'lru-cache';

export const ANONYMOUS_MARK = 'x-throwline-offline';

/** Headers that describe one transfer, not the page: never stored, recomputed per answer. */
const PER_TRANSFER = new Set(['content-length', 'content-encoding', 'transfer-encoding', 'vary', 'date', 'connection', 'keep-alive', 'etag']);

/** True when the request may speak for a person: then the app, not this cache, answers. */
export function carriesCredentials(headers) {
  if (headers.authorization) return true;
  const cookie = headers.cookie;
  return typeof cookie === 'string' && cookie.includes('session-token');
}

/** Whether `Accept-Encoding` admits gzip (by name or `*`) with a weight above zero. */
export function acceptsGzip(header) {
  if (typeof header !== 'string') return false;
  return header.split(',').some((part) => {
    const [name, ...params] = part.split(';').map((s) => s.trim().toLowerCase());
    if (name !== 'gzip' && name !== '*') return false;
    const q = params.find((p) => p.startsWith('q='));
    return q === undefined || Number(q.slice(2)) > 0;
  });
}

/**
 * Polka/connect middleware. Place it after the compression middleware, right before the app:
 * it sees the page's own bytes on the way out and, on a hit, sends an already gzipped body that
 * the compression middleware passes through untouched.
 */
export function anonymousPageCache({ maxEntries = 64, maxEntryBytes = 512 * 1024 } = {}) {
  /** url → { status, headers: [name, value][], plain: Buffer, gzip: Buffer } */
  const entries = new LRUCache({ max: maxEntries });

  function answer(req, res, entry) {
    for (const [name, value] of entry.headers) res.setHeader(name, value);
    res.setHeader('vary', 'Accept-Encoding');
    const packed = acceptsGzip(req.headers['accept-encoding']);
    const body = packed ? entry.gzip : entry.plain;
    if (packed) res.setHeader('content-encoding', 'gzip');
    res.setHeader('content-length', body.length);
    res.writeHead(entry.status);
    res.end(body);
  }

  function store(url, res, chunks) {
    if (res.statusCode !== 200 || res.getHeader(ANONYMOUS_MARK) !== 'anonymous' || res.getHeader('set-cookie') !== undefined) return;
    const plain = Buffer.concat(chunks);
    if (plain.length > maxEntryBytes) return;
    const headers = Object.entries(res.getHeaders()).filter(([name]) => !PER_TRANSFER.has(name));
    entries.set(url, { status: 200, headers, plain, gzip: gzipSync(plain) });
  }

  return (req, res, next) => {
    if (req.method !== 'GET' || carriesCredentials(req.headers)) return next();
    const url = req.url ?? '/';
    const hit = entries.get(url);
    if (hit) return answer(req, res, hit);
    const chunks = [];
    let size = 0;
    const write = res.write;
    const end = res.end;
    const writeHead = res.writeHead;
    // Headers handed to writeHead() bypass getHeaders() unless some were set before; set them
    // one by one so the mark and the page's own policy can be read back when storing.
    res.writeHead = function (status, reason, headers) {
      if (reason && typeof reason === 'object') [reason, headers] = [undefined, reason];
      if (headers && !Array.isArray(headers)) {
        for (const [name, value] of Object.entries(headers)) if (value !== undefined) res.setHeader(name, value);
        headers = undefined;
      }
      return headers ? writeHead.call(this, status, reason, headers) : reason === undefined ? writeHead.call(this, status) : writeHead.call(this, status, reason);
    };
    const keep = (chunk, encoding) => {
      if (chunk == null || size > maxEntryBytes) return;
      const buf = Buffer.isBuffer(chunk) ? chunk : typeof chunk === 'string' ? Buffer.from(chunk, typeof encoding === 'string' ? encoding : 'utf8') : Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength);
      size += buf.length;
      chunks.push(buf);
    };
    res.write = function (chunk, encoding, callback) {
      keep(chunk, encoding);
      return write.call(this, chunk, encoding, callback);
    };
    res.end = function (chunk, encoding, callback) {
      if (typeof chunk !== 'function') keep(chunk, encoding);
      if (size <= maxEntryBytes) store(url, res, chunks);
      return end.call(this, chunk, encoding, callback);
    };
    next();
  };
}
