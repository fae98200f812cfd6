import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, rmSync, statfsSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SERVE_SCRIPT } from '~/cli/build-if-stale.mjs';
import { DEMO, ROOT, TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';
import { freePort } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { plainJpeg } from './files-fixtures';

/**
 * A full disk, for real: the server runs in its own mount namespace with UPLOADS_DIR on a 2 MiB
 * tmpfs. The test reads that folder through /proc/<pid>/root, which resolves paths in the
 * server's namespace.
 */
const TMPFS_BYTES = 2 * 1024 * 1024;

function namespaceProbe(): string | null {
  const probeDir = mkdtempSync(join(TMP_ROOT, 'probe-'));
  try {
    const res = spawnSync('unshare', ['-m', 'sh', '-c', `mount -t tmpfs -o size=64k tmpfs "${probeDir}" && umount "${probeDir}"`], { encoding: 'utf8' });
    if (res.error) return `unshare is not available (${res.error.message})`;
    if (res.status !== 0) return `this machine forbids a private mount namespace or tmpfs (${res.stderr.trim() || `exit ${res.status}`})`;
    return null;
  } finally {
    rmSync(probeDir, { recursive: true, force: true });
  }
}

mkdirSync(TMP_ROOT, { recursive: true });
const refusal = namespaceProbe();
if (refusal) console.warn(`[files-disk-full] SKIPPED: ${refusal}. The 507 path is then untested on this machine.`);

let child: ChildProcess;
let dir: string;
let uploadsDir: string;
let url: string;
let log = '';
let engineer: Client;
let venue: string;

/** UPLOADS_DIR as the server sees it (inside its mount namespace). */
const inside = (...parts: string[]) => join(`/proc/${child.pid}/root`, uploadsDir, ...parts);
const stored = () => readdirSync(inside()).filter((n) => n !== '.tmp').sort();
const temps = () => readdirSync(inside('.tmp'));
const freeBytes = () => {
  const s = statfsSync(inside());
  return s.bavail * s.bsize;
};

function upload(bytes: Buffer, name: string, type: string) {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
  return engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
}

const randomPdf = (size: number) => Buffer.concat([Buffer.from('%PDF-1.4\n'), randomBytes(size - 9)]);

describe.skipIf(refusal !== null)('a full disk', () => {
  beforeAll(async () => {
    dir = mkdtempSync(join(TMP_ROOT, 'diskfull-'));
    const dbPath = join(dir, 'throwline.db');
    copyFileSync(TEMPLATE_DB, dbPath);
    uploadsDir = join(dir, 'uploads');
    mkdirSync(uploadsDir);
    const port = await freePort();
    url = `http://127.0.0.1:${port}`;
    child = spawn('unshare', ['-m', 'sh', '-c', `mount -t tmpfs -o size=${TMPFS_BYTES} tmpfs "$UPLOADS_DIR" && exec "$NODE_BIN" "$ENTRY"`], {
      cwd: ROOT,
      env: {
        ...process.env,
        NODE_BIN: process.execPath,
        ENTRY: SERVE_SCRIPT,
        HOST: '127.0.0.1',
        PORT: String(port),
        DATABASE_URL: `file:${dbPath}`,
        UPLOADS_DIR: uploadsDir,
        AUTH_SECRET: 'test-secret-'.padEnd(48, 'x'),
        SEED_DEMO: '0',
        NODE_ENV: 'production',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout!.on('data', (d) => (log += d));
    child.stderr!.on('data', (d) => (log += d));
    const deadline = Date.now() + 30_000;
    for (;;) {
      if (child.exitCode !== null) throw new Error(`The server exited early (${child.exitCode}):\n${log}`);
      try {
        if ((await fetch(`${url}/api/calc/band?q=1`)).status < 500) break;
      } catch {
        // not listening yet
      }
      if (Date.now() > deadline) throw new Error(`The server did not start in 30 s:\n${log}`);
      await new Promise((r) => setTimeout(r, 100));
    }
    engineer = await signIn(url, DEMO.engineer);
    venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  });

  afterAll(async () => {
    if (child && child.exitCode === null) {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await exited;
    }
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('the uploads folder really is the small tmpfs, seen only by the server', async () => {
    const photo = await upload(await plainJpeg(320, 240), 'first.jpg', 'image/jpeg');
    expect(photo.status).toBe(201);
    expect(stored()).toHaveLength(3);
    expect(readdirSync(uploadsDir)).toEqual([]);
    expect(statfsSync(inside()).blocks * statfsSync(inside()).bsize).toBe(TMPFS_BYTES);
  });

  it('a PDF that does not fit while streaming in → 507, nothing half-written, space given back', async () => {
    const filler = await upload(randomPdf(1_300_000), 'drawing.pdf', 'application/pdf');
    expect(filler.status).toBe(201);
    const before = stored();
    const free = freeBytes();
    const res = await upload(randomPdf(free + 300_000), 'too-big.pdf', 'application/pdf');
    expect(res.status).toBe(507);
    expect(((await res.json()) as { error: string }).error).toMatch(/storage is full.*nothing was saved/);
    expect(temps()).toEqual([]);
    expect(stored()).toEqual(before);
    expect(freeBytes()).toBe(free);
  });

  it('a photo that fits but whose re-encoded sizes do not → 507, nothing half-written', async () => {
    const before = stored();
    const free = freeBytes();
    // Low quality in, quality 90 out: the stored sizes need roughly twice the upload's bytes.
    let photo: Buffer = Buffer.alloc(0);
    for (let side = 200; side < 2000; side += 20) {
      photo = await sharp({ create: { width: side, height: side, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 128, sigma: 50 } } }).jpeg({ quality: 40 }).toBuffer();
      if (photo.length > free * 0.55) break;
    }
    expect(photo.length).toBeLessThan(free);
    const res = await upload(photo, 'noisy.jpg', 'image/jpeg');
    expect(res.status).toBe(507);
    expect(temps()).toEqual([]);
    expect(stored()).toEqual(before);
    expect(freeBytes()).toBe(free);
  });

  it('reads keep working, and a small upload still fits afterwards', async () => {
    const { files } = (await (await engineer.fetch(`/api/venues/${venue}/files`)).json()) as { files: { url: string; thumbUrl: string | null; originalName: string }[] };
    expect(files.map((f) => f.originalName).sort()).toEqual(['drawing.pdf', 'first.jpg']);
    for (const f of files) {
      const res = await engineer.fetch(f.url);
      expect(res.status).toBe(200);
      expect((await res.arrayBuffer()).byteLength).toBeGreaterThan(0);
    }
    expect((await upload(await plainJpeg(64, 64), 'tiny.jpg', 'image/jpeg')).status).toBe(201);
    expect(temps()).toEqual([]);
    expect(log).not.toMatch(/unhandled error/);
  });
});
