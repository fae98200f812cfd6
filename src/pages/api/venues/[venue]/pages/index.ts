import type { APIRoute } from 'astro';
import { guardVenue } from '../../../../../server/guard';
import { handle, json } from '../../../../../server/http';
import { listPages } from '../../../../../server/venues';

export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.user, params.venue, 'venue.read');
    const pages = await listPages(venue.id);
    return json({ pages });
  });
