import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';
import { signInEveryone, type People } from './people-fixtures';
import { snapshot } from './pages-fixtures';
import { TOWN_MAX, VENUE_NAME_MAX } from '~/lib/text-limits';

/**
 * A venue's settings: its name and town (the slug and every link stay), and how long power and
 * rigging pages may go unchecked before the advance sheet warns. Managers and admins only.
 */
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

const patch = (who: keyof People['as'], body: unknown, venue = people.venue) => people.as[who].sendJson('PATCH', `/api/venues/${venue}`, body);

describe('PATCH /api/venues/:venue', () => {
  it('renames the venue for its manager; the address stays and every screen shows the new name at once', async () => {
    const { venue: before } = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}`)).json()) as { venue: { name: string; town: string | null } };
    // Warm the cached views first.
    await people.as.viewer.fetch(`/venues/${people.venue}/power-distribution`);
    await people.as.viewer.fetch(`/venues/${people.venue}/power-distribution`);
    try {
      const res = await patch('manager', { name: 'Haverkin Hall & Annexe', town: '' });
      expect(res.status).toBe(200);
      const { venue } = (await res.json()) as { venue: { slug: string; name: string; town: string | null } };
      expect(venue).toMatchObject({ slug: people.venue, name: 'Haverkin Hall & Annexe', town: null });
      expect(await (await people.as.viewer.fetch(`/venues/${people.venue}/power-distribution`)).text()).toContain('Haverkin Hall &amp; Annexe');
      expect(await (await people.as.viewer.fetch(`/venues/${people.venue}`)).text()).toContain('Haverkin Hall &amp; Annexe');
      const listed = (await (await people.as.viewer.fetch('/api/venues')).json()) as { venues: { slug: string; name: string }[] };
      expect(listed.venues.find((v) => v.slug === people.venue)?.name).toBe('Haverkin Hall & Annexe');
      const audit = (await people.db.execute({ sql: "select detail from audit_events where action = 'venue.update' order by created_at desc limit 1", args: [] })).rows[0];
      expect(JSON.parse(String(audit.detail))).toMatchObject({ name: { from: before.name, to: 'Haverkin Hall & Annexe' } });
    } finally {
      expect((await patch('admin', { name: before.name, town: before.town ?? '' })).status).toBe(200);
    }
  });

  it('takes names in any script, and shows markup in a name as text', async () => {
    const { venue: before } = (await (await people.as.viewer.fetch(`/api/venues/${people.venue}`)).json()) as { venue: { name: string; town: string | null } };
    try {
      const res = await patch('manager', { name: 'Salle Écluse — 北ホール <b>', town: 'Zürich' });
      expect(res.status).toBe(200);
      expect(((await res.json()) as { venue: { name: string } }).venue.name).toBe('Salle Écluse — 北ホール <b>');
      const home = await (await people.as.viewer.fetch(`/venues/${people.venue}`)).text();
      expect(home).toContain('Salle Écluse — 北ホール &lt;b&gt;');
      expect(home).not.toContain('北ホール <b>');
    } finally {
      expect((await patch('admin', { name: before.name, town: before.town ?? '' })).status).toBe(200);
    }
  });

  it('the warning on the advance sheet follows the venue setting', async () => {
    // Power distribution checked on site four months ago.
    const checked = new Date();
    checked.setUTCMonth(checked.getUTCMonth() - 4);
    await people.db.execute({ sql: "update pages set checked_at = ?, in_advance = 1 where slug = 'power-distribution'", args: [checked.getTime()] });
    const stale = async () => ((await (await people.as.viewer.fetch(`/venues/${people.venue}/advance`)).text()).match(/data-testid="check-stale"/g) ?? []).length;
    expect((await patch('manager', { checkStaleMonths: 6 })).status).toBe(200);
    const atSix = await stale();
    expect((await patch('manager', { checkStaleMonths: '3' })).status).toBe(200);
    expect(await stale()).toBe(atSix + 1);
    expect((await patch('manager', { checkStaleMonths: 6 })).status).toBe(200);
    expect(await stale()).toBe(atSix);
  });

  it.each([
    ['no field at all', {}],
    ['0 months', { checkStaleMonths: 0 }],
    ['37 months', { checkStaleMonths: 37 }],
    ['half a month', { checkStaleMonths: 2.5 }],
    ['months as true', { checkStaleMonths: true }],
    ['months as words', { checkStaleMonths: 'six' }],
    ['a one-letter name', { name: 'H' }],
    ['a name with a bidi override', { name: 'Hall\u202Eevil' }],
    ['a line break in the town', { town: 'Line\r\nBcc: x@y' }],
    ['a line break and a header in the name', { name: 'Hall\r\nX-Injected: 1' }],
    ['a NUL in the name', { name: 'Hall\u0000' }],
    ['an overlong name', { name: 'H'.repeat(VENUE_NAME_MAX + 1) }],
    ['an overlong town', { town: 't'.repeat(TOWN_MAX + 1) }],
    ['a name that is only spaces', { name: '     ' }],
    ['a new slug', { slug: 'elsewhere' }],
    ['not an object', ['Hall']],
  ])('%s is a 400 with a sentence, and nothing changes', async (_name, body) => {
    const before = await snapshot(server.dbPath);
    const res = await patch('manager', body);
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error.length).toBeGreaterThan(10);
    expect((await snapshot(server.dbPath)).audit).toBe(before.audit);
  });

  it('engineers and viewers may not (403), another venue’s manager and guests see no venue (404), the signed out 401', async () => {
    expect((await patch('engineer', { name: 'Engineer Hall' })).status).toBe(403);
    expect((await patch('viewer', { name: 'Viewer Hall' })).status).toBe(403);
    expect((await patch('otherManager', { name: 'Other Hall' })).status).toBe(404);
    expect((await patch('signedOut', { name: 'Nobody Hall' })).status).toBe(401);
    for (const who of ['engineer', 'viewer'] as const) expect((await people.as[who].fetch(`/venues/${people.venue}/settings`)).status).toBe(403);
    expect((await people.as.manager.fetch(`/venues/${people.venue}/settings`)).status).toBe(200);
  });
});

describe('a new venue and its first manager', () => {
  it('the admin creates a venue, the members screen asks for its first manager, and the invitation gives that role', async () => {
    const made = await people.as.admin.sendJson('POST', '/api/venues', { name: 'Quillmoor Barn', town: 'Quillmoor' });
    expect(made.status).toBe(201);
    const { venue } = (await made.json()) as { venue: { slug: string } };
    const screen = await (await people.as.admin.fetch(`/venues/${venue.slug}/members`)).text();
    expect(screen).toContain('data-testid="no-manager"');
    expect(screen).toMatch(/<option value="manager" selected/);
    // …and the way to its name and town, which the admin may change before anyone is in.
    expect(screen).toContain(`href="/venues/${venue.slug}/settings"`);
    expect((await people.as.admin.fetch(`/venues/${venue.slug}/settings`)).status).toBe(200);
    const invited = await people.as.admin.sendJson('POST', `/api/venues/${venue.slug}/invitations`, { email: 'first-manager@throwline.test', role: 'manager' });
    expect(invited.status).toBe(201);
    // The admin can rename it too, before anyone else is in.
    expect((await patch('admin', { name: 'Quillmoor Old Barn' }, venue.slug)).status).toBe(200);
    const actions = (await people.db.execute({ sql: "select action from audit_events a join venues v on v.id = a.venue_id where v.slug = ? order by a.created_at, a.rowid", args: [venue.slug] })).rows.map((r) => String(r.action));
    expect(actions).toEqual(['venue.create', 'invitation.create', 'venue.update']);
  });
});
