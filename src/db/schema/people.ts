import { index, integer, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { ROLES } from '~/lib/permissions';
import { createdAt, id } from './columns';
import { users } from './users';
import { venues } from './venues';

/**
 * A link that lets a touring crew read one venue's advance sheet without an account. Only the
 * SHA-256 of the token is kept; the link itself is shown once, when the pass is created.
 */
export const guestPasses = sqliteTable(
  'guest_passes',
  {
    id: id(),
    venueId: text('venue_id')
      .notNull()
      .references(() => venues.id, { onDelete: 'cascade' }),
    label: text('label').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
    lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
    useCount: integer('use_count').notNull().default(0),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('guest_passes_venue_idx').on(t.venueId)],
);

/** An invitation to join a venue with a role; the e-mailed token is kept only as its hash. */
export const invitations = sqliteTable(
  'invitations',
  {
    id: id(),
    venueId: text('venue_id')
      .notNull()
      .references(() => venues.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: text('role', { enum: ROLES }).notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
    invitedBy: text('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('invitations_venue_idx').on(t.venueId)],
);

/**
 * Failure counters for sign-in and the token links, in the database rather than process memory
 * so that several server processes share one count and a restart does not reset it.
 */
export const throttleCounters = sqliteTable('throttle_counters', {
  key: text('key').primaryKey(),
  count: integer('count').notNull().default(0),
  /** End of the current window, ms since the epoch. */
  resetAt: integer('reset_at').notNull(),
});
