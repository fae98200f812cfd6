import { defineMiddleware } from 'astro:middleware';
import { foreignOriginRefusal } from './server/origin-check';
import { readSessionUser } from './server/session';
import { completePagePolicy, securityHeaders } from './server/security-headers';

/** Paths that never depend on who is asking; reading the session there is wasted work. */
function isAnonymousPath(pathname: string): boolean {
  return (
    pathname.startsWith('/_astro/') ||
    pathname.startsWith('/api/calc/') ||
    pathname.startsWith('/api/auth/') ||
    pathname === '/sw.js' ||
    pathname === '/manifest.webmanifest' ||
    pathname === '/favicon.svg'
  );
}

function withSecurityHeaders(response: Response): Response {
  try {
    const pagePolicy = response.headers.get('content-security-policy');
    // Astro's page policy (with the script hashes) lacks the inline-style lines; a file's own
    // sandbox policy is left as the route wrote it.
    if (pagePolicy && /^text\/html\b/i.test(response.headers.get('content-type') ?? '')) response.headers.set('content-security-policy', completePagePolicy(pagePolicy));
    for (const [name, value] of Object.entries(securityHeaders)) {
      if (!response.headers.has(name)) response.headers.set(name, value);
    }
    return response;
  } catch {
    // Some responses (Response.redirect) have immutable headers; copy them once.
    const copy = new Response(response.body, response);
    for (const [name, value] of Object.entries(securityHeaders)) if (!copy.headers.has(name)) copy.headers.set(name, value);
    return copy;
  }
}

/**
 * Refuses a write sent from another site, fills `locals.user` once per request and adds the
 * security headers. It authorises nothing: every page and route checks permissions itself,
 * through src/server/guard.ts.
 */
export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  const refused = foreignOriginRefusal(context.request, context.url);
  if (refused) return withSecurityHeaders(refused);
  if (!isAnonymousPath(context.url.pathname) && !context.isPrerendered) {
    context.locals.user = await readSessionUser(context.request);
  }
  return withSecurityHeaders(await next());
});
