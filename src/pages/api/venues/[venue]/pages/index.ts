import type { APIRoute } from 'astro';
import type { PageSaved } from '~/lib/api-types';
import { PageCreateSchema } from '~/lib/schemas/page';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { createPage } from '~/server/pages';
import { listPages } from '~/server/venues';

export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'venue.read');
    const pages = await listPages(venue.id);
    return json({ pages });
  });

export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.edit');
    const input = parseWith(PageCreateSchema, await readJsonBody(request));
    const created = await createPage(venue.id, input, user);
    return json<PageSaved<Date>>(created, 201, { location: `/api/venues/${venue.slug}/pages/${created.page.slug}` });
  });
