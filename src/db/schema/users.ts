import { integer, primaryKey, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { createdAt, id } from './columns';

export const users = sqliteTable('users', {
  id: id(),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  passwordHash: text('password_hash'),
  isAdmin: integer('is_admin', { mode: 'boolean' }).notNull().default(false),
  /**
   * Sessions carry the epoch they were issued under; raising it (sign-out, password change,
   * removal, "sign out everywhere") ends every open session of this person at the next request.
   */
  sessionEpoch: integer('session_epoch').notNull().default(0),
  createdAt: createdAt(),
});

/** One-time tokens for sign-in links sent by e-mail (the shape Auth.js's e-mail providers use). */
export const verificationTokens = sqliteTable(
  'verification_tokens',
  {
    identifier: text('identifier').notNull(),
    token: text('token').notNull(),
    expires: integer('expires', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.identifier, t.token] })],
);
