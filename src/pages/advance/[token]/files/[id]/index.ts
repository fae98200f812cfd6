import type { APIRoute } from 'astro';
import { fileResponse, loadReadableFile, parseVariant } from '~/server/files/serve-file';
import { handle } from '~/server/http';

/** A file the guest's advance sheet uses, through the pass in the path; every other file is 404. */
export const GET: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    if (!locals.guest) return new Response('Not found', { status: 404 });
    const row = await loadReadableFile(locals.guest, params.id);
    return fileResponse(row, parseVariant('original'), request, false);
  });
