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

interface DecodedSession {
  sub: string;
  /** When this session stops being valid, in ms: the sooner of the token's exp and 12 h after sign-in. */
  validUntilMs: number;
  /** The person's session epoch when the cookie was issued (see endSessionsOf). */
  epoch: number;
}

/**
 * Decrypting the session cookie (JWE) costs more than the rest of a cached page read. A cookie's
 * contents never change, so its decoded subject and end are kept, keyed by the cookie text; the
 * end is checked again on every use. Only the decoding is saved: the person is still read from
 * the database on every request, so a removed account or changed admin flag applies at once.
 */
const MAX_DECODED = 2000;
const decoded = new Map<string, DecodedSession>();

function cookieValue(header: string, name: string): string | undefined {
  // Auth.js splits large tokens into name.0, name.1…; those are rare, so leave them to getToken.
  for (const part of header.split(';')) {
    const eqAt = part.indexOf('=');
    if (eqAt > 0 && part.slice(0, eqAt).trim() === name) return part.slice(eqAt + 1).trim();
  }
  return undefined;
}

async function decodeSession(request: Request, cookieName: string, secure: boolean): Promise<DecodedSession | null> {
  const raw = cookieValue(request.headers.get('cookie') ?? '', cookieName);
  const known = raw ? decoded.get(raw) : undefined;
  if (known) return known.validUntilMs > Date.now() ? known : null;
  let token: Record<string, unknown> | null;
  try {
    token = await getToken({ req: request, secret: getConfig().AUTH_SECRET, secureCookie: secure, salt: cookieName });
  } catch {
    return null;
  }
  if (!token || typeof token.sub !== 'string') return null;
  const authTime = Number(token.authTime);
  if (!Number.isFinite(authTime)) return null;
  const exp = Number(token.exp);
  const validUntilMs = Math.min(authTime + SESSION_LIFETIME_SECONDS * 1000, Number.isFinite(exp) ? exp * 1000 : Infinity);
  const session = { sub: token.sub, validUntilMs, epoch: Number(token.epoch ?? 0) };
  if (raw) {
    if (decoded.size >= MAX_DECODED) decoded.delete(decoded.keys().next().value!);
    decoded.set(raw, session);
  }
  return validUntilMs > Date.now() ? session : null;
}

/** Built once: every signed-in request runs it. */
let sessionUserQuery: ReturnType<typeof buildSessionUserQuery> | undefined;
type BuiltDb = Awaited<ReturnType<typeof getDb>>;
function buildSessionUserQuery(db: BuiltDb) {
  return db
    .select({ id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin, sessionEpoch: users.sessionEpoch })
    .from(users)
    .where(eq(users.id, sql.placeholder('id')))
    .limit(1)
    .prepare();
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
  const session = await decodeSession(request, cookieName, secure);
  if (!session) return null;
  sessionUserQuery ??= buildSessionUserQuery(await getDb());
  const row = (await sessionUserQuery.all({ id: session.sub }))[0];
  if (!row) return null;
  // A cookie issued before the last sign-out, password change or removal is refused here.
  if (session.epoch !== row.sessionEpoch) return null;
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
