import type { AstroGlobal } from 'astro';
import type { Action } from '../lib/permissions';
import { guardVenue, type VenueContext } from './guard';
import { HttpError } from './http';
import type { SessionUser } from './session';

export type PageGuardResult =
  | { ok: true; ctx: VenueContext & { user: SessionUser } }
  | { ok: false; response: Response | Promise<Response> };

/**
 * The HTML counterpart of guardVenue: a signed-out visitor is sent to sign in and brought back,
 * a hidden or missing venue is the 404 page, a refused action the 403 page.
 */
export async function guardVenuePage(Astro: AstroGlobal, action: Action): Promise<PageGuardResult> {
  try {
    return { ok: true, ctx: await guardVenue(Astro.locals.user, Astro.params.venue, action) };
  } catch (err) {
    return { ok: false, response: errorPageResponse(Astro, err) };
  }
}

export function errorPageResponse(Astro: AstroGlobal, err: unknown): Response | Promise<Response> {
  if (!(err instanceof HttpError)) throw err;
  if (err.status === 401) {
    return Astro.redirect(`/signin?next=${encodeURIComponent(Astro.url.pathname + Astro.url.search)}`, 303);
  }
  return Astro.rewrite(err.status === 403 ? '/errors/403' : '/404');
}
