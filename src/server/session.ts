import { getToken } from '@auth/core/jwt';
import { eq } from 'drizzle-orm';
import { users } from '~/db/schema';
import { getConfig } from './config';
import { getDb } from './db';

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
    columns: { id: true, email: true, name: true, isAdmin: true },
  });
  return row ?? null;
}
