import type { APIRoute } from 'astro';
import { AuditQuerySchema } from '~/lib/schemas/people';
import { listAudit } from '~/server/audit';
import { guardVenue } from '~/server/guard';
import { handle, json, parseWith, searchParamsObject } from '~/server/http';

/** Audit events, newest first, 50 a page, filterable by `actor` (user id) and `kind`. */
export const GET: APIRoute = ({ locals, params, url }) =>
  handle(async () => {
    const { venue } = await guardVenue(locals.principal, params.venue, 'audit.read');
    const filter = parseWith(AuditQuerySchema, searchParamsObject(url));
    return json(await listAudit(venue.id, filter));
  });
