import { index, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { createdAt, id } from './columns';
import { users } from './users';
import { venues } from './venues';

/** Who did what, when. Rows are only ever inserted. */
export const auditEvents = sqliteTable(
  'audit_events',
  {
    id: id(),
    venueId: text('venue_id').references(() => venues.id, { onDelete: 'cascade' }),
    actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    targetType: text('target_type').notNull(),
    targetId: text('target_id'),
    detail: text('detail', { mode: 'json' }).$type<Record<string, unknown>>(),
    createdAt: createdAt(),
  },
  (t) => [index('audit_venue_time_idx').on(t.venueId, t.createdAt)],
);
