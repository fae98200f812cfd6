import type { APIRoute } from 'astro';
import { guardVenue } from '~/server/guard';
import { handle } from '~/server/http';
import { revokeInvitation } from '~/server/invitations';

/** Withdraws a pending invitation: its link stops working at once. */
export const DELETE: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    await revokeInvitation(venue.id, params.id, user);
    return new Response(null, { status: 204 });
  });
