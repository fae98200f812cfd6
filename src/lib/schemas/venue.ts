import { z } from 'zod';
import { SLUG_PATTERN } from '~/lib/slug';
import { displayText } from './display-text';

export const VenueCreateSchema = z
  .object({
    name: displayText('the venue name', { min: 2, max: 120, minMessage: 'The venue name needs at least 2 characters.' }),
    town: displayText('the town', { max: 120 }).optional(),
    slug: z
      .string({ error: 'The slug must be text.' })
      .regex(SLUG_PATTERN, 'The slug may use only lower-case letters, digits and single hyphens, e.g. "north-hall".')
      .max(60, 'Keep the slug under 60 characters.')
      .optional(),
  })
  .strict();

export type VenueCreate = z.infer<typeof VenueCreateSchema>;
