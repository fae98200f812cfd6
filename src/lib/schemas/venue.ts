import { z } from 'zod';
import { SLUG_PATTERN } from '~/lib/slug';
import { SLUG_MAX, TOWN_MAX, VENUE_NAME_MAX, VENUE_NAME_MIN } from '~/lib/text-limits';

export const VenueCreateSchema = z
  .object({
    name: z
      .string({ error: 'Give the venue a name (text).' })
      .trim()
      .min(VENUE_NAME_MIN, `The venue name needs at least ${VENUE_NAME_MIN} characters.`)
      .max(VENUE_NAME_MAX, `Keep the venue name under ${VENUE_NAME_MAX} characters.`),
    town: z.string({ error: 'The town must be text.' }).trim().max(TOWN_MAX, `Keep the town under ${TOWN_MAX} characters.`).optional(),
    slug: z
      .string({ error: 'The slug must be text.' })
      .regex(SLUG_PATTERN, 'The slug may use only lower-case letters, digits and single hyphens, e.g. "north-hall".')
      .max(SLUG_MAX, `Keep the slug under ${SLUG_MAX} characters.`)
      .optional(),
  })
  .strict();

export type VenueCreate = z.infer<typeof VenueCreateSchema>;
