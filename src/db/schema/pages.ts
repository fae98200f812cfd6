import { index, integer, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { createdAt, id } from './columns';
import { users } from './users';
import { sections, venues } from './venues';

export const pages = sqliteTable(
  'pages',
  {
    id: id(),
    venueId: text('venue_id')
      .notNull()
      .references(() => venues.id, { onDelete: 'cascade' }),
    sectionId: text('section_id')
      .notNull()
      .references(() => sections.id),
    slug: text('slug').notNull(),
    title: text('title').notNull(),
    inAdvance: integer('in_advance', { mode: 'boolean' }).notNull().default(false),
    /** Order on the advance sheet (lowest first); meaningful only while inAdvance. */
    advancePosition: integer('advance_position').notNull().default(0),
    /** "Checked on site": who confirmed the page against the room, and when. No revision. */
    checkedAt: integer('checked_at', { mode: 'timestamp_ms' }),
    checkedBy: text('checked_by').references(() => users.id, { onDelete: 'set null' }),
    /** Hidden from the book and the advance sheet, history kept; null while live. */
    archivedAt: integer('archived_at', { mode: 'timestamp_ms' }),
    /** Number of the revision readers see; the compare-and-set on save checks this column. */
    currentRevision: integer('current_revision').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [
    uniqueIndex('pages_venue_slug_idx').on(t.venueId, t.slug),
    index('pages_section_idx').on(t.sectionId),
    // The venue home: each section's first pages by title, and the pages changed most recently.
    index('pages_venue_section_title_idx').on(t.venueId, t.sectionId, t.title, t.slug),
    index('pages_venue_updated_idx').on(t.venueId, t.updatedAt),
  ],
);

export const revisions = sqliteTable(
  'revisions',
  {
    id: id(),
    pageId: text('page_id')
      .notNull()
      .references(() => pages.id, { onDelete: 'cascade' }),
    number: integer('number').notNull(),
    /** The ProseMirror document as JSON text, as the server validated it. */
    doc: text('doc').notNull(),
    plainText: text('plain_text').notNull(),
    summary: text('summary').notNull().default(''),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    /** Set when this revision was made by restoring an older one. */
    restoredFrom: integer('restored_from'),
    /** The save's Idempotency-Key header, so a retry of a save that landed finds its revision. */
    idempotencyKey: text('idempotency_key'),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('revisions_page_number_idx').on(t.pageId, t.number), uniqueIndex('revisions_page_idempotency_idx').on(t.pageId, t.idempotencyKey)],
);
