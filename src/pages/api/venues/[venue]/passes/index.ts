import type { APIRoute } from 'astro';
import { PassCreateSchema } from '~/lib/schemas/people';
import { guardVenue } from '~/server/guard';
import { createPass, listPasses } from '~/server/guest-passes';
import { handle, json, parseWith, readJsonBody } from '~/server/http';

/** Passes with label, expiry, last use and use count; never the token. */
export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'members.manage');
    return json({ passes: await listPasses(venue.id) });
  });

/** `{label, showDate?, expiresAt?}` → 201; the `url` is shown this once and never stored. */
export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    const input = parseWith(PassCreateSchema, await readJsonBody(request));
    return json({ pass: await createPass(venue.id, input, user) }, 201);
  });
