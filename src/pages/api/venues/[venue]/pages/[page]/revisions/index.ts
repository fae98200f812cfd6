import type { APIRoute } from 'astro';
import type { HistoryAnswer } from '~/lib/api-types';
import { handle, json } from '~/server/http';
import { guardPage } from '~/server/pages';
import { listRevisions } from '~/server/revisions';

/** The history of a page, newest first. */
export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { page } = await guardPage(locals.user, params.venue, params.page, 'venue.read');
    const revisions = await listRevisions(page.id);
    return json<HistoryAnswer<Date>>({ page: { slug: page.slug, title: page.title, currentRevision: page.currentRevision }, revisions });
  });
