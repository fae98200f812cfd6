import type { APIRoute } from 'astro';
import type { FileAnswer, FileDeleted } from '~/lib/api-types';
import { FileCaptionSchema } from '~/lib/schemas/file';
import { deleteFile, loadVenueFile, updateCaption } from '~/server/files/file-records';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';

export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'venue.read');
    return json<FileAnswer>({ file: await loadVenueFile(venue.id, params.id) });
  });

/** `{caption}`: whoever may upload may caption. */
export const PATCH: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'file.upload');
    await loadVenueFile(venue.id, params.id);
    const { caption } = parseWith(FileCaptionSchema, await readJsonBody(request));
    return json<FileAnswer>({ file: await updateCaption(venue.id, params.id, caption, user) });
  });

/** A file that a page shows answers 409 with `usedBy` unless `?confirm=1` is given. */
export const DELETE: APIRoute = ({ locals, params, url }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'file.delete');
    const confirmed = url.searchParams.get('confirm') === '1';
    const { usedBy } = await deleteFile(venue.id, params.id, user, confirmed);
    // deleteFile answered 404 for a missing id, so params.id is set here.
    return json<FileDeleted>({ deleted: params.id ?? '', usedBy });
  });
