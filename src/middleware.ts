import { defineMiddleware } from 'astro:middleware';
import { guestTokenMisses } from './server/auth/rate-limit';
import { blockedFor, countHit } from './server/auth/throttle';
import { resolvePass, type ResolvedPass } from './server/guest-passes';
import { readSessionUser } from './server/session';
import { completePagePolicy, securityHeaders } from './server/security-headers';
import { foreignOriginRefusal } from './server/origin-check';
import { cachedPageResponse, calculatorPageKey, keepRenderedPage } from './server/page-render-cache';

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

const NO_VENUE_GUEST: ResolvedPass = { guestPassId: '', venueId: '', label: '', expiresAt: new Date(0) };

const GUEST_PATH = /^\/advance\/([^/]+)(?:\/|$)/;

/** The only JSON routes a pass presented as `Authorization: Bearer` may open. */
const GUEST_API = /^\/api\/venues\/[^/]+\/(advance|changes)$/;

/**
 * The guest token of this request: in the /advance/<token> path, or `Authorization: Bearer` for
 * the JSON routes. `scoped` is false when a Bearer token is sent anywhere else.
 */
function guestTokenOf(request: Request, pathname: string): { token: string; scoped: boolean } | null {
  const inPath = GUEST_PATH.exec(pathname);
  if (inPath) return { token: decodeURIComponent(inPath[1]), scoped: true };
  const auth = request.headers.get('authorization');
  return auth?.startsWith('Bearer ') ? { token: auth.slice(7).trim(), scoped: GUEST_API.test(pathname) } : null;
}

function tooManyGuesses(retryAfterMs: number): Response {
  return new Response('Too many wrong guest links from this address. Wait a few minutes, then open the link you were sent.', {
    status: 429,
    headers: { 'content-type': 'text/plain; charset=utf-8', 'retry-after': String(Math.ceil(retryAfterMs / 1000)) },
  });
}

function setHeaders(response: Response, extra: Record<string, string>, force: Record<string, string>): Response {
  const apply = (r: Response) => {
    const pagePolicy = r.headers.get('content-security-policy');
    // Astro's page policy (with the script hashes) lacks the inline-style lines; a file's own
    // sandbox policy is left as the route wrote it.
    if (pagePolicy && /^text\/html\b/i.test(r.headers.get('content-type') ?? '')) r.headers.set('content-security-policy', completePagePolicy(pagePolicy));
    for (const [name, value] of Object.entries({ ...securityHeaders, ...extra })) if (!r.headers.has(name)) r.headers.set(name, value);
    for (const [name, value] of Object.entries(force)) r.headers.set(name, value);
    return r;
  };
  try {
    return apply(response);
  } catch {
    // Some responses (Response.redirect) have immutable headers; copy them once.
    return apply(new Response(response.body, response));
  }
}

/**
 * Fills `locals.user` (a member's session), `locals.guest` (a guest pass) and `locals.principal`
 * (whichever is asking) once per request, refuses a write sent from another site, and adds the
 * security headers. It authorises nothing:
 * every page and route checks permissions itself, through src/server/guard.ts.
 */
export const onRequest = defineMiddleware(async (context, next) => {
  context.locals.user = null;
  context.locals.guest = null;
  context.locals.principal = null;
  const refused = foreignOriginRefusal(context.request, context.url);
  if (refused) return setHeaders(refused, {}, {});
  const { pathname } = context.url;
  const dynamic = !isAnonymousPath(pathname) && !context.isPrerendered;
  if (dynamic) {
    context.locals.user = await readSessionUser(context.request);
    context.locals.principal = context.locals.user;
    const presented = guestTokenOf(context.request, pathname);
    if (presented !== null) {
      const pass = await resolvePass(presented.token);
      if (pass === null) {
        const address = context.clientAddress;
        const wait = await blockedFor(guestTokenMisses, address);
        if (wait > 0) return setHeaders(tooManyGuesses(wait), { 'referrer-policy': 'no-referrer' }, {});
        await countHit(guestTokenMisses, address);
      }
      const live = pass !== null && pass !== 'dead' && presented.scoped ? pass : null;
      context.locals.guest = live;
      // A guest link speaks for itself, even in a browser that is also signed in. A link that
      // opens nothing is a guest of no venue: every guard then answers 404, never "sign in".
      context.locals.principal = live ?? NO_VENUE_GUEST;
    }
  }
  // A signed-in person's calculator page is kept whole like the read view (it differs from the
  // anonymous one only in the header): answered from memory when kept, else kept after rendering.
  const calcKey = context.locals.guest ? null : calculatorPageKey(context.url, context.request.method, context.locals.user);
  const kept = calcKey ? cachedPageResponse(calcKey, context.request) : null;
  if (calcKey && !kept) context.locals.renderKey = calcKey;
  let response = kept ?? (await next());
  if (!kept && context.locals.renderKey) response = await keepRenderedPage(context.locals.renderKey, response);
  const onGuestPath = GUEST_PATH.test(pathname);
  const extra: Record<string, string> = onGuestPath ? { 'referrer-policy': 'no-referrer', 'x-robots-tag': 'noindex, nofollow' } : {};
  const force: Record<string, string> = {};
  if (onGuestPath) force['referrer-policy'] = 'no-referrer';
  // Signed-in pages are never kept by the browser or a proxy: a shared FOH laptop keeps nothing.
  if ((context.locals.user || onGuestPath) && (response.headers.get('content-type') ?? '').includes('text/html')) force['cache-control'] = 'no-store';
  return setHeaders(response, extra, force);
});
