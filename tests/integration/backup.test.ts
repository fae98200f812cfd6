import { createClient } from '@libsql/client';
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, ROOT, TMP_ROOT } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { PDF_BYTES } from './files-fixtures';
import { createTestPage, doc, para } from './pages-fixtures';

/** `npm run backup` while four writers save and upload, then `npm run restore` into a new folder. */
let server: TestServer;
let engineer: Client;
let venue: string;
let work: string;

function runCli(script: string, args: string[], env: Record<string, string>): Promise<{ code: number; out: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', script, ...args], { cwd: ROOT, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (out += d));
    child.on('exit', (code) => resolve({ code: code ?? -1, out }));
  });
}

interface Acked {
  slug: string;
  number: number;
  text: string;
  at: number;
}

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  mkdirSync(TMP_ROOT, { recursive: true });
  work = mkdtempSync(join(TMP_ROOT, 'backup-'));
});
afterAll(async () => {
  await server?.stop();
});

describe('backup under write load, then restore', () => {
  it('keeps every revision and file acknowledged before the backup began, and restores only into an empty folder', async () => {
    const slugs = await Promise.all([0, 1, 2, 3].map(async (i) => (await createTestPage(engineer, venue, `Backup load ${i} ${Date.now()}`, doc(para('start')))).page.slug));
    const acked: Acked[] = [];
    const files: { id: string; sha: string; at: number }[] = [];
    let stop = false;
    const writer = async (slug: string, w: number) => {
      let base = 1;
      for (let n = 0; !stop; n++) {
        const text = `writer ${w} step ${n}`;
        const res = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, { baseRevision: base, doc: doc(para(text)) });
        if (res.status !== 200) throw new Error(`save answered ${res.status}`);
        const { revision } = (await res.json()) as { revision: { number: number } };
        base = revision.number;
        acked.push({ slug, number: revision.number, text, at: Date.now() });
        if (n % 5 === 0) {
          const bytes = Buffer.concat([PDF_BYTES, Buffer.from(`% writer ${w} file ${n}\n`)]);
          const form = new FormData();
          form.append('file', new Blob([new Uint8Array(bytes)], { type: 'application/pdf' }), `w${w}-${n}.pdf`);
          const up = await engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
          if (up.status !== 201) throw new Error(`upload answered ${up.status}`);
          files.push({ id: ((await up.json()) as { file: { id: string } }).file.id, sha: createHash('sha256').update(bytes).digest('hex'), at: Date.now() });
        }
      }
    };
    const writers = slugs.map((s, i) => writer(s, i));
    for (let waited = 0; acked.length < 12 && waited < 60_000; waited += 100) await new Promise((r) => setTimeout(r, 100));
    const backupStarted = Date.now();
    const backups = join(work, 'backups');
    const backup = await runCli('src/cli/backup.ts', [backups], { DATABASE_URL: `file:${server.dbPath}`, UPLOADS_DIR: server.uploadsDir });
    await new Promise((r) => setTimeout(r, 500));
    stop = true;
    await Promise.all(writers);
    expect(backup.code, backup.out).toBe(0);
    const folders = readdirSync(backups);
    expect(folders).toHaveLength(1);
    expect(folders[0]).toMatch(/^throwline-\d{8}-\d{6}$/);
    const before = acked.filter((a) => a.at < backupStarted);
    expect(before.length).toBeGreaterThan(10);
    expect(acked.length).toBeGreaterThan(before.length);

    const restoredDir = join(work, 'restored');
    const env = { DATABASE_URL: `file:${join(restoredDir, 'data', 'throwline.db')}`, UPLOADS_DIR: join(restoredDir, 'uploads') };
    const restore = await runCli('src/cli/restore.ts', [join(backups, folders[0])], env);
    expect(restore.code, restore.out).toBe(0);

    const db = createClient({ url: env.DATABASE_URL });
    try {
      expect(String((await db.execute('PRAGMA integrity_check')).rows[0][0])).toBe('ok');
      for (const a of before) {
        const row = (await db.execute({ sql: 'SELECT r.plain_text FROM revisions r JOIN pages p ON p.id = r.page_id WHERE p.slug = ? AND r.number = ?', args: [a.slug, a.number] })).rows[0];
        expect(row?.plain_text, `${a.slug} #${a.number}`).toBe(a.text);
      }
      // Chains are whole: every page's revisions run 1..current with no gap.
      const chains = (await db.execute('SELECT p.slug, p.current_revision AS cur, count(r.id) AS n, max(r.number) AS top FROM pages p JOIN revisions r ON r.page_id = p.id GROUP BY p.id')).rows;
      for (const c of chains) expect([Number(c.n), Number(c.top)], String(c.slug)).toEqual([Number(c.cur), Number(c.cur)]);
      const stored = (await db.execute('SELECT id, storage_name FROM files')).rows;
      const storedIds = new Set(stored.map((r) => String(r.id)));
      for (const f of files.filter((x) => x.at < backupStarted)) expect(storedIds.has(f.id), f.id).toBe(true);
      for (const r of stored) {
        const bytes = readFileSync(join(env.UPLOADS_DIR, String(r.storage_name)));
        if (String(r.storage_name).endsWith('.pdf')) expect(createHash('sha256').update(bytes).digest('hex') + '.pdf').toBe(String(r.storage_name));
      }
    } finally {
      db.close();
    }

    // The restored folders serve: a fresh server on them reads a page saved before the backup.
    const again = await startServer(env);
    try {
      const reader = await signIn(again.url, DEMO.engineer);
      const last = before[before.length - 1];
      const res = await reader.fetch(`/api/venues/${venue}/pages/${last.slug}/revisions/${last.number}`);
      expect(res.status).toBe(200);
    } finally {
      await again.stop();
    }

    // A second restore into the same, now full, folders is refused and changes nothing there.
    writeFileSync(join(work, 'marker'), 'x');
    const refused = await runCli('src/cli/restore.ts', [join(backups, folders[0])], env);
    expect(refused.code).toBe(1);
    expect(refused.out).toMatch(/Nothing was restored: .* is not empty .*Restore only into an empty folder/);
    const notBackup = await runCli('src/cli/restore.ts', [work], { DATABASE_URL: `file:${join(work, 'empty', 'data', 'x.db')}`, UPLOADS_DIR: join(work, 'empty', 'uploads') });
    expect(notBackup.code).toBe(1);
    expect(notBackup.out).toMatch(/is not a Throwline backup/);
  });
});
