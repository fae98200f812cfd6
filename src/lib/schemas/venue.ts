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
