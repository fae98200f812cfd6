import type { APIRoute } from 'astro';
import type { HistoryAnswer } from '~/lib/api-types';
import { HistoryQuerySchema } from '~/lib/schemas/page';
import { handle, json, parseWith, searchParamsObject } from '~/server/http';
import { guardPage } from '~/server/pages';
import { listRevisions } from '~/server/revisions';

/** The history of a page, newest first, a page at a time: `?before=n&limit=k`, then `nextBefore`. */
export const GET: APIRoute = ({ locals, params, url }) =>
  handle(async () => {
    const { page } = await guardPage(locals.principal, params.venue, params.page, 'venue.read');
    const query = parseWith(HistoryQuerySchema, searchParamsObject(url));
    const { revisions, nextBefore } = await listRevisions(page.id, query);
    return json<HistoryAnswer<Date>>({ page: { slug: page.slug, title: page.title, currentRevision: page.currentRevision }, revisions, nextBefore });
  });
