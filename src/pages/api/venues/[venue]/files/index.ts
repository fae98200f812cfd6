import type { APIRoute } from 'astro';
import type { FileAnswer, FilesAnswer } from '~/lib/api-types';
import { listVenueFiles } from '~/server/files/file-records';
import { saveUpload } from '~/server/files/save-upload';
import { guardVenue } from '~/server/guard';
import { handle, json } from '~/server/http';

export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'venue.read');
    return json<FilesAnswer>({ files: await listVenueFiles(venue.id) });
  });

/** Multipart: field `file` (one per request), optional `caption` and `page` (a page slug). */
export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'file.upload');
    const file = await saveUpload(request, venue, user);
    return json<FileAnswer>({ file }, 201, { location: file.url });
  });
