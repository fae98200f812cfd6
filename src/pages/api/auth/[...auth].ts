import type { APIRoute } from 'astro';
import { AstroAuth } from 'auth-astro/server';
import { clearSignInFailures, recordSignInFailure, signInRetryAfter } from '../../../server/auth/rate-limit';
import { json } from '../../../server/http';

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
    return json(
      { error: `Too many wrong passwords for this account. Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again, or ask a manager to check your account.` },
      429,
      { 'retry-after': String(retryAfter) },
    );
  }

  const response = (await authHandlers.POST(context)) as Response;
  const target = response.headers.get('location') ?? '';
  const failed = /[?&]error=/.test(target) || response.status === 401;
  if (failed) await recordSignInFailure(email, address);
  else await clearSignInFailures(email, address);
  return response;
};
