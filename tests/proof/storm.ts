import { createClient } from '@libsql/client';
import { signIn, type Client } from '../helpers/session';
import { DEMO } from '../helpers/paths';

export interface StormResult {
  clients: number;
  pages: number;
  seconds: number;
  saves: number;
  conflicts: number;
  lost: number;
  brokenChains: number;
  mismatched: number;
  duplicates: number;
}

const docOf = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

/**
 * Eight people saving five pages as fast as they can, each save on the revision it last saw, a
 * 409 answered by saving again on the winner. Then, straight from the SQLite file: every
 * acknowledged revision is stored with exactly the document sent, chains run 1..current.
 */
export async function editStorm(url: string, dbPath: string, venue: string, seconds: number): Promise<StormResult> {
  const who = [DEMO.engineer, DEMO.manager, DEMO.admin, DEMO.engineer, DEMO.manager, DEMO.admin, DEMO.engineer, DEMO.manager];
  const clients: Client[] = [];
  for (const email of who) clients.push(await signIn(url, email));
  const slugs: string[] = [];
  for (let i = 0; i < 5; i++) {
    const res = await clients[0].sendJson('POST', `/api/venues/${venue}/pages`, { title: `Storm ${i} ${Date.now()}`, section: 'stage', doc: docOf('start') });
    slugs.push(((await res.json()) as { page: { slug: string } }).page.slug);
  }
  const acked = new Map<string, string>();
  let duplicates = 0;
  let conflicts = 0;
  const until = Date.now() + seconds * 1000;
  await Promise.all(
    clients.map(async (client, c) => {
      const base = new Map(slugs.map((s) => [s, 1]));
      for (let k = 0; Date.now() < until; k++) {
        const slug = slugs[(c + k) % slugs.length];
        const text = `client ${c} save ${k} on ${slug}`;
        const res = await client.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, { baseRevision: base.get(slug), doc: docOf(text) });
        const body = (await res.json()) as { revision?: { number: number }; current?: { number: number } };
        if (res.status === 200 && body.revision) {
          const key = `${slug}#${body.revision.number}`;
          if (acked.has(key)) duplicates++;
          acked.set(key, JSON.stringify(docOf(text)));
          base.set(slug, body.revision.number);
        } else if (res.status === 409 && body.current) {
          conflicts++;
          base.set(slug, body.current.number);
        } else throw new Error(`storm save answered ${res.status}`);
      }
    }),
  );
  const db = createClient({ url: `file:${dbPath}` });
  let lost = 0;
  let mismatched = 0;
  let brokenChains = 0;
  try {
    for (const slug of slugs) {
      const page = (await db.execute({ sql: 'SELECT id, current_revision FROM pages WHERE slug = ?', args: [slug] })).rows[0];
      const numbers = (await db.execute({ sql: 'SELECT number FROM revisions WHERE page_id = ? ORDER BY number', args: [page.id] })).rows.map((r) => Number(r.number));
      const current = Number(page.current_revision);
      if (numbers.length !== current || numbers.some((n, i) => n !== i + 1)) brokenChains++;
    }
    for (const [key, sent] of acked) {
      const [slug, n] = key.split('#');
      const row = (await db.execute({ sql: 'SELECT r.doc FROM revisions r JOIN pages p ON p.id = r.page_id WHERE p.slug = ? AND r.number = ?', args: [slug, Number(n)] })).rows[0];
      if (!row) lost++;
      else if (JSON.stringify(JSON.parse(String(row.doc))) !== sent) mismatched++;
    }
  } finally {
    db.close();
  }
  return { clients: clients.length, pages: slugs.length, seconds, saves: acked.size, conflicts, lost, brokenChains, mismatched, duplicates };
}
