import type { APIRoute } from 'astro';
import { z } from 'zod';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, readJsonBody } from '~/server/http';
import { setPageArchived } from '~/server/page-shelf';

const ArchiveSchema = z.object({ archived: z.boolean({ error: 'Send "archived" as true (archive the page) or false (restore it).' }) }).strict();

/** `{archived: true}` takes the page out of the book, history kept; false puts it back. Engineers and up. */
export const PUT: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardVenue(locals.principal, params.venue, 'page.edit');
    const { archived } = parseWith(ArchiveSchema, await readJsonBody(request));
    return json(await setPageArchived(venue.id, params.page, archived, user));
  });
