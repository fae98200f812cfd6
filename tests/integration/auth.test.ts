import { encode } from '@auth/core/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, attemptSignIn, signIn } from '../helpers/session';

let server: TestServer;

async function userIdOf(email: string): Promise<string> {
  const { createClient } = await import('@libsql/client');
  const db = createClient({ url: `file:${server.dbPath}` });
  const { rows } = await db.execute({ sql: 'select id from users where email = ?', args: [email] });
  db.close();
  return String(rows[0].id);
}
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

describe('sign-in', () => {
  it('accepts the right password and the session reaches the API', async () => {
    const attempt = await attemptSignIn(server.url, DEMO.manager, DEMO_PASSWORD);
    expect(attempt.status).toBe(302);
    expect(attempt.location).toMatch(/\/venues$/);
    expect(attempt.jar.header()).toContain('authjs.session-token=');
    const client = await signIn(server.url, DEMO.manager);
    const res = await client.fetch('/api/venues');
    expect(res.status).toBe(200);
  });

  it('refuses a wrong password with no session and a message on the sign-in page', async () => {
    const attempt = await attemptSignIn(server.url, DEMO.viewer, 'not-the-password');
    expect(attempt.status).toBe(302);
    expect(attempt.location).toContain('error=CredentialsSignin');
    expect(attempt.jar.header()).not.toContain('session-token');
    const page = await fetch(new URL(attempt.location!, server.url));
    expect(await page.text()).toContain('do not match an account');
  });

  it('refuses an unknown account exactly like a wrong password', async () => {
    const attempt = await attemptSignIn(server.url, 'nobody@throwline.test', 'whatever-it-is');
    expect(attempt.location).toContain('error=CredentialsSignin');
  });

  it('answers 429 on the 11th wrong password in 15 minutes, even with the right one', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await attemptSignIn(server.url, DEMO.engineer, `wrong-${i}`)).status);
    expect(statuses.every((s) => s === 302)).toBe(true);
    const eleventh = await attemptSignIn(server.url, DEMO.engineer, 'wrong-again');
    expect(eleventh.status).toBe(429);
    const right = await attemptSignIn(server.url, DEMO.engineer, DEMO_PASSWORD);
    expect(right.status).toBe(429);
    expect(right.jar.header()).not.toContain('session-token');
  });

  it('keeps counting per account: another account from the same address still signs in', async () => {
    const other = await attemptSignIn(server.url, DEMO.admin, DEMO_PASSWORD);
    expect(other.jar.header()).toContain('session-token');
  });

  it('ends a session 12 hours after sign-in, however fresh the cookie is', async () => {
    const client = await signIn(server.url, DEMO.viewer);
    const me = (await (await client.fetch('/api/venues')).json()) as { venues: unknown[] };
    expect(me.venues.length).toBe(1);
    const sub = await userIdOf(DEMO.viewer);
    const salt = 'authjs.session-token';
    const mint = (ageHours: number) =>
      encode({ token: { sub, authTime: Date.now() - ageHours * 3600_000 }, secret: server.authSecret, salt, maxAge: 3600 });
    const fresh = await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${await mint(11.9)}` } });
    expect(fresh.status).toBe(200);
    const stale = await fetch(`${server.url}/api/venues`, { headers: { cookie: `${salt}=${await mint(12.1)}` } });
    expect(stale.status).toBe(401);
  });

  it('rejects a forged session cookie', async () => {
    const res = await fetch(`${server.url}/api/venues`, { headers: { cookie: 'authjs.session-token=forged.value.here' } });
    expect(res.status).toBe(401);
  });

  it('signs out: the cookie is cleared', async () => {
    const client = await signIn(server.url, DEMO.viewer);
    const csrfRes = await client.fetch('/api/auth/csrf');
    client.jar.absorb(csrfRes);
    const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
    const out = await client.fetch('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, callbackUrl: '/signin?signedout=1' }),
    });
    client.jar.absorb(out);
    expect(client.jar.header()).not.toContain('session-token');
    expect((await client.fetch('/api/venues')).status).toBe(401);
  });

  it('sends a signed-out visitor of an HTML page to sign in and back', async () => {
    const res = await anonymous(server.url).fetch('/venues/some-venue/some-page');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/signin?next=%2Fvenues%2Fsome-venue%2Fsome-page');
  });
});
