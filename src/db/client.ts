import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { createClient, type Client } from '@libsql/client';
import { drizzle, type LibSQLDatabase } from 'drizzle-orm/libsql';
import * as schema from './schema';
// Before any connection prepares a statement: reuse them (see the module for why it is safe).
import './statement-cache';

export type Db = LibSQLDatabase<typeof schema> & { $client: Client };

export interface OpenOptions {
  /** Connections in the client's pool; 1 for the writer, a few for readers. */
  connections?: number;
}

/**
 * Opens the database with the settings the rest of the code relies on: WAL so readers never wait
 * for the writer, foreign keys enforced, and synchronous=FULL so a committed revision survives a
 * power cut at the desk. Those pragmas hold per connection, which is why the writer has exactly
 * one connection and sets them once.
 */
export async function openDb(url: string, options: OpenOptions = {}): Promise<Db> {
  if (url.startsWith('file:')) mkdirSync(dirname(resolve(url.slice('file:'.length))), { recursive: true });
  const client = createClient({ url, concurrency: options.connections ?? 1, timeout: 5000 });
  if (url.startsWith('file:')) {
    await client.execute('PRAGMA journal_mode = WAL');
    await client.execute('PRAGMA synchronous = FULL');
  }
  await client.execute('PRAGMA foreign_keys = ON');
  return drizzle(client, { schema }) as Db;
}
