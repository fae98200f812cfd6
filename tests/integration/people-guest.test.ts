import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';
import type { Client } from '../helpers/session';
import { plainJpeg } from './files-fixtures';
import { signInEveryone, type People } from './people-fixtures';

let server: TestServer;
let people: People;

interface FileView {
  id: string;
  displayUrl: string | null;
}

async function upload(client: Client, venueSlug: string, seed: number): Promise<FileView> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(await plainJpeg(200, 150, seed))], { type: 'image/jpeg' }), 'rack.jpg');
  const res = await client.fetch(`/api/venues/${venueSlug}/files`, { method: 'POST', body: form });
  expect(res.status).toBe(201);
  return ((await res.json()) as { file: FileView }).file;
}

async function pageWithPhoto(title: string, file: FileView) {
  const doc = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: `${title} text` }] }, { type: 'image', attrs: { src: file.displayUrl, alt: title } }] };
  const res = await people.as.engineer.sendJson('POST', `/api/venues/${people.venue}/pages`, { title, section: 'stage', doc });
  expect(res.status).toBe(201);
  return ((await res.json()) as { page: { slug: string } }).page.slug;
}

async function newPass(label: string, body: Record<string, unknown> = {}) {
  const res = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/passes`, { label, ...body });
  expect(res.status).toBe(201);
  const { pass } = (await res.json()) as { pass: { id: string; url: string; expiresAt: string } };
  return { ...pass, token: pass.url.split('/').pop()! };
}

beforeAll(async () => {
  server = await startServer();
  people = await signInEveryone(server);
});
afterAll(async () => {
  people?.db.close();
  await server?.stop();
});

describe('the advance sheet', () => {
  it('the manager picks pages and their order; the sheet and its JSON follow that order', async () => {
    const put = await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/advance`, { pages: ['rigging-points', 'power-distribution', 'load-in-and-access'] });
    expect(put.status).toBe(200);
    const sheet = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/advance`)).json()) as { pages: { slug: string; html: string; checkStale: boolean }[] };
    expect(sheet.pages.map((p) => p.slug)).toEqual(['rigging-points', 'power-distribution', 'load-in-and-access']);
    const html = await (await people.as.viewer.fetch(`/venues/${people.venue}/advance`)).text();
    expect(html.indexOf('id="p-rigging-points"')).toBeLessThan(html.indexOf('id="p-power-distribution"'));
    expect(html).toContain('data-testid="advance-contents"');
    // The demo's power page was last checked 240 days ago: past the 6-month default.
    expect(sheet.pages.find((p) => p.slug === 'power-distribution')!.checkStale).toBe(true);
    expect(sheet.pages.find((p) => p.slug === 'rigging-points')!.checkStale).toBe(false);
  });

  it('refuses unknown or repeated pages with a sentence and changes nothing', async () => {
    const unknown = await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/advance`, { pages: ['rigging-points', 'no-such-page'] });
    expect(unknown.status).toBe(400);
    expect(((await unknown.json()) as { error: string }).error).toContain('no-such-page');
    const twice = await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/advance`, { pages: ['rigging-points', 'rigging-points'] });
    expect(twice.status).toBe(400);
    const sheet = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/advance`)).json()) as { pages: { slug: string }[] };
    expect(sheet.pages.map((p) => p.slug)).toEqual(['rigging-points', 'power-distribution', 'load-in-and-access']);
  });

  it('an engineer stamps "checked on site" without a new revision; the warning goes', async () => {
    const before = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/pages/power-distribution`)).json()) as { page: { currentRevision: number } };
    const res = await people.as.engineer.fetch(`/api/venues/${people.venue}/pages/power-distribution/check`, { method: 'POST' });
    expect(res.status).toBe(200);
    const after = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/pages/power-distribution`)).json()) as { page: { currentRevision: number } };
    expect(after.page.currentRevision).toBe(before.page.currentRevision);
    const sheet = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/advance`)).json()) as { pages: { slug: string; checkStale: boolean; checkedBy: string }[] };
    const power = sheet.pages.find((p) => p.slug === 'power-distribution')!;
    expect(power.checkStale).toBe(false);
    expect(power.checkedBy).toBeTruthy();
  });

  it('the switch on a page adds it at the end and takes it off', async () => {
    expect((await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/pages/venue-contacts/advance`, { included: true })).status).toBe(200);
    let sheet = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/advance`)).json()) as { pages: { slug: string }[] };
    expect(sheet.pages.at(-1)!.slug).toBe('venue-contacts');
    expect((await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/pages/venue-contacts/advance`, { included: false })).status).toBe(200);
    sheet = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}/advance`)).json()) as { pages: { slug: string }[] };
    expect(sheet.pages.map((p) => p.slug)).not.toContain('venue-contacts');
  });
});

describe('guest passes', () => {
  let onSheet: FileView;
  let offSheet: FileView;
  let pass: Awaited<ReturnType<typeof newPass>>;

  beforeAll(async () => {
    onSheet = await upload(people.as.engineer, people.venue, 40);
    offSheet = await upload(people.as.engineer, people.venue, 41);
    const shown = await pageWithPhoto('Guest stage photo', onSheet);
    await pageWithPhoto('Private stage photo', offSheet);
    await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/pages/${shown}/advance`, { included: true });
    pass = await newPass('The Lantern Choir, Friday', { showDate: new Date(Date.now() + 2 * 86400_000).toISOString().slice(0, 10) });
  });

  it('stores only the hash of a 256-bit token, and expires the day after the show', async () => {
    expect(pass.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const { rows } = await people.db.execute({ sql: 'select token_hash, expires_at from guest_passes where id = ?', args: [pass.id] });
    expect(String(rows[0].token_hash)).toMatch(/^[0-9a-f]{64}$/);
    expect(String(rows[0].token_hash)).not.toContain(pass.token);
    const expires = new Date(Number(rows[0].expires_at));
    expect(expires.getUTCHours()).toBe(23);
    expect(Math.round((expires.getTime() - Date.now()) / 86400_000)).toBeGreaterThanOrEqual(2);
    const list = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/passes`)).json()) as { passes: Record<string, unknown>[] };
    expect(JSON.stringify(list)).not.toContain(pass.token);
  });

  it('refuses an expiry beyond 90 days or in the past', async () => {
    const far = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/passes`, { label: 'Too long', expiresAt: new Date(Date.now() + 91 * 86400_000).toISOString() });
    expect(far.status).toBe(400);
    expect(((await far.json()) as { error: string }).error).toMatch(/90 days/);
    const past = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/passes`, { label: 'Past', expiresAt: '2020-01-01T00:00:00Z' });
    expect(past.status).toBe(400);
  });

  it('shows the sheet with its photos through the pass, and counts the use', async () => {
    const res = await fetch(`${server.url}/advance/${pass.token}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('referrer-policy')).toBe('no-referrer');
    expect(res.headers.get('cache-control')).toBe('no-store');
    const html = await res.text();
    expect(html).toContain('Guest stage photo');
    expect(html).not.toContain('Private stage photo');
    const img = `/advance/${pass.token}/files/${onSheet.id}/display`;
    expect(html).toContain(`src="${img}"`);
    expect((await fetch(`${server.url}${img}`)).status).toBe(200);
    const json = await fetch(`${server.url}/api/venues/${people.venue}/advance`, { headers: { authorization: `Bearer ${pass.token}` } });
    expect(json.status).toBe(200);
    const list = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/passes`)).json()) as { passes: { id: string; useCount: number; lastUsedAt: string | null }[] };
    const mine = list.passes.find((p) => p.id === pass.id)!;
    expect(mine.useCount).toBe(2);
    expect(mine.lastUsedAt).not.toBeNull();
  });

  it('gives nothing else: other files, pages, search and the API answer 404', async () => {
    const bearer = { authorization: `Bearer ${pass.token}` };
    expect((await fetch(`${server.url}/advance/${pass.token}/files/${offSheet.id}/display`)).status).toBe(404);
    expect((await fetch(`${server.url}/advance/${pass.token}/files/${offSheet.id}`)).status).toBe(404);
    for (const path of [`/api/venues/${people.venue}/pages`, `/api/venues/${people.venue}/files`, '/api/search?q=stage', `/api/venues/${people.venue}/members`, `/api/venues/${people.venue}/passes`, '/api/venues']) {
      expect((await fetch(`${server.url}${path}`, { headers: bearer })).status, path).toBe(404);
    }
    // Nor a page's own routes, even for a page on the sheet, nor a block's computed curve that a
    // viewer can download.
    const curve = `/venues/${people.venue}/system-processing/curves/1.txt`;
    expect((await people.as.viewer.fetch(curve)).status).toBe(200);
    for (const path of [curve, `/api/venues/${people.venue}/pages/rigging-points`, `/api/venues/${people.venue}/pages/rigging-points/revisions`]) {
      expect((await fetch(`${server.url}${path}`, { headers: bearer })).status, path).toBe(404);
    }
    // The pass does not turn into a session anywhere else.
    expect((await fetch(`${server.url}/files/${onSheet.id}/display`, { headers: bearer })).status).toBe(404);
    expect((await fetch(`${server.url}/advance/${pass.token}/anything-else`)).status).toBe(404);
  });

  it('changes since a date in the link list only the advance pages', async () => {
    const res = await fetch(`${server.url}/api/venues/${people.venue}/changes?since=2020-01-01`, { headers: { authorization: `Bearer ${pass.token}` } });
    const body = (await res.json()) as { pages: { slug: string }[] };
    expect(body.pages.length).toBeGreaterThan(0);
    const onSheetSlugs = ((await (await people.as.viewer.fetch(`/api/venues/${people.venue}/advance`)).json()) as { pages: { slug: string }[] }).pages.map((p) => p.slug);
    for (const p of body.pages) expect(onSheetSlugs).toContain(p.slug);
    expect((await fetch(`${server.url}/api/venues/${people.venue}/changes`, { headers: { authorization: `Bearer ${pass.token}` } })).status).toBe(400);
    const page = await (await fetch(`${server.url}/advance/${pass.token}?since=2020-01-01`)).text();
    expect(page).toContain('data-testid="changes"');
  });

  it('a revoked pass is 404 from the next request, and the audit log shows its life', async () => {
    const doomed = await newPass('Revoke me');
    expect((await fetch(`${server.url}/advance/${doomed.token}`)).status).toBe(200);
    expect((await people.as.manager.fetch(`/api/venues/${people.venue}/passes/${doomed.id}`, { method: 'DELETE' })).status).toBe(204);
    expect((await fetch(`${server.url}/advance/${doomed.token}`)).status).toBe(404);
    expect((await fetch(`${server.url}/api/venues/${people.venue}/advance`, { headers: { authorization: `Bearer ${doomed.token}` } })).status).toBe(404);
    const audit = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/audit?kind=pass`)).json()) as { events: { action: string; targetId: string }[] };
    const mine = audit.events.filter((e) => e.targetId === doomed.id).map((e) => e.action);
    expect(mine).toEqual(expect.arrayContaining(['pass.create', 'pass.use', 'pass.revoke']));
  });

  it('rate-limits wrong tokens per address (429), without blocking a real pass being recognised as dead', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 21; i++) statuses.push((await fetch(`${server.url}/advance/${String(i).padStart(43, 'x')}`)).status);
    expect(statuses.slice(0, 20).every((s) => s === 404)).toBe(true);
    expect(statuses[20]).toBe(429);
  });
});

describe('audit log', () => {
  it('filters by kind and person, newest first, paged', async () => {
    for (let i = 0; i < 12; i++) await newPass(`Paging pass ${i}`);
    const all = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/audit`)).json()) as { events: { action: string; createdAt: string; actorId: string | null }[]; hasMore: boolean };
    expect(all.events.length).toBe(50);
    expect(all.hasMore).toBe(true);
    const second = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/audit?page=2`)).json()) as { events: { createdAt: string }[] };
    expect(second.events.length).toBeGreaterThan(0);
    expect(Date.parse(second.events[0].createdAt)).toBeLessThanOrEqual(Date.parse(all.events.at(-1)!.createdAt));
    const times = all.events.map((e) => Date.parse(e.createdAt));
    expect([...times].sort((a, b) => b - a)).toEqual(times);
    const pages = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/audit?kind=page`)).json()) as { events: { action: string }[] };
    expect(pages.events.every((e) => e.action.startsWith('page.'))).toBe(true);
    const engineerId = all.events.find((e) => e.action === 'page.check')?.actorId;
    const byEngineer = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/audit?actor=${engineerId}`)).json()) as { events: { actorId: string }[] };
    expect(byEngineer.events.length).toBeGreaterThan(0);
    expect(byEngineer.events.every((e) => e.actorId === engineerId)).toBe(true);
    expect((await people.as.manager.fetch(`/api/venues/${people.venue}/audit?kind=nonsense`)).status).toBe(400);
    expect((await people.as.manager.fetch(`/api/venues/${people.venue}/audit?page=0`)).status).toBe(400);
  });
});
