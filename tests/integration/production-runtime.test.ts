import { spawn, type ChildProcess } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync, brotliDecompressSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROOT, TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';
import { freePort, startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';
import { DEMO } from '../helpers/paths';
import { plainJpeg } from './files-fixtures';

const PROBE = join(ROOT, 'tests/helpers/react-build-probe.mjs');

async function waitFor<T>(what: string, probe: () => T | undefined | Promise<T | undefined>, log: () => string): Promise<T> {
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      const value = await probe();
      if (value !== undefined) return value;
    } catch {
      // not there yet
    }
    if (Date.now() > deadline) throw new Error(`${what} did not happen in 60 s:\n${log()}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

function reactFilesLoaded(probeDir: string): string[] | undefined {
  const files = readdirSync(probeDir).flatMap((name) => JSON.parse(readFileSync(join(probeDir, name), 'utf8')) as string[]);
  return files.some((f) => /react-dom-server/.test(f)) ? files : undefined;
}

describe('npm start', () => {
  let dir: string;
  let child: ChildProcess;
  let log = '';
  afterAll(async () => {
    if (child && child.exitCode === null && child.signalCode === null) {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await exited;
    }
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it("renders with React's production build even when NODE_ENV is not set", async () => {
    mkdirSync(TMP_ROOT, { recursive: true });
    dir = mkdtempSync(join(TMP_ROOT, 'start-'));
    const probeDir = join(dir, 'probe');
    mkdirSync(probeDir);
    copyFileSync(TEMPLATE_DB, join(dir, 'throwline.db'));
    const port = await freePort();
    const env: Record<string, string | undefined> = {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: `file:${join(dir, 'throwline.db')}`,
      UPLOADS_DIR: join(dir, 'uploads'),
      AUTH_SECRET: 'test-secret-'.padEnd(48, 'x'),
      SEED_DEMO: '0',
      NODE_OPTIONS: `--import=${PROBE}`,
      REACT_PROBE_DIR: probeDir,
    };
    // What a person typing `npm start` has: no NODE_ENV at all (vitest sets "test").
    delete env.NODE_ENV;
    child = spawn(process.execPath, ['src/cli/start.mjs'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout!.on('data', (d) => (log += d));
    child.stderr!.on('data', (d) => (log += d));
    const url = `http://127.0.0.1:${port}`;
    // A calculator page server-renders a React island, so React is loaded by the time it answers.
    const html = await waitFor('the calculator page', async () => {
      const res = await fetch(`${url}/calc/bandwidth`);
      return res.status === 200 ? res.text() : undefined;
    }, () => log);
    expect(html).toContain('astro-island');
    const files = await waitFor('React loading', () => reactFilesLoaded(probeDir), () => log);
    expect(files.filter((f) => /production/.test(f)).length).toBeGreaterThan(0);
    expect(files.filter((f) => /development/.test(f))).toEqual([]);
  });
});

describe('compression', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startServer();
  });
  afterAll(() => server?.stop());

  const get = (path: string, encoding?: string) => fetch(`${server.url}${path}`, encoding ? { headers: { 'accept-encoding': encoding } } : {});
  // fetch() decodes transparently; node:http-level bytes are what went over the wire.
  async function raw(path: string, encoding: string, cookie = ''): Promise<{ headers: Headers; body: Buffer }> {
    const { request } = await import('node:http');
    return new Promise((resolve, reject) => {
      const req = request(`${server.url}${path}`, { headers: { 'accept-encoding': encoding, ...(cookie ? { cookie } : {}) } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ headers: new Headers(res.headers as Record<string, string>), body: Buffer.concat(chunks) }));
      });
      req.on('error', reject);
      req.end();
    });
  }

  it('sends the client build pre-compressed, brotli first, gzip otherwise, and says it varies', async () => {
    const html = await (await get('/calc/bandwidth')).text();
    const scripts = [...new Set([...html.matchAll(/\/_astro\/[\w.-]+\.js/g)].map((m) => m[0]))];
    expect(scripts.length).toBeGreaterThan(0);
    // The largest: files under 1 KiB get no compressed copy (it would save less than its headers).
    const sized = await Promise.all(scripts.map(async (path) => ({ path, plain: await raw(path, 'identity') })));
    const { path: script, plain } = sized.sort((a, b) => b.plain.body.length - a.plain.body.length)[0];
    expect(plain.headers.get('content-encoding')).toBeNull();
    const br = await raw(script, 'gzip, deflate, br');
    expect(br.headers.get('content-encoding')).toBe('br');
    expect(br.headers.get('vary')).toMatch(/accept-encoding/i);
    expect(br.headers.get('cache-control')).toMatch(/immutable/);
    expect(br.headers.get('content-type')).toMatch(/javascript/);
    expect(brotliDecompressSync(br.body).equals(plain.body)).toBe(true);
    // The copy written at build time, sent as it is (its length known before the body).
    expect(Number(br.headers.get('content-length'))).toBe(br.body.length);
    const gz = await raw(script, 'gzip');
    expect(gz.headers.get('content-encoding')).toBe('gzip');
    expect(gunzipSync(gz.body).equals(plain.body)).toBe(true);
    expect(gz.body.length).toBeLessThan(plain.body.length);
  });

  it('compresses HTML and JSON rendered per request, with gzip even where brotli is offered', async () => {
    // Per request, gzip: a brotli stream costs more to set up than these small pages cost to pack.
    for (const path of ['/calc/bandwidth', '/signin', '/calc/offline-pages.json']) {
      const res = await raw(path, 'gzip, br');
      expect(res.headers.get('content-encoding'), path).toBe('gzip');
      expect(gunzipSync(res.body).length, path).toBeGreaterThan(res.body.length);
      expect(res.headers.get('vary'), path).toMatch(/accept-encoding/i);
      const plain = await raw(path, 'identity');
      expect(plain.headers.get('content-encoding'), path).toBeNull();
      expect(res.body.length, path).toBeLessThan(plain.body.length);
    }
    const gz = await raw('/calc/bandwidth', 'gzip');
    expect(gz.headers.get('content-encoding')).toBe('gzip');
    expect(gunzipSync(gz.body).toString()).toContain('<html');
  });

  it('answers a malformed address with 400, not a crash', async () => {
    const res = await get('/%E0%A4%A');
    expect(res.status).toBe(400);
    expect((await get('/calc/bandwidth')).status).toBe(200);
  });

  it('never compresses photos or PDFs again: they are packed already', async () => {
    const engineer = await signIn(server.url, DEMO.engineer);
    const venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
    const upload = async (bytes: Buffer, name: string, type: string) => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
      const res = await engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
      expect(res.status).toBe(201);
      return ((await res.json()) as { file: { id: string } }).file.id;
    };
    const photo = await upload(await plainJpeg(800, 600), 'rack.jpg', 'image/jpeg');
    // Text-like bytes that gzip would shrink a lot: still sent as stored.
    const pdf = await upload(Buffer.from(`%PDF-1.4\n${'0 0 0 RG 0 0 m 100 100 l S\n'.repeat(2000)}%%EOF\n`), 'patch.pdf', 'application/pdf');
    const cookie = engineer.jar.header();
    for (const path of [`/files/${photo}`, `/files/${photo}/display`, `/files/${photo}/thumb`, `/files/${pdf}`]) {
      const res = await raw(path, 'gzip, br', cookie);
      expect(res.headers.get('content-type'), path).toMatch(/^(image\/|application\/pdf)/);
      expect(res.headers.get('content-encoding'), path).toBeNull();
    }
    // …while the JSON listing those files is compressed.
    expect((await raw(`/api/venues/${venue}/files`, 'gzip, br', cookie)).headers.get('content-encoding')).toBe('gzip');
  });
});
