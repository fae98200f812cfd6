import type { APIRoute } from 'astro';
import { SectionUpdateSchema } from '~/lib/schemas/page';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { deleteSection, updateSection } from '~/server/page-sections';

/** Rename `{title}` and/or move `{move: "up" | "down"}` one section. */
export const PATCH: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.edit');
    const input = parseWith(SectionUpdateSchema, await readJsonBody(request));
    return json({ section: await updateSection(venue.id, params.section, input, user) });
  });

/** Removes an empty section; 409 while pages are still in it. */
export const DELETE: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.edit');
    await deleteSection(venue.id, params.section, user);
    return new Response(null, { status: 204 });
  });
