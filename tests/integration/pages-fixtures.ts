import { createClient } from '@libsql/client';
import type { PageJson, RevisionWithDoc } from '~/lib/api-types';
import type { PmNode } from '~/lib/doc/types';
import type { Client } from '../helpers/session';

/** Small builders and a read-only look into the server's database, shared by the page tests. */
export type Doc = PmNode;

export const para = (text: string, marks?: Doc['marks']): Doc => ({ type: 'paragraph', content: [{ type: 'text', text, ...(marks ? { marks } : {}) }] });
export const doc = (...content: Doc[]): Doc => ({ type: 'doc', content });

/** GET answers a revision with its document; POST's revision carries it too. */
export interface PageAnswer {
  page: PageJson;
  revision: RevisionWithDoc;
}

export async function getPage(client: Client, venue: string, page: string): Promise<PageAnswer> {
  const res = await client.fetch(`/api/venues/${venue}/pages/${page}`);
  if (res.status !== 200) throw new Error(`GET page ${venue}/${page}: ${res.status} ${await res.text()}`);
  return (await res.json()) as PageAnswer;
}

export async function createTestPage(client: Client, venue: string, title: string, body: Doc, section = 'stage'): Promise<PageAnswer> {
  const res = await client.sendJson('POST', `/api/venues/${venue}/pages`, { title, section, doc: body, summary: 'First version' });
  if (res.status !== 201) throw new Error(`create page: ${res.status} ${await res.text()}`);
  return (await res.json()) as PageAnswer;
}

/** Row counts and one page's pointer, read straight from the SQLite file the server writes. */
export async function snapshot(dbPath: string, pageSlug?: string) {
  const db = createClient({ url: `file:${dbPath}` });
  try {
    const count = async (table: string) => Number((await db.execute(`select count(*) as n from ${table}`)).rows[0].n);
    const page = pageSlug ? (await db.execute({ sql: 'select id, current_revision, title, updated_at from pages where slug = ?', args: [pageSlug] })).rows[0] : undefined;
    return {
      pages: await count('pages'),
      revisions: await count('revisions'),
      audit: await count('audit_events'),
      sections: await count('sections'),
      page: page ? { currentRevision: Number(page.current_revision), title: String(page.title), updatedAt: Number(page.updated_at) } : undefined,
    };
  } finally {
    db.close();
  }
}

export async function auditActions(dbPath: string, targetSlug: string): Promise<string[]> {
  const db = createClient({ url: `file:${dbPath}` });
  try {
    const { rows } = await db.execute({ sql: "select action from audit_events where json_extract(detail, '$.slug') = ? order by created_at, rowid", args: [targetSlug] });
    return rows.map((r) => String(r.action));
  } finally {
    db.close();
  }
}
