import type { APIRoute } from 'astro';
import { z } from 'zod';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { movePage } from '~/server/page-shelf';
import { SLUG_PATTERN } from '~/lib/slug';

// Section slugs are always of the slug pattern: anything else (other scripts, line breaks,
// direction controls) is refused here, so no error sentence ever repeats such text back.
const MoveSchema = z
  .object({
    section: z
      .string({ error: 'Choose a section.' })
      .min(1, 'Choose a section.')
      .max(100, 'Choose one of the sections of this venue.')
      .regex(SLUG_PATTERN, 'Choose one of the sections of this venue.'),
  })
  .strict();

/** `{section: slug}` moves the page to that section of its venue, without a new revision. Engineers and up. */
export const PUT: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.edit');
    const { section } = parseWith(MoveSchema, await readJsonBody(request));
    return json(await movePage(venue.id, params.page, section, user));
  });
