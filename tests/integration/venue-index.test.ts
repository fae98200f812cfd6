import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addBigVenue } from '../bench/big-venue';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { createClient } from '@libsql/client';
import { createTestPage, doc, para } from './pages-fixtures';

/** A venue of 1,700 pages in 8 sections (212 or 213 each): the home stays small, every page is reachable. */
let server: TestServer;
let manager: Client;
let viewer: Client;
let big: string;

beforeAll(async () => {
  server = await startServer();
  big = await addBigVenue(server.dbPath, DEMO.manager, 1700);
  manager = await signIn(server.url, DEMO.manager);
  viewer = await signIn(server.url, DEMO.viewer);
});
afterAll(() => server?.stop());

const html = async (who: Client, path: string) => {
  const res = await who.fetch(path);
  expect(res.status, path).toBe(200);
  return res.text();
};
// Links in the section lists only: the "Recent changes" box links recently saved pages as well.
const withoutRecent = (text: string) => text.replace(/<section[^>]*data-testid="recent-changes"[\s\S]*?<\/section>/, '');
const pageLinks = (text: string) => [...withoutRecent(text).matchAll(new RegExp(`href="/venues/${big}/(page-\\d+)"`, 'g'))].map((m) => m[1]);

describe('a venue of many pages', () => {
  it('the home shows the first 50 of each section and a link to all of them, with true totals', async () => {
    const text = await html(manager, `/venues/${big}`);
    expect(text).toContain('1700 pages');
    expect(pageLinks(text)).toHaveLength(8 * 50);
    expect(text).toMatch(/All 213 pages in Part 1/);
    expect(text).toContain(`href="/venues/${big}?section=part-0"`);
  });

  it('a section lists its pages 200 at a time; together the pages hold each page exactly once', async () => {
    const first = await html(manager, `/venues/${big}?section=part-0`);
    expect(pageLinks(first)).toHaveLength(200);
    expect(first).toMatch(/Page 1 of 2/);
    expect(first).toMatch(new RegExp(`href="/venues/${big}\\?section=part-0&(amp;|#38;)page=2"`));
    const second = await html(manager, `/venues/${big}?section=part-0&page=2`);
    expect(pageLinks(second)).toHaveLength(13);
    expect(second).toMatch(/Previous/);
    const all = [...pageLinks(first), ...pageLinks(second)];
    expect(new Set(all).size).toBe(213);
    // Section 0 holds every 8th page of the venue.
    expect(all.every((slug) => Number(slug.slice(5)) % 8 === 0)).toBe(true);
  });

  it.each([
    ['an unknown section', '?section=no-such-part', /There is no section “no-such-part” here/],
    ['a page number that is not one', '?section=part-1&page=abc', /Page 1 of 2/],
    ['a page past the end', '?section=part-1&page=9999', /No pages yet/],
    ['hostile text', `?section=${encodeURIComponent('"><script>x</script>')}`, /There is no section/],
  ])('%s: still the venue, never a 500', async (_name, query, expected) => {
    const text = await html(manager, `/venues/${big}${query}`);
    expect(text).toMatch(expected);
    expect(text).not.toContain('<script>x</script>');
  });

  it('a venue whose sections all fit their preview lists every live page, by section and title, as SQL sorts them', async () => {
    const { venues } = (await (await manager.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
    const small = venues.find((v) => v.slug !== big)!.slug;
    // Renamed after it was made, so its address sorts first and its title last.
    const extra = await createTestPage(manager, small, 'Aaa first by address', doc(para('shelf test')), 'stage');
    expect((await manager.sendJson('PUT', `/api/venues/${small}/pages/${extra.page.slug}`, { doc: doc(para('shelf test')), baseRevision: 1, title: 'Zzz last by title' })).status).toBe(200);
    const gone = await createTestPage(manager, small, 'Aab archived one', doc(para('shelf test')), 'stage');
    expect((await manager.sendJson('PUT', `/api/venues/${small}/pages/${gone.page.slug}/archived`, { archived: true })).status).toBe(200);
    const db = createClient({ url: `file:${server.dbPath}` });
    try {
      const rows = (
        await db.execute({
          sql: `select s.slug as section, p.slug from sections s join venues v on v.id = s.venue_id
                left join pages p on p.section_id = s.id and p.archived_at is null
                where v.slug = ? order by s.position, s.title, p.title, p.slug`,
          args: [small],
        })
      ).rows;
      const expected = new Map<string, string[]>();
      for (const r of rows) {
        const list = expected.get(String(r.section)) ?? [];
        if (r.slug !== null) list.push(String(r.slug));
        expected.set(String(r.section), list);
      }
      expect(Math.max(...[...expected.values()].map((l) => l.length))).toBeLessThanOrEqual(50);
      const text = withoutRecent(await html(manager, `/venues/${small}`));
      const shown = new Map(
        [...text.matchAll(/<section aria-labelledby="sec-([\w-]+)"[\s\S]*?<\/section>/g)].map((m) => [
          m[1],
          [...m[0].matchAll(new RegExp(`href="/venues/${small}/([\\w-]+)"`, 'g'))].map((l) => l[1]),
        ]),
      );
      expect(shown).toEqual(expected);
      expect(shown.get('stage')!.at(-1)).toBe(extra.page.slug);
      expect([...shown.values()].flat()).not.toContain(gone.page.slug);
      expect(text).not.toContain('data-testid="section-more"');
    } finally {
      db.close();
    }
  });

  it('a person who is not a member gets the 404, section or not', async () => {
    expect((await viewer.fetch(`/venues/${big}`)).status).toBe(404);
    expect((await viewer.fetch(`/venues/${big}?section=part-0`)).status).toBe(404);
  });

  it('"Recent changes" are the newest revisions of live pages, as a plain sort of every revision finds them', async () => {
    const a = await createTestPage(manager, big, 'Recent A', doc(para('one')), 'part-0');
    for (const [n, text] of [[1, 'two'], [2, 'three']] as const) {
      expect((await manager.sendJson('PUT', `/api/venues/${big}/pages/${a.page.slug}`, { doc: doc(para(text)), baseRevision: n })).status).toBe(200);
    }
    const b = await createTestPage(manager, big, 'Recent B', doc(para('only')), 'part-1');
    const db = createClient({ url: `file:${server.dbPath}` });
    // The reference: every revision of the venue's live pages, newest first (ties by page, number).
    const expected = async () =>
      (
        await db.execute({
          sql: `select p.slug, r.number from revisions r join pages p on p.id = r.page_id join venues v on v.id = p.venue_id
                where v.slug = ? and p.archived_at is null order by r.created_at desc limit 8`,
          args: [big],
        })
      ).rows.map((r) => `${r.slug}#${r.number}`);
    const shown = async () => {
      const box = (await html(manager, `/venues/${big}`)).match(/<section[^>]*data-testid="recent-changes"[\s\S]*?<\/section>/)![0];
      return [...box.matchAll(new RegExp(`href="/venues/${big}/([\\w-]+)">[^<]*</a> · revision (\\d+)`, 'g'))].map((m) => `${m[1]}#${m[2]}`);
    };
    try {
      const first = await shown();
      expect(first.slice(0, 4)).toEqual([`${b.page.slug}#1`, `${a.page.slug}#3`, `${a.page.slug}#2`, `${a.page.slug}#1`]);
      expect(new Set(first.slice(0, 4))).toEqual(new Set((await expected()).slice(0, 4)));
      expect(first).toHaveLength(8);
      // An archived page leaves the list and the counts.
      await db.execute({ sql: 'update pages set archived_at = ? where slug = ?', args: [Date.now(), a.page.slug] });
      const after = await shown();
      expect(after.some((x) => x.startsWith(`${a.page.slug}#`))).toBe(false);
      expect(after[0]).toBe(`${b.page.slug}#1`);
      expect(await html(manager, `/venues/${big}`)).toContain('1701 pages');
    } finally {
      await db.execute({ sql: 'update pages set archived_at = null where slug = ?', args: [a.page.slug] });
      db.close();
    }
  });

  it('a word on more than 1,000 pages is ranked among its newest 1,000, and says so; a rarer word is ranked whole', async () => {
    const db = createClient({ url: `file:${server.dbPath}` });
    try {
      // The reference, straight from the index: the newest 1,000 matches this manager may read,
      // then the best 20 of those by the same ranking.
      const managerId = String((await db.execute({ sql: 'select id from users where email = ?', args: [DEMO.manager] })).rows[0].id);
      const readable = 'p.venue_id in (select venue_id from memberships where user_id = ?) and p.archived_at is null';
      const newest = (
        await db.execute({
          sql: `select f.rowid as id from pages_fts f join page_search_keys k on k.id = f.rowid join pages p on p.id = k.page_id
                where f.pages_fts match 'stage' and ${readable} order by f.rowid desc limit 1000`,
          args: [managerId],
        })
      ).rows.map((r) => Number(r.id));
      expect(newest).toHaveLength(1000);
      const best = (
        await db.execute({
          sql: `select p.slug from pages_fts join page_search_keys k on k.id = pages_fts.rowid join pages p on p.id = k.page_id
                where pages_fts match 'stage' and pages_fts.rank match 'bm25(10.0, 1.0)' and pages_fts.rowid >= ? and ${readable}
                order by pages_fts.rank limit 20`,
          args: [Math.min(...newest), managerId],
        })
      ).rows.map((r) => String(r.slug));
      const answer = (await (await manager.fetch('/api/search?q=stage')).json()) as { hits: { page: { slug: string } }[]; recentOnly: boolean };
      expect(answer.recentOnly).toBe(true);
      expect(answer.hits.map((h) => h.page.slug)).toEqual(best);
      expect(await html(manager, '/search?q=stage')).toContain('data-testid="search-recent-only"');
      const rare = (await (await manager.fetch('/api/search?q=quokkaphone')).json()) as { recentOnly: boolean };
      expect(rare.recentOnly).toBe(false);
      expect(await html(manager, '/search?q=quokkaphone')).not.toContain('data-testid="search-recent-only"');
    } finally {
      db.close();
    }
  });

  it('the demo venue, with few pages, still lists every page on its home', async () => {
    const venue = ((await (await viewer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
    const { pages } = (await (await viewer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    const text = await html(viewer, `/venues/${venue}`);
    for (const p of pages) expect(text).toContain(`href="/venues/${venue}/${p.slug}"`);
    expect(text).not.toContain('data-testid="section-more"');
  });
});
