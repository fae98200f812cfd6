import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { Client, CookieJar, signIn } from '../helpers/session';
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

/** Posts the invitation page's own form, as a browser does. */
async function acceptAsNewPerson(link: string, fields: Record<string, string>): Promise<Response> {
  const url = new URL(link);
  return fetch(`${server.url}${url.pathname}`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: server.url },
    body: new URLSearchParams(fields),
  });
}

describe('invitations by e-mail, received at the wire', () => {
  it('a new engineer accepts from the e-mail, gets a session and edits a page', async () => {
    const email = 'new.engineer@throwline.test';
    const res = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email, role: 'engineer' });
    expect(res.status).toBe(201);
    const mail = await mailTo(server, email);
    expect(mail.subject).toContain('invited');
    const link = linkIn(mail.text, '/invite/');
    // The token is stored only as its hash: the raw token appears nowhere in the database.
    const token = link.split('/').pop()!;
    const { rows } = await people.db.execute({ sql: 'select token_hash from invitations where email = ?', args: [email] });
    expect(rows.length).toBe(1);
    expect(String(rows[0].token_hash)).not.toContain(token);
    expect(String(rows[0].token_hash)).toMatch(/^[0-9a-f]{64}$/);

    const page = await fetch(`${server.url}${new URL(link).pathname}`);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Create my account');
    const accepted = await acceptAsNewPerson(link, { name: 'Robin Ashgrove', password: 'a-long-enough-password' });
    expect(accepted.status).toBe(303);
    expect(accepted.headers.get('location')).toBe(`/venues/${people.venue}`);
    const jar = new CookieJar();
    jar.absorb(accepted);
    expect(jar.header()).toContain('authjs.session-token=');
    const engineer = new Client(server.url, jar);
    const current = (await (await engineer.fetch(`/api/venues/${people.venue}/pages/power-distribution`)).json()) as { page: { currentRevision: number }; revision: { doc: unknown } };
    const save = await engineer.sendJson('PUT', `/api/venues/${people.venue}/pages/power-distribution`, { baseRevision: current.page.currentRevision, doc: current.revision.doc, summary: 'First edit by the invited engineer' });
    expect(save.status).toBe(200);
    // Members list shows the new person with the role given.
    const list = (await (await people.as.manager.fetch(`/api/venues/${people.venue}/members`)).json()) as { members: { email: string; role: string }[] };
    expect(list.members.find((m) => m.email === email)?.role).toBe('engineer');

    // Used once: the same link again is a dead end with a sentence, and no session.
    const again = await acceptAsNewPerson(link, { name: 'Someone Else', password: 'another-long-password' });
    expect(again.status).toBe(404);
    expect(again.headers.getSetCookie().join('')).not.toContain('session-token');
    expect(await again.text()).toContain('has been used, has expired or was withdrawn');
  });

  it('an existing account joins after signing in as the invited address', async () => {
    const res = await people.as.manager.sendJson('POST', `/api/venues/${people.otherVenue}/invitations`, { email: DEMO.engineer, role: 'viewer' });
    expect(res.status).toBe(201);
    const link = linkIn((await mailTo(server, DEMO.engineer)).text, '/invite/');
    const path = new URL(link).pathname;
    // Signed out, or signed in as someone else: no joining.
    const shown = await (await fetch(`${server.url}${path}`)).text();
    expect(shown.replace(/<[^>]+>/g, '')).toContain('Sign in as');
    const wrong = await people.as.viewer.fetch(path, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: '' });
    expect(wrong.status).toBe(403);
    const engineer = await signIn(server.url, DEMO.engineer);
    expect((await engineer.fetch(`/api/venues/${people.otherVenue}/pages`)).status).toBe(404);
    const join = await engineer.fetch(path, { method: 'POST', headers: { 'content-type': 'application/x-www-form-urlencoded' }, body: '' });
    expect(join.status).toBe(303);
    expect((await engineer.fetch(`/api/venues/${people.otherVenue}/pages`)).status).toBe(200);
  });

  it('forged, expired and withdrawn links are 404 with a sentence, never a session', async () => {
    const forged = await acceptAsNewPerson(`${server.url}/invite/${'A'.repeat(43)}`, { name: 'X', password: 'long-enough-password' });
    expect(forged.status).toBe(404);
    expect(forged.headers.getSetCookie().join('')).not.toContain('session-token');
    expect((await fetch(`${server.url}/invite/not-even-a-token`)).status).toBe(404);

    const email = 'late@throwline.test';
    await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email, role: 'viewer' });
    const link = linkIn((await mailTo(server, email)).text, '/invite/');
    await people.db.execute({ sql: 'update invitations set expires_at = ? where email = ?', args: [Date.now() - 1, email] });
    const expired = await acceptAsNewPerson(link, { name: 'Late Person', password: 'long-enough-password' });
    expect(expired.status).toBe(404);
    const { rows } = await people.db.execute({ sql: 'select count(*) as n from users where email = ?', args: [email] });
    expect(Number(rows[0].n)).toBe(0);

    const email2 = 'withdrawn@throwline.test';
    const created = (await (await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email: email2, role: 'viewer' })).json()) as { invitation: { id: string } };
    const link2 = linkIn((await mailTo(server, email2)).text, '/invite/');
    expect((await people.as.manager.fetch(`/api/venues/${people.venue}/invitations/${created.invitation.id}`, { method: 'DELETE' })).status).toBe(204);
    expect((await acceptAsNewPerson(link2, { name: 'Withdrawn', password: 'long-enough-password' })).status).toBe(404);
  });

  it('sending again replaces the link: the first one stops working', async () => {
    const email = 'resend@throwline.test';
    const created = (await (await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email, role: 'viewer' })).json()) as { invitation: { id: string } };
    const first = linkIn((await mailTo(server, email, 1)).text, '/invite/');
    expect((await people.as.manager.fetch(`/api/venues/${people.venue}/invitations/${created.invitation.id}/resend`, { method: 'POST' })).status).toBe(201);
    const second = linkIn((await mailTo(server, email, 2)).text, '/invite/');
    expect(second).not.toBe(first);
    expect((await fetch(first)).status).toBe(404);
    expect((await acceptAsNewPerson(second, { name: 'Resent Person', password: 'long-enough-password' })).status).toBe(303);
  });

  it('refuses header injection in addresses and names, and sends nothing', async () => {
    const before = (await outbox(server)).length;
    for (const email of ['victim@throwline.test\r\nBcc: everyone@elsewhere.test', 'a@throwline.test, b@elsewhere.test', 'Name <a@throwline.test>']) {
      const res = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email, role: 'viewer' });
      expect(res.status, email).toBe(400);
      expect(((await res.json()) as { field: string }).field).toBe('email');
    }
    expect((await outbox(server)).length).toBe(before);

    const email = 'name-injection@throwline.test';
    await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email, role: 'viewer' });
    const link = linkIn((await mailTo(server, email)).text, '/invite/');
    const bad = await acceptAsNewPerson(link, { name: 'Eve\r\nBcc: x@elsewhere.test', password: 'long-enough-password' });
    expect(bad.status).toBe(400);
    expect(await bad.text()).toContain('line breaks');
  });

  it('rate-limits mail to one address', async () => {
    const email = 'flooded@throwline.test';
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email, role: 'viewer' })).status);
    expect(statuses).toEqual([201, 201, 201, 429]);
  });

  it('an existing member cannot be invited again (409)', async () => {
    const res = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/invitations`, { email: DEMO.viewer, role: 'manager' });
    expect(res.status).toBe(409);
  });
});
