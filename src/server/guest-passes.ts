import { and, desc, eq, sql } from 'drizzle-orm';
import { guestPasses } from '~/db/schema';
import type { Guest } from '~/lib/permissions';
import { defaultPassExpiry, passExpiryProblem } from '~/lib/schemas/people';
import { recordAudit } from './audit';
import { getDb, writeTx } from './db';
import { HttpError } from './http';
import { hashesEqual, newSecretToken, SECRET_TOKEN, tokenHash } from './secret-token';
import type { SessionUser } from './session';

export const PASS_NOT_FOUND = 'There is no such guest pass in this venue.';

export interface PassInput {
  label: string;
  showDate?: string;
  expiresAt?: string;
}

/** Creates a pass and returns its link, which is never stored and cannot be shown again. */
export async function createPass(venueId: string, input: PassInput, actor: SessionUser) {
  const now = new Date();
  const expiresAt = input.expiresAt ? new Date(input.expiresAt) : defaultPassExpiry(now, input.showDate);
  const problem = passExpiryProblem(now, expiresAt);
  if (problem) throw new HttpError(400, problem, input.expiresAt ? 'expiresAt' : 'showDate');
  const token = newSecretToken();
  return writeTx(async (tx) => {
    const [pass] = await tx.insert(guestPasses).values({ venueId, label: input.label, tokenHash: tokenHash(token), expiresAt, createdBy: actor.id }).returning();
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'pass.create', targetType: 'pass', targetId: pass.id, detail: { label: pass.label, expiresAt: expiresAt.toISOString() } });
    return { id: pass.id, label: pass.label, expiresAt, url: `/advance/${token}` };
  });
}

export async function listPasses(venueId: string) {
  const db = await getDb();
  const rows = await db.select().from(guestPasses).where(eq(guestPasses.venueId, venueId)).orderBy(desc(guestPasses.createdAt));
  const now = Date.now();
  return rows.map((p) => ({
    id: p.id,
    label: p.label,
    expiresAt: p.expiresAt,
    createdAt: p.createdAt,
    revokedAt: p.revokedAt,
    lastUsedAt: p.lastUsedAt,
    useCount: p.useCount,
    state: p.revokedAt ? ('revoked' as const) : p.expiresAt.getTime() <= now ? ('expired' as const) : ('active' as const),
  }));
}

export async function revokePass(venueId: string, passId: string | undefined, actor: SessionUser): Promise<void> {
  if (!passId || passId.length > 100) throw new HttpError(404, PASS_NOT_FOUND);
  await writeTx(async (tx) => {
    const [pass] = await tx.select().from(guestPasses).where(and(eq(guestPasses.id, passId), eq(guestPasses.venueId, venueId))).limit(1);
    if (!pass) throw new HttpError(404, PASS_NOT_FOUND);
    if (pass.revokedAt) return;
    await tx.update(guestPasses).set({ revokedAt: new Date() }).where(eq(guestPasses.id, pass.id));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'pass.revoke', targetType: 'pass', targetId: pass.id, detail: { label: pass.label } });
  });
}

export interface ResolvedPass extends Guest {
  label: string;
  expiresAt: Date;
}

/**
 * What a token opens: the live pass, 'dead' for a real pass that expired or was revoked (a crew
 * member with an old link is not guessing), or null for a token that matches nothing. The row is found
 * by the token's SHA-256, so the lookup says nothing about how close a wrong token was; the
 * hashes are compared again in constant time before the pass is trusted.
 */
export async function resolvePass(token: string | undefined): Promise<ResolvedPass | 'dead' | null> {
  if (!token || !SECRET_TOKEN.test(token)) return null;
  const hash = tokenHash(token);
  const db = await getDb();
  const [pass] = await db.select().from(guestPasses).where(eq(guestPasses.tokenHash, hash)).limit(1);
  if (!pass || !hashesEqual(pass.tokenHash, hash)) return null;
  if (pass.revokedAt || pass.expiresAt.getTime() <= Date.now()) return 'dead';
  return { guestPassId: pass.id, venueId: pass.venueId, label: pass.label, expiresAt: pass.expiresAt };
}

const USE_AUDIT_GAP_MS = 60 * 60 * 1000;

/** Counts one opening of the sheet; the audit log gets the first use and then at most one an hour. */
export async function recordPassUse(passId: string): Promise<void> {
  await writeTx(async (tx) => {
    const [pass] = await tx.select().from(guestPasses).where(eq(guestPasses.id, passId)).limit(1);
    if (!pass) return;
    const now = new Date();
    await tx.update(guestPasses).set({ lastUsedAt: now, useCount: sql`${guestPasses.useCount} + 1` }).where(eq(guestPasses.id, passId));
    if (!pass.lastUsedAt || now.getTime() - pass.lastUsedAt.getTime() > USE_AUDIT_GAP_MS) {
      await recordAudit(tx, { venueId: pass.venueId, actorId: null, action: 'pass.use', targetType: 'pass', targetId: pass.id, detail: { label: pass.label } });
    }
  });
}
