import type { APIRoute } from 'astro';
import { fileResponse, loadReadableFile, parseVariant } from '~/server/files/serve-file';
import { handle } from '~/server/http';

/** The display or thumbnail size of a file on the guest's advance sheet. */
export const GET: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    if (!locals.guest) return new Response('Not found', { status: 404 });
    const row = await loadReadableFile(locals.guest, params.id);
    return fileResponse(row, parseVariant(params.variant), request, false);
  });
