import { mkdir, readdir, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { files } from '~/db/schema';
import { getDb, writeTx } from '~/server/db';
import { asStorageError } from './storage-errors';
import { STORED_NAME, tempDir, uploadsDir } from './storage-paths';

let ready: Promise<void> | undefined;

/**
 * Runs once per server process, before the first upload, list or download: every file
 * operation awaits it, so nothing of this process is in flight while it cleans up.
 */
export function ensureStorageReady(): Promise<void> {
  ready ??= (async () => {
    await mkdir(tempDir(), { recursive: true });
    try {
      const report = await sweepStorage();
      if (report.tempRemoved || report.orphansRemoved || report.flaggedMissing || report.foundAgain) {
        console.log(`[throwline] file storage check: ${JSON.stringify(report)}`);
      }
    } catch (err) {
      // A failed sweep leaves litter, not damage; uploads and downloads still work.
      console.error('[throwline] file storage check failed', err);
    }
  })().catch((err) => {
    ready = undefined;
    throw asStorageError(err);
  });
  return ready;
}

/**
 * One of several server processes (WEB_CONCURRENCY > 1) cannot know what the others are doing:
 * another may be mid-upload, its bytes in the temp folder or already renamed but not yet given a
 * row. There, only litter older than any upload could take is removed; a lone process has
 * nothing in flight while it sweeps (every file operation waits for the sweep).
 */
const IN_FLIGHT_MS = 30 * 60 * 1000;

async function oldEnough(path: string): Promise<boolean> {
  // src/cli/serve.mjs hands its workers the resolved number of processes.
  if (Number(process.env.WEB_CONCURRENCY ?? '1') <= 1) return true;
  try {
    return Date.now() - (await stat(path)).mtimeMs > IN_FLIGHT_MS;
  } catch {
    return false;
  }
}

export interface SweepReport {
  tempRemoved: number;
  orphansRemoved: number;
  flaggedMissing: number;
  foundAgain: number;
}

/**
 * After a crash or a full disk: removes temporary files, removes stored files no row points at
 * (only names this module makes; anything else in the folder is left alone), and flags rows
 * whose bytes are gone so the files screen can say so.
 */
export async function sweepStorage(): Promise<SweepReport> {
  const report: SweepReport = { tempRemoved: 0, orphansRemoved: 0, flaggedMissing: 0, foundAgain: 0 };
  for (const entry of await readdir(tempDir())) {
    if (!(await oldEnough(join(tempDir(), entry)))) continue;
    await rm(join(tempDir(), entry), { recursive: true, force: true });
    report.tempRemoved++;
  }

  const db = await getDb();
  const rows = await db
    .select({ id: files.id, storageName: files.storageName, displayName: files.displayName, thumbName: files.thumbName, missing: files.missing })
    .from(files);
  const referenced = new Set(rows.flatMap((r) => [r.storageName, r.displayName, r.thumbName]).filter((n): n is string => !!n));
  const onDisk = new Set((await readdir(uploadsDir())).filter((name) => STORED_NAME.test(name)));

  for (const name of onDisk) {
    if (referenced.has(name) || !(await oldEnough(join(uploadsDir(), name)))) continue;
    await rm(join(uploadsDir(), name), { force: true });
    report.orphansRemoved++;
  }

  const changes: { id: string; missing: boolean }[] = [];
  for (const row of rows) {
    const names = [row.storageName, row.displayName, row.thumbName].filter((n): n is string => !!n);
    const present = names.every((n) => onDisk.has(n));
    if (present === !row.missing) continue;
    changes.push({ id: row.id, missing: !present });
    if (present) report.foundAgain++;
    else report.flaggedMissing++;
  }
  if (changes.length) {
    await writeTx(async (tx) => {
      for (const change of changes) await tx.update(files).set({ missing: change.missing }).where(eq(files.id, change.id));
    });
  }
  return report;
}
