import { encode } from '@auth/core/jwt';
import { createClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { plainJpeg } from './files-fixtures';
import { createTestPage, doc, para, type Doc } from './pages-fixtures';

/**
 * The read view caches a revision's rendered HTML, and sessions cache their decoded cookie.
 * Neither may ever show something stale: every change is visible on the very next request,
 * with the cache warm (each page is read twice before the change).
 */
let server: TestServer;
let engineer: Client;
let viewer: Client;
let venue: string;

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  viewer = await signIn(server.url, DEMO.viewer);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
});
afterAll(() => server?.stop());

async function read(who: Client, slug: string): Promise<string> {
  const res = await who.fetch(`/venues/${venue}/${slug}`);
  expect(res.status).toBe(200);
  return res.text();
}
async function warm(who: Client, slug: string): Promise<string> {
  await read(who, slug);
  return read(who, slug);
}
const put = (slug: string, body: unknown) => engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, body);

async function sql(statement: string, args: (string | number)[] = []) {
  const db = createClient({ url: `file:${server.dbPath}` });
  try {
    return await db.execute({ sql: statement, args });
  } finally {
    db.close();
  }
}

describe('the read view never serves a stale revision', () => {
  it('a save is visible on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache drum riser', doc(para('Riser height 40 cm.')));
    expect(await warm(viewer, page.slug)).toContain('Riser height 40 cm.');
    expect((await put(page.slug, { doc: doc(para('Riser height 60 cm.')), baseRevision: 1 })).status).toBe(200);
    const html = await read(viewer, page.slug);
    expect(html).toContain('Riser height 60 cm.');
    expect(html).not.toContain('40 cm');
  });

  it('a restore is visible on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache wedge mixes', doc(para('Wedge 1 is vocal only.')));
    expect((await put(page.slug, { doc: doc(para('Wedge 1 is vocal and keys.')), baseRevision: 1 })).status).toBe(200);
    expect(await warm(viewer, page.slug)).toContain('vocal and keys');
    expect((await engineer.sendJson('POST', `/api/venues/${venue}/pages/${page.slug}/revisions/1/restore`, {})).status).toBe(201);
    const html = await read(viewer, page.slug);
    expect(html).toContain('Wedge 1 is vocal only.');
    expect(html).not.toContain('vocal and keys');
  });

  it('two pages with the same text never share a rendering of the other’s revision', async () => {
    const a = await createTestPage(engineer, venue, 'Cache twin A', doc(para('Identical body.')));
    const b = await createTestPage(engineer, venue, 'Cache twin B', doc(para('Identical body.')));
    expect((await put(b.page.slug, { doc: doc(para('Only B changed.')), baseRevision: 1 })).status).toBe(200);
    expect(await warm(viewer, a.page.slug)).toContain('Identical body.');
    expect(await read(viewer, b.page.slug)).toContain('Only B changed.');
  });

  it('a deleted photo turns into a note on the next read', async () => {
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(await plainJpeg(320, 240))], { type: 'image/jpeg' }), 'rack.jpg');
    const uploaded = await engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
    expect(uploaded.status).toBe(201);
    const { file } = (await uploaded.json()) as { file: { id: string; displayUrl: string } };
    const photo: Doc = { type: 'image', attrs: { src: file.displayUrl, alt: 'Rack B' } };
    const { page } = await createTestPage(engineer, venue, 'Cache rack photo', doc(para('Rack B:'), photo));
    expect(await warm(viewer, page.slug)).toContain(`<img src="${file.displayUrl}"`);
    // A file a page shows needs the confirmation the files screen asks for.
    expect((await engineer.fetch(`/api/venues/${venue}/files/${file.id}?confirm=1`, { method: 'DELETE' })).status).toBe(200);
    const html = await read(viewer, page.slug);
    expect(html).not.toContain(`<img src="${file.displayUrl}"`);
    expect(html).toContain('Photo removed: Rack B');
  });

  it('a role change shows (or hides) the edit control on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache role check', doc(para('Who may edit this?')));
    expect(await warm(viewer, page.slug)).not.toContain('data-testid="edit-page"');
    const viewerId = String((await sql('select id from users where email = ?', [DEMO.viewer])).rows[0].id);
    await sql("update memberships set role = 'engineer' where user_id = ?", [viewerId]);
    try {
      expect(await read(viewer, page.slug)).toContain('data-testid="edit-page"');
    } finally {
      await sql("update memberships set role = 'viewer' where user_id = ?", [viewerId]);
    }
    expect(await read(viewer, page.slug)).not.toContain('data-testid="edit-page"');
  });

  it('a membership removed: the page is a 404 on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache membership', doc(para('Members only.')));
    await warm(viewer, page.slug);
    const viewerId = String((await sql('select id from users where email = ?', [DEMO.viewer])).rows[0].id);
    const row = (await sql('select * from memberships where user_id = ?', [viewerId])).rows[0];
    await sql('delete from memberships where user_id = ?', [viewerId]);
    try {
      expect((await viewer.fetch(`/venues/${venue}/${page.slug}`)).status).toBe(404);
    } finally {
      await sql('insert into memberships (venue_id, user_id, role, created_at) values (?, ?, ?, ?)', [String(row.venue_id), viewerId, String(row.role), Number(row.created_at)]);
    }
  });
});

/**
 * The read view is also kept whole, keyed by everything it shows; these change what it shows
 * without a new revision, so each must still be visible on the next request.
 */
describe('the whole kept page never outlives what it shows', () => {
  const nameOf = async (email: string) => String((await sql('select name from users where email = ?', [email])).rows[0].name);

  it('two people reading the same page each see their own name in the header', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache two readers', doc(para('Shared words.')));
    await warm(viewer, page.slug);
    const asEngineer = await read(engineer, page.slug);
    expect(asEngineer).toContain(`data-account-name="${await nameOf(DEMO.engineer)}"`);
    expect(asEngineer).not.toContain(`data-account-name="${await nameOf(DEMO.viewer)}"`);
  });

  it('a renamed reader, author, page or venue shows on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache renames', doc(para('Names everywhere.')));
    await warm(viewer, page.slug);
    const viewerName = await nameOf(DEMO.viewer);
    const engineerName = await nameOf(DEMO.engineer);
    const venueName = String((await sql('select name from venues where slug = ?', [venue])).rows[0].name);
    try {
      await sql('update users set name = ? where email = ?', ['Reader Renamed', DEMO.viewer]);
      expect(await read(viewer, page.slug)).toContain('data-account-name="Reader Renamed"');
      await sql('update users set name = ? where email = ?', ['Author Renamed', DEMO.engineer]);
      expect(await read(viewer, page.slug)).toContain('by Author Renamed');
      await sql('update pages set title = ? where slug = ?', ['Cache renames, retitled', page.slug]);
      expect(await read(viewer, page.slug)).toContain('Cache renames, retitled');
      await sql('update venues set name = ? where slug = ?', ['Renamed Hall', venue]);
      expect(await read(viewer, page.slug)).toContain('Renamed Hall');
    } finally {
      await sql('update users set name = ? where email = ?', [viewerName, DEMO.viewer]);
      await sql('update users set name = ? where email = ?', [engineerName, DEMO.engineer]);
      await sql('update venues set name = ? where slug = ?', [venueName, venue]);
    }
  });

  it('marking a page checked on site and putting it on the advance sheet show on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache stamps', doc(para('Check me.')));
    expect(await warm(viewer, page.slug)).toContain('Not yet checked on site');
    expect((await engineer.sendJson('POST', `/api/venues/${venue}/pages/${page.slug}/check`, {})).status).toBeLessThan(300);
    expect(await read(viewer, page.slug)).toContain('Checked on site');
    const manager = await signIn(server.url, DEMO.manager);
    expect(await warm(manager, page.slug)).toContain('Put on the advance sheet');
    expect((await manager.sendJson('PUT', `/api/venues/${venue}/pages/${page.slug}/advance`, { included: true })).status).toBeLessThan(300);
    expect(await read(manager, page.slug)).toContain('Take off the advance sheet');
  });

  it('archiving, restoring and moving a page, and a new section to move it to, show on the next read', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache shelf', doc(para('On the shelf.')), 'stage');
    const shelf = (body: unknown) => engineer.sendJson('PUT', `/api/venues/${venue}/pages/${page.slug}/${'archived' in (body as object) ? 'archived' : 'section'}`, body);
    const crumbs = (html: string) => html.match(/<nav aria-label="Breadcrumb"[\s\S]*?<\/nav>/)?.[0] ?? '';
    await warm(viewer, page.slug);
    expect(await warm(engineer, page.slug)).not.toContain('data-testid="archived-note"');
    expect((await shelf({ archived: true })).status).toBe(200);
    expect((await viewer.fetch(`/venues/${venue}/${page.slug}`)).status).toBe(404);
    const archived = await read(engineer, page.slug);
    expect(archived).toContain('data-testid="archived-note"');
    expect(archived).not.toContain('data-testid="move-section"');
    expect((await shelf({ archived: false })).status).toBe(200);
    expect(await read(engineer, page.slug)).not.toContain('data-testid="archived-note"');
    expect(await read(viewer, page.slug)).toContain('On the shelf.');

    expect(crumbs(await warm(viewer, page.slug))).toContain('Stage');
    expect((await shelf({ section: 'power' })).status).toBe(200);
    expect(crumbs(await read(viewer, page.slug))).toContain('Power');
    expect(crumbs(await read(engineer, page.slug))).not.toContain('Stage');

    const made = await engineer.sendJson('POST', `/api/venues/${venue}/sections`, { title: 'Cache loading dock' });
    expect(made.status).toBe(201);
    const { section } = (await made.json()) as { section: { slug: string } };
    expect(await read(engineer, page.slug)).toContain(`<option value="${section.slug}"`);
  });

  it('a calculator page names whoever is signed in, a renamed person included, and nobody when signed out', async () => {
    const calc = async (who: Client) => {
      const res = await who.fetch('/calc/spl');
      expect(res.status).toBe(200);
      return res.text();
    };
    const viewerName = await nameOf(DEMO.viewer);
    await calc(viewer);
    expect(await calc(viewer)).toContain(`data-account-name="${viewerName}"`);
    expect(await calc(engineer)).toContain(`data-account-name="${await nameOf(DEMO.engineer)}"`);
    const signedOut = await (await fetch(`${server.url}/calc/spl`)).text();
    expect(signedOut).not.toContain('data-account-name=');
    try {
      await sql('update users set name = ? where email = ?', ['Calc Reader Renamed', DEMO.viewer]);
      expect(await calc(viewer)).toContain('data-account-name="Calc Reader Renamed"');
    } finally {
      await sql('update users set name = ? where email = ?', [viewerName, DEMO.viewer]);
    }
  });

  it('sends the kept page gzipped to a browser that takes gzip, equal to the plain one', async () => {
    const { page } = await createTestPage(engineer, venue, 'Cache packed', doc(para('Packed once.')));
    const plain = await warm(viewer, page.slug);
    const { request } = await import('node:http');
    const { gunzipSync } = await import('node:zlib');
    const packed = await new Promise<{ encoding?: string; body: Buffer }>((resolve, reject) => {
      const req = request(`${server.url}/venues/${venue}/${page.slug}`, { headers: { cookie: viewer.jar.header(), 'accept-encoding': 'gzip, br' } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ encoding: res.headers['content-encoding'], body: Buffer.concat(chunks) }));
      });
      req.on('error', reject);
      req.end();
    });
    expect(packed.encoding).toBe('gzip');
    expect(gunzipSync(packed.body).toString()).toBe(plain);
  });
});

describe('decoded sessions are cached, their end is not', () => {
  const salt = 'authjs.session-token';
  async function userId(email: string) {
    return String((await sql('select id from users where email = ?', [email])).rows[0].id);
  }

  it('a cookie that was valid stops working once its 12 hours are up, though it was seen before', async () => {
    const sub = await userId(DEMO.viewer);
    // Signed in 12 hours ago less two seconds: valid now, not in three seconds.
    const cookie = `${salt}=${await encode({ token: { sub, authTime: Date.now() - 12 * 3600_000 + 2000 }, secret: server.authSecret, salt, maxAge: 3600 })}`;
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie } })).status).toBe(200);
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie } })).status).toBe(200);
    await new Promise((r) => setTimeout(r, 3000));
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie } })).status).toBe(401);
  });

  it('an account removed while its cookie is cached is signed out on the next request', async () => {
    const sub = await userId(DEMO.otherManager);
    const cookie = `${salt}=${await encode({ token: { sub, authTime: Date.now() }, secret: server.authSecret, salt, maxAge: 3600 })}`;
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie } })).status).toBe(200);
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie } })).status).toBe(200);
    await sql('update users set is_admin = 1 where id = ?', [sub]);
    const asAdmin = (await (await fetch(`${server.url}/api/venues`, { headers: { cookie } })).json()) as { venues: unknown[] };
    await sql('update users set is_admin = 0 where id = ?', [sub]);
    const asManager = (await (await fetch(`${server.url}/api/venues`, { headers: { cookie } })).json()) as { venues: unknown[] };
    // The admin flag read fresh each time: all venues, then only their own.
    expect(asAdmin.venues.length).toBeGreaterThan(asManager.venues.length);
    // The test's own connection does not enforce foreign keys: the row simply goes.
    await sql('delete from users where id = ?', [sub]);
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie } })).status).toBe(401);
  });

  it('a forged or altered cookie is refused, cached or not', async () => {
    const sub = await userId(DEMO.viewer);
    const good = await encode({ token: { sub, authTime: Date.now() }, secret: server.authSecret, salt, maxAge: 3600 });
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${good}` } })).status).toBe(200);
    const altered = good.slice(0, -4) + (good.endsWith('AAAA') ? 'BBBB' : 'AAAA');
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${altered}` } })).status).toBe(401);
    const otherSecret = await encode({ token: { sub, authTime: Date.now() }, secret: 'another-secret-'.padEnd(48, 'y'), salt, maxAge: 3600 });
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${otherSecret}` } })).status).toBe(401);
  });
});
