import type { APIRoute } from 'astro';
import { AstroAuth } from '~/server/auth/astro-auth.mjs';
import { clearSignInFailures, recordSignInFailure, signInRetryAfter } from '~/server/auth/rate-limit';
import { json } from '~/server/http';

export const prerender = false;

const authHandlers = AstroAuth();

/**
 * Auth.js's own routes, wrapped so that wrong passwords are counted per account and address
 * here, where the client address is known; Auth.js itself only sees the Request.
 */
export const GET: APIRoute = (context) => authHandlers.GET(context) as Promise<Response>;

export const POST: APIRoute = async (context) => {
  if (!context.url.pathname.endsWith('/callback/credentials')) return authHandlers.POST(context) as Promise<Response>;

  const form = await context.request.clone().formData().catch(() => null);
  const email = String(form?.get('email') ?? '').slice(0, 254);
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
  else await clearSignInFailures(email, address);
  return response;
};
