import type { APIRoute } from 'astro';
import { guardVenue } from '~/server/guard';
import { handle, json } from '~/server/http';
import { listMembers } from '~/server/members';

/** Members with role and last visit, and the invitations still open. Managers and admins. */
export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'members.manage');
    return json(await listMembers(venue.id));
  });
