import { resolve } from 'node:path';
import { migrate } from 'drizzle-orm/libsql/migrator';
import type { Db } from './client';

/** Applies drizzle-kit's SQL migrations from drizzle/; already-applied ones are skipped. */
export async function runMigrations(db: Db, migrationsFolder = resolve('drizzle')): Promise<void> {
  await migrate(db, { migrationsFolder });
}
