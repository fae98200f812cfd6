import type { APIRoute } from 'astro';
import { markChecked } from '~/server/advance';
import { guardVenue } from '~/server/guard';
import { handle, json } from '~/server/http';

/** Stamps the page "checked on site" by the caller, now; no new revision. Engineers and up. */
export const POST: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.check');
    return json(await markChecked(venue.id, params.page, user));
  });
