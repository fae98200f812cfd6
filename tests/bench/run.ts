/**
 * `npm run bench`: throughput of the server's main paths and the cost of the acoustics core,
 * each reported as a ratio against a baseline measured in the same run on the same machine,
 * so the numbers compare across machines. Nothing here asserts a time.
 */
import { spawnSync } from 'node:child_process';
import setup from '../setup/global-setup';
import { DEMO } from '../helpers/paths';
import { startServer } from '../helpers/server';
import { signIn } from '../helpers/session';
import { load } from './http-load';
import { benchAcoustics } from './acoustics';
import { benchLighthouse } from './lighthouse';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 4);
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 20);

function row(name: string, perSecond: number, baseline: number, extra = '') {
  console.log(`${name.padEnd(44)} ${perSecond.toFixed(0).padStart(7)} req/s   ×${(perSecond / baseline).toFixed(2)} of baseline ${extra}`);
}

async function benchHttp() {
  setup();
  const server = await startServer();
  try {
    const manager = await signIn(server.url, DEMO.manager);
    const cookie = { headers: { cookie: manager.jar.header() } };
    const { venues } = (await (await manager.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
    const venue = venues[0].slug;
    const { pages } = (await (await manager.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    const opts = { seconds: SECONDS, concurrency: CONCURRENCY };

    console.log(`\nHTTP, ${CONCURRENCY} connections, ${SECONDS} s each, loopback, same machine as the server`);
    const baseline = await load(`${server.url}/favicon.svg`, {}, opts);
    row('baseline: static file', baseline.perSecond, baseline.perSecond, `(p95 ${baseline.p95ms.toFixed(1)} ms)`);
    const cases: [string, string, RequestInit][] = [
      ['calculator JSON route (no session)', '/api/calc/band?q=4.318', {}],
      ['sign-in page (no session, csrf)', '/signin', {}],
      ['venue pages JSON (session + SQLite)', `/api/venues/${venue}/pages`, cookie],
      ['venue home HTML (session + SQLite)', `/venues/${venue}`, cookie],
      ['page read view HTML (session + render)', `/venues/${venue}/${pages[0].slug}`, cookie],
    ];
    for (const [name, path, init] of cases) {
      const r = await load(`${server.url}${path}`, init, opts);
      row(name, r.perSecond, baseline.perSecond, `(p95 ${r.p95ms.toFixed(1)} ms${r.failures ? `, ${r.failures} failures` : ''})`);
    }
  } finally {
    await server.stop();
  }
}

await benchHttp();
benchAcoustics();
await benchLighthouse();

const upload = spawnSync(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/cli/bench-upload.ts'], { stdio: 'inherit' });
if (upload.error) console.log('(upload benchmark not run)');
