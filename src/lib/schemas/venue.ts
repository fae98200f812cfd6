import { z } from 'zod';
import { SLUG_PATTERN } from '~/lib/slug';

export const VenueCreateSchema = z
  .object({
    name: z
      .string({ error: 'Give the venue a name (text).' })
      .trim()
      .min(2, 'The venue name needs at least 2 characters.')
      .max(120, 'Keep the venue name under 120 characters.'),
    town: z.string({ error: 'The town must be text.' }).trim().max(120, 'Keep the town under 120 characters.').optional(),
    slug: z
      .string({ error: 'The slug must be text.' })
      .regex(SLUG_PATTERN, 'The slug may use only lower-case letters, digits and single hyphens, e.g. "north-hall".')
      .max(60, 'Keep the slug under 60 characters.')
      .optional(),
  })
  .strict();

export type VenueCreate = z.infer<typeof VenueCreateSchema>;
