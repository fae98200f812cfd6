import type { APIRoute } from 'astro';
import type { RevisionAnswer } from '~/lib/api-types';
import { handle, json } from '~/server/http';
import { guardPage } from '~/server/pages';
import { getRevision, revisionNumberParam } from '~/server/revisions';

/** One revision with its document and plain text. */
export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { page } = await guardPage(locals.principal, params.venue, params.page, 'venue.read');
    const revision = await getRevision(page.id, revisionNumberParam(params.n));
    return json<RevisionAnswer<Date>>({ revision }, 200, { 'cache-control': 'private, max-age=300' });
  });
