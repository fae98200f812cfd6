import { readdirSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { DEMO, ROOT } from '../helpers/paths';
import { anonymous, signIn, type Client } from '../helpers/session';

type Need = 'anyone' | 'signed-in' | 'viewer' | 'editor' | 'manager' | 'admin';
type Who = 'anonymous' | 'viewer' | 'engineer' | 'manager' | 'non-member' | 'admin';

interface Ids {
  venue: string;
  page: string;
  section: string;
  fileOf: (client: Client) => Promise<string>;
  sectionOf: () => Promise<string>;
}

interface Row {
  /** The route file under src/pages this row exercises. */
  file: string;
  method: string;
  need: Need;
  html?: boolean;
  path: (ids: Ids, client: Client) => Promise<string> | string;
  body?: unknown;
}

const bad = { nonsense: true };
const ROWS: Row[] = [
  { file: 'api/venues/index.ts', method: 'GET', need: 'signed-in', path: () => '/api/venues' },
  { file: 'api/venues/index.ts', method: 'POST', need: 'admin', path: () => '/api/venues', body: bad },
  { file: 'api/search.ts', method: 'GET', need: 'signed-in', path: () => '/api/search?q=stage' },
  { file: 'api/admin/mail-test.ts', method: 'POST', need: 'admin', path: () => '/api/admin/mail-test', body: bad },
  { file: 'api/venues/[venue]/pages/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/pages` },
  { file: 'api/venues/[venue]/pages/index.ts', method: 'POST', need: 'editor', path: (i) => `/api/venues/${i.venue}/pages`, body: bad },
  { file: 'api/venues/[venue]/pages/[page]/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/pages/${i.page}` },
  { file: 'api/venues/[venue]/pages/[page]/index.ts', method: 'PUT', need: 'editor', path: (i) => `/api/venues/${i.venue}/pages/${i.page}`, body: bad },
  { file: 'api/venues/[venue]/pages/[page]/revisions/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/revisions` },
  { file: 'api/venues/[venue]/pages/[page]/revisions/[n]/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/revisions/1` },
  { file: 'api/venues/[venue]/pages/[page]/revisions/[n]/restore.ts', method: 'POST', need: 'editor', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/revisions/1/restore`, body: bad },
  { file: 'api/venues/[venue]/sections/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/sections` },
  { file: 'api/venues/[venue]/sections/index.ts', method: 'POST', need: 'editor', path: (i) => `/api/venues/${i.venue}/sections`, body: bad },
  { file: 'api/venues/[venue]/sections/[section].ts', method: 'PATCH', need: 'editor', path: (i) => `/api/venues/${i.venue}/sections/${i.section}`, body: bad },
  { file: 'api/venues/[venue]/sections/[section].ts', method: 'DELETE', need: 'editor', path: async (i) => `/api/venues/${i.venue}/sections/${await i.sectionOf()}` },
  { file: 'api/venues/[venue]/files/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/files` },
  { file: 'api/venues/[venue]/files/index.ts', method: 'POST', need: 'editor', path: (i) => `/api/venues/${i.venue}/files`, body: bad },
  { file: 'api/venues/[venue]/files/[id].ts', method: 'GET', need: 'viewer', path: async (i, c) => `/api/venues/${i.venue}/files/${await i.fileOf(c)}` },
  { file: 'api/venues/[venue]/files/[id].ts', method: 'PATCH', need: 'editor', path: async (i, c) => `/api/venues/${i.venue}/files/${await i.fileOf(c)}`, body: bad },
  { file: 'api/venues/[venue]/files/[id].ts', method: 'DELETE', need: 'editor', path: async (i, c) => `/api/venues/${i.venue}/files/${await i.fileOf(c)}?confirm=1` },
  { file: 'files/[id].ts', method: 'GET', need: 'viewer', path: async (i, c) => `/files/${await i.fileOf(c)}` },
  { file: 'files/[id]/[variant].ts', method: 'GET', need: 'viewer', path: async (i, c) => `/files/${await i.fileOf(c)}/original` },
  { file: 'api/calc/band.ts', method: 'GET', need: 'anyone', path: () => '/api/calc/band?q=2' },
  { file: 'api/calc/response.ts', method: 'POST', need: 'anyone', path: () => '/api/calc/response', body: bad },
  { file: 'calc/offline-pages.json.ts', method: 'GET', need: 'anyone', path: () => '/calc/offline-pages.json' },
  { file: 'index.astro', method: 'GET', need: 'anyone', html: true, path: () => '/' },
  { file: 'calc/index.astro', method: 'GET', need: 'anyone', html: true, path: () => '/calc' },
  { file: 'signin.astro', method: 'GET', need: 'anyone', html: true, path: () => '/signin' },
  { file: 'venues/index.astro', method: 'GET', need: 'signed-in', html: true, path: () => '/venues' },
  { file: 'venues/[venue]/index.astro', method: 'GET', need: 'viewer', html: true, path: (i) => `/venues/${i.venue}` },
  { file: 'venues/[venue]/[page]/index.astro', method: 'GET', need: 'viewer', html: true, path: (i) => `/venues/${i.venue}/${i.page}` },
  { file: 'venues/[venue]/[page]/history.astro', method: 'GET', need: 'viewer', html: true, path: (i) => `/venues/${i.venue}/${i.page}/history` },
  { file: 'venues/[venue]/[page]/edit.astro', method: 'GET', need: 'editor', html: true, path: (i) => `/venues/${i.venue}/${i.page}/edit` },
  { file: 'venues/[venue]/new.astro', method: 'GET', need: 'editor', html: true, path: (i) => `/venues/${i.venue}/new` },
  { file: 'venues/[venue]/files.astro', method: 'GET', need: 'viewer', html: true, path: (i) => `/venues/${i.venue}/files` },
  { file: 'venues/[venue]/sections.astro', method: 'GET', need: 'editor', html: true, path: (i) => `/venues/${i.venue}/sections` },
  { file: 'admin/outbox.astro', method: 'GET', need: 'admin', html: true, path: () => '/admin/outbox' },
  // People, the advance sheet, archiving and venue settings (bad bodies: nothing is changed).
  { file: 'api/venues/[venue]/index.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}` },
  { file: 'api/venues/[venue]/index.ts', method: 'PATCH', need: 'manager', path: (i) => `/api/venues/${i.venue}`, body: bad },
  { file: 'api/venues/[venue]/pages/[page]/archived.ts', method: 'PUT', need: 'editor', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/archived`, body: bad },
  { file: 'api/venues/[venue]/pages/[page]/section.ts', method: 'PUT', need: 'editor', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/section`, body: bad },
  { file: 'api/venues/[venue]/pages/[page]/advance.ts', method: 'PUT', need: 'manager', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/advance`, body: bad },
  { file: 'api/venues/[venue]/pages/[page]/check.ts', method: 'POST', need: 'editor', path: (i) => `/api/venues/${i.venue}/pages/${i.page}/check` },
  { file: 'api/venues/[venue]/members/index.ts', method: 'GET', need: 'manager', path: (i) => `/api/venues/${i.venue}/members` },
  { file: 'api/venues/[venue]/invitations/index.ts', method: 'POST', need: 'manager', path: (i) => `/api/venues/${i.venue}/invitations`, body: bad },
  { file: 'api/venues/[venue]/passes/index.ts', method: 'GET', need: 'manager', path: (i) => `/api/venues/${i.venue}/passes` },
  { file: 'api/venues/[venue]/passes/index.ts', method: 'POST', need: 'manager', path: (i) => `/api/venues/${i.venue}/passes`, body: bad },
  { file: 'api/venues/[venue]/audit.ts', method: 'GET', need: 'manager', path: (i) => `/api/venues/${i.venue}/audit` },
  { file: 'api/venues/[venue]/advance.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/advance` },
  { file: 'api/venues/[venue]/advance.ts', method: 'PUT', need: 'manager', path: (i) => `/api/venues/${i.venue}/advance`, body: bad },
  { file: 'api/venues/[venue]/changes.ts', method: 'GET', need: 'viewer', path: (i) => `/api/venues/${i.venue}/changes?since=2020-01-01` },
  { file: 'venues/[venue]/[page]/curves/[n].txt.ts', method: 'GET', need: 'viewer', path: (i) => `/venues/${i.venue}/system-processing/curves/1.txt` },
  { file: 'venues/[venue]/archived.astro', method: 'GET', need: 'editor', html: true, path: (i) => `/venues/${i.venue}/archived` },
  { file: 'venues/[venue]/settings.astro', method: 'GET', need: 'manager', html: true, path: (i) => `/venues/${i.venue}/settings` },
  { file: 'venues/[venue]/members.astro', method: 'GET', need: 'manager', html: true, path: (i) => `/venues/${i.venue}/members` },
  { file: 'venues/[venue]/passes.astro', method: 'GET', need: 'manager', html: true, path: (i) => `/venues/${i.venue}/passes` },
  { file: 'venues/[venue]/audit.astro', method: 'GET', need: 'manager', html: true, path: (i) => `/venues/${i.venue}/audit` },
  { file: 'venues/[venue]/advance/index.astro', method: 'GET', need: 'viewer', html: true, path: (i) => `/venues/${i.venue}/advance` },
  { file: 'venues/[venue]/advance/edit.astro', method: 'GET', need: 'manager', html: true, path: (i) => `/venues/${i.venue}/advance/edit` },
  { file: 'venues/[venue]/changes.astro', method: 'GET', need: 'viewer', html: true, path: (i) => `/venues/${i.venue}/changes` },
  { file: 'search.astro', method: 'GET', need: 'signed-in', html: true, path: () => '/search?q=stage' },
  { file: 'account.astro', method: 'GET', need: 'signed-in', html: true, path: () => '/account' },
  { file: 'signin/link.astro', method: 'GET', need: 'anyone', html: true, path: () => '/signin/link' },
  { file: 'signin/forgot.astro', method: 'GET', need: 'anyone', html: true, path: () => '/signin/forgot' },
];

/** What a person in each position must get; "allowed" means past every guard (2xx, or 400/409/422 for a bad body). */
function expected(need: Need, who: Who, html: boolean): 'allowed' | 401 | 403 | 404 {
  if (need === 'anyone') return 'allowed';
  if (who === 'anonymous') return 401;
  if (need === 'signed-in') return 'allowed';
  if (need === 'admin') return who === 'admin' ? 'allowed' : 403;
  if (who === 'non-member') return 404;
  if (need === 'editor' && who === 'viewer') return 403;
  if (need === 'manager' && (who === 'viewer' || who === 'engineer')) return 403;
  void html;
  return 'allowed';
}

function outcome(status: number, html: boolean, location: string | null): 'allowed' | 401 | 403 | 404 | number {
  if (status === 401 || (html && status === 303 && location?.startsWith('/signin'))) return 401;
  // Signed-in people are sent on from the front door and the sign-in page: that is allowed.
  if (html && status === 303) return 'allowed';
  if (status === 403 || status === 404) return status;
  if ((status >= 200 && status < 300) || [400, 409, 413, 415, 422].includes(status)) return 'allowed';
  return status;
}

function routeFiles(dir = join(ROOT, 'src/pages')): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    if (statSync(full).isDirectory()) return routeFiles(full);
    const rel = relative(join(ROOT, 'src/pages'), full);
    return name.startsWith('_') ? [] : [rel];
  });
}

export interface MatrixResult {
  checks: number;
  wrong: number;
  wrongCases: string[];
  routeFiles: number;
  notCovered: string[];
}

/**
 * Every route row × six people (signed out, viewer, engineer, manager, a manager of the other
 * venue only, the instance administrator), each answer compared with what the roles say.
 */
export async function accessMatrix(url: string, venue: string, page: string, section: string): Promise<MatrixResult> {
  const people: Record<Who, Client> = {
    anonymous: anonymous(url),
    viewer: await signIn(url, DEMO.viewer),
    engineer: await signIn(url, DEMO.engineer),
    manager: await signIn(url, DEMO.manager),
    'non-member': await signIn(url, DEMO.otherManager),
    admin: await signIn(url, DEMO.admin),
  };
  // A fresh file per request where a request may consume it (DELETE), made by an editor.
  const fileOf = async () => {
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(Buffer.from(`%PDF-1.4\n% matrix ${Math.random()}\n%%EOF\n`))], { type: 'application/pdf' }), 'm.pdf');
    const res = await people.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
    return ((await res.json()) as { file: { id: string } }).file.id;
  };
  const sectionOf = async () => {
    const res = await people.manager.sendJson('POST', `/api/venues/${venue}/sections`, { title: `Matrix ${Math.random().toString(36).slice(2, 8)}` });
    return ((await res.json()) as { section: { slug: string } }).section.slug;
  };
  const ids: Ids = { venue, page, section, fileOf, sectionOf };
  let checks = 0;
  const wrongCases: string[] = [];
  for (const row of ROWS) {
    for (const who of Object.keys(people) as Who[]) {
      const client = people[who];
      const path = await row.path(ids, client);
      const init: RequestInit = { method: row.method };
      if (row.body !== undefined) init.headers = { 'content-type': 'application/json' };
      if (row.body !== undefined) init.body = JSON.stringify(row.body);
      const res = await client.fetch(path, init);
      await res.arrayBuffer();
      checks++;
      const want = expected(row.need, who, !!row.html);
      const got = outcome(res.status, !!row.html, res.headers.get('location'));
      if (got !== want) wrongCases.push(`${row.method} ${path} as ${who}: ${res.status}, wanted ${want}`);
    }
  }
  const covered = new Set(ROWS.map((r) => r.file));
  const all = () => routeFiles();
  const exempt = new Set([
    'api/auth/[...auth].ts',
    '404.astro',
    'errors/403.astro',
    'signout.astro',
    // Calculator pages and guides are open to anyone, as /calc is (tested there).
    ...all().filter((f) => f.startsWith('calc/')),
    // Opened by a token rather than a role: tests/integration/people-guest.test.ts,
    // people-invitations.test.ts and people-email-links.test.ts try live, spent and forged ones.
    'advance/[token]/index.astro',
    'advance/[token]/files/[id]/index.ts',
    'advance/[token]/files/[id]/[variant].ts',
    'invite/[token].astro',
    'signin/link/[token].astro',
    'signin/reset/[token].astro',
    // These act on one member, invitation or pass by id, or end the caller's own sessions; each
    // person × role case is in tests/integration/people-matrix.test.ts.
    'api/venues/[venue]/members/[userId].ts',
    'api/venues/[venue]/invitations/[id]/index.ts',
    'api/venues/[venue]/invitations/[id]/resend.ts',
    'api/venues/[venue]/passes/[id].ts',
    'api/account/sessions.ts',
  ]);
  const notCovered = all().filter((f) => !covered.has(f) && !exempt.has(f) && !f.startsWith('api/calc/'));
  return { checks, wrong: wrongCases.length, wrongCases, routeFiles: all().length, notCovered };
}
