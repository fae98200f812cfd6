import { eq, sql } from 'drizzle-orm';
import { throttleCounters } from '~/db/schema';
import { getDb, writeTx } from '~/server/db';

/**
 * Fixed-window failure counters kept in SQLite, so every server process sharing the database
 * counts together and a restart does not wipe the count.
 */
export interface ThrottleRule {
  prefix: string;
  limit: number;
  windowMs: number;
}

/** Milliseconds until the window under `key` ends, when its count has reached the limit; else 0. */
export async function blockedFor(rule: ThrottleRule, key: string): Promise<number> {
  const db = await getDb();
  const [row] = await db.select().from(throttleCounters).where(eq(throttleCounters.key, `${rule.prefix}:${key}`)).limit(1);
  const now = Date.now();
  if (!row || row.resetAt <= now || row.count < rule.limit) return 0;
  return row.resetAt - now;
}

/** Counts one more event under `key` and returns the count in the current window. */
export async function countHit(rule: ThrottleRule, key: string): Promise<number> {
  const now = Date.now();
  const resetAt = now + rule.windowMs;
  const fullKey = `${rule.prefix}:${key}`;
  return writeTx(async (tx) => {
    // One upsert: a window that has ended starts again at 1.
    const [row] = await tx
      .insert(throttleCounters)
      .values({ key: fullKey, count: 1, resetAt })
      .onConflictDoUpdate({
        target: throttleCounters.key,
        set: {
          count: sql`CASE WHEN ${throttleCounters.resetAt} <= ${now} THEN 1 ELSE ${throttleCounters.count} + 1 END`,
          resetAt: sql`CASE WHEN ${throttleCounters.resetAt} <= ${now} THEN ${resetAt} ELSE ${throttleCounters.resetAt} END`,
        },
      })
      .returning({ count: throttleCounters.count });
    return row.count;
  });
}

export async function clearHits(rule: ThrottleRule, key: string): Promise<void> {
  await writeTx((tx) => tx.delete(throttleCounters).where(eq(throttleCounters.key, `${rule.prefix}:${key}`)));
}
