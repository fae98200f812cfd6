import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';

let server: TestServer;
const as: Record<keyof typeof DEMO, Client> = {} as never;
let mainVenue: string;
let otherVenue: string;

beforeAll(async () => {
  server = await startServer();
  for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) as[who] = await signIn(server.url, DEMO[who]);
  const { venues } = (await (await as.admin.fetch('/api/venues')).json()) as { venues: { slug: string; name: string }[] };
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  mainVenue = mine.venues[0].slug;
  otherVenue = venues.find((v) => v.slug !== mainVenue)!.slug;
});
afterAll(() => server?.stop());

describe('GET /api/venues', () => {
  it('401 when signed out', async () => {
    const res = await anonymous(server.url).fetch('/api/venues');
    expect(res.status).toBe(401);
    expect((await res.json()).error).toMatch(/sign in/i);
  });

  it('lists only the venues a person belongs to, with the role', async () => {
    const eng = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string; role: string }[] };
    expect(eng.venues.map((v) => [v.slug, v.role])).toEqual([[mainVenue, 'engineer']]);
    const viewer = (await (await as.viewer.fetch('/api/venues')).json()) as { venues: { role: string }[] };
    expect(viewer.venues.map((v) => v.role)).toEqual(['viewer']);
    const admin = (await (await as.admin.fetch('/api/venues')).json()) as { venues: unknown[] };
    expect(admin.venues.length).toBe(2);
  });
});

describe('GET /api/venues/:venue/pages', () => {
  it.each(['admin', 'manager', 'engineer', 'viewer'] as const)('%s reads the main venue', async (who) => {
    const res = await as[who].fetch(`/api/venues/${mainVenue}/pages`);
    expect(res.status).toBe(200);
    const { pages } = (await res.json()) as { pages: { slug: string; section: string; currentRevision: number; inAdvance: boolean; updatedAt: unknown; title: string }[] };
    expect(pages.length).toBeGreaterThanOrEqual(8);
    for (const p of pages) {
      expect(p).toMatchObject({ slug: expect.any(String), section: expect.any(String), title: expect.any(String), currentRevision: expect.any(Number), inAdvance: expect.any(Boolean) });
      expect(p.updatedAt).toBeDefined();
    }
  });

  it('a member of another venue gets 404, the same as a venue that does not exist', async () => {
    const hidden = await as.otherManager.fetch(`/api/venues/${mainVenue}/pages`);
    const missing = await as.otherManager.fetch('/api/venues/no-such-venue/pages');
    expect(hidden.status).toBe(404);
    expect(missing.status).toBe(404);
    expect(await hidden.json()).toEqual(await missing.json());
  });

  it('the manager of the second venue reads it, and only it', async () => {
    const { venues } = (await (await as.otherManager.fetch('/api/venues')).json()) as { venues: { slug: string; role: string }[] };
    expect(venues.map((v) => [v.slug, v.role])).toEqual([[otherVenue, 'manager']]);
    expect((await as.otherManager.fetch(`/api/venues/${otherVenue}/pages`)).status).toBe(200);
  });

  it('the engineer of the main venue cannot see the second venue (404)', async () => {
    expect((await as.engineer.fetch(`/api/venues/${otherVenue}/pages`)).status).toBe(404);
  });

  it('401 when signed out, before anything else is revealed', async () => {
    expect((await anonymous(server.url).fetch(`/api/venues/no-such-venue/pages`)).status).toBe(401);
  });
});

describe('POST /api/venues', () => {
  it('an admin creates a venue with default sections', async () => {
    const res = await as.admin.sendJson('POST', '/api/venues', { name: 'Test Annex', town: 'Nowhere' });
    expect(res.status).toBe(201);
    const { venue } = (await res.json()) as { venue: { slug: string } };
    expect(venue.slug).toBe('test-annex');
    const pages = await as.admin.fetch(`/api/venues/${venue.slug}/pages`);
    expect(pages.status).toBe(200);
  });

  it.each(['manager', 'engineer', 'viewer', 'otherManager'] as const)('%s may not create a venue (403)', async (who) => {
    const res = await as[who].sendJson('POST', '/api/venues', { name: 'Sneaky Hall' });
    expect(res.status).toBe(403);
    expect((await res.json()).error).toMatch(/administrator/);
  });

  it('401 when signed out', async () => {
    expect((await anonymous(server.url).sendJson('POST', '/api/venues', { name: 'X Hall' })).status).toBe(401);
  });

  it('a duplicate slug is a 409 that says what to change', async () => {
    await as.admin.sendJson('POST', '/api/venues', { name: 'Twice Hall' });
    const res = await as.admin.sendJson('POST', '/api/venues', { name: 'Twice Hall' });
    expect(res.status).toBe(409);
    expect((await res.json()).field).toBe('slug');
  });

  describe('bad input is a 400 with a sentence, never a 500', () => {
    const cases: [string, string | unknown, RegExp, string?][] = [
      ['malformed JSON', '{"name": "Oops",', /not valid JSON/],
      ['an empty body', '', /empty/],
      ['a number for the name', { name: 42 }, /name/i, 'name'],
      ['a missing name', { town: 'Somewhere' }, /name/i, 'name'],
      ['a one-letter name', { name: 'A' }, /at least 2/, 'name'],
      ['a bad slug', { name: 'Good Name', slug: 'Bad Slug!' }, /lower-case/, 'slug'],
      ['an array body', [1, 2, 3], /object|expected/i],
      ['a __proto__ key', '{"name":"Proto Hall","__proto__":{"isAdmin":true}}', /reserved key/],
      ['an unknown field', { name: 'Extra Hall', id: 'x' }, /id|unrecognized/i],
    ];
    it.each(cases)('%s', async (_label, body, message, field) => {
      const res = await as.admin.sendJson('POST', '/api/venues', body);
      expect(res.status).toBe(400);
      const answer = (await res.json()) as { error: string; field?: string };
      expect(answer.error).toMatch(message);
      if (field) expect(answer.field).toBe(field);
    });

    it('JSON sent as text/plain is refused with what to send instead', async () => {
      const res = await as.admin.fetch('/api/venues', { method: 'POST', headers: { 'content-type': 'text/plain' }, body: '{"name":"Plain Hall"}' });
      expect([400, 403, 415]).toContain(res.status);
      expect(res.status).not.toBe(500);
    });
  });
});

describe('HTML pages by role', () => {
  it('the viewer reads a page of the main venue without an edit control', async () => {
    const { pages } = (await (await as.viewer.fetch(`/api/venues/${mainVenue}/pages`)).json()) as { pages: { slug: string }[] };
    const res = await as.viewer.fetch(`/venues/${mainVenue}/${pages[0].slug}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toContain('data-testid="page-body"');
    expect(html).not.toContain('data-testid="edit-page"');
  });

  it('the engineer sees the edit control', async () => {
    const { pages } = (await (await as.engineer.fetch(`/api/venues/${mainVenue}/pages`)).json()) as { pages: { slug: string }[] };
    const html = await (await as.engineer.fetch(`/venues/${mainVenue}/${pages[0].slug}`)).text();
    expect(html).toContain('data-testid="edit-page"');
  });

  it('a venue the person is not in is the 404 page', async () => {
    const res = await as.engineer.fetch(`/venues/${otherVenue}`);
    expect(res.status).toBe(404);
  });

  it('a missing page of a readable venue is the 404 page', async () => {
    expect((await as.viewer.fetch(`/venues/${mainVenue}/no-such-page`)).status).toBe(404);
  });
});
