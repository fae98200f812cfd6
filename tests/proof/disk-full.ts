import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, statfsSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO, TMP_ROOT } from '../helpers/paths';
import { signIn } from '../helpers/session';
import { startOn } from './proof-server';

export interface DiskFullResult {
  ran: boolean;
  reason?: string;
  attempts: number;
  answered507: number;
  halfWritten: number;
}

/**
 * The same real full disk as tests/integration/files-disk-full.test.ts: the server in its own
 * mount namespace with UPLOADS_DIR on a 2 MiB tmpfs, read from outside through /proc/<pid>/root.
 */
export async function diskFull(dbPath: string, dir: string, venue: string): Promise<DiskFullResult> {
  const probe = mkdtempSync(join(TMP_ROOT, 'probe-'));
  const res = spawnSync('unshare', ['-m', 'sh', '-c', `mount -t tmpfs -o size=64k tmpfs "${probe}" && umount "${probe}"`], { encoding: 'utf8' });
  rmSync(probe, { recursive: true, force: true });
  if (res.error || res.status !== 0) return { ran: false, reason: 'no private mount namespace here', attempts: 0, answered507: 0, halfWritten: 0 };
  const uploadsDir = join(dir, 'tmpfs-uploads');
  mkdirSync(uploadsDir, { recursive: true });
  const server = await startOn(dbPath, uploadsDir, { NODE_BIN: process.execPath }, (node, script) => [
    'unshare',
    ['-m', 'sh', '-c', `mount -t tmpfs -o size=${2 * 1024 * 1024} tmpfs "$UPLOADS_DIR" && exec "${node}" "${script}"`],
  ]);
  const inside = (...p: string[]) => join(`/proc/${server.child.pid}/root`, uploadsDir, ...p);
  let attempts = 0;
  let answered507 = 0;
  let halfWritten = 0;
  try {
    const client = await signIn(server.url, DEMO.engineer);
    for (const size of [2_500_000, 3_000_000, 1_900_000]) {
      const before = readdirSync(inside()).filter((n) => n !== '.tmp').sort().join();
      const free = statfsSync(inside()).bavail * statfsSync(inside()).bsize;
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(Buffer.concat([Buffer.from('%PDF-1.4\n'), randomBytes(Math.max(size, free + 200_000))]))], { type: 'application/pdf' }), 'big.pdf');
      attempts++;
      const answer = await client.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
      if (answer.status === 507) answered507++;
      await answer.arrayBuffer();
      const after = readdirSync(inside()).filter((n) => n !== '.tmp').sort().join();
      const temps = readdirSync(inside('.tmp'));
      const freeAfter = statfsSync(inside()).bavail * statfsSync(inside()).bsize;
      if (after !== before || temps.length || freeAfter !== free) halfWritten++;
    }
  } finally {
    await server.stop();
  }
  return { ran: true, attempts, answered507, halfWritten };
}
