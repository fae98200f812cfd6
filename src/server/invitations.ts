import { and, eq, isNull } from 'drizzle-orm';
import { invitations, memberships, users, venues } from '~/db/schema';
import type { Role } from '~/lib/permissions';
import { recordAudit, recordSignIn } from './audit';
import { blockedFor, countHit } from './auth/throttle';
import { mailPerRecipient } from './auth/rate-limit';
import { hashPassword } from './auth/password';
import { getConfig } from './config';
import { getDb, writeTx } from './db';
import { HttpError } from './http';
import { sendMail } from './mail/mailer';
import { grantMembership } from './members';
import { hashesEqual, newSecretToken, SECRET_TOKEN, tokenHash } from './secret-token';
import type { SessionUser } from './session';

const INVITATION_DAYS = 7;
const INVITATION_NOT_FOUND = 'There is no such invitation in this venue.';

/**
 * Where links in e-mail point. PUBLIC_URL when set: a Host header is chosen by whoever sends the
 * request, and a link built from a forged one would carry the token to someone else's site.
 */
export function publicOrigin(request: Request): string {
  return getConfig().PUBLIC_URL?.replace(/\/+$/, '') ?? new URL(request.url).origin;
}

/** Text that goes into a mail header: no line breaks or control characters, ever. */
function headerSafe(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f]+/g, ' ').slice(0, 150);
}

export async function inviteByEmail(venue: { id: string; name: string }, email: string, role: Role, actor: SessionUser, request: Request) {
  if (await blockedFor(mailPerRecipient, email)) {
    throw new HttpError(429, 'Several messages went to this address in the last 15 minutes. Wait a while before sending another.');
  }
  const db = await getDb();
  const [existing] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.venueId, venue.id), eq(users.email, email)))
    .limit(1);
  if (existing) throw new HttpError(409, `${email} is already a member of this venue (${existing.role}); change the role in the list instead.`, 'email');
  const token = newSecretToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 24 * 60 * 60 * 1000);
  const invitation = await writeTx(async (tx) => {
    // A new invitation replaces any still pending for the same address, so only the newest link works.
    await tx
      .update(invitations)
      .set({ revokedAt: new Date() })
      .where(and(eq(invitations.venueId, venue.id), eq(invitations.email, email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
    const [row] = await tx.insert(invitations).values({ venueId: venue.id, email, role, tokenHash: tokenHash(token), expiresAt, invitedBy: actor.id }).returning();
    await recordAudit(tx, { venueId: venue.id, actorId: actor.id, action: 'invitation.create', targetType: 'invitation', targetId: row.id, detail: { email, role } });
    return row;
  });
  await countHit(mailPerRecipient, email);
  const link = `${publicOrigin(request)}/invite/${token}`;
  try {
    await sendMail({
      to: email,
      subject: headerSafe(`You are invited to ${venue.name} on Throwline`),
      text: [
        `${actor.name} invited you to the system book of ${venue.name} as ${role}.`,
        '',
        `Open this link within ${INVITATION_DAYS} days to accept:`,
        link,
        '',
        'The link works once. If you did not expect this message, ignore it.',
      ].join('\n'),
    });
  } catch (err) {
    console.error('[throwline] invitation mail failed', err);
    throw new HttpError(502, 'The invitation is saved but the mail server did not accept the message. Use "Send again" in a moment.');
  }
  return { id: invitation.id, email, role, expiresAt };
}

export async function revokeInvitation(venueId: string, invitationId: string | undefined, actor: SessionUser): Promise<void> {
  if (!invitationId || invitationId.length > 100) throw new HttpError(404, INVITATION_NOT_FOUND);
  await writeTx(async (tx) => {
    const [row] = await tx.select().from(invitations).where(and(eq(invitations.id, invitationId), eq(invitations.venueId, venueId))).limit(1);
    if (!row || row.acceptedAt) throw new HttpError(404, INVITATION_NOT_FOUND);
    if (row.revokedAt) return;
    await tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, row.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'invitation.revoke', targetType: 'invitation', targetId: row.id, detail: { email: row.email } });
  });
}

/** Sends a pending invitation again, with a fresh link (the old one stops working). */
export async function resendInvitation(venue: { id: string; name: string }, invitationId: string | undefined, actor: SessionUser, request: Request) {
  if (!invitationId || invitationId.length > 100) throw new HttpError(404, INVITATION_NOT_FOUND);
  const db = await getDb();
  const [row] = await db.select().from(invitations).where(and(eq(invitations.id, invitationId), eq(invitations.venueId, venue.id))).limit(1);
  if (!row || row.acceptedAt || row.revokedAt) throw new HttpError(404, INVITATION_NOT_FOUND);
  return inviteByEmail(venue, row.email, row.role, actor, request);
}

export interface OpenInvitation {
  id: string;
  email: string;
  role: Role;
  venueId: string;
  venueSlug: string;
  venueName: string;
  accountExists: boolean;
}

/** The pending, unexpired invitation a token opens, or null. */
export async function openInvitation(token: string | undefined): Promise<OpenInvitation | null> {
  if (!token || !SECRET_TOKEN.test(token)) return null;
  const hash = tokenHash(token);
  const db = await getDb();
  const [row] = await db
    .select({ inv: invitations, venueSlug: venues.slug, venueName: venues.name })
    .from(invitations)
    .innerJoin(venues, eq(venues.id, invitations.venueId))
    .where(eq(invitations.tokenHash, hash))
    .limit(1);
  if (!row || !hashesEqual(row.inv.tokenHash, hash)) return null;
  if (row.inv.acceptedAt || row.inv.revokedAt || row.inv.expiresAt.getTime() <= Date.now()) return null;
  const account = await db.query.users.findFirst({ where: eq(users.email, row.inv.email), columns: { id: true } });
  return { id: row.inv.id, email: row.inv.email, role: row.inv.role, venueId: row.inv.venueId, venueSlug: row.venueSlug, venueName: row.venueName, accountExists: !!account };
}

/**
 * Uses the invitation once: a new person gets an account with the name and password they chose,
 * an existing one (signed in as the invited address) joins. Marked accepted in the same write,
 * so two clicks on one link make one member.
 */
export async function acceptInvitation(token: string, who: { signedIn: SessionUser | null; name?: string; password?: string }): Promise<{ userId: string; venueSlug: string }> {
  const hash = tokenHash(token);
  const passwordHash = who.password ? await hashPassword(who.password) : null;
  return writeTx(async (tx) => {
    const [row] = await tx.select({ inv: invitations, venueSlug: venues.slug }).from(invitations).innerJoin(venues, eq(venues.id, invitations.venueId)).where(eq(invitations.tokenHash, hash)).limit(1);
    if (!row || row.inv.acceptedAt || row.inv.revokedAt || row.inv.expiresAt.getTime() <= Date.now()) {
      throw new HttpError(404, 'This invitation link has been used, has expired or was withdrawn. Ask the venue manager for a new one.');
    }
    const inv = row.inv;
    const [account] = await tx.select().from(users).where(eq(users.email, inv.email)).limit(1);
    let userId: string;
    if (account) {
      if (!who.signedIn || who.signedIn.id !== account.id) {
        throw new HttpError(403, `This invitation is for ${inv.email}. Sign in with that account to accept it.`);
      }
      userId = account.id;
    } else {
      if (!who.name || !passwordHash) throw new HttpError(400, 'Enter your name and a password to create your account.', 'name');
      const [created] = await tx.insert(users).values({ email: inv.email, name: who.name, passwordHash }).returning({ id: users.id });
      userId = created.id;
    }
    const [current] = await tx.select({ role: memberships.role }).from(memberships).where(and(eq(memberships.venueId, inv.venueId), eq(memberships.userId, userId))).limit(1);
    // Accepting never demotes: a manager who clicks an old viewer invitation stays manager.
    if (!current) await grantMembership(tx, inv.venueId, userId, inv.role);
    await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, inv.id));
    await recordAudit(tx, { venueId: inv.venueId, actorId: userId, action: 'invitation.accept', targetType: 'invitation', targetId: inv.id, detail: { email: inv.email, role: inv.role, newAccount: !account } });
    // A new person leaves this page signed in; an existing account signed in already.
    if (!account) await recordSignIn(tx, userId, 'invitation');
    return { userId, venueSlug: row.venueSlug };
  });
}
