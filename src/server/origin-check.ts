import { json } from './http';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
/** Bodies a page on another site can send without asking (no CORS preflight). */
const SIMPLE_BODY = /^(application\/x-www-form-urlencoded|multipart\/form-data|text\/plain)\b/i;

/**
 * The Origin rule, for every route: a request that can change something (any method but GET,
 * HEAD and OPTIONS) and carries an Origin header must name this site's origin. Browsers send
 * Origin on every such request, so a page on another site can never write with a visitor's
 * cookies, whatever the content type. Without an Origin, a form, multipart or text body is
 * refused too (that is what an old browser or a stripped header would send cross-site); a JSON
 * body without one comes from a script, which no other site can make a browser send.
 */
export function foreignOriginRefusal(request: Request, url: URL): Response | null {
  if (SAFE_METHODS.has(request.method)) return null;
  const origin = request.headers.get('origin');
  if (origin === url.origin) return null;
  if (origin === null) {
    if (!SIMPLE_BODY.test(request.headers.get('content-type') ?? '')) return null;
    return json({ error: 'Send an Origin header naming this site with form and file uploads; browsers do this themselves.' }, 403);
  }
  return json({ error: 'This request came from another site (its Origin header is not this one); Throwline only accepts changes sent from its own pages.' }, 403);
}
