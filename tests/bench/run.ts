/**
 * `npm run bench`: the server's main paths and the acoustics core, each reported as a ratio
 * against a baseline measured in the same run on the same machine, so the numbers compare across
 * machines. Nothing here asserts a time.
 *
 * The server is started exactly as `npm start` starts it (src/cli/serve.mjs, production mode,
 * WEB_CONCURRENCY from the environment, default 1), on a copy of the demo database plus an
 * invented 10,000-page venue. Load comes from wrk when installed, else autocannon, in a process
 * of its own; its CPU is printed beside the server's, since both share this machine's cores.
 * Every request says `Accept-Encoding: gzip, br`, as browsers do.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { request } from 'node:http';
import { join } from 'node:path';
import sharp from 'sharp';
import setup from '../setup/global-setup';
import { DEMO, TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';
import { pageScriptBytes } from '../helpers/page-scripts';
import { startServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { benchAcoustics } from './acoustics';
import { benchTraces } from './traces';
import { addBigVenue } from './big-venue';
import { benchLighthouse } from './lighthouse';
import { LOAD_TOOL, runLoad, type LoadResult } from './load-generator';

const SECONDS = Number(process.env.BENCH_SECONDS ?? 5);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 20);
// A p95 of 40 samples is the second-worst of them, and moved by ±8 ms between runs here.
const SEARCH_QUERIES = Number(process.env.BENCH_SEARCH_QUERIES ?? 200);
const ENCODING = { 'accept-encoding': 'gzip, br' };

function serverPids(primary: number): number[] {
  const out = spawnSync('ps', ['-o', 'pid=', '--ppid', String(primary)], { encoding: 'utf8' }).stdout;
  return [primary, ...out.split('\n').map((s) => Number(s.trim())).filter((n) => n > 0)];
}

function kib(bytes: number): string {
  return `${(bytes / 1024).toFixed(1)} KiB`;
}

function memoryMb(pid: number): { rss: number; peak: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const field = (name: string) => Number(status.match(new RegExp(`^${name}:\\s+(\\d+)`, 'm'))?.[1] ?? NaN) / 1024;
  return { rss: field('VmRSS'), peak: field('VmHWM') };
}

/** Bytes as they cross the wire (node:http does not decode), with or without compression. */
function wireBytes(url: string, headers: Record<string, string>): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = request(url, { headers }, (res) => {
      let n = 0;
      res.on('data', (c: Buffer) => (n += c.length));
      res.on('end', () => resolve(n));
    });
    req.on('error', reject);
    req.end();
  });
}

async function latencies(client: Client, paths: string[]): Promise<{ p50: number; p95: number }> {
  const times: number[] = [];
  for (const path of paths) {
    const t0 = performance.now();
    const res = await client.fetch(path);
    await res.arrayBuffer();
    if (res.status !== 200) throw new Error(`${path}: ${res.status}`);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))];
  return { p50: at(0.5), p95: at(0.95) };
}

async function syntheticPhoto(width: number, height: number): Promise<Buffer> {
  // Film-grain noise at half size, scaled up: compresses like a real photo (~11 MB at 24 MP).
  const grain = await sharp({ create: { width: width / 2, height: height / 2, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 120, sigma: 30 } } }).raw().toBuffer();
  return sharp(grain, { raw: { width: width / 2, height: height / 2, channels: 3 } }).resize(width, height, { kernel: 'cubic' }).jpeg({ quality: 90 }).toBuffer();
}

async function main() {
  setup();
  mkdirSync(TMP_ROOT, { recursive: true });
  const dir = mkdtempSync(join(TMP_ROOT, 'bench-'));
  const dbPath = join(dir, 'bench.db');
  copyFileSync(TEMPLATE_DB, dbPath);
  console.log('Adding a 10,000-page venue to a copy of the demo database…');
  const bigVenue = await addBigVenue(dbPath, DEMO.manager);
  {
    // The big venue went in through SQL, so its index rows hold raw text only: have the server
    // rebuild them with the trade's spellings, as it would after an upgrade.
    const { createClient } = await import('@libsql/client');
    const db = createClient({ url: `file:${dbPath}` });
    await db.execute('UPDATE search_index_state SET version = 0');
    db.close();
  }
  const server = await startServer({ DATABASE_URL: `file:${dbPath}`, ...(process.env.WEB_CONCURRENCY ? { WEB_CONCURRENCY: process.env.WEB_CONCURRENCY } : {}) });
  try {
    const pids = serverPids(server.pid);
    const workers = pids.slice(1);
    const manager = await signIn(server.url, DEMO.manager);
    const cookie = manager.jar.header();
    const { venues } = (await (await manager.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
    const venue = venues.find((v) => v.slug !== bigVenue)!.slug;
    const { createClient } = await import('@libsql/client');
    const db = createClient({ url: `file:${dbPath}` });
    const biggest = String(
      (await db.execute({ sql: 'select p.slug from pages p join venues v on v.id = p.venue_id join revisions r on r.page_id = p.id and r.number = p.current_revision where v.slug = ? order by length(r.doc) desc limit 1', args: [venue] })).rows[0].slug,
    );
    db.close();
    const calcHtml = await (await fetch(`${server.url}/calc/bandwidth`)).text();
    const css = calcHtml.match(/\/_astro\/[\w.-]+\.css/)?.[0];
    if (!css) throw new Error('no stylesheet on the calculator page');

    console.log(`\nHTTP: ${LOAD_TOOL}, ${CONNECTIONS} connections, ${SECONDS} s each, loopback; server ${workers.length} process(es); Accept-Encoding: gzip, br`);
    const header = `${'path'.padEnd(46)} ${'req/s'.padStart(7)}  ${'ratio'.padStart(6)}  ${'p50 ms'.padStart(7)}  ${'p99 ms'.padStart(7)}  ${'server CPU s'.padStart(12)}  ${'load gen CPU s'.padStart(14)}`;
    console.log(header);
    console.log('-'.repeat(header.length));
    const row = (name: string, r: LoadResult, baseline: number) =>
      console.log(
        `${name.padEnd(46)} ${r.perSecond.toFixed(0).padStart(7)}  ${(r.perSecond / baseline).toFixed(3).padStart(6)}  ${r.p50ms.toFixed(2).padStart(7)}  ${r.p99ms.toFixed(2).padStart(7)}  ${r.serverCpu.toFixed(1).padStart(12)}  ${r.generatorCpu.toFixed(1).padStart(14)}${r.non2xx ? `  (${r.non2xx} not 2xx!)` : ''}`,
      );
    const load = (path: string, headers: Record<string, string> = {}) => runLoad(`${server.url}${path}`, { seconds: SECONDS, connections: CONNECTIONS, headers: { ...ENCODING, ...headers }, serverPids: pids });
    const baseline = await load(css);
    row('baseline: static CSS file (pre-compressed)', baseline, baseline.perSecond);
    const cases: [string, string, Record<string, string>][] = [
      ['/ signed out', '/', {}],
      ['calculator page /calc/bandwidth, signed out', '/calc/bandwidth', {}],
      // Signed in, the header names the person, so the page is rendered for every request.
      ['calculator page /calc/bandwidth, signed in', '/calc/bandwidth', { cookie }],
      ['calculator JSON route', '/api/calc/band?q=4.318', {}],
      ['venue index, signed in', `/venues/${venue}`, { cookie }],
      ['page read view, signed in (biggest demo page)', `/venues/${venue}/${biggest}`, { cookie }],
      ['venue index of 10,000 pages, signed in', `/venues/${bigVenue}`, { cookie }],
      ['search "stage" (in 2 of 3 of 10,000 pages)', '/api/search?q=stage', { cookie }],
    ];
    // BENCH_SEARCH_ONLY=1: the search figures alone, for working on search.
    const searchOnly = process.env.BENCH_SEARCH_ONLY === '1';
    for (const [name, path, headers] of searchOnly ? cases.slice(-1) : cases) row(name, await load(path, headers), baseline.perSecond);

    console.log(`\nSearch over the 10,000-page venue (one client, ${SEARCH_QUERIES} queries each, ms)`);
    const terms: [string, string[]][] = [
      ['1 letter', ['s', 'a', 'm', 'd', 'c', 'f', 'b', 'p']],
      ['2 letters', ['st', 'am', 'mo', 'de', 'ca', 'fi', 'ba', 'pa']],
      ['3 letters', ['sta', 'amp', 'mon', 'del', 'cab', 'fil', 'bas', 'pat']],
      ['common word', ['stage', 'rack', 'monitor', 'cable', 'power', 'delay', 'network', 'balcony']],
      ['rare word', ['quokkaphone']],
    ];
    const searchPaths = (words: string[]) => Array.from({ length: SEARCH_QUERIES }, (_, i) => `/api/search?q=${encodeURIComponent(words[i % words.length])}`);
    for (const [name, words] of terms) {
      await latencies(manager, searchPaths(words).slice(0, 4));
      const { p50, p95 } = await latencies(manager, searchPaths(words));
      console.log(`  ${name.padEnd(14)} p50 ${p50.toFixed(1).padStart(6)}   p95 ${p95.toFixed(1).padStart(6)}`);
    }
    const calcAlone = await runLoad(`${server.url}/api/calc/band?q=4.318`, { seconds: SECONDS, connections: 2, headers: ENCODING, serverPids: pids });
    let searching = true;
    const searchers = Array.from({ length: 4 }, async (_, k) => {
      let i = k;
      const words = [...terms[2][1], ...terms[3][1]];
      while (searching) await (await manager.fetch(`/api/search?q=${words[i++ % words.length]}`)).arrayBuffer();
    });
    const calcBusy = await runLoad(`${server.url}/api/calc/band?q=4.318`, { seconds: SECONDS, connections: 2, headers: ENCODING, serverPids: pids });
    searching = false;
    await Promise.all(searchers);
    console.log(`  calculator API p99, 2 connections: alone ${calcAlone.p99ms.toFixed(1)} ms; while 4 clients search ${calcBusy.p99ms.toFixed(1)} ms (p50 ${calcAlone.p50ms.toFixed(2)} → ${calcBusy.p50ms.toFixed(2)})`);
    if (searchOnly) return;

    console.log('\nJavaScript a screen loads at once (gzip) and bytes on the wire (HTML)');
    const screens: [string, string][] = [
      ['page read view', `/venues/${venue}/${biggest}`],
      ['venue index', `/venues/${venue}`],
      ['venue index, 10,000 pages', `/venues/${bigVenue}`],
      ['search results', '/search?q=stage'],
      ['calculator page', '/calc/bandwidth'],
      ['files screen', `/venues/${venue}/files`],
      ['page editor', `/venues/${venue}/${biggest}/edit`],
    ];
    for (const [name, path] of screens) {
      const js = await pageScriptBytes((p) => manager.fetch(p), path);
      const plain = await wireBytes(`${server.url}${path}`, { cookie, 'accept-encoding': 'identity' });
      const packed = await wireBytes(`${server.url}${path}`, { cookie, ...ENCODING });
      console.log(`  ${name.padEnd(26)} JS ${kib(js.gzipBytes).padStart(10)} gzip (${kib(js.rawBytes)} raw)   HTML ${kib(plain).padStart(10)} → ${kib(packed).padStart(9)} compressed`);
    }

    console.log('\nUpload of a 24 MP JPEG over HTTP (multipart, hashing, fsync, database)');
    const engineer = await signIn(server.url, DEMO.engineer);
    const photo = await syntheticPhoto(6000, 4000);
    const worker = workers[0];
    const idle = memoryMb(worker);
    const times: number[] = [];
    let peak = 0;
    const upload = async (i: number) => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(photo)], { type: 'image/jpeg' }), `rack-${i}.jpg`);
      const t0 = performance.now();
      const res = await engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
      await res.arrayBuffer();
      if (res.status !== 201) throw new Error(`upload: ${res.status}`);
      return performance.now() - t0;
    };
    for (let i = 0; i < 10; i++) {
      times.push(await upload(i));
      if (i === 0) peak = memoryMb(worker).peak;
    }
    await new Promise((r) => setTimeout(r, 2000));
    const after = memoryMb(worker);
    // Ten more: memory that is handed back stays level; memory that is kept grows again.
    for (let i = 10; i < 20; i++) await upload(i);
    await new Promise((r) => setTimeout(r, 2000));
    const again = memoryMb(worker);
    times.sort((a, b) => a - b);
    console.log(`  ${(photo.length / 1e6).toFixed(1)} MB file: median ${times[5].toFixed(0)} ms; RSS idle ${idle.rss.toFixed(0)} MB, peak during the first ${peak.toFixed(0)} MB, after 10 uploads ${after.rss.toFixed(0)} MB, after 10 more ${again.rss.toFixed(0)} MB (peak ${again.peak.toFixed(0)} MB)`);
  } finally {
    await server.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

await main();
benchAcoustics();
benchTraces();
await benchLighthouse();
if (process.env.BENCH_PIPELINE === '1') spawnSync(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/cli/bench-upload.ts'], { stdio: 'inherit' });
