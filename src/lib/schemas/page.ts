import { z } from 'zod';
import { SLUG_PATTERN } from '~/lib/slug';
import { PAGE_TITLE_MAX, SEARCH_MAX_LENGTH, SECTION_TITLE_MAX, SLUG_MAX, SUMMARY_MAX } from '~/lib/text-limits';

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

const title = z
  .string({ error: 'Give the page a title (text).' })
  .trim()
  .min(1, 'Give the page a title.')
  .max(PAGE_TITLE_MAX, `Keep the title under ${PAGE_TITLE_MAX} characters.`);

const summary = z
  .string({ error: 'The summary must be text.' })
  .trim()
  .max(SUMMARY_MAX, `Keep the summary to one line (under ${SUMMARY_MAX} characters).`)
  .refine((s) => !/[\r\n]/.test(s), 'Keep the summary to one line.');

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

const sectionTitle = z
  .string({ error: 'Give the section a title (text).' })
  .trim()
  .min(1, 'Give the section a title.')
  .max(SECTION_TITLE_MAX, `Keep the section title under ${SECTION_TITLE_MAX} characters.`);

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
