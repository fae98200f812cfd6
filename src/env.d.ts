/// <reference path="../.astro/types.d.ts" />
/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person, read once per request by the middleware; null when signed out. */
    user: import('./server/session').SessionUser | null;
    /** The guest pass this request carries (in an /advance/<token> path or a Bearer header). */
    guest: import('./server/guest-passes').ResolvedPass | null;
    /** Whoever is asking: the guest when a pass is presented, else the signed-in person. */
    /** The venue a page's guard loaded, for the header's account menu. */
    venueHere?: { slug: string; access: import('./lib/permissions').VenueAccess };
    /** Set by a page that may be kept whole (src/server/page-render-cache.ts): its render key. */
    renderKey?: string;
    principal: import('./server/session').SessionUser | import('./server/guest-passes').ResolvedPass | null;
  }
}
