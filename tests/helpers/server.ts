import { spawn, type ChildProcess } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { SERVE_SCRIPT } from '~/cli/build-if-stale.mjs';
import { ROOT, TEMPLATE_DB, TMP_ROOT } from './paths';

export interface TestServer {
  url: string;
  /** The process started (with WEB_CONCURRENCY > 1, the primary of its worker processes). */
  pid: number;
  authSecret: string;
  dir: string;
  dbPath: string;
  uploadsDir: string;
  output: () => string;
  stop: () => Promise<void>;
}

const TEST_AUTH_SECRET = 'test-secret-'.padEnd(48, 'x');

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number };
      srv.close(() => resolve(port));
    });
  });
}

/**
 * Starts the built server (dist/) as its own process on a free loopback port, with a copy of
 * the seeded template database and an empty uploads folder of its own.
 */
export async function startServer(env: Record<string, string> = {}): Promise<TestServer> {
  mkdirSync(TMP_ROOT, { recursive: true });
  const dir = mkdtempSync(join(TMP_ROOT, 'srv-'));
  const dbPath = join(dir, 'throwline.db');
  const uploadsDir = join(dir, 'uploads');
  mkdirSync(uploadsDir);
  copyFileSync(TEMPLATE_DB, dbPath);
  const port = await freePort();
  let log = '';
  const child: ChildProcess = spawn(process.execPath, [SERVE_SCRIPT], {
    cwd: ROOT,
    env: {
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: `file:${dbPath}`,
      UPLOADS_DIR: uploadsDir,
      AUTH_SECRET: TEST_AUTH_SECRET,
      SEED_DEMO: '0',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout!.on('data', (d) => (log += d));
  child.stderr!.on('data', (d) => (log += d));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The server exited early (${child.exitCode}):\n${log}`);
    try {
      const res = await fetch(`${url}/api/calc/band?q=1`);
      if (res.status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`The server did not start in 30 s:\n${log}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    pid: child.pid!,
    authSecret: env.AUTH_SECRET ?? TEST_AUTH_SECRET,
    dir,
    dbPath,
    uploadsDir,
    output: () => log,
    stop: async () => {
      // A process ended by a signal keeps exitCode null; signalCode tells it has gone.
      if (child.exitCode === null && child.signalCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await exited;
      }
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
