import type { APIRoute } from 'astro';
import type { SectionsAnswer } from '~/lib/api-types';
import { SectionCreateSchema } from '~/lib/schemas/page';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { createSection, listSectionsWithCounts } from '~/server/page-sections';

export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'venue.read');
    return json<SectionsAnswer>({ sections: await listSectionsWithCounts(venue.id) });
  });

export const POST: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.edit');
    const input = parseWith(SectionCreateSchema, await readJsonBody(request));
    return json({ section: await createSection(venue.id, input, user) }, 201);
  });
