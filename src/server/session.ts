import { encode, getToken } from '@auth/core/jwt';
import { eq, sql } from 'drizzle-orm';
import { users } from '~/db/schema';
import { getConfig } from './config';
import { getDb, writeTx, type Tx } from './db';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** Sessions end 12 hours after sign-in, however active the person is. */
export const SESSION_LIFETIME_SECONDS = 12 * 60 * 60;

export function sessionCookieName(secure: boolean): string {
  return secure ? '__Secure-authjs.session-token' : 'authjs.session-token';
}

/**
 * Reads the Auth.js session cookie directly (decrypting the JWT) rather than through a full
 * Auth.js request per page, and loads the person fresh from the database so a removed account
 * or a changed admin flag takes effect on the next request.
 */
export async function readSessionUser(request: Request): Promise<SessionUser | null> {
  const secure = new URL(request.url).protocol === 'https:';
  const cookieName = sessionCookieName(secure);
  if (!request.headers.get('cookie')?.includes(cookieName)) return null;
  let token: Record<string, unknown> | null;
  try {
    token = await getToken({ req: request, secret: getConfig().AUTH_SECRET, secureCookie: secure, salt: cookieName });
  } catch {
    return null;
  }
  if (!token || typeof token.sub !== 'string') return null;
  const authTime = Number(token.authTime);
  if (!Number.isFinite(authTime) || Date.now() - authTime > SESSION_LIFETIME_SECONDS * 1000) return null;
  const db = await getDb();
  const row = await db.query.users.findFirst({
    where: eq(users.id, token.sub),
    columns: { id: true, email: true, name: true, isAdmin: true, sessionEpoch: true },
  });
  if (!row) return null;
  // A cookie issued before the last sign-out, password change or removal is refused here.
  if (Number(token.epoch ?? 0) !== row.sessionEpoch) return null;
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin };
}

/** The epoch a new session of this person is issued under. */
export async function currentSessionEpoch(userId: string): Promise<number> {
  const db = await getDb();
  const row = await db.query.users.findFirst({ where: eq(users.id, userId), columns: { sessionEpoch: true } });
  return row?.sessionEpoch ?? 0;
}

/** Ends every open session of this person at their next request. Inside the caller's write. */
export async function endSessionsOf(tx: Tx, userId: string): Promise<void> {
  await tx.update(users).set({ sessionEpoch: sql`${users.sessionEpoch} + 1` }).where(eq(users.id, userId));
}

export async function endAllSessions(userId: string): Promise<void> {
  await writeTx((tx) => endSessionsOf(tx, userId));
}

/**
 * A session cookie in exactly the form Auth.js writes it (same JWT encryption, salt, claims and
 * lifetime), for sign-ins that end on our own routes: an accepted invitation or an e-mailed link.
 */
export async function sessionCookieFor(userId: string, request: Request): Promise<string> {
  const secure = new URL(request.url).protocol === 'https:';
  const name = sessionCookieName(secure);
  const value = await encode({
    token: { sub: userId, authTime: Date.now(), epoch: await currentSessionEpoch(userId) },
    secret: getConfig().AUTH_SECRET,
    salt: name,
    maxAge: SESSION_LIFETIME_SECONDS,
  });
  return `${name}=${value}; Path=/; HttpOnly; SameSite=Lax; Max-Age=${SESSION_LIFETIME_SECONDS}${secure ? '; Secure' : ''}`;
}
