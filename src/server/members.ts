import { and, asc, eq, gt, isNull } from 'drizzle-orm';
import { invitations, memberships, users } from '~/db/schema';
import type { Role } from '~/lib/permissions';
import { recordAudit } from './audit';
import { getDb, writeTx, type Tx } from './db';
import { HttpError } from './http';
import { endSessionsOf, type SessionUser } from './session';

const MEMBER_NOT_FOUND = 'That person is not a member of this venue.';
const LAST_MANAGER = 'This is the last manager of the venue. Make someone else a manager first, then change or remove this one.';

export async function listMembers(venueId: string) {
  const db = await getDb();
  const members = await db
    .select({ userId: users.id, email: users.email, name: users.name, role: memberships.role, visitStartedAt: memberships.visitStartedAt, since: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.venueId, venueId))
    .orderBy(asc(users.name));
  const pending = await db
    .select({ id: invitations.id, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.venueId, venueId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(asc(invitations.email));
  return {
    members: members.map(({ visitStartedAt, ...m }) => ({ ...m, lastVisitAt: visitStartedAt })),
    invitations: pending,
  };
}

async function membershipInTx(tx: Tx, venueId: string, userId: string | undefined) {
  if (!userId || userId.length > 100) throw new HttpError(404, MEMBER_NOT_FOUND);
  const [row] = await tx
    .select({ role: memberships.role, email: users.email })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.venueId, venueId), eq(memberships.userId, userId)))
    .limit(1);
  if (!row) throw new HttpError(404, MEMBER_NOT_FOUND);
  return row;
}

async function managerCount(tx: Tx, venueId: string): Promise<number> {
  const rows = await tx.select({ userId: memberships.userId }).from(memberships).where(and(eq(memberships.venueId, venueId), eq(memberships.role, 'manager')));
  return rows.length;
}

/** Changes a member's role; a venue never loses its last manager this way (409). */
export async function changeRole(venueId: string, userId: string | undefined, role: Role, actor: SessionUser) {
  return writeTx(async (tx) => {
    const member = await membershipInTx(tx, venueId, userId);
    if (member.role === role) return { userId: userId!, role };
    if (member.role === 'manager' && (await managerCount(tx, venueId)) <= 1) throw new HttpError(409, LAST_MANAGER);
    await tx.update(memberships).set({ role }).where(and(eq(memberships.venueId, venueId), eq(memberships.userId, userId!)));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'member.role', targetType: 'member', targetId: userId!, detail: { email: member.email, from: member.role, to: role } });
    return { userId: userId!, role };
  });
}

/**
 * Removes a member. Their open sessions end at the next request (the session epoch moves on),
 * so a laptop left signed in at FOH stops working for them everywhere, not only here.
 */
export async function removeMember(venueId: string, userId: string | undefined, actor: SessionUser) {
  await writeTx(async (tx) => {
    const member = await membershipInTx(tx, venueId, userId);
    if (member.role === 'manager' && (await managerCount(tx, venueId)) <= 1) throw new HttpError(409, LAST_MANAGER);
    await tx.delete(memberships).where(and(eq(memberships.venueId, venueId), eq(memberships.userId, userId!)));
    await endSessionsOf(tx, userId!);
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'member.remove', targetType: 'member', targetId: userId!, detail: { email: member.email, role: member.role } });
  });
}

/** Adds or updates a membership inside the caller's write (accepting an invitation, the admin's first manager). */
export async function grantMembership(tx: Tx, venueId: string, userId: string, role: Role): Promise<void> {
  await tx.insert(memberships).values({ venueId, userId, role }).onConflictDoUpdate({ target: [memberships.venueId, memberships.userId], set: { role } });
}

const VISIT_GAP_MS = 30 * 60 * 1000;

/**
 * Starts a new visit when the last one began more than 30 minutes ago; the previous start becomes
 * "your last visit" for the changed-since view. At most one write per member per half hour.
 */
export async function noteVisit(venueId: string, userId: string, knownVisitStart?: Date | null): Promise<void> {
  // The venue guard has usually read the visit already (with the membership); read it only if not.
  let visitStartedAt = knownVisitStart;
  if (visitStartedAt === undefined) {
    const db = await getDb();
    const [row] = await db.select({ visitStartedAt: memberships.visitStartedAt }).from(memberships).where(and(eq(memberships.venueId, venueId), eq(memberships.userId, userId))).limit(1);
    if (!row) return;
    visitStartedAt = row.visitStartedAt;
  }
  const now = Date.now();
  if (visitStartedAt && now - visitStartedAt.getTime() < VISIT_GAP_MS) return;
  await writeTx((tx) =>
    tx
      .update(memberships)
      .set({ lastVisitAt: visitStartedAt ?? null, visitStartedAt: new Date(now) })
      .where(and(eq(memberships.venueId, venueId), eq(memberships.userId, userId))),
  );
}

/** When this member's previous visit began, or null on a first visit. */
export async function lastVisitOf(venueId: string, userId: string): Promise<Date | null> {
  const db = await getDb();
  const [row] = await db.select({ lastVisitAt: memberships.lastVisitAt }).from(memberships).where(and(eq(memberships.venueId, venueId), eq(memberships.userId, userId))).limit(1);
  return row?.lastVisitAt ?? null;
}
