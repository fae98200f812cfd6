import { and, asc, eq, isNull, sql } from 'drizzle-orm';
import { memberships, pages, sections, venues } from '~/db/schema';
import type { VenueCreate, VenueUpdate } from '~/lib/schemas/venue';
import { DEFAULT_SECTIONS } from '~/lib/default-sections';
import { slugify } from '~/lib/slug';
import { recordAudit } from './audit';
import type { Db } from '~/db/client';
import { getDb, writeTx } from './db';
import { readableVenueCondition } from './guard';
import { HttpError } from './http';
import type { SessionUser } from './session';

/** Venues this person may read, with their role there (admins see all, role null where not a member). */
export async function listVenuesFor(user: SessionUser) {
  const db = await getDb();
  const rows = await db
    .select({
      id: venues.id,
      slug: venues.slug,
      name: venues.name,
      town: venues.town,
      role: memberships.role,
      pageCount: sql<number>`(select count(*) from ${pages} where ${pages.venueId} = ${venues.id} and ${pages.archivedAt} is null)`,
    })
    .from(venues)
    .leftJoin(memberships, sql`${memberships.venueId} = ${venues.id} and ${memberships.userId} = ${user.id}`)
    .where(readableVenueCondition(user, venues.id))
    .orderBy(asc(venues.name));
  return rows;
}

export async function createVenue(input: VenueCreate, actor: SessionUser) {
  const slug = input.slug ?? slugify(input.name);
  if (!slug) throw new HttpError(400, 'The name gives no usable slug; add a slug of letters and digits.', 'slug');
  return writeTx(async (tx) => {
    const taken = await tx.select({ id: venues.id }).from(venues).where(eq(venues.slug, slug)).limit(1);
    if (taken.length) throw new HttpError(409, `A venue with the slug "${slug}" exists already; choose another slug.`, 'slug');
    const [venue] = await tx.insert(venues).values({ name: input.name, town: input.town ?? null, slug }).returning();
    await tx.insert(sections).values(DEFAULT_SECTIONS.map((s, position) => ({ ...s, position, venueId: venue.id })));
    await recordAudit(tx, { venueId: venue.id, actorId: actor.id, action: 'venue.create', targetType: 'venue', targetId: venue.id, detail: { name: venue.name } });
    return venue;
  });
}

/** Built once: the read view asks for the sections on every read by an engineer. */
let sectionsQuery: ReturnType<typeof buildSectionsQuery> | undefined;

function buildSectionsQuery(db: Db) {
  return db.select().from(sections).where(eq(sections.venueId, sql.placeholder('venueId'))).orderBy(asc(sections.position), asc(sections.title)).prepare();
}

export async function listSections(venueId: string) {
  sectionsQuery ??= buildSectionsQuery(await getDb());
  return sectionsQuery.all({ venueId });
}

/** Live pages of a venue with their section, for GET /api/venues/:venue/pages and the files screen. */
export async function listPages(venueId: string) {
  const db = await getDb();
  return db
    .select({
      id: pages.id,
      slug: pages.slug,
      title: pages.title,
      section: sections.slug,
      sectionTitle: sections.title,
      currentRevision: pages.currentRevision,
      updatedAt: pages.updatedAt,
      inAdvance: pages.inAdvance,
    })
    .from(pages)
    .innerJoin(sections, eq(sections.id, pages.sectionId))
    .where(and(eq(pages.venueId, venueId), isNull(pages.archivedAt)))
    .orderBy(asc(sections.position), asc(pages.title));
}

/**
 * Changes a venue's name, town or check interval, audited with what it was. The slug stays, so
 * every link and bookmark keeps working; a field left out is left as it is.
 */
export async function updateVenue(venueId: string, input: VenueUpdate, actor: SessionUser) {
  return writeTx(async (tx) => {
    const [before] = await tx.select().from(venues).where(eq(venues.id, venueId)).limit(1);
    if (!before) throw new HttpError(404, 'There is no such venue, or you are not a member of it.');
    const changes: Partial<typeof venues.$inferInsert> = {};
    if (input.name !== undefined && input.name !== before.name) changes.name = input.name;
    if (input.town !== undefined && (input.town || null) !== before.town) changes.town = input.town || null;
    if (input.checkStaleMonths !== undefined && input.checkStaleMonths !== before.checkStaleMonths) changes.checkStaleMonths = input.checkStaleMonths;
    if (Object.keys(changes).length === 0) return before;
    const [after] = await tx.update(venues).set(changes).where(eq(venues.id, venueId)).returning();
    const detail = Object.fromEntries(Object.keys(changes).map((k) => [k, { from: before[k as keyof typeof before], to: after[k as keyof typeof after] }]));
    await recordAudit(tx, { venueId, actorId: actor.id, action: 'venue.update', targetType: 'venue', targetId: venueId, detail });
    return after;
  });
}
