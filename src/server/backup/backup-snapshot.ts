import { createClient } from '@libsql/client';
import { copyFile, link, mkdir, readdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { STORED_NAME } from '~/server/files/storage-paths';

export const BACKUP_DB = 'throwline.db';
export const BACKUP_UPLOADS = 'uploads';
export const BACKUP_MANIFEST = 'backup.json';

export interface BackupManifest {
  format: 1;
  createdAt: string;
  revisions: number;
  files: number;
  storedFiles: number;
  storedBytes: number;
  integrity: 'ok';
}

export interface BackupSource {
  /** Path of the live SQLite file (the server may be writing to it). */
  dbPath: string;
  uploadsDir: string;
  /** The generated session secret, when there is one, so restored sessions stay valid. */
  authSecretPath?: string;
}

/** A folder name that sorts by time and never collides within a second: throwline-20261203-064512. */
export function backupFolderName(now = new Date()): string {
  return `throwline-${now.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15)}`;
}

/**
 * The stored bytes into the backup: a hard link when the backup is on the same filesystem
 * (stored files are never changed in place, only replaced by rename), a copy otherwise.
 */
async function takeFile(from: string, to: string): Promise<number> {
  try {
    await link(from, to);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') throw err;
    if ((err as NodeJS.ErrnoException).code !== 'EEXIST') await copyFile(from, to);
  }
  return (await stat(to)).size;
}

/**
 * Writes a consistent backup into `<parent>/<dated folder>` while the server runs: first every
 * stored file, then `VACUUM INTO` (one read transaction, so one moment of the database), then
 * any file the snapshot names that arrived in between. Files are content-addressed and never
 * rewritten, so the snapshot plus the files it names is a state the server really had. If a
 * file the snapshot names was deleted before it could be taken, the snapshot is taken again.
 * The folder appears under its final name only when complete and checked.
 */
export async function writeBackup(source: BackupSource, parent: string, now = new Date()): Promise<{ dir: string; manifest: BackupManifest }> {
  const finalDir = resolve(parent, backupFolderName(now));
  if (existsSync(finalDir)) throw new Error(`${finalDir} exists already; wait a second and run the backup again.`);
  const work = `${finalDir}.partial`;
  await rm(work, { recursive: true, force: true });
  await mkdir(join(work, BACKUP_UPLOADS), { recursive: true });
  const taken = new Map<string, number>();
  const take = async (name: string) => {
    if (taken.has(name)) return;
    taken.set(name, await takeFile(join(source.uploadsDir, name), join(work, BACKUP_UPLOADS, name)));
  };
  try {
    for (const name of existsSync(source.uploadsDir) ? await readdir(source.uploadsDir) : []) {
      if (!STORED_NAME.test(name)) continue;
      await take(name).catch((err) => {
        // Deleted while we listed: the snapshot below will not name it either.
        if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
      });
    }
    for (let attempt = 1; ; attempt++) {
      const snapshot = join(work, BACKUP_DB);
      await rm(snapshot, { force: true });
      const live = createClient({ url: `file:${source.dbPath}` });
      try {
        await live.execute({ sql: 'VACUUM INTO ?', args: [snapshot] });
      } finally {
        live.close();
      }
      const db = createClient({ url: `file:${snapshot}` });
      try {
        const named = (await db.execute('SELECT storage_name AS a, display_name AS b, thumb_name AS c FROM files')).rows.flatMap((r) => [r.a, r.b, r.c]).filter((n): n is string => typeof n === 'string' && n.length > 0);
        const lost: string[] = [];
        for (const name of new Set(named)) {
          if (!STORED_NAME.test(name)) continue;
          await take(name).catch((err) => {
            if ((err as NodeJS.ErrnoException).code === 'ENOENT') lost.push(name);
            else throw err;
          });
        }
        if (lost.length && attempt < 5) continue;
        if (lost.length) throw new Error(`Files kept disappearing while the backup ran (${lost.length}); run it again.`);
        const keep = new Set(named);
        // Files deleted before the snapshot do not belong in it.
        for (const name of [...taken.keys()]) {
          if (keep.has(name)) continue;
          await rm(join(work, BACKUP_UPLOADS, name), { force: true });
          taken.delete(name);
        }
        const integrity = String((await db.execute('PRAGMA integrity_check')).rows[0][0]);
        if (integrity !== 'ok') throw new Error(`The snapshot failed its integrity check: ${integrity}`);
        const count = async (table: string) => Number((await db.execute(`SELECT count(*) AS n FROM ${table}`)).rows[0].n);
        const manifest: BackupManifest = {
          format: 1,
          createdAt: now.toISOString(),
          revisions: await count('revisions'),
          files: await count('files'),
          storedFiles: taken.size,
          storedBytes: [...taken.values()].reduce((a, b) => a + b, 0),
          integrity: 'ok',
        };
        db.close();
        if (source.authSecretPath && existsSync(source.authSecretPath)) await copyFile(source.authSecretPath, join(work, 'auth-secret'));
        await writeFile(join(work, BACKUP_MANIFEST), JSON.stringify(manifest, null, 2) + '\n');
        await rename(work, finalDir);
        return { dir: finalDir, manifest };
      } finally {
        db.close();
      }
    }
  } catch (err) {
    await rm(work, { recursive: true, force: true });
    throw err;
  }
}
