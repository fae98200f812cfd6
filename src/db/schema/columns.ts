import { integer, text } from 'drizzle-orm/sqlite-core';

/** Random text ids: unguessable, so an id in a URL never hints at how many rows exist. */
export const id = () =>
  text('id')
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());

/** Milliseconds since the epoch; set by the application so tests can reason about order. */
export const createdAt = () =>
  integer('created_at', { mode: 'timestamp_ms' })
    .notNull()
    .$defaultFn(() => new Date());
