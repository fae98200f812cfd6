import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { run } from './ensure-install.mjs';

const INPUTS = ['src', 'public', 'content', 'astro.config.mjs', 'package-lock.json', 'tsconfig.json'];
export const BUILD_DIR = process.env.THROWLINE_BUILD_DIR ?? 'dist';
export const SERVER_ENTRY = `${BUILD_DIR}/server/entry.mjs`;
/** The search thread's file, bundled beside the entry (src/cli/search-worker-build.mjs). */
export const SEARCH_WORKER_FILE = 'search-worker.mjs';
/** What serves the build: `npm start`, the tests and the benchmark all start this file (static files,
 * compression, security headers on every response, the trusted client address, then Astro). */
export const SERVE_SCRIPT = 'src/cli/serve.mjs';

function newestMtime(path) {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

/** Builds when dist/ is missing or older than any source file; a fresh build is reused. */
export function buildIfStale() {
  const built = existsSync(SERVER_ENTRY) ? statSync(SERVER_ENTRY).mtimeMs : 0;
  const sources = Math.max(...INPUTS.map(newestMtime));
  if (built > sources) return false;
  console.log('→ building (astro build)…');
  // Configuration comes from the environment at run time only; nothing secret is built in.
  // NODE_ENV=production also when called from vitest (which sets "test"): a build made for
  // another mode ships React's development runtime and fails when served in production.
  const env = { ...process.env, ASTRO_TELEMETRY_DISABLED: '1', NODE_ENV: 'production' };
  delete env.AUTH_SECRET;
  run(process.execPath, ['node_modules/astro/astro.js', 'build'], { env });
  return true;
}
