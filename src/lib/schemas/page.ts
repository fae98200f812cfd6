import { z } from 'zod';
import { SLUG_PATTERN } from '~/lib/slug';
import { PAGE_TITLE_MAX, SEARCH_MAX_LENGTH, SECTION_TITLE_MAX, SLUG_MAX, SUMMARY_MAX } from '~/lib/text-limits';
import { displayText } from './display-text';

export { SEARCH_MAX_LENGTH };

/**
 * Request bodies for pages, revisions, sections and search, shared by the editor island and the
 * routes. Every object is strict: a key the route does not take (authorId, venueId, number…) is
 * a 400, never silently ignored. The document itself is only typed as "some value" here; its real
 * check is validateDoc, which must walk it without recursion before anything else does.
 */
/** A strict object whose refusals read as sentences: an extra key is named, a non-object explained. */
function strictBody<T extends z.core.$ZodLooseShape>(shape: T) {
  return z.strictObject(shape, {
    error: (iss) =>
      iss.code === 'unrecognized_keys'
        ? `This request cannot set ${iss.keys.map((k) => `"${k}"`).join(', ')}; remove ${iss.keys.length > 1 ? 'them' : 'it'}.`
        : iss.code === 'invalid_type'
          ? 'Send a JSON object.'
          : undefined,
  });
}

const title = displayText('the title', { min: 1, max: PAGE_TITLE_MAX, minMessage: 'Give the page a title.' });

const summary = z
  .string({ error: 'The summary must be text.' })
  .refine((s) => !/[\r\n]/.test(s), 'Keep the summary to one line.')
  .pipe(displayText('the summary', { max: SUMMARY_MAX, maxMessage: `Keep the summary to one line (under ${SUMMARY_MAX} characters).` }));

const sectionSlug = z
  .string({ error: 'Choose a section.' })
  .min(1, 'Choose a section.')
  .max(SLUG_MAX, 'Choose one of the sections of this venue.');

const revisionNumber = z
  .number({ error: 'Say which revision you started from: baseRevision must be a number.' })
  .int('baseRevision must be a whole number.')
  .min(0, 'baseRevision cannot be negative.');

const doc = z.unknown().refine((d) => d !== undefined, 'Send the page text as a document ("doc").');

export const PageCreateSchema = strictBody({
  title,
  section: sectionSlug,
  doc,
  summary: summary.optional(),
  slug: z
    .string({ error: 'The slug must be text.' })
    .regex(SLUG_PATTERN, 'The slug may use only lower-case letters, digits and single hyphens, e.g. "stage-patch".')
    .max(SLUG_MAX, `Keep the slug under ${SLUG_MAX} characters.`)
    .optional(),
});
export type PageCreate = z.infer<typeof PageCreateSchema>;

export const PageSaveSchema = strictBody({
  doc,
  baseRevision: revisionNumber,
  summary: summary.optional(),
  title: title.optional(),
  section: sectionSlug.optional(),
});
export type PageSave = z.infer<typeof PageSaveSchema>;

export const RestoreSchema = strictBody({
  baseRevision: revisionNumber.optional(),
  summary: summary.optional(),
});
export type RestoreRequest = z.infer<typeof RestoreSchema>;

/** Query parameters, so other keys are ignored rather than refused. */
export const SearchQuerySchema = z.object({
  q: z
    .string({ error: 'Add ?q= with the words to search for.' })
    .max(SEARCH_MAX_LENGTH, `Keep the search under ${SEARCH_MAX_LENGTH} characters.`),
  limit: z.coerce
    .number({ error: 'limit must be a number.' })
    .int('limit must be a whole number.')
    .min(1, 'limit must be at least 1.')
    .max(50, 'limit may be at most 50.')
    .optional(),
});

const sectionTitle = displayText('the section title', { min: 1, max: SECTION_TITLE_MAX, minMessage: 'Give the section a title.' });

export const SectionCreateSchema = strictBody({
  title: sectionTitle,
  slug: z
    .string({ error: 'The slug must be text.' })
    .regex(SLUG_PATTERN, 'The slug may use only lower-case letters, digits and single hyphens, e.g. "backline".')
    .max(SLUG_MAX, `Keep the slug under ${SLUG_MAX} characters.`)
    .optional(),
});
export type SectionCreate = z.infer<typeof SectionCreateSchema>;

export const SectionUpdateSchema = strictBody({
  title: sectionTitle.optional(),
  move: z.enum(['up', 'down'], { error: 'move is "up" or "down".' }).optional(),
}).refine((v) => v.title !== undefined || v.move !== undefined, 'Send a new title or a move ("up" or "down").');
export type SectionUpdate = z.infer<typeof SectionUpdateSchema>;

/** Paging of a page's history: `before` a revision number, `limit` revisions per page. */
export const HistoryQuerySchema = z.object({
  before: z.coerce
    .number({ error: 'before must be a revision number.' })
    .int('before must be a whole revision number.')
    .min(2, 'before must be a revision number of 2 or more (revision 1 has nothing older).')
    .max(1_000_000_000, 'before is past any revision number.')
    .optional(),
  limit: z.coerce
    .number({ error: 'limit must be a number.' })
    .int('limit must be a whole number.')
    .min(1, 'limit must be at least 1.')
    .max(500, 'limit may be at most 500.')
    .optional(),
});
