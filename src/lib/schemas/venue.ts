import { z } from 'zod';
import { SLUG_PATTERN } from '~/lib/slug';
import { SLUG_MAX, TOWN_MAX, VENUE_NAME_MAX, VENUE_NAME_MIN } from '~/lib/text-limits';
import { displayText } from './display-text';

export const VenueCreateSchema = z
  .object({
    name: displayText('the venue name', { min: VENUE_NAME_MIN, max: VENUE_NAME_MAX, minMessage: `The venue name needs at least ${VENUE_NAME_MIN} characters.` }),
    town: displayText('the town', { max: TOWN_MAX }).optional(),
    slug: z
      .string({ error: 'The slug must be text.' })
      .regex(SLUG_PATTERN, 'The slug may use only lower-case letters, digits and single hyphens, e.g. "north-hall".')
      .max(SLUG_MAX, `Keep the slug under ${SLUG_MAX} characters.`)
      .optional(),
  })
  .strict();

export type VenueCreate = z.infer<typeof VenueCreateSchema>;

/** How long a power or rigging page may go without an on-site check before the sheet warns. */
export const CHECK_STALE_MONTHS_MIN = 1;
export const CHECK_STALE_MONTHS_MAX = 36;

/**
 * A venue's settings, any of them: the name and town people read (the slug, and so every link,
 * stays as it is), and the check interval. An empty town clears it.
 */
export const VenueUpdateSchema = z
  .object({
    name: VenueCreateSchema.shape.name.optional(),
    town: z.union([z.literal(''), displayText('the town', { max: TOWN_MAX })]).optional(),
    // A number from a script, or the digits a form field sends; nothing else is read as months.
    checkStaleMonths: z
      .union([z.number(), z.string().regex(/^\d{1,3}$/).transform(Number)], { error: 'Give the months as a whole number.' })
      .pipe(z.number().int('Give the months as a whole number.')
      .min(CHECK_STALE_MONTHS_MIN, `Warn after at least ${CHECK_STALE_MONTHS_MIN} month.`)
      .max(CHECK_STALE_MONTHS_MAX, `Warn after at most ${CHECK_STALE_MONTHS_MAX} months.`))
      .optional(),
  })
  .strict()
  .refine((v) => v.name !== undefined || v.town !== undefined || v.checkStaleMonths !== undefined, { error: 'Send at least one of name, town or checkStaleMonths.' });

export type VenueUpdate = z.infer<typeof VenueUpdateSchema>;
