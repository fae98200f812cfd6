import { createClient } from '@libsql/client';
import { chmod, copyFile, mkdir, readdir, readFile, rename } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { STORED_NAME } from '~/server/files/storage-paths';
import { BACKUP_DB, BACKUP_MANIFEST, BACKUP_UPLOADS, type BackupManifest } from './backup-snapshot';

export class RestoreRefused extends Error {}

export interface RestoreTarget {
  dbPath: string;
  uploadsDir: string;
}

/** Entries that make a folder "not empty" for a restore (an empty .tmp left by a server is fine). */
async function contents(dir: string): Promise<string[]> {
  if (!existsSync(dir)) return [];
  const entries = await readdir(dir);
  const left: string[] = [];
  for (const e of entries) {
    if (e === '.tmp' && (await readdir(join(dir, e))).length === 0) continue;
    left.push(e);
  }
  return left;
}

/**
 * Brings a backup back into an EMPTY data folder and uploads folder; it never mixes a backup
 * with a database that already holds something. Checks the backup first (manifest, integrity,
 * every file the database names), then copies, then checks the restored database again.
 */
export async function restoreBackup(backupDir: string, target: RestoreTarget): Promise<BackupManifest> {
  const from = resolve(backupDir);
  if (!existsSync(join(from, BACKUP_MANIFEST)) || !existsSync(join(from, BACKUP_DB))) {
    throw new RestoreRefused(`${from} is not a Throwline backup (it has no ${BACKUP_MANIFEST} and ${BACKUP_DB}); give the folder that \`npm run backup\` printed.`);
  }
  const manifest = JSON.parse(await readFile(join(from, BACKUP_MANIFEST), 'utf8')) as BackupManifest;
  const dataDir = dirname(resolve(target.dbPath));
  for (const dir of new Set([dataDir, resolve(target.uploadsDir)])) {
    const found = await contents(dir);
    if (found.length) {
      throw new RestoreRefused(
        `Nothing was restored: ${dir} is not empty (it holds ${found.slice(0, 3).join(', ')}${found.length > 3 ? ', …' : ''}). Restore only into an empty folder: move its contents away, or point DATABASE_URL and UPLOADS_DIR at new folders.`,
      );
    }
  }
  const backupDb = createClient({ url: `file:${join(from, BACKUP_DB)}` });
  let named: string[];
  try {
    const integrity = String((await backupDb.execute('PRAGMA integrity_check')).rows[0][0]);
    if (integrity !== 'ok') throw new RestoreRefused(`Nothing was restored: the backup's database fails its integrity check (${integrity}).`);
    named = (await backupDb.execute('SELECT storage_name AS a, display_name AS b, thumb_name AS c FROM files')).rows.flatMap((r) => [r.a, r.b, r.c]).filter((n): n is string => typeof n === 'string' && n.length > 0);
  } finally {
    backupDb.close();
  }
  const missing = named.filter((n) => !existsSync(join(from, BACKUP_UPLOADS, n)));
  if (missing.length) throw new RestoreRefused(`Nothing was restored: the backup lacks ${missing.length} stored file(s) its database names (e.g. ${missing[0]}).`);

  await mkdir(dataDir, { recursive: true });
  await mkdir(target.uploadsDir, { recursive: true });
  for (const name of new Set(named)) {
    if (!STORED_NAME.test(name)) continue;
    await copyFile(join(from, BACKUP_UPLOADS, name), join(target.uploadsDir, name));
  }
  if (existsSync(join(from, 'auth-secret'))) {
    await copyFile(join(from, 'auth-secret'), join(dataDir, 'auth-secret'));
    await chmod(join(dataDir, 'auth-secret'), 0o600);
  }
  // The database last, under a temporary name: a restore cut short leaves no database that
  // looks complete.
  const partial = `${target.dbPath}.restoring`;
  await copyFile(join(from, BACKUP_DB), partial);
  const restored = createClient({ url: `file:${partial}` });
  try {
    const integrity = String((await restored.execute('PRAGMA integrity_check')).rows[0][0]);
    if (integrity !== 'ok') throw new Error(`The restored database fails its integrity check (${integrity}).`);
  } finally {
    restored.close();
  }
  await rename(partial, target.dbPath);
  return manifest;
}
