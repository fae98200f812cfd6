import type { APIRoute } from 'astro';
import type { SearchAnswer } from '~/lib/api-types';
import { SearchQuerySchema } from '~/lib/schemas/page';
import { requireUser } from '~/server/guard';
import { handle, json, parseWith, searchParamsObject } from '~/server/http';
import { searchPages } from '~/server/page-search';

/** Hits across the pages this person may read: venue, page, section and a marked snippet. */
export const GET: APIRoute = ({ locals, url }) =>
  handle(async () => {
    const user = requireUser(locals.principal);
    const { q, limit } = parseWith(SearchQuerySchema, searchParamsObject(url));
    const { hits, recentOnly } = await searchPages(user, q, limit);
    return json<SearchAnswer<Date>>({ q, hits, recentOnly });
  });
