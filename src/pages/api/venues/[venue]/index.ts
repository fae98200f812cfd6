import type { APIRoute } from 'astro';
import { VenueUpdateSchema } from '~/lib/schemas/venue';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { updateVenue } from '~/server/venues';

const venueJson = (v: { slug: string; name: string; town: string | null; checkStaleMonths: number }) => ({ slug: v.slug, name: v.name, town: v.town, checkStaleMonths: v.checkStaleMonths });

/** The venue as a member sees it, with their role. */
export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue, access } = await guardVenue(locals.principal, params.venue, 'venue.read');
    return json({ venue: { ...venueJson(venue), role: access.role } });
  });

/** `{name?, town?, checkStaleMonths?}`: the venue's settings (its managers and admins); the slug never changes. */
export const PATCH: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'venue.settings');
    const input = parseWith(VenueUpdateSchema, await readJsonBody(request));
    return json({ venue: venueJson(await updateVenue(venue.id, input, user)) });
  });
