import { index, integer, primaryKey, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ROLES } from '~/lib/permissions';
import { createdAt, id } from './columns';
import { users } from './users';

export const venues = sqliteTable('venues', {
  id: id(),
  slug: text('slug').notNull().unique(),
  name: text('name').notNull(),
  town: text('town'),
  /** Power and rigging pages warn on the advance sheet when their last on-site check is older. */
  checkStaleMonths: integer('check_stale_months').notNull().default(6),
  createdAt: createdAt(),
});

export const memberships = sqliteTable(
  'memberships',
  {
    venueId: text('venue_id')
      .notNull()
      .references(() => venues.id, { onDelete: 'cascade' }),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    // Exactly the roles the permission policy knows.
    role: text('role', { enum: ROLES }).notNull(),
    /** The previous visit's start, kept for "changed since your last visit". */
    lastVisitAt: integer('last_visit_at', { mode: 'timestamp_ms' }),
    /** The time this visit began; moved to lastVisitAt when a new visit starts. */
    visitStartedAt: integer('visit_started_at', { mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.venueId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

/** A venue's own list of sections; pages hang off one of them, in the order of `position`. */
export const sections = sqliteTable(
  'sections',
  {
    id: id(),
    venueId: text('venue_id')
      .notNull()
      .references(() => venues.id, { onDelete: 'cascade' }),
    slug: text('slug').notNull(),
    title: text('title').notNull(),
    position: integer('position').notNull().default(0),
  },
  (t) => [uniqueIndex('sections_venue_slug_idx').on(t.venueId, t.slug)],
);
