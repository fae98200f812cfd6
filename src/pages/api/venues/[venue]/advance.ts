import type { APIRoute } from 'astro';
import { isGuest } from '~/lib/permissions';
import { AdvanceSelectionSchema } from '~/lib/schemas/people';
import { loadAdvanceSheet, setAdvanceSelection } from '~/server/advance';
import { guardAdvanceReader, guardVenue } from '~/server/guard';
import { recordPassUse } from '~/server/guest-passes';
import { handle, json, parseWith, readJsonBody } from '~/server/http';

/**
 * The advance sheet in order. Members read it with their session; a guest sends the pass token
 * as `Authorization: Bearer <token>`, and image addresses then point at the pass's file route.
 */
export const GET: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, principal } = await guardAdvanceReader(locals.principal, params.venue);
    const token = isGuest(principal) ? request.headers.get('authorization')!.slice(7).trim() : null;
    const pages = await loadAdvanceSheet(venue, token ? { imageUrl: (src) => `/advance/${token}${src}` } : {});
    if (isGuest(principal)) await recordPassUse(principal.guestPassId);
    return json({ venue: { slug: venue.slug, name: venue.name }, pages });
  });

/** `{pages: [slug, …]}`: which pages form the sheet, in order. Managers and admins. */
export const PUT: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    const { pages } = parseWith(AdvanceSelectionSchema, await readJsonBody(request));
    return json({ pages: await setAdvanceSelection(venue.id, pages, user) });
  });
