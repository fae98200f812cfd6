import { and, eq, sql, type SQL } from 'drizzle-orm';
import { memberships, venues } from '~/db/schema';
import { can, isGuest, isMember, readScope, refusalMessage, type Action, type Guest, type Principal, type Role, type VenueAccess } from '~/lib/permissions';
import type { Db } from '~/db/client';
import { getDb } from './db';
import { HttpError } from './http';
import type { SessionUser } from './session';

/**
 * The server side of the permission policy, used by every route and page in the same order:
 * who are you (401) → does the venue exist for you (404) → may you (403).
 *
 * A guest (guest pass) is never told more than a stranger would be: everything outside the
 * advance sheet of their venue answers 404, not 401 or 403.
 */

/** What middleware puts on `locals`: the member or null, and the guest or null. */
export type RequestPrincipal = SessionUser | Guest | null | undefined;

const NOTHING_HERE = 'There is nothing at this address.';

export function requireUser(principal: RequestPrincipal): SessionUser {
  if (isGuest(principal)) throw new HttpError(404, NOTHING_HERE);
  if (!principal) throw new HttpError(401, 'Sign in first; this needs an account.');
  return principal as SessionUser;
}

/**
 * The rule of readScope() as a SQL condition on a venue-id column: the one filter every list
 * and search uses, so "which venues may this person read" is decided in one place.
 */
export function readableVenueCondition(principal: Principal | undefined, venueIdColumn: SQL | typeof venues.id): SQL {
  const scope = readScope(principal);
  switch (scope.kind) {
    case 'all':
      return sql`1 = 1`;
    case 'memberships':
      return sql`${venueIdColumn} IN (SELECT m.venue_id FROM memberships m WHERE m.user_id = ${scope.userId})`;
    case 'advance-of':
    case 'none':
      // A guest reads the advance sheet through its own route, never through lists or search.
      return sql`1 = 0`;
  }
}

export interface VenueRow {
  id: string;
  slug: string;
  name: string;
  town: string | null;
  checkStaleMonths: number;
}

export interface VenueContext {
  venue: VenueRow;
  access: VenueAccess;
  /** When the member's current visit began (null before the first); absent for non-members. */
  visitStartedAt?: Date | null;
}

const NOT_FOUND = 'There is no such venue, or you are not a member of it.';

/**
 * The venue as this principal may see it. A venue they are not a member of answers exactly like
 * one that does not exist, so a URL never reveals which venues exist. A guest sees only the
 * venue of their pass.
 */
export async function loadVenue(principal: SessionUser | Guest, venueSlug: string | undefined): Promise<VenueContext> {
  if (!venueSlug || venueSlug.length > 100) throw new HttpError(404, NOT_FOUND);
  venueQuery ??= buildVenueQuery(await getDb());
  const userId = isMember(principal) ? principal.id : '';
  const row = (await venueQuery.all({ userId, slug: venueSlug }))[0];
  if (!row) throw new HttpError(404, NOT_FOUND);
  const { role, visitStartedAt, ...venue } = row;
  if (isGuest(principal)) {
    if (principal.venueId !== venue.id) throw new HttpError(404, NOT_FOUND);
    return { venue, access: { role: null, venueId: venue.id } };
  }
  if (!role && !principal.isAdmin) throw new HttpError(404, NOT_FOUND);
  return { venue, access: { role: (role as Role | null) ?? null, venueId: venue.id }, ...(role ? { visitStartedAt } : {}) };
}

/** Built once: every venue-scoped request runs it. The member's visit comes along for noteVisit. */
let venueQuery: ReturnType<typeof buildVenueQuery> | undefined;

function buildVenueQuery(db: Db) {
  return db
    .select({
      id: venues.id,
      slug: venues.slug,
      name: venues.name,
      town: venues.town,
      checkStaleMonths: venues.checkStaleMonths,
      role: memberships.role,
      visitStartedAt: memberships.visitStartedAt,
    })
    .from(venues)
    .leftJoin(memberships, and(eq(memberships.venueId, venues.id), eq(memberships.userId, sql.placeholder('userId'))))
    .where(eq(venues.slug, sql.placeholder('slug')))
    .limit(1)
    .prepare();
}

export function requirePermission(principal: Principal, action: Action, access?: VenueAccess | null): void {
  if (can(principal, action, access)) return;
  if (isGuest(principal)) throw new HttpError(404, NOTHING_HERE);
  throw new HttpError(403, refusalMessage(action, access));
}

/** 401 → 404 → 403 for a signed-in member's venue-scoped action; guests get 404. */
export async function guardVenue(principal: RequestPrincipal, venueSlug: string | undefined, action: Action): Promise<VenueContext & { user: SessionUser }> {
  const signedIn = requireUser(principal);
  const ctx = await loadVenue(signedIn, venueSlug);
  requirePermission(signedIn, action, ctx.access);
  return { ...ctx, user: signedIn };
}

/**
 * The one guard that admits guests: reading the advance sheet (and the changes on it) of a
 * venue, as a member with `advance.read` or as the holder of that venue's pass.
 */
export async function guardAdvanceReader(principal: RequestPrincipal, venueSlug: string | undefined): Promise<VenueContext & { principal: SessionUser | Guest }> {
  if (!principal) throw new HttpError(401, 'Sign in first, or open the guest link you were sent.');
  const ctx = await loadVenue(principal, venueSlug);
  requirePermission(principal, 'advance.read', ctx.access);
  return { ...ctx, principal };
}
