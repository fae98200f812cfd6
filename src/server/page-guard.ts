import type { AstroGlobal } from 'astro';
import type { Action } from '~/lib/permissions';
import { guardVenue, requirePermission, requireUser, type VenueContext } from './guard';
import { noteVisit } from './members';
import { HttpError } from './http';
import { loadPageFor, type PageLoader, type PageRow } from './pages';
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
    const ctx = await guardVenue(Astro.locals.principal, Astro.params.venue, action);
    if (ctx.access.role) await noteVisit(ctx.venue.id, ctx.user.id, ctx.visitStartedAt);
    Astro.locals.venueHere = { slug: ctx.venue.slug, access: ctx.access };
    return { ok: true, ctx };
  } catch (err) {
    return { ok: false, response: errorPageResponse(Astro, err) };
  }
}

/**
 * The HTML counterpart of requireUser for screens any signed-in person may open (venues, search,
 * account): signed out → sign in and come back; a guest pass presented here opens nothing (404),
 * as everywhere outside the advance sheet, even in a browser that is also signed in.
 */
export function guardSignedInPage(Astro: AstroGlobal): { ok: true; user: SessionUser } | { ok: false; response: Response | Promise<Response> } {
  try {
    return { ok: true, user: requireUser(Astro.locals.principal) };
  } catch (err) {
    return { ok: false, response: errorPageResponse(Astro, err) };
  }
}

/**
 * The HTML counterpart of requireUser + requirePermission for instance-wide screens (no venue):
 * signed out → sign in and come back, refused → the 403 page.
 */
export function guardInstancePage(Astro: AstroGlobal, action: Action): { ok: true; user: SessionUser } | { ok: false; response: Response | Promise<Response> } {
  try {
    const user = requireUser(Astro.locals.principal);
    requirePermission(user, action);
    return { ok: true, user };
  } catch (err) {
    return { ok: false, response: errorPageResponse(Astro, err) };
  }
}

/**
 * guardVenuePage, then loads one page of that venue with `load`; a missing page, or an archived
 * one for someone who may not restore it (loadPageFor), is the 404 page.
 * Used by the read, edit and history views so each states only what it loads.
 */
export async function guardPageView<T extends { page: PageRow }>(
  Astro: AstroGlobal,
  action: Action,
  load: PageLoader<T>,
): Promise<{ ok: true; ctx: VenueContext & { user: SessionUser }; loaded: T } | { ok: false; response: Response | Promise<Response> }> {
  const guard = await guardVenuePage(Astro, action);
  if (!guard.ok) return guard;
  try {
    return { ok: true, ctx: guard.ctx, loaded: await loadPageFor(guard.ctx, Astro.params.page, load) };
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
