import { openDb, type Db } from '~/db/client';
import { runMigrations } from '~/db/migrate';
import { getConfig } from './config';
import { ensureSearchIndex } from './search-index';
import { enqueueWrite } from './write-queue';

interface Handles {
  /** Pooled connections for reads: a read never waits for (or fails on) an open write. */
  read: Db;
  /** One connection, used only inside `writeTx`, so its pragmas always apply. */
  write: Db;
}

const READ_CONNECTIONS = 4;
let ready: Promise<Handles> | undefined;

function handles(): Promise<Handles> {
  ready ??= (async () => {
    const url = getConfig().DATABASE_URL;
    const write = await openDb(url, { connections: 1 });
    await enqueueWrite(() => runMigrations(write));
    await enqueueWrite(() => ensureSearchIndex(write));
    // A libSQL server handles concurrency itself; only a local file needs a second client.
    const read = url.startsWith('file:') ? await openDb(url, { connections: READ_CONNECTIONS }) : write;
    return { read, write };
  })();
  ready.catch(() => (ready = undefined));
  return ready;
}

/**
 * The process's database for reading, migrated before first use. Never write through it:
 * writes go through `writeTx`.
 */
export async function getDb(): Promise<Db> {
  return (await handles()).read;
}

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** The database or a transaction: for reads that must also work inside `writeTx`. */
export type Reader = Db | Tx;

/**
 * Runs `work` in one write transaction, queued behind every other write of this process.
 * Inside `work` use only `tx`. Anything thrown rolls the whole transaction back.
 */
export async function writeTx<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
  const { write } = await handles();
  return enqueueWrite(() => write.transaction(work));
}
