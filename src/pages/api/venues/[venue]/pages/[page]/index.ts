import type { APIRoute } from 'astro';
import type { PageAnswer, PageSaved } from '~/lib/api-types';
import { PageSaveSchema } from '~/lib/schemas/page';
import { handle, idempotencyKey, json, parseWith, readJsonBody } from '~/server/http';
import { guardPage, loadPageWithCurrent, pageJson } from '~/server/pages';
import { authorJson, revisionJson } from '~/server/revision-json';
import { saveRevision } from '~/server/revisions';

export const GET: APIRoute = ({ locals, params }) =>
  handle(async () => {
    const { page, section, revision } = await guardPage(locals.principal, params.venue, params.page, 'venue.read', loadPageWithCurrent);
    return json<PageAnswer<Date>>({
      page: pageJson(page, section),
      revision: revision ? revisionJson(revision, authorJson(revision.authorId, revision.authorName), revision.doc) : null,
    });
  });

/**
 * Saves on top of `baseRevision`; 409 with the current revision when someone saved first. An
 * `Idempotency-Key` header makes a retry of a save that landed answer 200 with its revision.
 */
export const PUT: APIRoute = ({ locals, params, request }) =>
  handle(async () => {
    const { venue, user } = await guardPage(locals.principal, params.venue, params.page, 'page.edit');
    const key = idempotencyKey(request);
    const input = parseWith(PageSaveSchema, await readJsonBody(request));
    const saved = await saveRevision(venue.id, params.page, input, user, key);
    return json<PageSaved<Date>>(saved);
  });
