import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';
import { auditActions, createTestPage, doc, getPage, para, snapshot, type Doc } from './pages-fixtures';

let server: TestServer;
const as: Record<keyof typeof DEMO, Client> = {} as never;
let mainVenue: string;
let otherVenue: string;

beforeAll(async () => {
  server = await startServer();
  for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) as[who] = await signIn(server.url, DEMO[who]);
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  mainVenue = mine.venues[0].slug;
  const all = (await (await as.admin.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  otherVenue = all.venues.find((v) => v.slug !== mainVenue)!.slug;
});
afterAll(() => server?.stop());

const put = (who: Client, venue: string, page: string, body: unknown) => who.sendJson('PUT', `/api/venues/${venue}/pages/${page}`, body);

describe('reading a page', () => {
  it('GET answers {page, revision} with the document and its author', async () => {
    const { pages } = (await (await as.viewer.fetch(`/api/venues/${mainVenue}/pages`)).json()) as { pages: { slug: string; currentRevision: number }[] };
    const answer = await getPage(as.viewer, mainVenue, pages[0].slug);
    expect(answer.page).toMatchObject({ slug: pages[0].slug, currentRevision: pages[0].currentRevision, section: { slug: expect.any(String) } });
    expect(answer.revision).toMatchObject({ number: pages[0].currentRevision, doc: { type: 'doc' }, summary: expect.any(String), author: { name: expect.any(String) } });
    expect(Date.parse(answer.revision.createdAt)).not.toBeNaN();
  });

  it('401 signed out, 404 for a missing page and for a venue the person is not in', async () => {
    expect((await anonymous(server.url).fetch(`/api/venues/${mainVenue}/pages/anything`)).status).toBe(401);
    expect((await as.viewer.fetch(`/api/venues/${mainVenue}/pages/no-such-page`)).status).toBe(404);
    const { pages } = (await (await as.admin.fetch(`/api/venues/${mainVenue}/pages`)).json()) as { pages: { slug: string }[] };
    expect((await as.otherManager.fetch(`/api/venues/${mainVenue}/pages/${pages[0].slug}`)).status).toBe(404);
  });
});

describe('creating a page', () => {
  it('an engineer creates a page: 201 with revision 1, listed, audited', async () => {
    const created = await createTestPage(as.engineer, mainVenue, 'Wireless frequencies', doc(para('Channel plan for the house IEMs.')));
    expect(created.page).toMatchObject({ slug: 'wireless-frequencies', currentRevision: 1, section: { slug: 'stage' } });
    expect(created.revision).toMatchObject({ number: 1, summary: 'First version', author: { name: expect.any(String) } });
    const { pages } = (await (await as.viewer.fetch(`/api/venues/${mainVenue}/pages`)).json()) as { pages: { slug: string }[] };
    expect(pages.map((p) => p.slug)).toContain('wireless-frequencies');
    expect(await auditActions(server.dbPath, 'wireless-frequencies')).toEqual(['page.create']);
  });

  it('a second page with the same title gets its own slug; a route name is never a page slug', async () => {
    const again = await createTestPage(as.engineer, mainVenue, 'Wireless frequencies', doc(para('Second.')));
    expect(again.page.slug).toBe('wireless-frequencies-2');
    const reserved = await createTestPage(as.engineer, mainVenue, 'New', doc(para('x')));
    expect(reserved.page.slug).toBe('new-page');
  });

  it.each([
    ['a viewer', 'viewer', 403],
    ['a manager of another venue', 'otherManager', 404],
  ] as const)('%s may not create one', async (_label, who, status) => {
    const before = await snapshot(server.dbPath);
    const res = await as[who].sendJson('POST', `/api/venues/${mainVenue}/pages`, { title: 'Sneaky', section: 'stage', doc: doc(para('x')) });
    expect(res.status).toBe(status);
    expect(await snapshot(server.dbPath)).toEqual(before);
  });

  it.each([
    ['no title', { section: 'stage', doc: doc(para('x')) }, /title/i, 'title'],
    ['a section of no venue', { title: 'X', section: 'no-such-section', doc: doc(para('x')) }, /no section/i, 'section'],
    ['an unknown node', { title: 'X', section: 'stage', doc: doc({ type: 'marquee' }) }, /"marquee"/, 'doc'],
    ['a venueId', { title: 'X', section: 'stage', doc: doc(para('x')), venueId: 'x' }, /"venueId"/, undefined],
    ['a bad slug', { title: 'X', section: 'stage', doc: doc(para('x')), slug: 'Bad Slug' }, /lower-case/, 'slug'],
  ])('400 for %s, nothing created', async (_label, body, message, field) => {
    const before = await snapshot(server.dbPath);
    const res = await as.engineer.sendJson('POST', `/api/venues/${mainVenue}/pages`, body);
    expect(res.status).toBe(400);
    const answer = (await res.json()) as { error: string; field?: string };
    expect(answer.error).toMatch(message);
    if (field) expect(answer.field).toBe(field);
    expect(await snapshot(server.dbPath)).toEqual(before);
  });
});

describe('saving: compare-and-set on baseRevision', () => {
  let slug: string;
  beforeAll(async () => {
    slug = (await createTestPage(as.engineer, mainVenue, 'Save target', doc(para('Version one.')))).page.slug;
  });

  it('a save on the current revision makes the next one, audited', async () => {
    const res = await put(as.engineer, mainVenue, slug, { doc: doc(para('Version two.')), baseRevision: 1, summary: 'Second pass' });
    expect(res.status).toBe(200);
    const { revision } = (await res.json()) as { revision: { number: number; summary: string } };
    expect(revision).toMatchObject({ number: 2, summary: 'Second pass' });
    const now = await getPage(as.viewer, mainVenue, slug);
    expect(now.revision.doc).toEqual(doc(para('Version two.')));
    expect(await auditActions(server.dbPath, slug)).toEqual(['page.create', 'page.save']);
  });

  it('a save on a stale base is 409 with the current revision, and changes nothing', async () => {
    const before = await snapshot(server.dbPath, slug);
    const res = await put(as.manager, mainVenue, slug, { doc: doc(para('Stale edit.')), baseRevision: 1 });
    expect(res.status).toBe(409);
    const answer = (await res.json()) as { error: string; current: { number: number; doc: Doc; summary: string; author: { name: string }; createdAt: string } };
    expect(answer.error).toMatch(/someone else saved/i);
    expect(answer.current).toMatchObject({ number: 2, doc: doc(para('Version two.')), summary: 'Second pass', author: { name: expect.any(String) } });
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
  });

  it('a burst of 16 simultaneous saves on one base: exactly one 200, the rest 409, history grows by one', async () => {
    const base = (await getPage(as.viewer, mainVenue, slug)).page.currentRevision;
    const historyBefore = ((await (await as.viewer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions`)).json()) as { revisions: unknown[] }).revisions.length;
    const writers = [as.engineer, as.manager, as.admin];
    const responses = await Promise.all(
      Array.from({ length: 16 }, (_, i) => put(writers[i % writers.length], mainVenue, slug, { doc: doc(para(`Burst writer ${i}.`)), baseRevision: base, summary: `burst ${i}` })),
    );
    const statuses = responses.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(15);
    const winner = responses[responses.findIndex((r) => r.status === 200)];
    const { revision } = (await winner.json()) as { revision: { number: number; summary: string } };
    expect(revision.number).toBe(base + 1);
    for (const loser of responses.filter((r) => r.status === 409)) {
      expect(((await loser.json()) as { current: { number: number } }).current.number).toBe(base + 1);
    }
    const history = ((await (await as.viewer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions`)).json()) as { revisions: { summary: string }[] }).revisions;
    expect(history.length).toBe(historyBefore + 1);
    expect(history[0].summary).toBe(revision.summary);
  });

  it('the title can change with a save; a missing section is a 400', async () => {
    const base = (await getPage(as.viewer, mainVenue, slug)).page.currentRevision;
    const res = await put(as.engineer, mainVenue, slug, { doc: doc(para('Renamed.')), baseRevision: base, title: 'Save target (renamed)', section: 'monitors' });
    expect(res.status).toBe(200);
    const now = await getPage(as.viewer, mainVenue, slug);
    expect(now.page).toMatchObject({ title: 'Save target (renamed)', slug, section: { slug: 'monitors' } });
    const bad = await put(as.engineer, mainVenue, slug, { doc: doc(para('x')), baseRevision: base + 1, section: 'nowhere' });
    expect(bad.status).toBe(400);
  });

  it('401 signed out, 403 for the viewer, 404 for a stranger — in that order', async () => {
    const body = { doc: doc(para('x')), baseRevision: 1 };
    expect((await put(anonymous(server.url), 'no-such-venue', slug, body)).status).toBe(401);
    const viewer = await put(as.viewer, mainVenue, slug, body);
    expect(viewer.status).toBe(403);
    expect(((await viewer.json()) as { error: string }).error).toMatch(/viewer.*may not edit pages/);
    expect((await put(as.otherManager, mainVenue, slug, body)).status).toBe(404);
    expect((await put(as.viewer, mainVenue, 'no-such-page', body)).status).toBe(404);
  });
});

describe('history and restore', () => {
  let slug: string;
  beforeAll(async () => {
    slug = (await createTestPage(as.engineer, mainVenue, 'History target', doc(para('Alpha text.')))).page.slug;
    for (const [i, text] of ['Beta text.', 'Gamma text.'].entries()) {
      const res = await put(as.engineer, mainVenue, slug, { doc: doc(para(text)), baseRevision: i + 1, summary: text });
      expect(res.status).toBe(200);
    }
  });

  it('lists revisions newest first with author, time and summary', async () => {
    const res = await as.viewer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions`);
    expect(res.status).toBe(200);
    const { revisions } = (await res.json()) as { revisions: { number: number; summary: string; author: { name: string }; createdAt: string }[] };
    expect(revisions.map((r) => r.number)).toEqual([3, 2, 1]);
    expect(revisions.map((r) => r.summary)).toEqual(['Gamma text.', 'Beta text.', 'First version']);
    const times = revisions.map((r) => Date.parse(r.createdAt));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    expect(revisions[0].author.name).toBeTruthy();
  });

  it('one revision carries its document and plain text; bad numbers are 404', async () => {
    const res = await as.viewer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions/1`);
    expect(res.status).toBe(200);
    const { revision } = (await res.json()) as { revision: { number: number; doc: Doc; plainText: string } };
    expect(revision).toMatchObject({ number: 1, doc: doc(para('Alpha text.')), plainText: 'Alpha text.' });
    for (const n of ['0', '99', 'x', '-1', '1.5', '1e3']) {
      expect((await as.viewer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions/${n}`)).status).toBe(404);
    }
  });

  it('restore makes a new revision equal to the old one, marked and audited', async () => {
    const res = await as.engineer.sendJson('POST', `/api/venues/${mainVenue}/pages/${slug}/revisions/1/restore`, { baseRevision: 3 });
    expect(res.status).toBe(201);
    const { revision } = (await res.json()) as { revision: { number: number; restoredFrom: number; summary: string } };
    expect(revision).toMatchObject({ number: 4, restoredFrom: 1, summary: 'Restored revision 1' });
    const now = await getPage(as.viewer, mainVenue, slug);
    expect(now.revision).toMatchObject({ number: 4, doc: doc(para('Alpha text.')), restoredFrom: 1 });
    expect((await auditActions(server.dbPath, slug)).at(-1)).toBe('page.restore');
  });

  it('restore without a body works too; restoring the current revision is a 400', async () => {
    const res = await as.manager.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions/2/restore`, { method: 'POST' });
    expect(res.status).toBe(201);
    const same = await as.manager.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions/5/restore`, { method: 'POST' });
    expect(same.status).toBe(400);
    expect(((await same.json()) as { error: string }).error).toMatch(/current text already/);
  });

  it('restore on a stale base is a 409; the viewer gets 403; nothing changes', async () => {
    const before = await snapshot(server.dbPath, slug);
    const stale = await as.engineer.sendJson('POST', `/api/venues/${mainVenue}/pages/${slug}/revisions/1/restore`, { baseRevision: 2 });
    expect(stale.status).toBe(409);
    expect(((await stale.json()) as { current: { number: number } }).current.number).toBe(5);
    const viewer = await as.viewer.fetch(`/api/venues/${mainVenue}/pages/${slug}/revisions/1/restore`, { method: 'POST' });
    expect(viewer.status).toBe(403);
    const extra = await as.engineer.sendJson('POST', `/api/venues/${mainVenue}/pages/${slug}/revisions/1/restore`, { authorId: 'x' });
    expect(extra.status).toBe(400);
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
  });
});

describe('hostile input to a save: a 4xx with a sentence, no 5xx, nothing changed', () => {
  let slug: string;
  let base: number;
  beforeAll(async () => {
    const created = await createTestPage(as.engineer, mainVenue, 'Hostile target', doc(para('Safe text.')));
    slug = created.page.slug;
    base = created.page.currentRevision;
  });

  /** Built as text: JSON.stringify itself would overflow the stack on 10,000 levels. */
  const deepBody = (levels: number) =>
    `{"baseRevision":${base},"doc":{"type":"doc","content":[${'{"type":"blockquote","content":['.repeat(levels)}{"type":"paragraph"}${']}'.repeat(levels)}]}}`;
  const link = (href: string) => doc(para('click', [{ type: 'link', attrs: { href } }]));

  const cases: [string, () => { body: string | object; type?: string }, number, RegExp][] = [
    ['malformed JSON', () => ({ body: '{"doc": {"type": "doc"', type: 'application/json' }), 400, /not valid JSON/],
    ['JSON sent as text/plain', () => ({ body: JSON.stringify({ doc: doc(para('x')), baseRevision: base }), type: 'text/plain' }), 415, /Content-Type: application\/json/],
    ['a 5 MB document', () => ({ body: { doc: doc(para('x'.repeat(5 * 1024 * 1024))), baseRevision: base } }), 413, /larger than/],
    ['a 1.5 MB document (under the body cap, over the page cap)', () => ({ body: { doc: doc(...Array.from({ length: 40 }, () => para('y'.repeat(40_000)))), baseRevision: base } }), 413, /limit is 1 MiB/],
    ['nesting 10,000 deep', () => ({ body: deepBody(10_000), type: 'application/json' }), 400, /nested more than 40 levels/],
    ['a __proto__ key', () => ({ body: `{"doc":{"type":"doc","content":[{"type":"paragraph","__proto__":{"polluted":1}}]},"baseRevision":${base}}`, type: 'application/json' }), 400, /reserved key/],
    ['an unknown node type', () => ({ body: { doc: doc({ type: 'scriptBlock', content: [] }), baseRevision: base } }), 400, /"scriptBlock"/],
    ['an unknown mark', () => ({ body: { doc: doc(para('x', [{ type: 'onclick' }])), baseRevision: base } }), 400, /"onclick"/],
    ['a javascript: link', () => ({ body: { doc: link('javascript:alert(document.cookie)'), baseRevision: base } }), 400, /Links may point only to http, https, mailto/],
    ['a data: link', () => ({ body: { doc: link('data:text/html;base64,PHNjcmlwdD4='), baseRevision: base } }), 400, /Links may point only/],
    ['a foreign image source', () => ({ body: { doc: doc({ type: 'image', attrs: { src: 'https://tracker.example/pixel.gif' } }), baseRevision: base } }), 400, /Images must be files uploaded/],
    ['heading level 99', () => ({ body: { doc: doc({ type: 'heading', attrs: { level: 99 }, content: [{ type: 'text', text: 'Big' }] }), baseRevision: base } }), 400, /level 99.*1 to 4/],
    ['a body that sets authorId', () => ({ body: { doc: doc(para('x')), baseRevision: base, authorId: 'someone-else' } }), 400, /"authorId"/],
    ['a body that sets venueId', () => ({ body: { doc: doc(para('x')), baseRevision: base, venueId: 'another' } }), 400, /"venueId"/],
    ['no baseRevision', () => ({ body: { doc: doc(para('x')) } }), 400, /baseRevision/],
    ['baseRevision as text', () => ({ body: { doc: doc(para('x')), baseRevision: String(base) } }), 400, /baseRevision/],
    ['no document', () => ({ body: { baseRevision: base } }), 400, /doc/],
    ['an array body', () => ({ body: [1, 2] }), 400, /JSON object/],
  ];

  it.each(cases)('%s', async (_label, make, status, message) => {
    const before = await snapshot(server.dbPath, slug);
    const { body, type } = make();
    const res = await as.engineer.fetch(`/api/venues/${mainVenue}/pages/${slug}`, {
      method: 'PUT',
      headers: { 'content-type': type ?? 'application/json' },
      body: typeof body === 'string' ? body : JSON.stringify(body),
    });
    expect(res.status).toBe(status);
    const answer = (await res.json()) as { error: string };
    expect(answer.error).toMatch(message);
    expect(answer.error).toMatch(/^[A-Z"].*[.;)]/);
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
  });

  it('a save into another venue is a 404 and changes nothing there or here', async () => {
    const before = await snapshot(server.dbPath, slug);
    // The manager belongs to both venues; the page belongs to the first only.
    const res = await put(as.manager, otherVenue, slug, { doc: doc(para('Moved across?')), baseRevision: base });
    expect(res.status).toBe(404);
    const engineer = await put(as.engineer, otherVenue, slug, { doc: doc(para('x')), baseRevision: base });
    expect(engineer.status).toBe(404);
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
  });

  it('text that looks like HTML is saved as text and never becomes markup on the page', async () => {
    const hostile = '<script>alert(1)</script> <img src=x onerror=alert(2)> "><svg onload=alert(3)>';
    const res = await put(as.engineer, mainVenue, slug, {
      doc: doc({ type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: hostile }] }, para(hostile, [{ type: 'link', attrs: { href: '/venues?x="><script>alert(4)</script>' } }])),
      baseRevision: base,
      summary: '<b>bold</b> summary',
    });
    expect(res.status).toBe(200);
    for (const path of [`/venues/${mainVenue}/${slug}`, `/venues/${mainVenue}/${slug}/history`]) {
      const html = await (await as.viewer.fetch(path)).text();
      expect(html).not.toMatch(/<script>alert/);
      expect(html).not.toMatch(/<img src=x/);
      expect(html).not.toMatch(/<svg onload/);
      expect(html).not.toMatch(/<b>bold<\/b>/);
      if (path.endsWith(slug)) expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    }
  });
});

describe('sections', () => {
  it('an engineer adds, renames, moves and removes an empty section; audited', async () => {
    const created = await as.engineer.sendJson('POST', `/api/venues/${mainVenue}/sections`, { title: 'Backline' });
    expect(created.status).toBe(201);
    expect(((await created.json()) as { section: { slug: string } }).section.slug).toBe('backline');
    const renamed = await as.engineer.sendJson('PATCH', `/api/venues/${mainVenue}/sections/backline`, { title: 'Backline and risers', move: 'up' });
    expect(renamed.status).toBe(200);
    const { sections } = (await (await as.viewer.fetch(`/api/venues/${mainVenue}/sections`)).json()) as { sections: { slug: string; title: string; position: number; pageCount: number }[] };
    const index = sections.findIndex((s) => s.slug === 'backline');
    expect(sections[index].pageCount).toBe(0);
    expect(sections.find((s) => s.slug === 'stage')!.pageCount).toBeGreaterThan(0);
    expect(sections.map((s) => s.position)).toEqual(sections.map((_, i) => i));
    expect(sections[index].title).toBe('Backline and risers');
    expect(index).toBe(sections.length - 2);
    expect((await as.engineer.fetch(`/api/venues/${mainVenue}/sections/backline`, { method: 'DELETE' })).status).toBe(204);
    expect(await auditActions(server.dbPath, 'backline')).toEqual(['section.create', 'section.update', 'section.delete']);
  });

  it('a section with pages cannot go (409); a viewer may not change sections (403)', async () => {
    const before = await snapshot(server.dbPath);
    const busy = await as.engineer.fetch(`/api/venues/${mainVenue}/sections/stage`, { method: 'DELETE' });
    expect(busy.status).toBe(409);
    expect(((await busy.json()) as { error: string }).error).toMatch(/move .* to another section first/);
    expect((await as.viewer.sendJson('POST', `/api/venues/${mainVenue}/sections`, { title: 'Nope' })).status).toBe(403);
    expect((await as.engineer.sendJson('PATCH', `/api/venues/${mainVenue}/sections/stage`, { slug: 'x' })).status).toBe(400);
    expect(await snapshot(server.dbPath)).toEqual(before);
  });
});
