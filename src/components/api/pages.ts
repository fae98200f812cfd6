import type { PageAnswer, PageSaved, RevisionWithDoc, SaveConflictBody } from '~/lib/api-types';
import type { PmNode } from '~/lib/doc/types';
import { ApiError, request, UNREACHABLE, venueApi } from './client';

/** The revision the editor started from, or the one that won when a save was refused with 409. */
export type CurrentRevision = Pick<RevisionWithDoc, 'number' | 'doc' | 'summary' | 'author' | 'createdAt'>;

export type SaveResult =
  | { kind: 'ok'; url: string; revision: number }
  | { kind: 'conflict'; current: CurrentRevision }
  | { kind: 'error'; message: string; field?: string };

const OFFLINE = 'Could not reach Throwline. Your text is kept on this device; save again when the connection is back.';
const SIGNED_OUT = 'Your session has ended. Sign in again in another tab, then press Save here: your text is kept on this device.';

/** A save's outcome as the editor shows it: the page, the revision that won, or a sentence. */
async function save(send: () => Promise<PageSaved>, venue: string): Promise<SaveResult> {
  try {
    const answer = await send();
    return { kind: 'ok', url: `/venues/${venue}/${answer.page.slug}`, revision: answer.revision.number };
  } catch (err) {
    if (!(err instanceof ApiError)) throw err;
    const current = (err.body as Partial<SaveConflictBody>).current;
    if (err.status === 409 && current) return { kind: 'conflict', current };
    if (err.status === UNREACHABLE) return { kind: 'error', message: OFFLINE };
    if (err.status === 401) return { kind: 'error', message: SIGNED_OUT };
    return { kind: 'error', message: err.error, field: err.field };
  }
}

const fallback = (status: number) => `The server answered ${status}. Your text is kept on this device.`;

export function pageApi(venue: string, page: string): string {
  return `${venueApi(venue)}/pages/${encodeURIComponent(page)}`;
}

let lastSave: { fingerprint: string; key: string } | null = null;

/**
 * One key per save attempt: pressing Save again with the same text on the same base after a lost
 * answer sends the same key, so a save that had landed answers with its revision, not a 409.
 */
function idempotencyKeyFor(fingerprint: string): string {
  if (lastSave?.fingerprint !== fingerprint) lastSave = { fingerprint, key: crypto.randomUUID() };
  return lastSave.key;
}

export function savePage(venue: string, page: string, body: { doc: PmNode; baseRevision: number; summary: string; title?: string; section?: string }) {
  const url = pageApi(venue, page);
  // With a key a retry is safe whether or not the first attempt landed: try once more at once.
  const headers = { 'idempotency-key': idempotencyKeyFor(url + JSON.stringify(body)) };
  return save(() => request<PageSaved>(url, { method: 'PUT', body, fallback, unreachable: OFFLINE, headers, retryUnreachable: true }), venue);
}

export function createPage(venue: string, body: { doc: PmNode; title: string; section: string; summary: string }) {
  return save(() => request<PageSaved>(`${venueApi(venue)}/pages`, { method: 'POST', body, fallback, unreachable: OFFLINE }), venue);
}

/** GET /api/venues/:venue/pages: the venue's pages, slug and title first. */
export async function listPages(venue: string): Promise<{ slug: string; title: string }[]> {
  return (await request<{ pages: { slug: string; title: string }[] }>(`${venueApi(venue)}/pages`)).pages;
}

/** GET /api/venues/:venue/pages/:page: the page with its current revision and document. */
export function getPage(venue: string, page: string): Promise<PageAnswer> {
  return request<PageAnswer>(pageApi(venue, page));
}

/** PUT: a new revision on top of `baseRevision`; refused with an ApiError (409 when someone saved first). */
export function putPage(venue: string, page: string, body: { doc: PmNode; baseRevision: number; summary: string }): Promise<PageSaved> {
  return request<PageSaved>(pageApi(venue, page), { method: 'PUT', body });
}
