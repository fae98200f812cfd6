/// <reference path="../.astro/types.d.ts" />
/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** The signed-in person, read once per request by the middleware; null when signed out. */
    user: import('./server/session').SessionUser | null;
  }
}
