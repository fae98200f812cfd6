// The one way the built app is served: `npm start` spawns this file, and so do the tests and the
// benchmark (tests/helpers/server.ts), so what they measure is what a venue runs.
//
// The Astro node adapter is built in middleware mode and sits behind a small HTTP layer:
//   headers      the security headers on EVERY response (static files never reach Astro's
//                middleware), a JSON 400 for a URL that cannot be percent-decoded, and the
//                client address: Astro takes the first X-Forwarded-For value from anyone, so it
//                is replaced by the socket address unless TRUST_PROXY names the proxy
//   sirv         the client build, with the brotli / gzip files written at build time
//   compression  HTML and JSON rendered per request, gzip (photos, PDFs and fonts never: packed)
//   page cache   calculator pages rendered for nobody in particular, kept for signed-out visitors
//   the adapter  everything else
// The first process only supervises: it forks WEB_CONCURRENCY worker processes (node:cluster
// shares the listening socket) over the same database, and starts another if one dies. Workers
// always run in a child, so the allocator settings below apply from their first byte.
import { spawnSync } from 'node:child_process';
import cluster from 'node:cluster';
import { availableParallelism } from 'node:os';
import { dirname, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { BUILD_DIR, SEARCH_WORKER_FILE, SERVER_ENTRY } from './build-if-stale.mjs';
import { acceptedWithoutBrotli } from './accept-encoding.mjs';
import { anonymousPageCache } from './anonymous-page-cache.mjs';
import { clientAddressFor, parseTrustedProxies } from './client-address.mjs';
import { hstsFromEnv, securityHeaders } from '../server/security-policy.mjs';

// The build is a production build; React, Astro and Vite pick their runtime from NODE_ENV when
// first loaded, so anything else here would serve React's development SSR (several times slower).
process.env.NODE_ENV = 'production';

/**
 * How glibc's malloc behaves in the workers (mallopt(3); a setting already in the environment
 * wins). Photos are decoded by libvips in tens of MB at a time, and by default glibc hands little
 * of that back: each thread gets its own arena, and after a large block is freed the size above
 * which blocks are mmap'ed (and so returned when freed) rises to that block's size, so the next
 * photo's buffers come from the heap and stay. Two arenas and a fixed 128 KiB threshold keep the
 * RSS after uploads near idle (DEVELOPERS.md, "Memory"; `npm run bench` measures it).
 */
const GLIBC_MALLOC = {
  MALLOC_ARENA_MAX: process.env.MALLOC_ARENA_MAX ?? '2',
  MALLOC_MMAP_THRESHOLD_: process.env.MALLOC_MMAP_THRESHOLD_ ?? '131072',
};

/** WEB_CONCURRENCY: a number of processes, or "auto" for one per CPU core. Default 1. */
export function workerCount(value = process.env.WEB_CONCURRENCY) {
  if (value === undefined || value === '') return 1;
  if (value === 'auto') return availableParallelism();
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 64) {
    console.error(`✗ WEB_CONCURRENCY must be a whole number from 1 to 64, or "auto" (got "${value}").`);
    process.exit(1);
  }
  return n;
}

/** Only text is worth compressing per request; images, PDFs and fonts are packed already. */
const TEXT_TYPE = /^(text\/|application\/(json|javascript|xml|manifest\+json|problem\+json)|image\/svg\+xml)/i;

async function serveOneProcess() {
  // The search thread's own file, built beside the server entry (src/cli/search-worker-build.mjs).
  process.env.THROWLINE_SEARCH_WORKER_FILE = resolve(dirname(SERVER_ENTRY), SEARCH_WORKER_FILE);
  const [{ default: polka }, { default: sirv }, { default: compression }, { handler }] = await Promise.all([
    import('polka'),
    import('sirv'),
    import('compression'),
    import(pathToFileURL(resolve(SERVER_ENTRY)).href),
  ]);
  const assets = sirv(resolve(BUILD_DIR, 'client'), {
    brotli: true,
    gzip: true,
    etag: true,
    dotfiles: false,
    // Hashed file names never change content; everything else in public/ is revalidated.
    setHeaders(res, pathname) {
      res.setHeader('Cache-Control', pathname.startsWith('/_astro/') ? 'public, max-age=31536000, immutable' : 'public, max-age=0, must-revalidate');
    },
  });
  const compress = compression({
    filter: (_req, res) => TEXT_TYPE.test(String(res.getHeader('Content-Type') ?? '')),
    threshold: 1024,
  });
  // Rendered responses are gzipped, never brotli'd: a brotli stream costs far more to set up
  // than a 5–60 KB page costs to pack. Measured with wrk on a page read, one process: no
  // compression 374 req/s, gzip 326, brotli (quality 4) 238. Brotli saves under a tenth of the
  // bytes of these small pages; the client build keeps its brotli copies (packed at build time).
  const gzipOnly = (req, _res, next) => {
    const accepted = req.headers['accept-encoding'];
    if (typeof accepted === 'string' && accepted.includes('br')) req.headers['accept-encoding'] = acceptedWithoutBrotli(accepted);
    next();
  };
  const app = polka({
    onError(err, _req, res) {
      console.error(err);
      if (!res.headersSent) res.writeHead(500);
      res.end();
    },
  });
  const headers = Object.entries(securityHeaders(hstsFromEnv(process.env)));
  const trusted = parseTrustedProxies(process.env.TRUST_PROXY);
  app.use((req, res, next) => {
    // Set before anything answers; a header the app writes itself (a page's own CSP with its
    // script hashes, a file's sandbox policy) takes precedence over these.
    for (const [name, value] of headers) res.setHeader(name, value);
    try {
      decodeURI(req.url ?? '/');
    } catch {
      const api = (req.url ?? '').startsWith('/api/');
      res.writeHead(400, { 'content-type': api ? 'application/json; charset=utf-8' : 'text/plain; charset=utf-8', 'cache-control': 'no-store' });
      res.end(
        api
          ? JSON.stringify({ error: 'The address has a broken %-escape (such as %zz or an encoded half of a character); fix the link and try again.' })
          : 'The address has a broken %-escape; fix the link and try again.\n',
      );
      return;
    }
    req.headers['x-forwarded-for'] = clientAddressFor(req.socket.remoteAddress, req.headers['x-forwarded-for'], trusted);
    next();
  });
  // No `next` for the adapter: with none it renders the app's own 404 page for unknown paths.
  app.use(assets, gzipOnly, compress, anonymousPageCache(), (req, res) => handler(req, res));

  const host = process.env.HOST || 'localhost';
  const port = Number(process.env.PORT || 4321);
  await new Promise((done) => app.listen(port, host, done));
  const server = app.server;
  for (const signal of ['SIGINT', 'SIGTERM']) {
    process.once(signal, () => {
      server.close(() => process.exit(0));
      // Keep-alive connections would hold close() open; idle ones can go now.
      server.closeIdleConnections?.();
      setTimeout(() => process.exit(0), 3000).unref();
    });
  }
}

function superviseWorkers(count) {
  let stopping = false;
  const host = process.env.HOST || 'localhost';
  const port = process.env.PORT || 4321;
  let listening = 0;
  // Workers see the resolved count ("auto" becomes a number): the storage sweep depends on it.
  const fork = () => cluster.fork({ ...GLIBC_MALLOC, WEB_CONCURRENCY: String(count) });
  cluster.on('listening', () => {
    if (++listening === count) console.log(`Throwline is listening on http://${host}:${port}/${count > 1 ? ` (${count} processes)` : ''}`);
  });
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    // A worker that never got to listen met a setting or start-up error: restarting would only
    // repeat it, so stop with its exit code (its message is already printed).
    if (listening < count) process.exit(code || 1);
    console.error(`[throwline] server process ${worker.process.pid} ended (${signal ?? code}); starting another`);
    fork();
  });
  // Each process migrates lazily on first use; several at once on a new database would race,
  // so the primary brings the schema up to date first (a no-op when npm start already has).
  if (count > 1) {
    const migrated = spawnSync(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/cli/prepare-db.ts'], {
      stdio: 'inherit',
      env: { ...process.env, SEED_DEMO: '0' },
    });
    if (migrated.status !== 0) process.exit(migrated.status ?? 1);
  }
  for (let i = 0; i < count; i++) fork();
  for (const signal of ['SIGINT', 'SIGTERM']) {
    process.once(signal, () => {
      stopping = true;
      for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM');
      setTimeout(() => process.exit(0), 5000).unref();
    });
  }
}

if (cluster.isPrimary) superviseWorkers(workerCount());
else await serveOneProcess();
