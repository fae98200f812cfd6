import { copyFileSync, mkdtempSync } from 'node:fs';
import { join } from 'node:path';
import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { createTestPage, doc, para } from './pages-fixtures';
import type { SearchHit as Hit } from '~/lib/api-types';

// Invented model names and a made-up marker word per page, so the demo pages never interfere.
const PAGES = [
  ['Bar network', 'Guest Wi-Fi is "Brindle-Guest"; the desk network is wired. Marker vexquill.'],
  ['Stage power', 'Stage left has a 63 A three-phase and two 32A commandos. Marker vexquill.'],
  ['Noise agreement', 'The council limit is 98 dB(A) over 15 minutes at the mix position. Marker vexquill.'],
  ['Late licence', 'After 23:00 keep it under 92dBA, and bass under 105 dBC. Marker vexquill.'],
  ['Monitor world', 'Wedges run off the QX-220 rack mixer through a KV-40-S split. Marker vexquill.'],
  ['Delay towers', 'Phantom 48V on all inputs; cabs are 8 Ω; fills delayed 12 milliseconds. Marker vexquill.'],
] as const;

let server: TestServer;
let engineer: Client;
let venue: string;

async function titles(who: Client, q: string): Promise<string[]> {
  const res = await who.fetch(`/api/search?q=${encodeURIComponent(q)}&limit=50`);
  expect(res.status).toBe(200);
  return ((await res.json()) as { hits: Hit[] }).hits.map((h) => h.page.title).sort();
}

async function hits(who: Client, q: string): Promise<Hit[]> {
  return ((await (await who.fetch(`/api/search?q=${encodeURIComponent(q)}&limit=50`)).json()) as { hits: Hit[] }).hits;
}

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  for (const [title, text] of PAGES) await createTestPage(engineer, venue, title, doc(para(text)));
});
afterAll(() => server?.stop());

describe('search finds the trade’s own spellings', () => {
  it.each([
    ['wifi', ['Bar network']],
    ['WiFi', ['Bar network']],
    ['wi-fi', ['Bar network']],
    ['brindle guest', ['Bar network']],
    ['brindleguest', ['Bar network']],
    ['63A', ['Stage power']],
    ['63 A', ['Stage power']],
    ['63 amps', ['Stage power']],
    ['32 A', ['Stage power']],
    ['db limit', ['Noise agreement']],
    ['dBA', ['Late licence', 'Noise agreement']],
    ['dB(A)', ['Late licence', 'Noise agreement']],
    ['98 dBA', ['Noise agreement']],
    ['92 dB(A)', ['Late licence']],
    ['db', ['Late licence', 'Noise agreement']],
    ['qx220', ['Monitor world']],
    ['QX 220', ['Monitor world']],
    ['kv40s', ['Monitor world']],
    ['kv-40', ['Monitor world']],
    ['48 V', ['Delay towers']],
    ['8 ohms', ['Delay towers']],
    ['12ms', ['Delay towers']],
  ])('%j finds %j', async (q, expected) => {
    // The demo pages use these spellings too: the marker word keeps the answer to this file's pages.
    expect(await titles(engineer, `vexquill ${q}`)).toEqual(expected);
    // And without it, the demo's own pages are found beside them.
    expect(await titles(engineer, q)).toEqual(expect.arrayContaining(expected));
  });

  it('marks the spelling the page uses, not the one typed, and names venue and section', async () => {
    const [wifi] = await hits(engineer, 'vexquill wifi');
    expect(wifi.snippetParts.filter((p) => p.match).map((p) => p.text)).toEqual(['Wi-Fi', 'vexquill']);
    expect(wifi.snippet).toContain('<mark>Wi-Fi</mark>');
    expect(wifi.snippet).toContain('&quot;Brindle-Guest&quot;');
    expect(wifi.venue.slug).toBe(venue);
    expect(wifi.section.slug).toBe('stage');
    const [power] = await hits(engineer, 'vexquill 63a');
    expect(power.snippetParts.filter((p) => p.match).map((p) => p.text)).toEqual(['63 A', 'vexquill']);
    const [noise] = await hits(engineer, 'vexquill dba limit');
    expect(noise.snippetParts.filter((p) => p.match).map((p) => p.text)).toEqual(['limit', 'dB(A)', 'vexquill']);
  });

  it('the index follows a save: the new spelling is found, the old one is gone', async () => {
    const made = await createTestPage(engineer, venue, 'Spare desk', doc(para('The spare is a QX-110.')));
    expect(await titles(engineer, 'qx110')).toEqual(['Spare desk']);
    const saved = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${made.page.slug}`, { doc: doc(para('The spare is a ZR-7 now.')), baseRevision: 1 });
    expect(saved.status).toBe(200);
    expect(await titles(engineer, 'qx110')).toEqual([]);
    expect(await titles(engineer, 'zr7')).toEqual(['Spare desk']);
  });
});

describe('the results page', () => {
  it('pages through the matches with next and previous links', async () => {
    // 25 pages share the marker word: one full page of 20, then 5.
    for (let i = 0; i < 19; i++) await createTestPage(engineer, venue, `Paging ${i}`, doc(para('Marker vexquill for paging.')));
    const first = await (await engineer.fetch('/search?q=vexquill')).text();
    expect(first).toMatch(/Matches 1–20, best first/);
    expect(first).toMatch(/rel="next" href="\/search\?q=vexquill&(amp|#38);page=2"/);
    expect(first).not.toContain('rel="prev"');
    const second = await (await engineer.fetch('/search?q=vexquill&page=2')).text();
    expect(second).toMatch(/Matches 21–25, best first/);
    expect(second).toContain('rel="prev"');
    expect(second).not.toContain('rel="next"');
    expect(second).toContain('<ol class="mt-2 divide-y divide-line" data-testid="search-hits" start="21"');
  });

  it.each(['0', '-3', 'abc', '99999999999999999999', '1e3', ''])('a page number of %j is read as one in range, never an error', async (n) => {
    const res = await engineer.fetch(`/search?q=vexquill&page=${encodeURIComponent(n)}`);
    expect(res.status).toBe(200);
    expect(await res.text()).toMatch(/Matches \d+–\d+|No more matches/);
  });

  it('says so when nothing matches, and offers another spelling', async () => {
    const html = await (await engineer.fetch('/search?q=zzqxnothing')).text();
    expect(html).toMatch(/No page you may read matches these words/);
    expect(html).not.toContain('data-testid="search-hits"');
  });
});

describe('a database indexed before the trade’s spellings', () => {
  it('is rebuilt at start, so pages saved before the upgrade are found by the new spellings', async () => {
    const dir = mkdtempSync(join(TMP_ROOT, 'reindex-'));
    const dbPath = join(dir, 'old.db');
    copyFileSync(TEMPLATE_DB, dbPath);
    const db = createClient({ url: `file:${dbPath}` });
    // As the SQL-only index left it: raw text in every row, and no reading recorded.
    await db.execute("UPDATE revisions SET plain_text = plain_text || ' Old note: Wi-Fi QX-330.' WHERE page_id = (SELECT id FROM pages ORDER BY created_at LIMIT 1) AND number = (SELECT current_revision FROM pages ORDER BY created_at LIMIT 1)");
    await db.execute(`DELETE FROM pages_fts`);
    await db.execute(`INSERT INTO pages_fts(rowid, title, body) SELECT k.id, p.title, coalesce(r.plain_text, '') FROM pages p JOIN page_search_keys k ON k.page_id = p.id LEFT JOIN revisions r ON r.page_id = p.id AND r.number = p.current_revision`);
    await db.execute('UPDATE search_index_state SET version = 0');
    db.close();
    const old = await startServer({ DATABASE_URL: `file:${dbPath}` });
    try {
      const admin = await signIn(old.url, DEMO.admin);
      expect(await titles(admin, 'qx330')).toHaveLength(1);
      expect(await titles(admin, 'wifi')).not.toHaveLength(0);
    } finally {
      await old.stop();
    }
  });
});
