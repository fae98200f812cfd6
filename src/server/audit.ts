import { and, desc, eq, inArray, isNull, like, or, sql } from 'drizzle-orm';
import { auditEvents, memberships, users } from '~/db/schema';
import { getDb, type Tx } from './db';

export interface AuditEntry {
  venueId: string | null;
  actorId: string | null;
  action: string;
  targetType: string;
  targetId?: string | null;
  detail?: Record<string, unknown>;
}

/** Written inside the same transaction as the change, so the log never disagrees with the data. */
export async function recordAudit(tx: Tx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({ ...entry, targetId: entry.targetId ?? null, detail: entry.detail ?? null });
}

export const AUDIT_PAGE_SIZE = 50;

/**
 * A venue's audit events, newest first, filtered by who and by kind (the part before the dot),
 * with the sign-ins of its current members (those belong to no venue).
 */
export async function listAudit(venueId: string, filter: { actor?: string; kind?: string; page: number }) {
  const db = await getDb();
  const membersNow = db.select({ id: memberships.userId }).from(memberships).where(eq(memberships.venueId, venueId));
  const where = and(
    or(eq(auditEvents.venueId, venueId), and(isNull(auditEvents.venueId), like(auditEvents.action, 'signin.%'), inArray(auditEvents.actorId, membersNow))),
    filter.actor ? eq(auditEvents.actorId, filter.actor) : undefined,
    filter.kind ? like(auditEvents.action, `${filter.kind}.%`) : undefined,
  );
  const rows = await db
    .select({ id: auditEvents.id, action: auditEvents.action, targetType: auditEvents.targetType, targetId: auditEvents.targetId, detail: auditEvents.detail, createdAt: auditEvents.createdAt, actorId: auditEvents.actorId, actorName: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(where)
    .orderBy(desc(auditEvents.createdAt), desc(sql`${auditEvents}.rowid`))
    .limit(AUDIT_PAGE_SIZE + 1)
    .offset((filter.page - 1) * AUDIT_PAGE_SIZE);
  return { events: rows.slice(0, AUDIT_PAGE_SIZE), page: filter.page, hasMore: rows.length > AUDIT_PAGE_SIZE };
}

export type SignInWay = 'password' | 'email-link' | 'password-reset' | 'invitation';

/**
 * A successful sign-in. It belongs to no venue: each venue's log shows the sign-ins of the
 * people who are its members now (see listAudit).
 */
export async function recordSignIn(tx: Tx, userId: string, way: SignInWay): Promise<void> {
  await recordAudit(tx, { venueId: null, actorId: userId, action: `signin.${way}`, targetType: 'user', targetId: userId });
}
