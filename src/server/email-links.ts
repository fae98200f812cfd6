import { and, eq, like, lt } from 'drizzle-orm';
import { users, verificationTokens } from '~/db/schema';
import { recordSignIn } from './audit';
import { blockedFor, countHit } from './auth/throttle';
import { mailPerAddress, mailPerRecipient } from './auth/rate-limit';
import { hashPassword } from './auth/password';
import { getDb, writeTx, type Reader } from './db';
import { HttpError } from './http';
import { publicOrigin } from './invitations';
import { sendMail } from './mail/mailer';
import { hashesEqual, newSecretToken, SECRET_TOKEN, tokenHash } from './secret-token';
import { endSessionsOf } from './session';

/**
 * Links sent by e-mail that stand in for a password: "e-mail me a sign-in link" and "forgot
 * password". The same machinery as invitations (256-bit token, only its SHA-256 stored, used
 * once), kept in Auth.js's verification-token table: `identifier` is `<purpose>:<user id>`,
 * `token` the hash.
 */
export type LinkPurpose = 'signin' | 'reset';

export const LINK_MINUTES = 30;

/** Said whether or not an account uses the address, so the form cannot be used to find accounts. */
export const LINK_SENT = `If an account uses that address, a link is on its way to it. It works once, within ${LINK_MINUTES} minutes.`;

const PATHS: Record<LinkPurpose, string> = { signin: '/signin/link/', reset: '/signin/reset/' };

const MAIL: Record<LinkPurpose, { subject: string; lead: string }> = {
  signin: { subject: 'Your Throwline sign-in link', lead: 'Open this link to sign in to Throwline:' },
  reset: { subject: 'Choose a new Throwline password', lead: 'Open this link to choose a new password for Throwline:' },
};

/**
 * Sends a link to `email` when an account uses it. Limited per sender address and per recipient
 * (the counts live in the database, shared by every server process); the recipient is counted
 * whether or not the account exists, so the limit answers alike for both.
 */
export async function requestEmailLink(purpose: LinkPurpose, email: string, senderAddress: string, request: Request): Promise<void> {
  if ((await blockedFor(mailPerAddress, senderAddress)) > 0 || (await blockedFor(mailPerRecipient, email)) > 0) {
    throw new HttpError(429, 'Several links were asked for from here or for this address in the last 15 minutes. Wait a while, then use the newest message you received.');
  }
  await countHit(mailPerAddress, senderAddress);
  await countHit(mailPerRecipient, email);
  const db = await getDb();
  const account = await db.query.users.findFirst({ where: eq(users.email, email), columns: { id: true, email: true } });
  if (!account) return;
  const token = newSecretToken();
  const identifier = `${purpose}:${account.id}`;
  await writeTx(async (tx) => {
    await tx.delete(verificationTokens).where(lt(verificationTokens.expires, new Date()));
    // Only the newest link of each kind works.
    await tx.delete(verificationTokens).where(eq(verificationTokens.identifier, identifier));
    await tx.insert(verificationTokens).values({ identifier, token: tokenHash(token), expires: new Date(Date.now() + LINK_MINUTES * 60 * 1000) });
  });
  const link = `${publicOrigin(request)}${PATHS[purpose]}${token}`;
  const { subject, lead } = MAIL[purpose];
  // Not awaited: an address with an account must not answer measurably later than one without.
  sendMail({
    to: account.email,
    subject,
    text: [lead, link, '', `The link works once, within ${LINK_MINUTES} minutes.`, 'If you did not ask for it, ignore this message; nothing changes.'].join('\n'),
  }).catch((err) => console.error(`[throwline] ${purpose} link mail failed`, err));
}

interface LinkRow {
  identifier: string;
  token: string;
  expires: Date;
}

function liveFor(purpose: LinkPurpose, row: LinkRow | undefined, hash: string): string | null {
  if (!row || !hashesEqual(row.token, hash) || row.expires.getTime() <= Date.now()) return null;
  return row.identifier.slice(purpose.length + 1);
}

async function findRow(reader: Reader, purpose: LinkPurpose, hash: string): Promise<LinkRow | undefined> {
  const [row] = await reader
    .select()
    .from(verificationTokens)
    .where(and(eq(verificationTokens.token, hash), like(verificationTokens.identifier, `${purpose}:%`)))
    .limit(1);
  return row;
}

/** The account a live link opens (without using it), or null for a forged, used or expired one. */
export async function peekEmailLink(purpose: LinkPurpose, token: string | undefined): Promise<{ userId: string; email: string } | null> {
  if (!token || !SECRET_TOKEN.test(token)) return null;
  const db = await getDb();
  const userId = liveFor(purpose, await findRow(db, purpose, tokenHash(token)), tokenHash(token));
  if (!userId) return null;
  const account = await db.query.users.findFirst({ where: eq(users.id, userId), columns: { id: true, email: true } });
  return account ? { userId: account.id, email: account.email } : null;
}

const DEAD_LINK = 'This link has been used or has expired. Ask for a new one on the sign-in page.';

/**
 * Uses a link once, inside one write: the row is deleted in the same transaction that acts on
 * it, so two clicks make one sign-in. A reset sets the new password and raises the session
 * epoch, which signs out every other session of the person.
 */
export async function spendEmailLink(purpose: LinkPurpose, token: string, newPassword?: string): Promise<string> {
  if (!SECRET_TOKEN.test(token)) throw new HttpError(404, DEAD_LINK);
  const hash = tokenHash(token);
  const passwordHash = purpose === 'reset' && newPassword ? await hashPassword(newPassword) : null;
  return writeTx(async (tx) => {
    const row = await findRow(tx, purpose, hash);
    const userId = liveFor(purpose, row, hash);
    if (!row || !userId) throw new HttpError(404, DEAD_LINK);
    const [account] = await tx.select({ id: users.id }).from(users).where(eq(users.id, userId)).limit(1);
    if (!account) throw new HttpError(404, DEAD_LINK);
    await tx.delete(verificationTokens).where(and(eq(verificationTokens.identifier, row.identifier), eq(verificationTokens.token, row.token)));
    if (purpose === 'reset') {
      if (!passwordHash) throw new HttpError(400, 'Choose a password of at least 10 characters.', 'password');
      await tx.update(users).set({ passwordHash }).where(eq(users.id, userId));
      await endSessionsOf(tx, userId);
      // A sign-in link asked for before the reset must not outlive it.
      await tx.delete(verificationTokens).where(eq(verificationTokens.identifier, `signin:${userId}`));
    }
    await recordSignIn(tx, userId, purpose === 'reset' ? 'password-reset' : 'email-link');
    return userId;
  });
}
