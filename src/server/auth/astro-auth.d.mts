import type { APIContext } from 'astro';

/** Auth.js's route handlers for Astro, configured from src/auth.config.ts (auth-astro's `auth:config`). */
export declare function AstroAuth(): {
  GET(context: APIContext): Promise<Response | undefined>;
  POST(context: APIContext): Promise<Response | undefined>;
};
