import type { APIRoute } from 'astro';
import type { RestoreAnswer } from '~/lib/api-types';
import { RestoreSchema } from '~/lib/schemas/page';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { guardPage } from '~/server/pages';
import { restoreRevision, revisionNumberParam } from '~/server/revisions';

/**
 * Makes a new revision equal to revision n. The body is optional: `{baseRevision}` turns the
 * restore into a compare-and-set like a save, `{summary}` replaces "Restored revision n".
 */
export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardPage(locals.principal, params.venue, params.page, 'page.edit');
    const n = revisionNumberParam(params.n);
    const hasBody = request.headers.has('content-type') || Number(request.headers.get('content-length') ?? '0') > 0;
    const input = parseWith(RestoreSchema, hasBody ? await readJsonBody(request) : {});
    const restored = await restoreRevision(venue.id, params.page, n, input, user);
    return json<RestoreAnswer<Date>>(restored, 201);
  });
