import type { APIRoute } from 'astro';
import { isGuest } from '~/lib/permissions';
import { SinceSchema } from '~/lib/schemas/people';
import { changesSince } from '~/server/changes';
import { guardAdvanceReader } from '~/server/guard';
import { handle, HttpError, json, parseWith, searchParamsObject } from '~/server/http';
import { lastVisitOf } from '~/server/members';

/**
 * Revisions since `since` (ISO 8601), per page. Without `since` a member gets the changes since
 * their last visit; a guest sees only the advance pages and must give a date.
 */
export const GET: APIRoute = ({ locals, params, url }) =>
  handle(async () => {
    const { venue, principal } = await guardAdvanceReader(locals.principal, params.venue);
    const { since } = parseWith(SinceSchema, searchParamsObject(url));
    const guest = isGuest(principal);
    let from = since ? new Date(since) : guest ? null : await lastVisitOf(venue.id, principal.id);
    if (!from && guest) throw new HttpError(400, 'Give "since" as a date, e.g. ?since=2026-11-01.', 'since');
    from ??= new Date(0);
    // Members read the whole venue; a guest only the pages on the sheet.
    const advanceOnly = guest;
    return json(await changesSince(venue.id, from, advanceOnly));
  });
