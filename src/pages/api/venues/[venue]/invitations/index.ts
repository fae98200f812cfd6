import type { APIRoute } from 'astro';
import { InvitationCreateSchema } from '~/lib/schemas/people';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { inviteByEmail } from '~/server/invitations';

/** `{email, role}` → 201 with the invitation; the link goes out by e-mail only. */
export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'members.manage');
    const { email, role } = parseWith(InvitationCreateSchema, await readJsonBody(request));
    return json({ invitation: await inviteByEmail(venue, email, role, user, request) }, 201);
  });
