import { openDb, type Db } from '../db/client';
import { runMigrations } from '../db/migrate';
import { getConfig } from './config';
import { enqueueWrite } from './write-queue';

let ready: Promise<Db> | undefined;

/** The process's database, migrated before first use. */
export function getDb(): Promise<Db> {
  ready ??= (async () => {
    const db = await openDb(getConfig().DATABASE_URL);
    await enqueueWrite(() => runMigrations(db));
    return db;
  })();
  return ready;
}

export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * Runs `work` in one write transaction, queued behind every other write of this process.
 * Inside `work` use only `tx`: the database has one connection and `tx` holds it.
 * Anything thrown rolls the whole transaction back.
 */
export async function writeTx<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
  const db = await getDb();
  return enqueueWrite(() => db.transaction(work));
}
