import type { APIRoute } from 'astro';
import { requireUser } from '~/server/guard';
import { handle, json } from '~/server/http';
import { endAllSessions } from '~/server/session';

/** "Sign out everywhere": every session of this person, this one included, ends now. */
export const DELETE: APIRoute = ({ locals }) =>
  handle(async () => {
    const user = requireUser(locals.principal);
    await endAllSessions(user.id);
    return json({ signedOut: true }, 200, { 'clear-site-data': '"cache"' });
  });
