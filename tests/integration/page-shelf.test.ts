import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';
import { auditActions, createTestPage, doc, para, snapshot } from './pages-fixtures';

/**
 * Archiving a page takes it out of the book and keeps it whole; restoring brings it back as it
 * was. Moving changes its section only. Every step is checked where a person would notice it:
 * the venue home, search, the advance sheet, the read view, the history and the JSON routes.
 */
let server: TestServer;
let engineer: Client;
let viewer: Client;
let manager: Client;
let otherManager: Client;
let venue: string;

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  viewer = await signIn(server.url, DEMO.viewer);
  manager = await signIn(server.url, DEMO.manager);
  otherManager = await signIn(server.url, DEMO.otherManager);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
});
afterAll(() => server?.stop());

const archive = (who: Client, slug: string, archived: boolean) => who.sendJson('PUT', `/api/venues/${venue}/pages/${slug}/archived`, { archived });
const move = (who: Client, slug: string, section: unknown) => who.sendJson('PUT', `/api/venues/${venue}/pages/${slug}/section`, { section });
const text = async (who: Client, path: string) => (await who.fetch(path)).text();
const searchHits = async (who: Client, q: string) => ((await (await who.fetch(`/api/search?q=${q}`)).json()) as { hits: { page: { slug: string } }[] }).hits.map((h) => h.page.slug);

describe('archiving and restoring a page', () => {
  it('takes the page out of the book, the search and the advance sheet, and restores it as it was', async () => {
    const { page } = await createTestPage(engineer, venue, 'Shelf spare wedges', doc(para('Four spare wedges, marmotvane brand.')));
    expect((await manager.sendJson('PUT', `/api/venues/${venue}/pages/${page.slug}/advance`, { included: true })).status).toBe(200);
    // Warm every view first: nothing cached may outlive the change.
    expect(await text(viewer, `/venues/${venue}/${page.slug}`)).toContain('Four spare wedges');
    expect(await text(viewer, `/venues/${venue}`)).toContain(`/venues/${venue}/${page.slug}"`);
    expect(await searchHits(viewer, 'marmotvane')).toEqual([page.slug]);
    const before = await snapshot(server.dbPath, page.slug);

    const res = await archive(engineer, page.slug, true);
    expect(res.status).toBe(200);
    expect(((await res.json()) as { page: { archivedAt: string | null } }).page.archivedAt).not.toBeNull();

    expect((await viewer.fetch(`/venues/${venue}/${page.slug}`)).status).toBe(404);
    expect((await viewer.fetch(`/api/venues/${venue}/pages/${page.slug}`)).status).toBe(404);
    expect((await viewer.fetch(`/venues/${venue}/${page.slug}/history`)).status).toBe(404);
    expect((await viewer.fetch(`/api/venues/${venue}/pages/${page.slug}/revisions`)).status).toBe(404);
    expect(await text(viewer, `/venues/${venue}`)).not.toContain(`/venues/${venue}/${page.slug}"`);
    expect(await searchHits(viewer, 'marmotvane')).toEqual([]);
    const sheet = (await (await viewer.fetch(`/api/venues/${venue}/advance`)).json()) as { pages: { slug: string }[] };
    expect(sheet.pages.map((p) => p.slug)).not.toContain(page.slug);
    const listed = (await (await viewer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    expect(listed.pages.map((p) => p.slug)).not.toContain(page.slug);

    // Those who may restore it find it, read it with a note, and cannot edit it until then.
    expect(await text(engineer, `/venues/${venue}/archived`)).toContain('Shelf spare wedges');
    const asEngineer = await text(engineer, `/venues/${venue}/${page.slug}`);
    expect(asEngineer).toContain('data-testid="archived-note"');
    expect(asEngineer).not.toContain('data-testid="edit-page"');
    const edit = await engineer.fetch(`/venues/${venue}/${page.slug}/edit`);
    expect(edit.status).toBe(303);
    expect(edit.headers.get('location')).toBe(`/venues/${venue}/${page.slug}`);
    const save = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${page.slug}`, { doc: doc(para('Sneaky edit.')), baseRevision: 1 });
    expect(save.status).toBe(409);
    expect(((await save.json()) as { error: string }).error).toMatch(/archived; restore it/);
    expect((await engineer.sendJson('POST', `/api/venues/${venue}/pages/${page.slug}/revisions/1/restore`, {})).status).toBe(409);
    // Nothing but the archive stamp and its audit event was written.
    const during = await snapshot(server.dbPath, page.slug);
    expect(during.revisions).toBe(before.revisions);
    expect(during.audit).toBe(before.audit + 1);

    expect((await archive(engineer, page.slug, false)).status).toBe(200);
    expect(await text(viewer, `/venues/${venue}/${page.slug}`)).toContain('Four spare wedges');
    expect(await text(viewer, `/venues/${venue}`)).toContain(`/venues/${venue}/${page.slug}"`);
    expect(await searchHits(viewer, 'marmotvane')).toEqual([page.slug]);
    const again = (await (await viewer.fetch(`/api/venues/${venue}/advance`)).json()) as { pages: { slug: string }[] };
    expect(again.pages.map((p) => p.slug)).toContain(page.slug);
    expect(await text(engineer, `/venues/${venue}/archived`)).not.toContain('Shelf spare wedges');
    expect(await auditActions(server.dbPath, page.slug)).toEqual(['page.create', 'advance.add', 'page.archive', 'page.unarchive']);
  });

  it('asking for the state a page is already in changes nothing and records nothing', async () => {
    const { page } = await createTestPage(engineer, venue, 'Shelf twice', doc(para('Twice.')));
    expect((await archive(engineer, page.slug, true)).status).toBe(200);
    const once = await snapshot(server.dbPath, page.slug);
    const second = await archive(engineer, page.slug, true);
    expect(second.status).toBe(200);
    expect((await snapshot(server.dbPath, page.slug)).audit).toBe(once.audit);
    expect((await archive(engineer, page.slug, false)).status).toBe(200);
    expect((await archive(engineer, page.slug, false)).status).toBe(200);
    expect(await auditActions(server.dbPath, page.slug)).toEqual(['page.create', 'page.archive', 'page.unarchive']);
  });

  it.each([
    ['a string for the flag', { archived: 'yes' }],
    ['no flag', {}],
    ['an extra field', { archived: true, reason: 'x' }],
    ['not an object', [true]],
  ])('%s is a 400 with a sentence, and nothing changes', async (_name, body) => {
    const before = await snapshot(server.dbPath);
    const res = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/rigging-points/archived`, body);
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error.length).toBeGreaterThan(10);
    expect((await snapshot(server.dbPath)).audit).toBe(before.audit);
  });

  it('is refused to viewers (403), other venues (404), the signed out (401), and for unknown pages (404)', async () => {
    expect((await archive(viewer, 'rigging-points', true)).status).toBe(403);
    expect((await archive(otherManager, 'rigging-points', true)).status).toBe(404);
    expect((await archive(anonymous(server.url), 'rigging-points', true)).status).toBe(401);
    expect((await archive(engineer, 'no-such-page', true)).status).toBe(404);
    expect((await archive(engineer, 'x'.repeat(300), true)).status).toBe(404);
    expect((await viewer.fetch(`/venues/${venue}/archived`)).status).toBe(403);
    // A write from another site is refused before anything else.
    const foreign = await engineer.fetch(`/api/venues/${venue}/pages/rigging-points/archived`, {
      method: 'PUT',
      headers: { origin: 'https://elsewhere.example', 'content-type': 'application/json' },
      body: JSON.stringify({ archived: true }),
    });
    expect(foreign.status).toBe(403);
    expect(await text(viewer, `/venues/${venue}/rigging-points`)).toContain('data-testid="page-title"');
  });

  it('keeps "archived" free as a page slug, for the archive screen', async () => {
    const res = await engineer.sendJson('POST', `/api/venues/${venue}/pages`, { title: 'Archived', slug: 'archived', section: 'stage', doc: doc(para('x')) });
    expect(res.status).toBe(400);
    const { page } = await createTestPage(engineer, venue, 'Archived', doc(para('A page titled so.')));
    expect(page.slug).not.toBe('archived');
  });
});

describe('moving a page to another section', () => {
  it('lists it under the new section, with no new revision and its last-changed time kept', async () => {
    const { page } = await createTestPage(engineer, venue, 'Shelf moving cables', doc(para('Cable trunk.')), 'stage');
    const before = await snapshot(server.dbPath, page.slug);
    const res = await move(engineer, page.slug, 'power');
    expect(res.status).toBe(200);
    expect(((await res.json()) as { page: { section: { slug: string } } }).page.section.slug).toBe('power');
    const after = await snapshot(server.dbPath, page.slug);
    expect(after.revisions).toBe(before.revisions);
    expect(after.page!.updatedAt).toBe(before.page!.updatedAt);
    const { page: got } = (await (await viewer.fetch(`/api/venues/${venue}/pages/${page.slug}`)).json()) as { page: { section: { slug: string } } };
    expect(got.section.slug).toBe('power');
    expect(await text(viewer, `/venues/${venue}/${page.slug}`)).toMatch(/Power/);
    // Its own section again: nothing to do, nothing recorded.
    expect((await move(engineer, page.slug, 'power')).status).toBe(200);
    expect(await auditActions(server.dbPath, page.slug)).toEqual(['page.create', 'page.move']);
  });

  it.each([
    ['a section of no such name', 'no-such-section', 400],
    ['an empty name', '', 400],
    ['a number', 7, 400],
    ['an overlong name', 'x'.repeat(500), 400],
    ['a section title in another script', 'ステージ', 400],
    ['an accented name', 'bühne', 400],
    ['a line break and a header after it', 'power\r\nX-Injected: 1', 400],
    ['an encoded line break', 'power%0d%0aX-Injected:%201', 400],
    ['a direction control', 'power\u202Eegats', 400],
    ['a NUL', 'power\u0000', 400],
    ['a path', '../power', 400],
    ['upper case', 'POWER', 400],
  ])('%s is refused naming the field, and the page stays put', async (_name, section, status) => {
    const res = await move(engineer, 'rigging-points', section);
    expect(res.status).toBe(status);
    const body = (await res.json()) as { error: string; field?: string };
    expect(body.error.length).toBeGreaterThan(5);
    expect(body.field).toBe('section');
    // The sentence never repeats what was sent when it is not a section name.
    expect(body.error).not.toMatch(/[\r\n\u0000\u202E]|Injected|ステージ/);
    expect(res.headers.get('x-injected')).toBeNull();
    const { page } = (await (await viewer.fetch(`/api/venues/${venue}/pages/rigging-points`)).json()) as { page: { section: { slug: string } } };
    expect(page.section.slug).toBe('rigging');
  });

  it('a page on the advance sheet stays on it, in its place, listed under its new section everywhere at once', async () => {
    const { page } = await createTestPage(engineer, venue, 'Shelf sheet mover', doc(para('Stage box to the left.')), 'stage');
    expect((await manager.sendJson('PUT', `/api/venues/${venue}/pages/${page.slug}/advance`, { included: true })).status).toBe(200);
    type Sheet = { pages: { slug: string; section: { slug: string } }[] };
    const sheet = async () => (await (await viewer.fetch(`/api/venues/${venue}/advance`)).json()) as Sheet;
    const order = (await sheet()).pages.map((p) => p.slug);
    expect(order).toContain(page.slug);
    // The book, section by section, read twice (warm) before the move.
    const sectionOf = (html: string, slug: string) => html.match(new RegExp(`<section aria-labelledby="sec-${slug}">[\\s\\S]*?</section>`))?.[0] ?? '';
    const crumbsOf = (html: string) => html.match(/<nav aria-label="Breadcrumb"[\s\S]*?<\/nav>/)?.[0] ?? '';
    const link = `/venues/${venue}/${page.slug}"`;
    for (let i = 0; i < 2; i++) {
      expect(sectionOf(await text(viewer, `/venues/${venue}?section=stage`), 'stage')).toContain(link);
      expect(crumbsOf(await text(viewer, `/venues/${venue}/${page.slug}`))).toContain('Stage');
      expect(await text(viewer, `/venues/${venue}/advance`)).toContain(page.title);
    }

    expect((await move(engineer, page.slug, 'power')).status).toBe(200);
    const after = await sheet();
    expect(after.pages.map((p) => p.slug)).toEqual(order);
    expect(after.pages.find((p) => p.slug === page.slug)?.section.slug).toBe('power');
    expect(sectionOf(await text(viewer, `/venues/${venue}?section=power`), 'power')).toContain(link);
    expect(sectionOf(await text(viewer, `/venues/${venue}?section=stage`), 'stage')).not.toContain(link);
    const read = await text(viewer, `/venues/${venue}/${page.slug}`);
    const crumbs = crumbsOf(read);
    expect(crumbs).toContain('Power');
    expect(crumbs).not.toContain('Stage');
    expect(read).toContain('Stage box to the left.');
    const { page: listed } = (await (await viewer.fetch(`/api/venues/${venue}/pages/${page.slug}`)).json()) as { page: { inAdvance: boolean } };
    expect(listed.inAdvance).toBe(true);
  });

  it('an archived page is restored before it is moved; viewers and other venues may not move pages', async () => {
    const { page } = await createTestPage(engineer, venue, 'Shelf archived mover', doc(para('Stay.')));
    expect((await archive(engineer, page.slug, true)).status).toBe(200);
    expect((await move(engineer, page.slug, 'power')).status).toBe(409);
    expect((await move(viewer, 'rigging-points', 'power')).status).toBe(403);
    expect((await move(otherManager, 'rigging-points', 'power')).status).toBe(404);
  });
});
