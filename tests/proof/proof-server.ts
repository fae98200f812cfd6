import { spawn, type ChildProcess } from 'node:child_process';
import { SERVE_SCRIPT } from '~/cli/build-if-stale.mjs';
import { ROOT } from '../helpers/paths';
import { freePort } from '../helpers/server';

/** A server on data that outlives it (the crash loop restarts it on the same files). */
export interface LiveServer {
  url: string;
  child: ChildProcess;
  /** Milliseconds from spawn to the first answer. */
  readyMs: number;
  kill9: () => Promise<void>;
  stop: () => Promise<void>;
}

export async function startOn(dbPath: string, uploadsDir: string, extraEnv: Record<string, string> = {}, wrap?: (node: string, script: string) => [string, string[]]): Promise<LiveServer> {
  const port = await freePort();
  const env = {
    ...process.env,
    HOST: '127.0.0.1',
    PORT: String(port),
    DATABASE_URL: `file:${dbPath}`,
    UPLOADS_DIR: uploadsDir,
    AUTH_SECRET: 'proof-secret-'.padEnd(48, 'x'),
    SEED_DEMO: '0',
    NODE_ENV: 'production',
    ...extraEnv,
  };
  const [cmd, args] = wrap ? wrap(process.execPath, SERVE_SCRIPT) : [process.execPath, [SERVE_SCRIPT]];
  const started = performance.now();
  const child = spawn(cmd, args, { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let log = '';
  child.stdout!.on('data', (d) => (log += d));
  child.stderr!.on('data', (d) => (log += d));
  const url = `http://127.0.0.1:${port}`;
  for (const deadline = Date.now() + 30_000; ; ) {
    if (child.exitCode !== null) throw new Error(`server exited early (${child.exitCode}):\n${log}`);
    try {
      if ((await fetch(`${url}/api/calc/band?q=1`)).status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server not ready in 30 s:\n${log}`);
    await new Promise((r) => setTimeout(r, 25));
  }
  const readyMs = performance.now() - started;
  const gone = () => new Promise<void>((r) => (child.exitCode !== null || child.signalCode !== null ? r() : child.once('exit', () => r())));
  return {
    url,
    child,
    readyMs,
    kill9: async () => {
      child.kill('SIGKILL');
      await gone();
    },
    stop: async () => {
      child.kill('SIGTERM');
      await gone();
    },
  };
}
