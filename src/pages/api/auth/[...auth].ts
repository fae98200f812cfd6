import type { APIRoute } from 'astro';
import { AstroAuth } from '~/server/auth/astro-auth.mjs';
import { clearSignInFailures, recordSignInFailure, signInRetryAfter } from '~/server/auth/rate-limit';
import { recordPasswordSignIn } from '~/server/sign-ins';
import { json } from '~/server/http';
import { endAllSessions, readSessionUser } from '~/server/session';

export const prerender = false;

const authHandlers = AstroAuth();

/**
 * Auth.js's own routes, wrapped so that wrong passwords are counted per account and address
 * here, where the client address is known; Auth.js itself only sees the Request.
 */
export const GET: APIRoute = (context) => authHandlers.GET(context) as Promise<Response>;

/** The e-mail field exactly as Auth.js reads the body (JSON, or form fields where the last repeat wins). */
async function emailAuthJsWillUse(request: Request): Promise<string> {
  const type = request.headers.get('content-type') ?? '';
  try {
    if (type.includes('application/json')) {
      const body = (await request.clone().json()) as { email?: unknown };
      return typeof body?.email === 'string' ? body.email : '';
    }
    if (type.includes('application/x-www-form-urlencoded')) {
      const fields = Object.fromEntries(new URLSearchParams(await request.clone().text()));
      return fields.email ?? '';
    }
  } catch {
    // An unreadable body signs nobody in; count it against the address only.
  }
  return '';
}

/** Sign-out ends the session on the server too: the person's session epoch moves on. */
async function signOut(context: Parameters<APIRoute>[0]): Promise<Response> {
  const user = await readSessionUser(context.request);
  const response = (await authHandlers.POST(context)) as Response;
  if (user && response.status < 400) await endAllSessions(user.id);
  const copy = new Response(response.body, response);
  // A shared FOH laptop keeps nothing of the signed-in pages after sign-out.
  copy.headers.set('clear-site-data', '"cache"');
  return copy;
}

export const POST: APIRoute = async (context) => {
  if (context.url.pathname.endsWith('/signout')) return signOut(context);
  if (!context.url.pathname.endsWith('/callback/credentials')) return authHandlers.POST(context) as Promise<Response>;

  const email = (await emailAuthJsWillUse(context.request)).slice(0, 254);
  // The server entry (src/cli/serve.mjs) has already replaced X-Forwarded-For with the address
  // it trusts, so this is the socket address unless TRUST_PROXY names the proxy in front.
  const address = context.clientAddress;
  const retryAfter = await signInRetryAfter(email, address);
  if (retryAfter > 0) {
    const minutes = Math.ceil(retryAfter / 60);
    const error = `Too many wrong passwords for this account. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again, or ask a manager to check your account.`;
    if ((context.request.headers.get('accept') ?? '').includes('text/html')) {
      // A browser posting the sign-in form gets a page, not JSON; the status stays 429.
      const html = `<!doctype html><html lang="en"><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Wait a moment · Throwline</title><body style="font-family:system-ui,sans-serif;max-width:32rem;margin:3rem auto;padding:0 1rem"><h1>Wait a moment</h1><p>${error}</p><p><a href="/signin">Back to sign-in</a></p></body></html>`;
      return new Response(html, { status: 429, headers: { 'content-type': 'text/html; charset=utf-8', 'retry-after': String(retryAfter) } });
    }
    return json({ error }, 429, { 'retry-after': String(retryAfter) });
  }

  const response = (await authHandlers.POST(context)) as Response;
  const target = response.headers.get('location') ?? '';
  const failed = /[?&]error=/.test(target) || response.status === 401;
  if (failed) await recordSignInFailure(email, address);
  else {
    await clearSignInFailures(email, address);
    if (response.headers.getSetCookie().some((c) => c.includes('session-token=') && !/max-age=0/i.test(c))) await recordPasswordSignIn(email);
  }
  return response;
};
