import type { APIRoute } from 'astro';
import { guardVenue } from '~/server/guard';
import { handle, json } from '~/server/http';
import { resendInvitation } from '~/server/invitations';

/** Sends a pending invitation again with a fresh link; the previous link stops working. */
export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    return json({ invitation: await resendInvitation(venue, params.id, user, request) }, 201);
  });
