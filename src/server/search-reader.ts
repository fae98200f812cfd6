import { createRequire } from 'node:module';
import { Worker } from 'node:worker_threads';
import type { SQL } from 'drizzle-orm';
import { SQLiteAsyncDialect } from 'drizzle-orm/sqlite-core';
import { getConfig } from './config';
import { getDb } from './db';

/**
 * Full-text queries over a big venue take tens of milliseconds of CPU inside SQLite, and the
 * libSQL client runs them on the event loop, so while a few people search every other request
 * (a calculator answer, a page save) waits behind them. Here they run in a worker thread with
 * its own read-only connection; the event loop only awaits the rows. A libSQL server does the
 * work in its own process, so there the shared client is used as it is.
 */

const dialect = new SQLiteAsyncDialect();

/** The search thread's nice value (19 is the lowest priority; 0 is everyone else's). */
export const SEARCH_NICENESS = 19;

// CommonJS run by the worker: its own client, and nothing it runs may write.
const WORKER_SOURCE = `
const { parentPort, workerData } = require('node:worker_threads');
// Searching is the one job here that can take a whole core; give this thread the lowest claim
// on it, so the event loop (every other request) runs first whenever both want the CPU. On
// Linux /proc/thread-self names this thread, and setpriority() on a thread id affects only it;
// elsewhere it stays at normal priority.
try {
  const tid = Number(require('node:fs').readlinkSync('/proc/thread-self').split('/').pop());
  if (tid > 0) require('node:os').setPriority(tid, workerData.niceness);
} catch {}
const { createClient } = require(workerData.clientPath);
const client = createClient({ url: workerData.url, timeout: 5000 });
const ready = client.execute('PRAGMA query_only = ON');
parentPort.on('message', async ({ id, sql, params }) => {
  try {
    await ready;
    const rs = await client.execute({ sql, args: params });
    const rows = rs.rows.map((r) => Object.fromEntries(rs.columns.map((c, i) => [c, r[i]])));
    parentPort.postMessage({ id, rows });
  } catch (e) {
    parentPort.postMessage({ id, error: String((e && e.message) || e) });
  }
});
`;

interface Pending {
  resolve: (rows: unknown[]) => void;
  reject: (e: Error) => void;
}

let worker: Worker | undefined;
let nextId = 0;
const pending = new Map<number, Pending>();

function failAll(e: Error) {
  for (const p of pending.values()) p.reject(e);
  pending.clear();
  worker = undefined;
}

function startWorker(url: string): Worker {
  const clientPath = createRequire(import.meta.url).resolve('@libsql/client');
  const w = new Worker(WORKER_SOURCE, { eval: true, workerData: { url, clientPath, niceness: SEARCH_NICENESS } });
  w.on('message', (m: { id: number; rows?: unknown[]; error?: string }) => {
    const p = pending.get(m.id);
    if (!p) return;
    pending.delete(m.id);
    if (m.error !== undefined) p.reject(new Error(m.error));
    else p.resolve(m.rows ?? []);
  });
  w.on('error', (e) => failAll(e));
  w.on('exit', () => failAll(new Error('The search worker stopped.')));
  // A worker waiting for queries must not keep a stopping server alive.
  w.unref();
  return w;
}

/** Runs one read-only query off the event loop (on a file database) and answers its rows. */
export async function readOffLoop<T>(query: SQL): Promise<T[]> {
  const url = getConfig().DATABASE_URL;
  if (!url.startsWith('file:')) return (await getDb()).all<T>(query);
  await getDb(); // migrated (and the index rebuilt) before the worker reads
  worker ??= startWorker(url);
  const { sql, params } = dialect.sqlToQuery(query);
  const id = nextId++;
  return new Promise<T[]>((resolve, reject) => {
    pending.set(id, { resolve: resolve as (rows: unknown[]) => void, reject });
    worker!.postMessage({ id, sql, params });
  });
}
