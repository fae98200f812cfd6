import type { APIRoute } from 'astro';
import type { VenueCreated } from '~/lib/api-types';
import { VenueCreateSchema } from '~/lib/schemas/venue';
import { requirePermission, requireUser } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { createVenue, listVenuesFor } from '~/server/venues';

export const GET: APIRoute = ({ locals }) =>
  handle(async () => {
    const user = requireUser(locals.principal);
    const venues = await listVenuesFor(user);
    return json({ venues });
  });

export const POST: APIRoute = ({ locals, request }) =>
  handle(async () => {
    const user = requireUser(locals.principal);
    requirePermission(user, 'venue.create');
    const input = parseWith(VenueCreateSchema, await readJsonBody(request));
    const venue = await createVenue(input, user);
    return json<VenueCreated>({ venue }, 201);
  });
