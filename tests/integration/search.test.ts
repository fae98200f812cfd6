import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';
import { createTestPage, doc, para } from './pages-fixtures';
import type { SearchHit as Hit } from '~/lib/api-types';

let server: TestServer;
const as: Record<keyof typeof DEMO, Client> = {} as never;
let mainVenue: string;
let otherVenue: string;


async function search(who: Client, q: string): Promise<{ status: number; hits: Hit[]; raw: string }> {
  const res = await who.fetch(`/api/search?q=${encodeURIComponent(q)}`);
  const raw = await res.text();
  return { status: res.status, hits: res.status === 200 ? (JSON.parse(raw).hits as Hit[]) : [], raw };
}

beforeAll(async () => {
  server = await startServer();
  for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) as[who] = await signIn(server.url, DEMO[who]);
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  mainVenue = mine.venues[0].slug;
  const all = (await (await as.admin.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  otherVenue = all.venues.find((v) => v.slug !== mainVenue)!.slug;

  // One made-up word in each venue, plus a title match and a body match for ranking.
  await createTestPage(as.engineer, mainVenue, 'Quokkaphone patch', doc(para('The stage left rack.')));
  await createTestPage(as.engineer, mainVenue, 'Loading dock', doc(para('Ask for the quokkaphone key at the door. <img src=x onerror=alert(1)> stays text.')));
  // Made by the admin: the seed's second-venue manager may not be a member there.
  await createTestPage(as.admin, otherVenue, 'Secret annex', doc(para('The zebrafinch cable lives in the other venue only.')));
  await createTestPage(as.engineer, mainVenue, 'Zebrafinch spares', doc(para('Visible spares list.')));
});
afterAll(() => server?.stop());

describe('GET /api/search', () => {
  it('401 when signed out', async () => {
    expect((await anonymous(server.url).fetch('/api/search?q=stage')).status).toBe(401);
  });

  it('finds pages by title and current text, with the match marked in a safe snippet', async () => {
    const { status, hits } = await search(as.viewer, 'quokkaphone');
    expect(status).toBe(200);
    expect(hits.map((h) => h.page.title)).toEqual(['Quokkaphone patch', 'Loading dock']);
    const body = hits[1];
    expect(body.snippet).toContain('<mark>quokkaphone</mark>');
    expect(body.snippet).toContain('&lt;img src=x onerror=alert(1');
    expect(body.snippet).not.toContain('<img');
    expect(body.snippetParts.filter((p) => p.match).map((p) => p.text)).toEqual(['quokkaphone']);
    expect(hits[0].titleParts).toContainEqual({ text: 'Quokkaphone', match: true });
    expect(body.url).toBe(`/venues/${mainVenue}/${body.page.slug}`);
  });

  it('ranks a title match above a body match', async () => {
    const { hits } = await search(as.engineer, 'quokkaphone');
    expect(hits[0].page.title).toBe('Quokkaphone patch');
  });

  it('matches the last word as a prefix, for results while typing', async () => {
    const { hits } = await search(as.engineer, 'quokkaph');
    expect(hits.length).toBe(2);
  });

  it('a page of a venue the person cannot read never appears, not even as a count', async () => {
    const engineer = await search(as.engineer, 'zebrafinch');
    expect(engineer.hits.map((h) => h.page.title)).toEqual(['Zebrafinch spares']);
    expect(engineer.raw).not.toContain('Secret annex');
    expect(engineer.raw).not.toContain(otherVenue);
    // recentOnly counts readable matches only (tests/integration/venue-index.test.ts checks it).
    expect(Object.keys(JSON.parse(engineer.raw)).sort()).toEqual(['hits', 'q', 'recentOnly']);
    expect(JSON.parse(engineer.raw).recentOnly).toBe(false);
    const viewer = await search(as.viewer, 'zebrafinch cable');
    expect(viewer.hits).toEqual([]);
    const other = await search(as.otherManager, 'zebrafinch');
    expect(other.hits.map((h) => h.venue.slug)).not.toContain(mainVenue);
    const admin = await search(as.admin, 'zebrafinch');
    expect(admin.hits.map((h) => h.page.title).sort()).toEqual(['Secret annex', 'Zebrafinch spares']);
  });

  it('search follows saves and restores: only the current text is indexed', async () => {
    const created = await createTestPage(as.engineer, mainVenue, 'Moving words', doc(para('The wombatrix is here.')));
    const slug = created.page.slug;
    expect((await search(as.engineer, 'wombatrix')).hits).toHaveLength(1);
    const saved = await as.engineer.sendJson('PUT', `/api/venues/${mainVenue}/pages/${slug}`, { doc: doc(para('Now the narwhalix.')), baseRevision: 1 });
    expect(saved.status).toBe(200);
    expect((await search(as.engineer, 'wombatrix')).hits).toHaveLength(0);
    expect((await search(as.engineer, 'narwhalix')).hits).toHaveLength(1);
    const restored = await as.engineer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions/1/restore`, { method: 'POST' });
    expect(restored.status).toBe(201);
    expect((await search(as.engineer, 'wombatrix')).hits).toHaveLength(1);
    expect((await search(as.engineer, 'narwhalix')).hits).toHaveLength(0);
  });

  describe('user input never breaks the query', () => {
    it.each([
      "' OR 1=1--",
      'quokkaphone OR 1=1--',
      'NEAR',
      'NEAR(quokkaphone patch, 2)',
      '*',
      '-',
      '-quokkaphone',
      '"unbalanced',
      'quokka"phone',
      '""',
      'title:quokkaphone',
      '{title body}: x',
      '^quokkaphone',
      'a AND',
      'AND OR NOT',
      'quokkaphone*',
      '(((',
      '\u0002mark\u0003',
      '🎛️ fader',
      'x'.repeat(200),
    ])('%j is searched as text: 200, never a 500', async (q) => {
      const { status, hits } = await search(as.engineer, q);
      expect(status).toBe(200);
      expect(Array.isArray(hits)).toBe(true);
    });

    it('an injection attempt matches nothing rather than everything', async () => {
      expect((await search(as.engineer, "zzqx' OR 1=1--")).hits).toEqual([]);
      expect((await search(as.engineer, 'zzqx OR quokkaphone')).hits).toEqual([]);
    });

    it('an operator word is a word: "quokkaphone NOT" finds nothing, because no page says "not" next to it', async () => {
      const plain = await search(as.engineer, 'quokkaphone');
      const withNot = await search(as.engineer, 'quokkaphone NOT');
      expect(plain.hits.length).toBeGreaterThan(0);
      expect(withNot.hits.length).toBeLessThanOrEqual(plain.hits.length);
    });

    it('a query over 200 characters is a 400 with a sentence; a missing q is a 400', async () => {
      const long = await as.engineer.fetch(`/api/search?q=${'y'.repeat(201)}`);
      expect(long.status).toBe(400);
      expect(((await long.json()) as { error: string }).error).toMatch(/under 200 characters/);
      const missing = await as.engineer.fetch('/api/search');
      expect(missing.status).toBe(400);
    });
  });
});

describe('short prefixes', () => {
  it('one or two letters match whole words only, never every word that starts with them', async () => {
    // "z" and "ze" would prefix-match "zebrafinch"; as whole words no page says either.
    expect((await search(as.engineer, 'z')).hits).toEqual([]);
    expect((await search(as.engineer, 'ze')).hits).toEqual([]);
    expect((await search(as.engineer, 'zeb')).hits.map((h) => h.page.title)).toContain('Zebrafinch spares');
  });
});

describe('GET /search, the results page', () => {
  const page = async (who: Client, q: string) => {
    const res = await who.fetch(`/search?q=${encodeURIComponent(q)}`);
    return { status: res.status, html: await res.text(), location: res.headers.get('location') };
  };

  it('sends a signed-out person to sign in, and back here after', async () => {
    const res = await anonymous(server.url).fetch('/search?q=quokkaphone', { redirect: 'manual' });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`/signin?next=${encodeURIComponent('/search?q=quokkaphone')}`);
  });

  it('lists every readable match server-rendered, with the venue named and matches marked as text', async () => {
    const { status, html } = await page(as.viewer, 'quokkaphone');
    expect(status).toBe(200);
    expect(html).toContain('data-testid="search-hits"');
    expect(html).toMatch(/<mark[^>]*>Quokkaphone<\/mark>/);
    expect(html).toContain(`href="/venues/${mainVenue}/`);
    expect(html).toContain('&lt;img src=x onerror=alert(1');
    expect(html).not.toContain('<img src=x');
    expect(html).toMatch(/2 pages/);
    // The query is echoed into both fields, escaped.
    expect(html).toContain('value="quokkaphone"');
  });

  it('never lists another venue’s page', async () => {
    const { html } = await page(as.viewer, 'zebrafinch');
    expect(html).not.toContain('Secret annex');
    expect(html).toMatch(/Zebrafinch<\/mark> spares/);
    const admin = await page(as.admin, 'zebrafinch');
    expect(admin.html).toContain('Secret annex');
  });

  it('asks for three letters rather than searching one or two', async () => {
    const { status, html } = await page(as.viewer, 'qu');
    expect(status).toBe(200);
    expect(html).toMatch(/Type 3 letters or more/);
    expect(html).not.toContain('Quokkaphone patch</a>');
  });

  it.each(['"><script>alert(1)</script>', "' OR 1=1--", 'x'.repeat(500), '\u0002mark\u0003'])('%j: a page, never a 500, nothing unescaped', async (q) => {
    const { status, html } = await page(as.viewer, q);
    expect(status).toBe(200);
    // Echoed only inside the fields' value attributes, with the quote escaped.
    expect(html).not.toContain('"><script>alert(1)');
  });

  it('the header carries a plain search form to this page, and no React for it', async () => {
    const { html } = await page(as.viewer, 'quokkaphone');
    expect(html).toMatch(/<form action="\/search" method="get" role="search"/);
    expect(html).not.toContain('astro-island');
  });
});

describe('words every object answers to', () => {
  // A lookup table built as an object literal once answered "constructor" with a function, and
  // saving a page with the word in it failed while indexing.
  it('a page about the constructor of a truss, with toString and __proto__ in it, saves and is found', async () => {
    const made = await createTestPage(as.engineer, mainVenue, 'Truss constructor notes', doc(para('The constructor signed 5 valueOf 5constructor; toString and __proto__ are plain words.')));
    expect(made.page.slug).toBeTruthy();
    for (const q of ['constructor', 'valueof', 'tostring', 'proto']) {
      const { status, hits } = await search(as.engineer, q);
      expect(status).toBe(200);
      expect(hits.map((h) => h.page.title)).toContain('Truss constructor notes');
    }
    const { hits } = await search(as.engineer, 'constructor');
    expect(hits.find((h) => h.page.title === 'Truss constructor notes')!.snippetParts.filter((p) => p.match).map((p) => p.text)).toEqual(['constructor']);
  });
});

describe('the search thread', () => {
  it('does the marking too: the built server never falls back to the event loop', async () => {
    expect((await search(as.engineer, 'quokkaphone')).hits.length).toBeGreaterThan(0);
    expect(server.output()).not.toContain('search runs on the event loop');
  });

  // Linux only: /proc names each thread and its nice value (field 19 of its stat line).
  const linux = process.platform === 'linux';
  it.runIf(linux)('runs at the lowest CPU priority, so searching never outruns the other requests', async () => {
    expect((await search(as.engineer, 'quokkaphone')).status).toBe(200);
    const { readdirSync, readFileSync } = await import('node:fs');
    const { execFileSync } = await import('node:child_process');
    const { SEARCH_NICENESS } = await import('~/server/search-reader');
    const workers = execFileSync('ps', ['-o', 'pid=', '--ppid', String(server.pid)], { encoding: 'utf8' }).split('\n').map((s) => s.trim()).filter(Boolean);
    const niceness = workers.flatMap((pid) =>
      readdirSync(`/proc/${pid}/task`).map((tid) => Number(readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8').split(') ')[1].split(' ')[16])),
    );
    // Exactly one thread (the search worker) lowered; the event loop and the rest untouched.
    expect(niceness.filter((n) => n === SEARCH_NICENESS)).toHaveLength(1);
    expect(niceness.filter((n) => n === 0).length).toBeGreaterThan(3);
  });
});
