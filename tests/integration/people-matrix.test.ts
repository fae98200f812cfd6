import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';
import { signInEveryone, userIdOf, type People, type Who } from './people-fixtures';

/**
 * The role matrix for every route and screen added for people and the advance sheet, in the home
 * venue, for each kind of principal. Expected answers follow DESIGN.md's roles table: managers
 * (and admins) run people and passes, engineers may also mark pages checked, viewers and guests
 * read the sheet; a manager of another venue, and any guest outside the sheet, gets 404.
 */

type Guest = 'guestValid' | 'guestExpired' | 'guestRevoked' | 'guestOtherVenue';
type Anyone = Who | Guest;
const MEMBERS: Who[] = ['admin', 'manager', 'engineer', 'viewer', 'otherManager', 'signedOut'];
const GUESTS: Guest[] = ['guestValid', 'guestExpired', 'guestRevoked', 'guestOtherVenue'];

let server: TestServer;
let people: People;
const tokens = {} as Record<Guest, string>;
let viewerId: string;

async function makePass(venue: string, label: string): Promise<{ id: string; token: string }> {
  const res = await people.as.manager.sendJson('POST', `/api/venues/${venue}/passes`, { label });
  expect(res.status).toBe(201);
  const { pass } = (await res.json()) as { pass: { id: string; url: string } };
  return { id: pass.id, token: pass.url.split('/').pop()! };
}

beforeAll(async () => {
  server = await startServer();
  people = await signInEveryone(server);
  viewerId = await userIdOf(people.db, 'viewer@throwline.test');
  tokens.guestValid = (await makePass(people.venue, 'Matrix act')).token;
  const expired = await makePass(people.venue, 'Expired act');
  await people.db.execute({ sql: 'update guest_passes set expires_at = ? where id = ?', args: [Date.now() - 1000, expired.id] });
  tokens.guestExpired = expired.token;
  const revoked = await makePass(people.venue, 'Revoked act');
  expect((await people.as.manager.fetch(`/api/venues/${people.venue}/passes/${revoked.id}`, { method: 'DELETE' })).status).toBe(204);
  tokens.guestRevoked = revoked.token;
  tokens.guestOtherVenue = (await makePass(people.otherVenue, 'Other venue act')).token;
});
afterAll(async () => {
  people?.db.close();
  await server?.stop();
});

function send(who: Anyone, method: string, path: string, body?: unknown): Promise<Response> {
  const isGuest = (GUESTS as string[]).includes(who);
  const client = isGuest ? people.as.signedOut : people.as[who as Who];
  const headers: Record<string, string> = isGuest ? { authorization: `Bearer ${tokens[who as Guest]}` } : {};
  if (body !== undefined) headers['content-type'] = 'application/json';
  return client.fetch(path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
}

/** Status per principal: `ok` for the allowed ones, 403 for members refused, 404 outside, 401 signed out. */
function expectation(allowed: Anyone[], ok: number, refusedMember = 403): Record<Anyone, number> {
  const out = {} as Record<Anyone, number>;
  for (const who of [...MEMBERS, ...GUESTS]) {
    if (allowed.includes(who)) out[who] = ok;
    else if (who === 'signedOut') out[who] = 401;
    else if (who === 'otherManager' || (GUESTS as string[]).includes(who)) out[who] = 404;
    else out[who] = refusedMember;
  }
  return out;
}

const MANAGERS: Anyone[] = ['admin', 'manager'];
const READERS: Anyone[] = ['admin', 'manager', 'engineer', 'viewer'];

let n = 0;
const routes: { name: string; run: (who: Anyone) => Promise<Response>; expect: Record<Anyone, number> }[] = [
  { name: 'GET members', run: (w) => send(w, 'GET', `/api/venues/${people.venue}/members`), expect: expectation(MANAGERS, 200) },
  { name: 'POST invitations', run: (w) => send(w, 'POST', `/api/venues/${people.venue}/invitations`, { email: `matrix-${w}-${n++}@throwline.test`, role: 'viewer' }), expect: expectation(MANAGERS, 201) },
  { name: 'PATCH member (no-op role)', run: (w) => send(w, 'PATCH', `/api/venues/${people.venue}/members/${viewerId}`, { role: 'viewer' }), expect: expectation(MANAGERS, 200) },
  { name: 'DELETE member (unknown id)', run: (w) => send(w, 'DELETE', `/api/venues/${people.venue}/members/no-such-user`), expect: expectation(MANAGERS, 404) },
  { name: 'DELETE invitation (unknown id)', run: (w) => send(w, 'DELETE', `/api/venues/${people.venue}/invitations/no-such-invitation`), expect: expectation(MANAGERS, 404) },
  { name: 'GET advance', run: (w) => send(w, 'GET', `/api/venues/${people.venue}/advance`), expect: expectation([...READERS, 'guestValid'], 200) },
  { name: 'PUT advance', run: (w) => send(w, 'PUT', `/api/venues/${people.venue}/advance`, { pages: ['power-distribution', 'rigging-points'] }), expect: expectation(MANAGERS, 200) },
  { name: 'POST passes', run: (w) => send(w, 'POST', `/api/venues/${people.venue}/passes`, { label: `Matrix ${w}` }), expect: expectation(MANAGERS, 201) },
  { name: 'GET passes', run: (w) => send(w, 'GET', `/api/venues/${people.venue}/passes`), expect: expectation(MANAGERS, 200) },
  { name: 'DELETE pass (unknown id)', run: (w) => send(w, 'DELETE', `/api/venues/${people.venue}/passes/no-such-pass`), expect: expectation(MANAGERS, 404) },
  { name: 'GET changes', run: (w) => send(w, 'GET', `/api/venues/${people.venue}/changes?since=2020-01-01`), expect: expectation([...READERS, 'guestValid'], 200) },
  { name: 'GET audit', run: (w) => send(w, 'GET', `/api/venues/${people.venue}/audit`), expect: expectation(MANAGERS, 200) },
  { name: 'PUT page advance switch', run: (w) => send(w, 'PUT', `/api/venues/${people.venue}/pages/power-distribution/advance`, { included: true }), expect: expectation(MANAGERS, 200) },
  { name: 'POST page check', run: (w) => send(w, 'POST', `/api/venues/${people.venue}/pages/power-distribution/check`), expect: expectation(['admin', 'manager', 'engineer'], 200) },
  // Archive and move (no-ops here: restore a live page, move a page to its own section).
  { name: 'PUT page archived', run: (w) => send(w, 'PUT', `/api/venues/${people.venue}/pages/power-distribution/archived`, { archived: false }), expect: expectation(['admin', 'manager', 'engineer'], 200) },
  { name: 'PUT page section', run: (w) => send(w, 'PUT', `/api/venues/${people.venue}/pages/power-distribution/section`, { section: 'power' }), expect: expectation(['admin', 'manager', 'engineer'], 200) },
  { name: 'GET venue', run: (w) => send(w, 'GET', `/api/venues/${people.venue}`), expect: expectation(READERS, 200) },
  { name: 'PATCH venue (same interval)', run: (w) => send(w, 'PATCH', `/api/venues/${people.venue}`, { checkStaleMonths: 6 }), expect: expectation(MANAGERS, 200) },
  // Routes that existed before: a guest's pass opens none of them.
  { name: 'GET pages (existing)', run: (w) => send(w, 'GET', `/api/venues/${people.venue}/pages`), expect: expectation(READERS, 200) },
  { name: 'GET search (existing)', run: (w) => send(w, 'GET', `/api/search?q=power`), expect: { ...expectation([...READERS, 'otherManager'], 200) } },
];

describe('role matrix: JSON routes', () => {
  for (const route of routes) {
    it(route.name, async () => {
      const got = {} as Record<Anyone, number>;
      for (const who of [...MEMBERS, ...GUESTS]) got[who] = (await route.run(who)).status;
      expect(got).toEqual(route.expect);
    });
  }
});

describe('role matrix: screens', () => {
  const screens: { path: () => string; allowed: Who[] }[] = [
    { path: () => `/venues/${people.venue}/members`, allowed: ['admin', 'manager'] },
    { path: () => `/venues/${people.venue}/passes`, allowed: ['admin', 'manager'] },
    { path: () => `/venues/${people.venue}/audit`, allowed: ['admin', 'manager'] },
    { path: () => `/venues/${people.venue}/advance/edit`, allowed: ['admin', 'manager'] },
    { path: () => `/venues/${people.venue}/advance`, allowed: ['admin', 'manager', 'engineer', 'viewer'] },
    { path: () => `/venues/${people.venue}/changes`, allowed: ['admin', 'manager', 'engineer', 'viewer'] },
    { path: () => `/venues/${people.venue}/archived`, allowed: ['admin', 'manager', 'engineer'] },
    { path: () => `/venues/${people.venue}/settings`, allowed: ['admin', 'manager'] },
  ];
  for (const screen of screens) {
    it(`${screen.path.toString().match(/\/(\w+(?:\/edit)?)`/)?.[1] ?? 'screen'}`, async () => {
      for (const who of MEMBERS) {
        const res = await people.as[who].fetch(screen.path());
        const want = screen.allowed.includes(who) ? 200 : who === 'signedOut' ? 303 : who === 'otherManager' ? 404 : 403;
        expect(res.status, `${who} ${screen.path()}`).toBe(want);
        if (want === 200) expect(res.headers.get('cache-control')).toBe('no-store');
      }
    });
  }

  it('the guest link opens only for a live pass, and only its own venue; others are 404', async () => {
    for (const guest of GUESTS) {
      const res = await people.as.signedOut.fetch(`/advance/${tokens[guest]}`);
      // The other venue's pass opens that venue's sheet, never this one's.
      expect(res.status, guest).toBe(guest === 'guestValid' || guest === 'guestOtherVenue' ? 200 : 404);
      if (guest === 'guestOtherVenue') expect(await res.text()).not.toContain('Haverkin Hall');
      expect(res.headers.get('referrer-policy')).toBe('no-referrer');
      expect(res.headers.get('x-robots-tag')).toContain('noindex');
    }
    const ok = await (await people.as.signedOut.fetch(`/advance/${tokens.guestValid}`)).text();
    expect(ok).toContain('name="robots" content="noindex');
    expect(ok).toContain('data-testid="advance-sheet"');
  });
});
