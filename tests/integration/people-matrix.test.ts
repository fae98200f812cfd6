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
let archivedSlug = 'archived-page-not-made-yet';

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
  const made = await people.as.engineer.sendJson('POST', `/api/venues/${people.venue}/pages`, {
    title: 'Matrix archived page',
    section: 'stage',
    doc: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Out of the book.' }] }] },
  });
  expect(made.status).toBe(201);
  archivedSlug = ((await made.json()) as { page: { slug: string } }).page.slug;
  expect((await people.as.engineer.sendJson('PUT', `/api/venues/${people.venue}/pages/${archivedSlug}/archived`, { archived: true })).status).toBe(200);
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

  /**
   * Every screen once more, now also for each guest presenting their pass as
   * `Authorization: Bearer` (a pass opens /advance/<token> and nothing else: 404 everywhere here,
   * never "sign in"), and the screens every signed-in person, or anyone, may open.
   */
  type Rule = 'manager' | 'editor' | 'reader' | 'signed-in' | 'anyone';
  const everyScreen: { path: () => string; rule: Rule }[] = [
    { path: () => `/venues/${people.venue}/members`, rule: 'manager' },
    { path: () => `/venues/${people.venue}/passes`, rule: 'manager' },
    { path: () => `/venues/${people.venue}/audit`, rule: 'manager' },
    { path: () => `/venues/${people.venue}/advance/edit`, rule: 'manager' },
    { path: () => `/venues/${people.venue}/settings`, rule: 'manager' },
    { path: () => `/venues/${people.venue}/archived`, rule: 'editor' },
    { path: () => `/venues/${people.venue}/sections`, rule: 'editor' },
    { path: () => `/venues/${people.venue}/power-distribution/edit`, rule: 'editor' },
    // An archived page: those who may restore it read it with a note; to everyone else it is not there.
    { path: () => `/venues/${people.venue}/${archivedSlug}`, rule: 'editor' },
    { path: () => `/venues/${people.venue}/${archivedSlug}/history`, rule: 'editor' },
    { path: () => `/venues/${people.venue}/advance`, rule: 'reader' },
    { path: () => `/venues/${people.venue}/changes`, rule: 'reader' },
    { path: () => `/venues/${people.venue}`, rule: 'reader' },
    { path: () => `/venues/${people.venue}/power-distribution`, rule: 'reader' },
    { path: () => '/search?q=power', rule: 'signed-in' },
    { path: () => '/account', rule: 'signed-in' },
    { path: () => '/venues', rule: 'signed-in' },
    { path: () => '/signin/link', rule: 'anyone' },
    { path: () => '/signin/forgot', rule: 'anyone' },
  ];
  const allowedBy: Record<Exclude<Rule, 'anyone' | 'signed-in'>, Who[]> = {
    manager: ['admin', 'manager'],
    editor: ['admin', 'manager', 'engineer'],
    reader: ['admin', 'manager', 'engineer', 'viewer'],
  };
  function screenAnswer(rule: Rule, who: Anyone): number {
    if (rule === 'anyone') return 200;
    if ((GUESTS as string[]).includes(who)) return 404;
    if (who === 'signedOut') return 303;
    if (rule === 'signed-in') return 200;
    if (allowedBy[rule].includes(who as Who)) return 200;
    return who === 'otherManager' ? 404 : 403;
  }
  for (const screen of everyScreen) {
    it(`every principal, guests with a pass included: ${screen.path.toString().replace(/^\(\) => /, '')}`, async () => {
      const got = {} as Record<Anyone, number>;
      const want = {} as Record<Anyone, number>;
      for (const who of [...MEMBERS, ...GUESTS]) {
        const res = await send(who, 'GET', screen.path());
        got[who] = res.status;
        want[who] = screenAnswer(screen.rule, who);
        // An archived page is no refusal but absence: a viewer gets the 404 page, not the 403 one.
        if (screen.path().includes(archivedSlug) && who === 'viewer') want[who] = 404;
        if (res.status === 303) expect(res.headers.get('location'), `${who} ${screen.path()}`).toMatch(/^\/signin\?next=/);
      }
      expect(got).toEqual(want);
    });
  }

  it('forged sign-in, reset and invitation links are a 404 for anyone, a pass presented included', async () => {
    // Few principals: wrong tokens count against the address (20 per 15 minutes), and these pages
    // answer the same whoever asks; each role is tried on at least one of them.
    const forged = 'A'.repeat(43);
    const asks: [Anyone, string][] = [
      ['signedOut', `/signin/link/${forged}`],
      ['viewer', `/signin/link/${forged}`],
      ['guestValid', `/signin/link/${forged}`],
      ['signedOut', `/signin/reset/${forged}`],
      ['manager', `/signin/reset/${forged}`],
      ['guestRevoked', `/signin/reset/${forged}`],
      ['signedOut', `/invite/${forged}`],
      ['engineer', `/invite/${forged}`],
      ['guestExpired', `/invite/${forged}`],
      ['admin', `/invite/${forged}x`],
      ['otherManager', `/signin/link/${forged}x`],
      ['guestOtherVenue', `/signin/reset/${forged}x`],
    ];
    for (const [who, path] of asks) {
      const res = await send(who, 'GET', path);
      expect(res.status, `${who} ${path}`).toBe(404);
      expect(res.headers.get('set-cookie') ?? '', `${who} ${path}`).not.toMatch(/session-token=[^;]/);
    }
  });

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
