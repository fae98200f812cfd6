import { sql } from 'drizzle-orm';
import type { Db } from '~/db/client';
import { indexText } from '~/lib/search/normalise-terms';

/** Bump when indexText reads text differently: every row is then rewritten at the next start. */
export const SEARCH_INDEX_VERSION = 1;

type Runner = Pick<Db, 'all' | 'run'>;

const CURRENT_TEXT = sql`
  SELECT k.id AS rowid, p.title AS title, coalesce(r.plain_text, '') AS body
  FROM pages p
  JOIN page_search_keys k ON k.page_id = p.id
  LEFT JOIN revisions r ON r.page_id = p.id AND r.number = p.current_revision`;

interface Row {
  rowid: number;
  title: string;
  body: string;
}

async function writeRows(tx: Runner, rows: Row[]) {
  for (const r of rows) {
    await tx.run(sql`UPDATE pages_fts SET title = ${indexText(r.title)}, body = ${indexText(r.body)} WHERE rowid = ${r.rowid}`);
  }
}

/**
 * Rewrites one page's index row with the joined spellings. Call inside the writeTx that changed
 * the page's title or current revision, after the change (the triggers have written the raw text).
 */
export async function reindexPage(tx: Runner, pageId: string): Promise<void> {
  await writeRows(tx, await tx.all<Row>(sql`${CURRENT_TEXT} WHERE p.id = ${pageId}`));
}

/** At start-up: rebuilds every row when the index was written by an older reading (or by SQL only). */
export async function ensureSearchIndex(db: Db): Promise<void> {
  const [state] = await db.all<{ version: number }>(sql`SELECT version FROM search_index_state WHERE id = 1`);
  if (state && Number(state.version) >= SEARCH_INDEX_VERSION) return;
  await db.transaction(async (tx) => {
    const [again] = await tx.all<{ version: number }>(sql`SELECT version FROM search_index_state WHERE id = 1`);
    if (again && Number(again.version) >= SEARCH_INDEX_VERSION) return;
    await writeRows(tx, await tx.all<Row>(CURRENT_TEXT));
    await tx.run(sql`INSERT INTO search_index_state (id, version) VALUES (1, ${SEARCH_INDEX_VERSION})
      ON CONFLICT (id) DO UPDATE SET version = excluded.version`);
  });
}
