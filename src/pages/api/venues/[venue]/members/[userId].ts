import type { APIRoute } from 'astro';
import { MemberUpdateSchema } from '~/lib/schemas/people';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { changeRole, removeMember } from '~/server/members';

/** `{role}`; 409 when it would leave the venue without a manager. */
export const PATCH: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    const { role } = parseWith(MemberUpdateSchema, await readJsonBody(request));
    return json({ member: await changeRole(venue.id, params.userId, role, user) });
  });

/** Removes the member; their open sessions end at their next request. 409 for the last manager. */
export const DELETE: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    await removeMember(venue.id, params.userId, user);
    return new Response(null, { status: 204 });
  });
