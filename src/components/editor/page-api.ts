import type { PmNode } from '~/lib/doc/types';

/** The revision that won when a save is refused with 409, as the server sends it. */
export interface RevisionInfo {
  number: number;
  doc: PmNode;
  summary: string;
  author: { id: string | null; name: string };
  createdAt: string;
}

export type SaveResult =
  | { kind: 'ok'; url: string; revision: number }
  | { kind: 'conflict'; current: RevisionInfo }
  | { kind: 'error'; message: string; field?: string };

const OFFLINE = 'Could not reach Throwline. Your text is kept on this device; save again when the connection is back.';
const SIGNED_OUT = 'Your session has ended. Sign in again in another tab, then press Save here: your text is kept on this device.';

let lastSave: { fingerprint: string; key: string } | null = null;

/**
 * One key per save attempt: pressing Save again with the same text on the same base after a lost
 * answer sends the same key, so a save that had landed answers with its revision, not a 409.
 */
function idempotencyKeyFor(fingerprint: string): string {
  if (lastSave?.fingerprint !== fingerprint) lastSave = { fingerprint, key: crypto.randomUUID() };
  return lastSave.key;
}

async function send(method: 'POST' | 'PUT', url: string, body: unknown, pageUrl: (answer: { page?: { slug?: string } }) => string, key?: string): Promise<SaveResult> {
  let res: Response;
  const headers: Record<string, string> = { 'content-type': 'application/json', accept: 'application/json', ...(key ? { 'idempotency-key': key } : {}) };
  const text = JSON.stringify(body);
  try {
    res = await fetch(url, { method, headers, body: text });
  } catch {
    // With a key a retry is safe whether or not the first attempt landed: try once more at once.
    if (!key) return { kind: 'error', message: OFFLINE };
    try {
      res = await fetch(url, { method, headers, body: text });
    } catch {
      return { kind: 'error', message: OFFLINE };
    }
  }
  const answer = await res.json().catch(() => ({}));
  if (res.ok) return { kind: 'ok', url: pageUrl(answer), revision: answer.revision?.number ?? 0 };
  if (res.status === 409 && answer.current) return { kind: 'conflict', current: answer.current as RevisionInfo };
  if (res.status === 401) return { kind: 'error', message: SIGNED_OUT };
  return { kind: 'error', message: answer.error ?? `The server answered ${res.status}. Your text is kept on this device.`, field: answer.field };
}

export function savePage(venue: string, page: string, body: { doc: PmNode; baseRevision: number; summary: string; title?: string; section?: string }) {
  const url = `/api/venues/${venue}/pages/${page}`;
  return send('PUT', url, body, () => `/venues/${venue}/${page}`, idempotencyKeyFor(url + JSON.stringify(body)));
}

export function createPage(venue: string, body: { doc: PmNode; title: string; section: string; summary: string }) {
  return send('POST', `/api/venues/${venue}/pages`, body, (answer) => `/venues/${venue}/${answer.page?.slug ?? ''}`);
}
