import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { enqueueWrite } from './write-queue';
import { openDb } from '~/db/client';
import { runMigrations } from '~/db/migrate';
import { users, venues } from '~/db/schema';

async function freshDb() {
  const dir = mkdtempSync(join(tmpdir(), 'tl-db-'));
  const db = await openDb(`file:${join(dir, 'nested', 'throwline.db')}`);
  await runMigrations(db);
  return db;
}

describe('openDb on a real SQLite file', () => {
  it('creates missing folders and sets WAL, synchronous=FULL and foreign keys', async () => {
    const db = await freshDb();
    const pragma = async (name: string) => Object.values((await db.$client.execute(`PRAGMA ${name}`)).rows[0])[0];
    expect(await pragma('journal_mode')).toBe('wal');
    expect(await pragma('synchronous')).toBe(2); // 2 = FULL (sqlite.org/pragma.html#pragma_synchronous)
    expect(await pragma('foreign_keys')).toBe(1);
    db.$client.close();
  });

  it('enforces foreign keys: a membership for a missing venue is refused', async () => {
    const db = await freshDb();
    await expect(db.$client.execute("insert into memberships (venue_id, user_id, role, created_at) values ('nope', 'nobody', 'viewer', 0)")).rejects.toThrow(/FOREIGN KEY/);
    db.$client.close();
  });

  it('rolls a failed transaction back completely, and the next write still goes through', async () => {
    const db = await freshDb();
    const failing = enqueueWrite(() =>
      db.transaction(async (tx) => {
        await tx.insert(venues).values({ slug: 'half-written', name: 'Half Written' });
        throw new Error('fault after the first insert');
      }),
    );
    const next = enqueueWrite(() => db.transaction(async (tx) => tx.insert(users).values({ email: 'a@b.test', name: 'A' })));
    await expect(failing).rejects.toThrow('fault after the first insert');
    await next;
    const [{ n }] = await db.select({ n: sql<number>`count(*)` }).from(venues);
    const [{ m }] = await db.select({ m: sql<number>`count(*)` }).from(users);
    expect(n).toBe(0);
    expect(m).toBe(1);
    db.$client.close();
  });
});
