import type { APIRoute } from 'astro';
import { z } from 'zod';
import { setPageInAdvance } from '~/server/advance';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';

const SwitchSchema = z.object({ included: z.boolean({ error: 'Send "included" as true or false.' }) }).strict();

/** The switch on each page: `{included: true}` adds it at the end of the sheet, false takes it off. */
export const PUT: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    const { included } = parseWith(SwitchSchema, await readJsonBody(request));
    return json(await setPageInAdvance(venue.id, params.page, included, user));
  });
