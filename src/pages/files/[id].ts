import type { APIRoute } from 'astro';
import { serveFileRoute } from '~/server/files/file-route';

/** The stored original; the same as /files/:id/original. */
export const GET: APIRoute = (context) => serveFileRoute(context, 'original');
