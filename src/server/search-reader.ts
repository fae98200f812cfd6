import { existsSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import type { SQL } from 'drizzle-orm';
import { SQLiteAsyncDialect } from 'drizzle-orm/sqlite-core';
import type { MatchQuery } from '~/lib/search/mark-matches';
import { searchResultOf, type HitRow, type SearchResult } from '~/lib/search/search-hits';
import { getConfig } from './config';
import { getDb } from './db';
import type { SearchReply, SearchRequest } from './search-worker';

/**
 * Full-text queries over a big venue take milliseconds of CPU inside SQLite, and marking the
 * hits in their text as many again; the libSQL client runs queries on the event loop, so while
 * a few people search every other request (a calculator answer, a page save) would wait behind
 * them. Here both run in a worker thread with its own read-only connection (search-worker.ts),
 * and the event loop only awaits the finished hits.
 *
 * The thread needs its own built file, which src/cli/serve.mjs names in SEARCH_WORKER_FILE_ENV.
 * Without it (the development server) or on a libSQL server (which does the SQL work in its own
 * process) the same query and marking run here.
 */

/** The search thread's nice value (19 is the lowest priority; 0 is everyone else's). */
export const SEARCH_NICENESS = 19;
/** Set by src/cli/serve.mjs to the built search-worker.mjs; not a setting for people. */
export const SEARCH_WORKER_FILE_ENV = 'THROWLINE_SEARCH_WORKER_FILE';

const dialect = new SQLiteAsyncDialect();

interface Pending {
  resolve: (result: SearchResult) => void;
  reject: (e: Error) => void;
}

let worker: Worker | undefined;
let nextId = 0;
const pending = new Map<number, Pending>();
let warned = false;

function failAll(e: Error) {
  for (const p of pending.values()) p.reject(e);
  pending.clear();
  worker = undefined;
}

function startWorker(file: string, url: string): Worker {
  const w = new Worker(file, { workerData: { url, niceness: SEARCH_NICENESS } });
  w.on('message', (m: SearchReply) => {
    const p = pending.get(m.id);
    if (!p) return;
    pending.delete(m.id);
    if ('error' in m) p.reject(new Error(m.error));
    else p.resolve(m.result);
  });
  w.on('error', (e) => failAll(e));
  w.on('exit', () => failAll(new Error('The search worker stopped.')));
  // A worker waiting for queries must not keep a stopping server alive.
  w.unref();
  return w;
}

function workerFile(): string | undefined {
  const file = process.env[SEARCH_WORKER_FILE_ENV];
  if (file && existsSync(file)) return file;
  if (!warned && process.env.NODE_ENV === 'production') {
    warned = true;
    console.warn(`! search runs on the event loop: no search worker file (${file ?? `${SEARCH_WORKER_FILE_ENV} not set`})`);
  }
  return undefined;
}

/**
 * Runs the search query (read-only) and marks `match`'s terms in each row's title and text,
 * off the event loop on a file database.
 */
export async function searchOffLoop(query: SQL, match: MatchQuery): Promise<SearchResult> {
  const url = getConfig().DATABASE_URL;
  const db = await getDb(); // migrated (and the index rebuilt) before the worker reads
  const file = url.startsWith('file:') ? workerFile() : undefined;
  if (!file) return searchResultOf(await db.all<HitRow>(query), match);
  worker ??= startWorker(file, url);
  const { sql, params } = dialect.sqlToQuery(query);
  const id = nextId++;
  return new Promise<SearchResult>((resolve, reject) => {
    pending.set(id, { resolve, reject });
    const request: SearchRequest = { id, sql, params, query: { terms: match.terms, prefixLast: match.prefixLast } };
    worker!.postMessage(request);
  });
}
