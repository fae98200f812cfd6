/**
 * The search thread (started by search-reader.ts). Built on its own into the server build as
 * search-worker.mjs (src/cli/search-worker-build.mjs), because a worker thread needs a file
 * Node can load as it is. It holds its own read-only connection, runs the search query and
 * marks the hits, so the event loop only receives finished results.
 */
import { readlinkSync } from 'node:fs';
import { setPriority } from 'node:os';
import { parentPort, workerData } from 'node:worker_threads';
import { createClient } from '@libsql/client';
import type { MatchQuery } from '~/lib/search/mark-matches';
import { searchResultOf, type HitRow } from '~/lib/search/search-hits';

export interface SearchRequest {
  id: number;
  sql: string;
  params: unknown[];
  query: MatchQuery;
}

export type SearchReply = { id: number; result: ReturnType<typeof searchResultOf> } | { id: number; error: string };

const { url, niceness } = workerData as { url: string; niceness: number };

// Searching is the one job here that can take a whole core; give this thread the lowest claim
// on it, so the event loop (every other request) runs first whenever both want the CPU. On
// Linux /proc/thread-self names this thread, and setpriority() on a thread id affects only it;
// elsewhere it stays at normal priority.
try {
  const tid = Number(readlinkSync('/proc/thread-self').split('/').pop());
  if (tid > 0) setPriority(tid, niceness);
} catch {
  // not Linux, or not allowed: normal priority
}

const client = createClient({ url, timeout: 5000 });
// Nothing this thread runs may write.
const ready = client.execute('PRAGMA query_only = ON');

parentPort!.on('message', async ({ id, sql, params, query }: SearchRequest) => {
  let reply: SearchReply;
  try {
    await ready;
    const rs = await client.execute({ sql, args: params as never });
    const rows = rs.rows.map((r) => Object.fromEntries(rs.columns.map((c, i) => [c, r[i]])) as unknown as HitRow);
    reply = { id, result: searchResultOf(rows, query) };
  } catch (e) {
    reply = { id, error: String((e as Error)?.message ?? e) };
  }
  parentPort!.postMessage(reply);
});
