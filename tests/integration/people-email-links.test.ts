// Sign-in links and password resets by e-mail, received at the wire by the local SMTP server.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { attemptSignIn, Client, CookieJar } from '../helpers/session';
import { linkIn, mailTo, outbox, signInEveryone, type People } from './people-fixtures';

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

function postForm(path: string, fields: Record<string, string>): Promise<Response> {
  return fetch(`${server.url}${path}`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: server.url },
    body: new URLSearchParams(fields),
  });
}

const SAME_ANSWER = 'If an account uses that address';

describe('"e-mail me a sign-in link"', () => {
  it('answers the same for a known and an unknown address, and mails only the known one', async () => {
    const before = (await outbox(server)).length;
    const known = await postForm('/signin/link', { email: DEMO.viewer });
    const unknown = await postForm('/signin/link', { email: 'nobody.here@throwline.test' });
    expect(known.status).toBe(unknown.status);
    expect(await known.text()).toContain(SAME_ANSWER);
    expect(await unknown.text()).toContain(SAME_ANSWER);
    await mailTo(server, DEMO.viewer);
    expect((await outbox(server)).filter((m) => m.to.includes('nobody.here@throwline.test'))).toEqual([]);
    expect((await outbox(server)).length).toBe(before + 1);
  });

  it('the link signs in once: opening it spends nothing, its button gives a session, a second use is refused', async () => {
    const mail = await mailTo(server, DEMO.viewer);
    const link = new URL(linkIn(mail.text, '/signin/link/'));
    const token = link.pathname.split('/').pop()!;
    const { rows } = await people.db.execute('select token from verification_tokens');
    expect(rows.map((r) => String(r.token)).join(' ')).not.toContain(token);
    // A mail scanner fetching the link does not use it up.
    expect((await fetch(`${server.url}${link.pathname}`)).status).toBe(200);
    const used = await postForm(link.pathname, {});
    expect(used.status).toBe(303);
    const jar = new CookieJar();
    jar.absorb(used);
    expect(jar.header()).toContain('authjs.session-token=');
    const me = new Client(server.url, jar);
    expect((await me.fetch('/api/venues')).status).toBe(200);
    const again = await postForm(link.pathname, {});
    expect(again.headers.get('set-cookie') ?? '').not.toContain('authjs.session-token=');
    expect([404, 410]).toContain(again.status);
  });

  it('a forged token gives a sentence and no session', async () => {
    const res = await postForm(`/signin/link/${'A'.repeat(43)}`, {});
    expect(res.headers.get('set-cookie') ?? '').not.toContain('authjs.session-token=');
    expect(res.status).toBe(404);
  });

  it('refuses an address with a header injected into it, and two e-mail fields', async () => {
    const before = (await outbox(server)).length;
    const injected = await postForm('/signin/link', { email: `${DEMO.engineer}\r\nBcc: spy@elsewhere.test` });
    expect(injected.status).toBe(400);
    const twice = await fetch(`${server.url}/signin/link`, {
      method: 'POST', redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: server.url },
      body: `email=${encodeURIComponent('decoy@throwline.test')}&email=${encodeURIComponent(DEMO.engineer)}`,
    });
    expect(twice.status).toBe(400);
    await new Promise((r) => setTimeout(r, 500));
    expect((await outbox(server)).length).toBe(before);
  });
});

describe('"forgot password"', () => {
  it('the reset link sets a new password, ends other sessions, and works once', async () => {
    const email = DEMO.engineer;
    const old = people.as.engineer;
    expect((await old.fetch('/api/venues')).status).toBe(200);
    expect((await postForm('/signin/forgot', { email })).status).toBe(200);
    const mail = await mailTo(server, email);
    const link = new URL(linkIn(mail.text, '/signin/reset/'));
    const mismatch = await postForm(link.pathname, { password: 'a-new-long-password', confirm: 'something-else-entirely' });
    expect(mismatch.headers.get('set-cookie') ?? '').not.toContain('authjs.session-token=');
    const reset = await postForm(link.pathname, { password: 'a-new-long-password', confirm: 'a-new-long-password' });
    expect(reset.status).toBe(303);
    // The session opened before the reset no longer reads.
    expect((await old.fetch('/api/venues')).status).toBe(401);
    expect((await attemptSignIn(server.url, email, DEMO_PASSWORD)).jar.header()).not.toContain('authjs.session-token=');
    expect((await attemptSignIn(server.url, email, 'a-new-long-password')).jar.header()).toContain('authjs.session-token=');
    const again = await postForm(link.pathname, { password: 'third-long-password', confirm: 'third-long-password' });
    expect(again.status).toBe(404);
  });
});
