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

async function send(method: 'POST' | 'PUT', url: string, body: unknown, pageUrl: (answer: { page?: { slug?: string } }) => string): Promise<SaveResult> {
  let res: Response;
  try {
    res = await fetch(url, { method, headers: { 'content-type': 'application/json', accept: 'application/json' }, body: JSON.stringify(body) });
  } catch {
    return { kind: 'error', message: OFFLINE };
  }
  const answer = await res.json().catch(() => ({}));
  if (res.ok) return { kind: 'ok', url: pageUrl(answer), revision: answer.revision?.number ?? 0 };
  if (res.status === 409 && answer.current) return { kind: 'conflict', current: answer.current as RevisionInfo };
  if (res.status === 401) return { kind: 'error', message: SIGNED_OUT };
  return { kind: 'error', message: answer.error ?? `The server answered ${res.status}. Your text is kept on this device.`, field: answer.field };
}

export function savePage(venue: string, page: string, body: { doc: PmNode; baseRevision: number; summary: string; title?: string; section?: string }) {
  return send('PUT', `/api/venues/${venue}/pages/${page}`, body, () => `/venues/${venue}/${page}`);
}

export function createPage(venue: string, body: { doc: PmNode; title: string; section: string; summary: string }) {
  return send('POST', `/api/venues/${venue}/pages`, body, (answer) => `/venues/${venue}/${answer.page?.slug ?? ''}`);
}
