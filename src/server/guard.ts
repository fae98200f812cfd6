import { and, eq, sql } from 'drizzle-orm';
import type { Db } from '~/db/client';
import { memberships, venues } from '~/db/schema';
import { can, refusalMessage, type Action, type Role, type VenueAccess } from '~/lib/permissions';
import { getDb } from './db';
import { HttpError } from './http';
import type { SessionUser } from './session';

/**
 * The server side of the permission policy, used by every route and page in the same order:
 * who are you (401) → does the venue exist for you (404) → may you (403).
 */

export function requireUser(user: SessionUser | null | undefined): SessionUser {
  if (!user) throw new HttpError(401, 'Sign in first; this needs an account.');
  return user;
}

export interface VenueRow {
  id: string;
  slug: string;
  name: string;
  town: string | null;
}

export interface VenueContext {
  venue: VenueRow;
  access: VenueAccess;
}

const NOT_FOUND = 'There is no such venue, or you are not a member of it.';

/** The venue and this person's role there in one prepared query per database handle. */
const venueQueries = new WeakMap<Db, ReturnType<typeof prepareVenueQuery>>();
function prepareVenueQuery(db: Db) {
  return db
    .select({ id: venues.id, slug: venues.slug, name: venues.name, town: venues.town, role: memberships.role })
    .from(venues)
    .leftJoin(memberships, and(eq(memberships.venueId, venues.id), eq(memberships.userId, sql.placeholder('userId'))))
    .where(eq(venues.slug, sql.placeholder('slug')))
    .limit(1)
    .prepare();
}

/**
 * The venue as this person may see it. A venue they are not a member of answers exactly like
 * one that does not exist, so a URL never reveals which venues exist.
 */
export async function loadVenue(user: SessionUser, venueSlug: string | undefined): Promise<VenueContext> {
  if (!venueSlug || venueSlug.length > 100) throw new HttpError(404, NOT_FOUND);
  const db = await getDb();
  let query = venueQueries.get(db);
  if (!query) venueQueries.set(db, (query = prepareVenueQuery(db)));
  const rows = await query.all({ slug: venueSlug, userId: user.id });
  const row = rows[0];
  if (!row || (!row.role && !user.isAdmin)) throw new HttpError(404, NOT_FOUND);
  const { role, ...venue } = row;
  return { venue, access: { role: (role as Role | null) ?? null } };
}

export function requirePermission(user: SessionUser, action: Action, access?: VenueAccess | null): void {
  if (!can(user, action, access)) throw new HttpError(403, refusalMessage(action, access));
}

/** 401 → 404 → 403 in one call, for the common case of a venue-scoped action. */
export async function guardVenue(user: SessionUser | null | undefined, venueSlug: string | undefined, action: Action): Promise<VenueContext & { user: SessionUser }> {
  const signedIn = requireUser(user);
  const ctx = await loadVenue(signedIn, venueSlug);
  requirePermission(signedIn, action, ctx.access);
  return { ...ctx, user: signedIn };
}
