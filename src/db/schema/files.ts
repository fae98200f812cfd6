import { index, integer, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { createdAt, id } from './columns';
import { pages } from './pages';
import { users } from './users';
import { venues } from './venues';

export const files = sqliteTable(
  'files',
  {
    id: id(),
    venueId: text('venue_id')
      .notNull()
      .references(() => venues.id, { onDelete: 'cascade' }),
    pageId: text('page_id').references(() => pages.id, { onDelete: 'set null' }),
    /** Name on disk under UPLOADS_DIR; derived from the content, never from the uploaded name. */
    storageName: text('storage_name').notNull(),
    /** Display-size and thumbnail renditions (images only). */
    displayName: text('display_name'),
    thumbName: text('thumb_name'),
    /** The uploader's file name, cleaned, kept only as text to show. */
    originalName: text('original_name').notNull(),
    mime: text('mime').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    width: integer('width'),
    height: integer('height'),
    caption: text('caption').notNull().default(''),
    uploadedBy: text('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    /** Set by the start-up sweep when the row's file is gone from disk. */
    missing: integer('missing', { mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
  },
  (t) => [index('files_venue_idx').on(t.venueId)],
);
