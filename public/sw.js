/*
 * Throwline service worker: the calculators keep working with no network after one visit.
 *
 * - install: save every calculator page and guide (the list comes from /calc/offline-pages.json),
 *   then every /_astro asset those pages load, found by reading the pages' HTML and, recursively,
 *   the imports of their scripts and the fonts of their stylesheets.
 * - /_astro/*: cache first (file names carry a content hash, so a cached file never goes stale).
 * - /calc pages and guides: network first, the saved copy when the network fails or stalls.
 * - /api/calc/* GET answers: network first, a saved copy offline. Nothing else under /api.
 * - The advance sheet (/advance/<token> for guests, /venues/<venue>/advance for members) and the
 *   photos it shows: network first, the copy saved on the last visit when offline (the page says
 *   when it was saved). A 404 from the network (a revoked pass) deletes the saved copy. Signing
 *   out deletes the members' copies (src/pages/signout.astro).
 * - Any other page opened without network: our own offline page, nothing stored.
 * - Anything else (venues, sign-in, signed-in pages) is left to the browser and never stored;
 *   a calculator page is stored only when the server marked it as rendered for nobody in
 *   particular (x-throwline-offline: anonymous), so no signed-in person's name is ever kept.
 */
const VERSION = 'v1';
const PAGES = `throwline-calc-pages-${VERSION}`;
const ASSETS = `throwline-calc-assets-${VERSION}`;
const ANSWERS = `throwline-calc-api-${VERSION}`;
const ADVANCE = `throwline-advance-${VERSION}`;
const OURS = [PAGES, ASSETS, ANSWERS];
const MAX_ADVANCE = 400;
const PAGE_LIST = '/calc/offline-pages.json';
/** Stored last: its presence means everything before it was saved. */
const READY_MARK = '/calc/__offline-ready';
const OFFLINE_HEADER = 'x-throwline-offline';
/** On bad Wi-Fi a saved page now beats a fresh page in ten seconds. */
const NETWORK_TIMEOUT_MS = 3500;
const MAX_ASSETS = 300;
const MAX_ANSWERS = 200;

const isCalcPath = (path) => path === '/calc' || path.startsWith('/calc/');
const isAdvancePage = (path) => /^\/advance\/[A-Za-z0-9_-]{43}$/.test(path) || /^\/venues\/[^/]+\/advance$/.test(path);
const isGuestFile = (path) => /^\/advance\/[A-Za-z0-9_-]{43}\/files\//.test(path);

self.addEventListener('install', (event) => {
  event.waitUntil(precache().then(() => self.skipWaiting()));
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const key of await caches.keys()) {
        if ((key.startsWith('throwline-calc-') && !OURS.includes(key)) || (key.startsWith('throwline-advance-') && key !== ADVANCE)) await caches.delete(key);
      }
      await self.clients.claim();
    })(),
  );
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  const path = url.pathname;
  if (path.startsWith('/_astro/')) event.respondWith(asset(event, url));
  else if (path.startsWith('/api/calc/')) event.respondWith(answer(request));
  else if (path.startsWith('/api/')) return;
  else if (isCalcPath(path)) event.respondWith(page(event, url));
  else if (isAdvancePage(path)) event.respondWith(advancePage(event, url));
  else if (isGuestFile(path) || path.startsWith('/files/')) event.respondWith(advanceFile(event, url));
  else if (path === '/manifest.webmanifest' || path === '/favicon.svg' || path.startsWith('/icons/')) event.respondWith(staticFile(event, url));
  else if (request.mode === 'navigate') event.respondWith(fetch(request).catch(() => offlinePage()));
});

// ---------------------------------------------------------------------------------------------
// Install: pages first, then a breadth-first walk of the assets they reference.

async function precache() {
  const listResponse = await fetch(PAGE_LIST, { credentials: 'omit', cache: 'no-store' });
  if (!listResponse.ok) throw new Error(`offline list: ${listResponse.status}`);
  const list = await listResponse.json();
  const pages = await caches.open(PAGES);
  const found = new Set();
  await Promise.all(
    list.pages.map(async (path) => {
      // credentials: 'omit' renders the page for nobody, whoever is signed in on this device.
      const response = await fetch(path, { credentials: 'omit', cache: 'no-store' });
      if (!response.ok) throw new Error(`${path}: ${response.status}`);
      const html = await response.clone().text();
      await pages.put(new URL(path, self.location.origin).href, response);
      for (const ref of references(html, new URL(path, self.location.origin))) found.add(ref);
    }),
  );
  await Promise.all(
    (list.static || []).map(async (path) => {
      const response = await fetch(path, { cache: 'no-store' });
      if (response.ok) await pages.put(new URL(path, self.location.origin).href, response);
    }),
  );
  await saveAssets([...found]);
  await pages.put(new URL(READY_MARK, self.location.origin).href, new Response('ready', { headers: { 'content-type': 'text/plain' } }));
  for (const client of await self.clients.matchAll({ includeUncontrolled: true })) client.postMessage({ type: 'offline-ready' });
}

async function saveAssets(start) {
  const cache = await caches.open(ASSETS);
  const seen = new Set(start);
  let wave = start;
  while (wave.length && seen.size <= MAX_ASSETS) {
    const next = [];
    await Promise.all(
      wave.map(async (href) => {
        const response = await fetch(href, { credentials: 'omit' });
        // A missing script would break a page offline, so it fails the install (retried next visit).
        if (!response.ok) throw new Error(`${href}: ${response.status}`);
        if (/\.(js|css)$/.test(new URL(href).pathname)) {
          for (const ref of references(await response.clone().text(), new URL(href))) {
            if (!seen.has(ref)) {
              seen.add(ref);
              next.push(ref);
            }
          }
        }
        await cache.put(href, response);
      }),
    );
    wave = next;
  }
}

/**
 * /_astro files mentioned in HTML, JS or CSS: attribute values (src, href, component-url,
 * renderer-url), module imports ("./chunk.js"), preload lists ("_astro/chunk.js") and url(...) in
 * stylesheets. Only woff2 fonts are kept: every browser that runs a service worker reads woff2.
 */
function references(text, base) {
  const out = new Set();
  const pattern = /["'`(]\s*((?:\.{1,2}\/|\/?_astro\/)[^"'`()\s]+?\.(?:m?js|css|woff2|svg|png|webp))(?=["'`)\s?#])/g;
  for (const match of text.matchAll(pattern)) {
    const raw = match[1];
    const url = raw.startsWith('_astro/') ? new URL(`/${raw}`, base) : new URL(raw, base);
    if (url.origin === self.location.origin && url.pathname.startsWith('/_astro/')) out.add(url.origin + url.pathname);
  }
  return out;
}

// ---------------------------------------------------------------------------------------------
// Requests.

async function asset(event, url) {
  const cache = await caches.open(ASSETS);
  const hit = await cache.match(url.origin + url.pathname);
  if (hit) return hit;
  const response = await fetch(event.request);
  // Only files a calculator page or the advance sheet asked for are kept; the rest stays out.
  const from = await clientPath(event);
  if (response.ok && from && (isCalcPath(from) || isAdvancePage(from))) keepAlive(event, cache.put(url.origin + url.pathname, response.clone()));
  return response;
}

async function clientPath(event) {
  const id = event.clientId || event.resultingClientId;
  const client = id ? await self.clients.get(id) : undefined;
  return client ? new URL(client.url).pathname : null;
}

/** The advance sheet: the network when it answers, else the copy from the last visit. */
async function advancePage(event, url) {
  const key = url.origin + url.pathname;
  const cache = await caches.open(ADVANCE);
  const network = fetch(event.request).then(async (response) => {
    if (response.status === 200) keepAlive(event, cache.put(key, response.clone()));
    // A revoked or expired pass, or a member removed: the saved copy must not outlive the access.
    else if (response.status === 404 || response.status === 401 || response.redirected) keepAlive(event, cache.delete(key));
    return response;
  });
  network.catch(() => undefined);
  try {
    return await withTimeout(network, NETWORK_TIMEOUT_MS);
  } catch {
    const saved = await cache.match(key);
    if (saved) return saved;
    return network.catch(() => offlinePage());
  }
}

/** Photos of the advance sheet: saved when the sheet asked for them, served from the copy offline. */
async function advanceFile(event, url) {
  const cache = await caches.open(ADVANCE);
  const key = url.origin + url.pathname;
  const from = isGuestFile(url.pathname) ? url.pathname : await clientPath(event);
  const keep = Boolean(from) && (isGuestFile(url.pathname) || isAdvancePage(from));
  try {
    const response = await fetch(event.request);
    if (keep && response.status === 200) {
      keepAlive(event, cache.put(key, response.clone()).then(() => trim(cache, MAX_ADVANCE)));
    }
    return response;
  } catch (error) {
    const saved = await cache.match(key);
    if (saved) return saved;
    throw error;
  }
}

/** The query is ignored for the saved copy: the calculators read their inputs from the address. */
async function page(event, url) {
  const key = url.origin + url.pathname;
  const cache = await caches.open(PAGES);
  const network = fetch(event.request).then((response) => {
    if (response.ok && response.headers.get(OFFLINE_HEADER) === 'anonymous') {
      keepAlive(event, cache.put(key, response.clone()));
    }
    return response;
  });
  network.catch(() => undefined);
  try {
    return await withTimeout(network, NETWORK_TIMEOUT_MS);
  } catch {
    const saved = await cache.match(key);
    if (saved) return saved;
    return network.catch(() => offlinePage());
  }
}

async function answer(request) {
  const cache = await caches.open(ANSWERS);
  try {
    const response = await fetch(request);
    if (response.status === 200) {
      await cache.put(request, response.clone());
      await trim(cache, MAX_ANSWERS);
    }
    return response;
  } catch {
    const saved = await cache.match(request);
    if (saved) return saved;
    return new Response(
      JSON.stringify({ error: 'This device is offline and has no saved answer for this question. The calculator pages work offline; use them.' }),
      { status: 503, headers: { 'content-type': 'application/json; charset=utf-8' } },
    );
  }
}

async function staticFile(event, url) {
  const cache = await caches.open(PAGES);
  const key = url.origin + url.pathname;
  const saved = await cache.match(key);
  const fresh = fetch(event.request)
    .then((response) => {
      if (response.ok) keepAlive(event, cache.put(key, response.clone()));
      return response;
    })
    .catch(() => undefined);
  return saved || (await fresh) || new Response('', { status: 504 });
}

/** Extends the event's life for a write when it still can; the write runs either way. */
function keepAlive(event, promise) {
  promise.catch(() => undefined);
  try {
    event.waitUntil(promise);
  } catch {
    // The answer was already given (saved copy after a timeout); the write simply finishes unobserved.
  }
}

function withTimeout(promise, ms) {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('timeout')), ms);
    promise.then(
      (value) => {
        clearTimeout(timer);
        resolve(value);
      },
      (error) => {
        clearTimeout(timer);
        reject(error);
      },
    );
  });
}

async function trim(cache, max) {
  const keys = await cache.keys();
  for (const key of keys.slice(0, Math.max(0, keys.length - max))) await cache.delete(key);
}

function offlinePage() {
  const body =
    '<!doctype html><html lang="en"><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">' +
    '<title>Offline · Throwline</title><body style="font-family:system-ui,sans-serif;background:#121317;color:#e9e6df;padding:1.5rem">' +
    '<h1>No network</h1><p>This page has not been saved on this device yet. The calculators, and an advance sheet you have opened once, are saved after one visit with a connection.</p>' +
    '<p><a style="color:#f08a4b" href="/calc">Open the calculators</a></p></body></html>';
  return new Response(body, { status: 503, headers: { 'content-type': 'text/html; charset=utf-8' } });
}
