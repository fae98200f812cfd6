import type { APIRoute } from 'astro';
import { guardVenue } from '~/server/guard';
import { revokePass } from '~/server/guest-passes';
import { handle } from '~/server/http';

/** Revokes the pass: its link answers 404 from the next request. */
export const DELETE: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    await revokePass(venue.id, params.id, user);
    return new Response(null, { status: 204 });
  });
