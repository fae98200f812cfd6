import type { APIRoute } from 'astro';
import { serveFileRoute } from '~/server/files/file-route';

/** variant: original | display (WebP, ≤ 1600 px) | thumb (WebP, ≤ 400 px). */
export const GET: APIRoute = (context) => serveFileRoute(context, context.params.variant);
