import { encode } from '@auth/core/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { attemptSignIn, CookieJar, signIn } from '../helpers/session';
import { signInEveryone, userIdOf, type People } from './people-fixtures';

let server: TestServer;
let people: People;

beforeAll(async () => {
  server = await startServer();
  people = await signInEveryone(server);
});
afterAll(async () => {
  people?.db.close();
  await server?.stop();
});

async function signOut(client: { fetch: (p: string, i?: RequestInit) => Promise<Response>; jar: CookieJar }) {
  const csrf = await client.fetch('/api/auth/csrf');
  client.jar.absorb(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  return client.fetch('/api/auth/signout', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ csrfToken, callbackUrl: '/signin?signedout=1' }),
  });
}

describe('sessions that end', () => {
  it('an old cookie is refused after sign-out, and sign-out clears the cache', async () => {
    const client = await signIn(server.url, DEMO.viewer);
    const saved = client.jar.header();
    expect((await client.fetch('/api/venues')).status).toBe(200);
    const out = await signOut(client);
    expect(out.status).toBe(302);
    expect(out.headers.get('clear-site-data')).toBe('"cache"');
    // The cookie from before sign-out, replayed as it was:
    const replay = await fetch(`${server.url}/api/venues`, { headers: { cookie: saved } });
    expect(replay.status).toBe(401);
    // Signing in again works and gives a fresh session.
    expect((await (await signIn(server.url, DEMO.viewer)).fetch('/api/venues')).status).toBe(200);
  });

  it('"sign out everywhere" ends every session of that person, not others', async () => {
    const phone = await signIn(server.url, DEMO.engineer);
    const laptop = await signIn(server.url, DEMO.engineer);
    const someoneElse = await signIn(server.url, DEMO.viewer);
    const res = await laptop.fetch('/api/account/sessions', { method: 'DELETE' });
    expect(res.status).toBe(200);
    expect(res.headers.get('clear-site-data')).toBe('"cache"');
    expect((await phone.fetch('/api/venues')).status).toBe(401);
    expect((await laptop.fetch('/api/venues')).status).toBe(401);
    expect((await someoneElse.fetch('/api/venues')).status).toBe(200);
  });

  it('a cookie minted with an old epoch is refused even though it decrypts', async () => {
    const sub = await userIdOf(people.db, DEMO.viewer);
    const { rows } = await people.db.execute({ sql: 'select session_epoch from users where id = ?', args: [sub] });
    const epoch = Number(rows[0].session_epoch);
    const salt = 'authjs.session-token';
    const mint = (e: number) => encode({ token: { sub, authTime: Date.now(), epoch: e }, secret: server.authSecret, salt, maxAge: 3600 });
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${await mint(epoch)}` } })).status).toBe(200);
    expect((await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${await mint(epoch - 1)}` } })).status).toBe(401);
  });

  it('signed-in HTML is never stored; a removed member loses the venue at the next request', async () => {
    const viewer = await signIn(server.url, DEMO.viewer);
    const page = await viewer.fetch(`/venues/${people.venue}`);
    expect(page.status).toBe(200);
    expect(page.headers.get('cache-control')).toBe('no-store');
    const viewerId = await userIdOf(people.db, DEMO.viewer);
    const removed = await people.as.manager.fetch(`/api/venues/${people.venue}/members/${viewerId}`, { method: 'DELETE' });
    expect(removed.status).toBe(204);
    expect((await viewer.fetch(`/api/venues/${people.venue}/pages`)).status).toBe(401);
    expect((await viewer.fetch(`/venues/${people.venue}`)).status).toBe(303);
    // Signing in again, the person is no longer a member: the venue is a 404 for them.
    const again = await signIn(server.url, DEMO.viewer);
    expect((await again.fetch(`/api/venues/${people.venue}/pages`)).status).toBe(404);
  });
});

describe('the last-manager rule', () => {
  it('the only manager of a venue can be neither demoted nor removed (409 with a sentence)', async () => {
    // In the other venue the demo has two managers; in the home venue only one.
    const managerId = await userIdOf(people.db, DEMO.manager);
    const demote = await people.as.admin.sendJson('PATCH', `/api/venues/${people.venue}/members/${managerId}`, { role: 'engineer' });
    expect(demote.status).toBe(409);
    expect(((await demote.json()) as { error: string }).error).toMatch(/last manager/);
    const remove = await people.as.manager.fetch(`/api/venues/${people.venue}/members/${managerId}`, { method: 'DELETE' });
    expect(remove.status).toBe(409);
    const { rows } = await people.db.execute({ sql: "select count(*) as n from memberships m join venues v on v.id = m.venue_id where v.slug = ? and m.role = 'manager'", args: [people.venue] });
    expect(Number(rows[0].n)).toBe(1);
    // With a second manager, the first may step down.
    const otherId = await userIdOf(people.db, DEMO.otherManager);
    const other = await people.as.otherManager.sendJson('PATCH', `/api/venues/${people.otherVenue}/members/${managerId}`, { role: 'viewer' });
    expect(other.status).toBe(200);
    const last = await people.as.otherManager.sendJson('PATCH', `/api/venues/${people.otherVenue}/members/${otherId}`, { role: 'viewer' });
    expect(last.status).toBe(409);
  });
});

// Every attempt runs a full scrypt verification (CPU-bound by design); on a loaded two-core
// runner eleven of them can take longer than the default 60 s.
const SLOW = 240_000;

describe('sign-in limits that hold', () => {
  it('rotating X-Forwarded-For does not reset the count (no TRUST_PROXY set)', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++) {
      statuses.push((await attemptSignIn(server.url, DEMO.admin, `wrong-${i}`, { 'x-forwarded-for': `198.51.100.${i + 1}` })).status);
    }
    expect(statuses.slice(0, 10).every((s) => s === 302)).toBe(true);
    expect(statuses[10]).toBe(429);
    const right = await attemptSignIn(server.url, DEMO.admin, DEMO_PASSWORD, { 'x-forwarded-for': '203.0.113.77' });
    expect(right.status).toBe(429);
    expect(right.jar.header()).not.toContain('session-token');
  }, SLOW);

  it('counts the e-mail Auth.js uses when the field is repeated', async () => {
    const target = DEMO.otherManager;
    const tries: number[] = [];
    for (let i = 0; i < 11; i++) {
      const csrf = await fetch(`${server.url}/api/auth/csrf`);
      const jar = new CookieJar();
      jar.absorb(csrf);
      const { csrfToken } = (await csrf.json()) as { csrfToken: string };
      // A decoy first, the real account last: Auth.js reads the last one.
      const body = `email=decoy${i}%40throwline.test&email=${encodeURIComponent(target)}&password=wrong-${i}&csrfToken=${csrfToken}&callbackUrl=%2Fvenues`;
      const res = await fetch(`${server.url}/api/auth/callback/credentials`, {
        method: 'POST',
        redirect: 'manual',
        headers: { 'content-type': 'application/x-www-form-urlencoded', origin: server.url, cookie: jar.header() },
        body,
      });
      tries.push(res.status);
    }
    expect(tries[10]).toBe(429);
    expect((await attemptSignIn(server.url, target, DEMO_PASSWORD)).status).toBe(429);
  }, SLOW);

  it('keeps the counters in the database, where other server processes read them', async () => {
    const { rows } = await people.db.execute("select key, count from throttle_counters where key like 'signin-acct:%'");
    const byKey = new Map(rows.map((r) => [String(r.key), Number(r.count)]));
    expect(byKey.get(`signin-acct:${DEMO.admin}`)).toBeGreaterThanOrEqual(10);
    expect(byKey.get(`signin-acct:${DEMO.otherManager}`)).toBeGreaterThanOrEqual(10);
  });
});

describe('sign-in limits behind a named proxy', () => {
  let proxied: TestServer;
  beforeAll(async () => {
    // The test client connects from loopback, so naming loopback makes the test the proxy.
    proxied = await startServer({ TRUST_PROXY: '127.0.0.1, ::1' });
  });
  afterAll(() => proxied?.stop());

  it('then the forwarded address counts, per address', async () => {
    for (let i = 0; i < 10; i++) await attemptSignIn(proxied.url, DEMO.viewer, `wrong-${i}`, { 'x-forwarded-for': '198.51.100.10' });
    expect((await attemptSignIn(proxied.url, DEMO.viewer, 'wrong', { 'x-forwarded-for': '198.51.100.10' })).status).toBe(429);
    // Another client behind the same proxy is not locked out by the first one's guesses.
    const other = await attemptSignIn(proxied.url, DEMO.viewer, DEMO_PASSWORD, { 'x-forwarded-for': '198.51.100.20' });
    expect(other.jar.header()).toContain('session-token');
  }, SLOW);
});
