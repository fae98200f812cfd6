import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';

/**
 * The state a crash or a full disk leaves behind, built by hand before the server starts:
 * a half-written temp file, a stored file with no row, a row with no file, and a row flagged
 * missing whose file has come back.
 */
const hex = (c: string) => c.repeat(64);
const ORPHAN = `${hex('a')}.jpg`;
const PRESENT = { storage: `${hex('b')}.jpg`, display: `${hex('b')}-display.webp`, thumb: `${hex('b')}-thumb.webp` };
const GONE = `${hex('c')}.pdf`;
const BACK = `${hex('d')}.pdf`;

let server: TestServer;
let dir: string;
let uploadsDir: string;
let venueSlug: string;
const ids = { present: crypto.randomUUID(), gone: crypto.randomUUID(), back: crypto.randomUUID() };

beforeAll(async () => {
  mkdirSync(TMP_ROOT, { recursive: true });
  dir = mkdtempSync(join(TMP_ROOT, 'sweep-'));
  const dbPath = join(dir, 'throwline.db');
  copyFileSync(TEMPLATE_DB, dbPath);
  uploadsDir = join(dir, 'uploads');
  mkdirSync(join(uploadsDir, '.tmp'), { recursive: true });
  writeFileSync(join(uploadsDir, '.tmp', 'crashed-upload.part'), 'half a photo');
  writeFileSync(join(uploadsDir, ORPHAN), 'no row points here');
  writeFileSync(join(uploadsDir, 'README.txt'), 'not ours: left alone');
  for (const name of Object.values(PRESENT)) writeFileSync(join(uploadsDir, name), 'bytes');
  writeFileSync(join(uploadsDir, BACK), '%PDF-1.4 back again');

  const db = createClient({ url: `file:${dbPath}` });
  const venue = (await db.execute({ sql: 'select v.id, v.slug from venues v join memberships m on m.venue_id = v.id join users u on u.id = m.user_id where u.email = ?', args: [DEMO.engineer] })).rows[0];
  venueSlug = String(venue.slug);
  const row = (id: string, storage: string, display: string | null, thumb: string | null, mime: string, missing: number, name: string) => ({
    sql: 'insert into files (id, venue_id, storage_name, display_name, thumb_name, original_name, mime, size_bytes, caption, missing, created_at) values (?, ?, ?, ?, ?, ?, ?, 5, ?, ?, ?)',
    args: [id, venue.id, storage, display, thumb, name, mime, name, missing, Date.now()],
  });
  await db.batch(
    [
      row(ids.present, PRESENT.storage, PRESENT.display, PRESENT.thumb, 'image/jpeg', 0, 'present.jpg'),
      row(ids.gone, GONE, null, null, 'application/pdf', 0, 'gone.pdf'),
      row(ids.back, BACK, null, null, 'application/pdf', 1, 'back.pdf'),
    ],
    'write',
  );
  db.close();
  server = await startServer({ DATABASE_URL: `file:${dbPath}`, UPLOADS_DIR: uploadsDir });
});
afterAll(async () => {
  await server?.stop();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

describe('the start-up check of the file storage', () => {
  it('runs before the first file operation and repairs what a crash left', async () => {
    const engineer = await signIn(server.url, DEMO.engineer);
    const res = await engineer.fetch(`/api/venues/${venueSlug}/files`);
    expect(res.status).toBe(200);
    const { files } = (await res.json()) as { files: { id: string; missing: boolean }[] };
    const missing = Object.fromEntries(files.map((f) => [f.id, f.missing]));
    expect(missing).toMatchObject({ [ids.present]: false, [ids.gone]: true, [ids.back]: false });

    expect(readdirSync(join(uploadsDir, '.tmp'))).toEqual([]);
    expect(existsSync(join(uploadsDir, ORPHAN))).toBe(false);
    expect(existsSync(join(uploadsDir, 'README.txt'))).toBe(true);
    for (const name of [...Object.values(PRESENT), BACK]) expect(existsSync(join(uploadsDir, name))).toBe(true);
    expect(server.output()).toMatch(/file storage check: .*"tempRemoved":1.*"orphansRemoved":1.*"flaggedMissing":1.*"foundAgain":1/);
  });

  it('a row whose bytes are gone answers 404 with a sentence, never a 500', async () => {
    const viewer = await signIn(server.url, DEMO.viewer);
    const res = await viewer.fetch(`/files/${ids.gone}`);
    expect(res.status).toBe(404);
    expect(((await res.json()) as { error: string }).error).toMatch(/missing/);
  });
});
