import { createClient } from '@libsql/client';
import { createHash, randomBytes } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { STORED_NAME as STORED } from '~/server/files/storage-paths';
import { DEMO } from '../helpers/paths';
import { signIn, type Client } from '../helpers/session';
import { startOn } from './proof-server';

export interface CrashResult {
  kills: number;
  integrityOk: number;
  ackedSaves: number;
  ackedUploads: number;
  ackedDeletes: number;
  lostWrites: number;
  rowsWithoutBytes: number;
  orphansAfterSweep: number;
  readyMsMedian: number;
  readyMsMax: number;
}

const docOf = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

function pdf(): Buffer {
  return Buffer.concat([Buffer.from('%PDF-1.4\n'), randomBytes(40_000 + Math.floor(Math.random() * 200_000))]);
}

/**
 * Kills the server with SIGKILL while saves, uploads and deletes are in flight, `kills` times,
 * restarting it on the same files each time. After every restart: the database passes
 * integrity_check, every write that was acknowledged is there (a deleted file stays gone), and
 * once the start-up sweep has run no row lacks its bytes and no bytes lack a row.
 */
export async function crashLoop(dbPath: string, uploadsDir: string, venue: string, kills: number): Promise<CrashResult> {
  const saves = new Map<string, string>(); // slug#n → text
  const uploads = new Map<string, string>(); // file id → sha256 of the bytes
  const deleted = new Set<string>();
  /** Deletes sent but not answered: whether they landed is not known, so neither outcome is lost. */
  const undecided = new Set<string>();
  const readyTimes: number[] = [];
  let integrityOk = 0;
  let lostWrites = 0;
  let rowsWithoutBytes = 0;
  let orphansAfterSweep = 0;
  const pageSlugs: string[] = [];

  for (let round = 0; round <= kills; round++) {
    const server = await startOn(dbPath, uploadsDir);
    readyTimes.push(server.readyMs);
    const client: Client = await signIn(server.url, DEMO.engineer);
    // The sweep runs before the first file operation of a process; listing triggers it.
    await (await client.fetch(`/api/venues/${venue}/files`)).arrayBuffer();
    const db = createClient({ url: `file:${dbPath}` });
    try {
      if (String((await db.execute('PRAGMA integrity_check')).rows[0][0]) === 'ok') integrityOk++;
      for (const [key, text] of saves) {
        const [slug, n] = key.split('#');
        const row = (await db.execute({ sql: 'SELECT r.plain_text FROM revisions r JOIN pages p ON p.id = r.page_id WHERE p.slug = ? AND r.number = ?', args: [slug, Number(n)] })).rows[0];
        if (!row || String(row.plain_text) !== text) lostWrites++;
      }
      const rows = (await db.execute('SELECT id, storage_name, display_name, thumb_name, missing FROM files')).rows;
      const ids = new Set(rows.map((r) => String(r.id)));
      for (const id of uploads.keys()) if (!deleted.has(id) && !undecided.has(id) && !ids.has(id)) lostWrites++;
      for (const id of deleted) if (ids.has(id)) lostWrites++;
      const named = new Set<string>();
      for (const r of rows) {
        for (const n of [r.storage_name, r.display_name, r.thumb_name]) {
          if (typeof n !== 'string' || !n) continue;
          named.add(n);
          if (!existsSync(join(uploadsDir, n))) rowsWithoutBytes++;
        }
        if (Number(r.missing)) rowsWithoutBytes++;
      }
      for (const name of readdirSync(uploadsDir)) if (STORED.test(name) && !named.has(name)) orphansAfterSweep++;
      // The revision chains stay whole too.
      for (const slug of pageSlugs) {
        const p = (await db.execute({ sql: 'SELECT id, current_revision FROM pages WHERE slug = ?', args: [slug] })).rows[0];
        const n = Number((await db.execute({ sql: 'SELECT count(*) AS n FROM revisions WHERE page_id = ?', args: [p.id] })).rows[0].n);
        if (n !== Number(p.current_revision)) lostWrites++;
      }
    } finally {
      db.close();
    }
    if (round === kills) {
      await server.stop();
      break;
    }
    if (pageSlugs.length === 0) {
      for (let i = 0; i < 3; i++) {
        const res = await client.sendJson('POST', `/api/venues/${venue}/pages`, { title: `Crash ${i} ${Date.now()}`, section: 'stage', doc: docOf('start') });
        pageSlugs.push(((await res.json()) as { page: { slug: string } }).page.slug);
      }
    }
    // Two acknowledged uploads per round, so the deletes below always have something to delete.
    for (let k = 0; k < 2; k++) {
      const bytes = pdf();
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(bytes)], { type: 'application/pdf' }), `seed-${round}-${k}.pdf`);
      const res = await client.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
      if (res.status === 201) uploads.set(((await res.json()) as { file: { id: string } }).file.id, createHash('sha256').update(bytes).digest('hex'));
    }
    let stop = false;
    const saver = async (slug: string) => {
      let base: number;
      try {
        base = ((await (await client.fetch(`/api/venues/${venue}/pages/${slug}`)).json()) as { page: { currentRevision: number } }).page.currentRevision;
      } catch {
        return; // killed before the first read
      }
      for (let k = 0; !stop; k++) {
        const text = `round ${round} save ${k} ${slug}`;
        try {
          const res = await client.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, { baseRevision: base, doc: docOf(text) });
          if (res.status !== 200) return;
          const { revision } = (await res.json()) as { revision: { number: number } };
          saves.set(`${slug}#${revision.number}`, text);
          base = revision.number;
        } catch {
          return; // the server is gone
        }
      }
    };
    const uploader = async () => {
      for (let k = 0; !stop; k++) {
        const bytes = pdf();
        const form = new FormData();
        form.append('file', new Blob([new Uint8Array(bytes)], { type: 'application/pdf' }), `crash-${round}-${k}.pdf`);
        try {
          const res = await client.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
          if (res.status !== 201) return;
          const { file } = (await res.json()) as { file: { id: string } };
          uploads.set(file.id, createHash('sha256').update(bytes).digest('hex'));
        } catch {
          return;
        }
      }
    };
    const deleter = async () => {
      while (!stop) {
        const candidates = [...uploads.keys()].filter((id) => !deleted.has(id) && !undecided.has(id));
        if (!candidates.length) {
          await new Promise((r) => setTimeout(r, 20));
          continue;
        }
        const id = candidates[Math.floor(Math.random() * candidates.length)];
        undecided.add(id);
        try {
          const res = await client.fetch(`/api/venues/${venue}/files/${id}?confirm=1`, { method: 'DELETE' });
          if (res.status === 200) {
            deleted.add(id);
            undecided.delete(id);
          } else if (res.status !== 404) return;
        } catch {
          return;
        }
      }
    };
    const work = [...pageSlugs.map(saver), uploader(), uploader(), deleter()];
    await new Promise((r) => setTimeout(r, 500 + Math.random() * 2000));
    await server.kill9();
    stop = true;
    await Promise.all(work);
  }
  const sorted = [...readyTimes].sort((a, b) => a - b);
  return {
    kills,
    integrityOk,
    ackedSaves: saves.size,
    ackedUploads: uploads.size,
    ackedDeletes: deleted.size,
    lostWrites,
    rowsWithoutBytes,
    orphansAfterSweep,
    readyMsMedian: Math.round(sorted[Math.floor(sorted.length / 2)]),
    readyMsMax: Math.round(sorted[sorted.length - 1]),
  };
}
