import { createClient } from '@libsql/client';
import { existsSync, readdirSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { PDF_BYTES } from './files-fixtures';
import { createTestPage, doc, getPage, para } from './pages-fixtures';

/**
 * The holes a hostile review found, one test each: a delete whose commit fails, odd bytes in
 * search and in names, links that leave the site, the exact upload cap, history past 1,000,
 * headers on every response, foreign Origins, broken %-escapes, retried saves, stalled uploads.
 */
let server: TestServer;
let engineer: Client;
let admin: Client;
let manager: Client;
let venue: string;

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  admin = await signIn(server.url, DEMO.admin);
  manager = await signIn(server.url, DEMO.manager);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
});
afterAll(async () => {
  await server?.stop();
});

function uploadPdf(bytes: Buffer, name = 'drawing.pdf', caption = '') {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'application/pdf' }), name);
  if (caption) form.append('caption', caption);
  return engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
}

async function withDb<T>(work: (db: ReturnType<typeof createClient>) => Promise<T>): Promise<T> {
  const db = createClient({ url: `file:${server.dbPath}` });
  try {
    return await work(db);
  } finally {
    db.close();
  }
}

const storedNames = () => readdirSync(server.uploadsDir).filter((n) => n !== '.tmp');

describe('a file delete that does not commit', () => {
  it('keeps the bytes with the row that came back', async () => {
    const res = await uploadPdf(Buffer.concat([PDF_BYTES, Buffer.from(`% keep ${Date.now()}\n`)]), 'keep.pdf');
    expect(res.status).toBe(201);
    const { file } = (await res.json()) as { file: { id: string } };
    const before = storedNames();
    // A deferred foreign key fails only at COMMIT: the last moment a crash could also strike.
    await withDb(async (db) => {
      await db.execute('CREATE TABLE commit_blocker (file_id TEXT REFERENCES files(id) DEFERRABLE INITIALLY DEFERRED)');
      await db.execute({ sql: 'INSERT INTO commit_blocker VALUES (?)', args: [file.id] });
    });
    const del = await engineer.fetch(`/api/venues/${venue}/files/${file.id}?confirm=1`, { method: 'DELETE' });
    expect(del.status).toBeGreaterThanOrEqual(500);
    const rows = await withDb(async (db) => (await db.execute({ sql: 'SELECT storage_name FROM files WHERE id = ?', args: [file.id] })).rows);
    expect(rows).toHaveLength(1);
    expect(storedNames()).toEqual(before);
    expect(existsSync(join(server.uploadsDir, String(rows[0].storage_name)))).toBe(true);
    // (The blocker stays: a write from outside the server would leave its connection with a
    // stale snapshot, a state no server in service meets.)
  });
  it('an ordinary delete removes the bytes, after the commit', async () => {
    const res = await uploadPdf(Buffer.concat([PDF_BYTES, Buffer.from(`% gone ${Date.now()}\n`)]), 'gone.pdf');
    const { file } = (await res.json()) as { file: { id: string } };
    const name = (await withDb(async (db) => (await db.execute({ sql: 'SELECT storage_name FROM files WHERE id = ?', args: [file.id] })).rows[0].storage_name)) as string;
    expect(existsSync(join(server.uploadsDir, name))).toBe(true);
    expect((await engineer.fetch(`/api/venues/${venue}/files/${file.id}?confirm=1`, { method: 'DELETE' })).status).toBe(200);
    expect(existsSync(join(server.uploadsDir, name))).toBe(false);
  });
});

describe('control characters in search', () => {
  it.each(['a%00b', '%00', 'stage%01box', '%22a%00%22', 'a%7Fb%1Bc'])('q=%s is an answer, not a 500', async (q) => {
    const res = await engineer.fetch(`/api/search?q=${q}`);
    expect(res.status).toBe(200);
    expect(Array.isArray(((await res.json()) as { hits?: unknown[]; results?: unknown[] }).hits ?? [])).toBe(true);
  });
});

describe('links that a browser reads as another host', () => {
  let slug: string;
  beforeAll(async () => {
    slug = (await createTestPage(engineer, venue, `Link page ${Date.now()}`, doc(para('start')))).page.slug;
  });
  it.each(['/\\evil.example', '\\\\evil.example', '\\/evil.example', '//evil.example', '/\\/evil.example', 'https:evil.example', ' //evil.example'])(
    '%s is refused on save',
    async (href) => {
      const { page } = await getPage(engineer, venue, slug);
      const res = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, {
        baseRevision: page.currentRevision,
        doc: doc(para('go', [{ type: 'link', attrs: { href } }])),
      });
      expect(res.status).toBe(400);
      expect(((await res.json()) as { error: string }).error).toMatch(/Links may point only/);
    },
  );
  it('a plain path on this site and an https link still save', async () => {
    const { page } = await getPage(engineer, venue, slug);
    const res = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, {
      baseRevision: page.currentRevision,
      doc: doc(para('here', [{ type: 'link', attrs: { href: '/venues/x\\y' } }]), para('there', [{ type: 'link', attrs: { href: 'https://example.org/a' } }])),
    });
    expect(res.status).toBe(200);
  });
});

describe('names with characters that hide or reorder text', () => {
  const hostile = ['Main\u202Egnp.exe', 'Stage\u0000left', 'Rack\u2066 B', 'Amp\u200Froom', 'Line\nbreak'];
  it.each(hostile)('a page title %j is refused and nothing is stored', async (title) => {
    const res = await engineer.sendJson('POST', `/api/venues/${venue}/pages`, { title, section: 'stage', doc: doc(para('x')) });
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error).toMatch(/control or text-direction character|title/i);
  });
  it.each(hostile)('a venue name %j is refused', async (name) => {
    const res = await admin.sendJson('POST', '/api/venues', { name });
    expect(res.status).toBe(400);
  });
  it.each(hostile)('a section title %j is refused', async (title) => {
    const res = await manager.sendJson('POST', `/api/venues/${venue}/sections`, { title });
    expect(res.status).toBe(400);
  });
  it('a summary or a caption with U+202E is refused', async () => {
    const slug = (await createTestPage(engineer, venue, `Summary page ${Date.now()}`, doc(para('a')))).page.slug;
    const res = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, { baseRevision: 1, doc: doc(para('b')), summary: 'fixed \u202Eeht' });
    expect(res.status).toBe(400);
    const up = await uploadPdf(Buffer.concat([PDF_BYTES, Buffer.from('% cap\n')]), 'cap.pdf', 'Rack \u202Eview');
    expect(up.status).toBe(400);
  });
  it('right-to-left text itself is welcome', async () => {
    const res = await engineer.sendJson('POST', `/api/venues/${venue}/pages`, { title: 'מערכת הגברה', section: 'stage', doc: doc(para('x')) });
    expect(res.status).toBe(201);
  });
});

describe('the upload cap', () => {
  const MiB = 1024 * 1024;
  it('a file of exactly 25 MiB is accepted', async () => {
    const bytes = Buffer.alloc(25 * MiB, 0x20);
    PDF_BYTES.copy(bytes, 0);
    const res = await uploadPdf(bytes, 'exact.pdf');
    expect(res.status).toBe(201);
    expect(((await res.json()) as { file: { sizeBytes: number } }).file.sizeBytes).toBe(25 * MiB);
  });
  it('one byte more is refused with 413', async () => {
    const bytes = Buffer.alloc(25 * MiB + 1, 0x20);
    PDF_BYTES.copy(bytes, 0);
    expect((await uploadPdf(bytes, 'over.pdf')).status).toBe(413);
  });
});

describe('a history longer than one page', () => {
  it('reaches revision 1 by following nextBefore, each revision once', async () => {
    const slug = (await createTestPage(engineer, venue, `Long history ${Date.now()}`, doc(para('r1')))).page.slug;
    const total = 1234;
    await withDb(async (db) => {
      const page = (await db.execute({ sql: 'SELECT id FROM pages WHERE slug = ?', args: [slug] })).rows[0];
      const author = (await db.execute({ sql: "SELECT author_id FROM revisions WHERE page_id = ? AND number = 1", args: [page.id] })).rows[0].author_id;
      const stmts = [];
      for (let n = 2; n <= total; n++) {
        stmts.push({
          sql: 'INSERT INTO revisions (id, page_id, number, doc, plain_text, summary, author_id, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
          args: [`hist-${slug}-${n}`, page.id, n, JSON.stringify(doc(para(`r${n}`))), `r${n}`, `step ${n}`, author, Date.now()],
        });
      }
      stmts.push({ sql: 'UPDATE pages SET current_revision = ? WHERE id = ?', args: [total, page.id] });
      await db.batch(stmts, 'write');
    });
    const seen: number[] = [];
    let before: number | null = null;
    for (let guard = 0; guard < 50; guard++) {
      const res = await engineer.fetch(`/api/venues/${venue}/pages/${slug}/revisions${before ? `?before=${before}` : ''}`);
      expect(res.status).toBe(200);
      const body = (await res.json()) as { revisions: { number: number }[]; nextBefore: number | null };
      seen.push(...body.revisions.map((r) => r.number));
      if (body.nextBefore === undefined || body.nextBefore === null) break;
      before = body.nextBefore;
    }
    expect(seen).toEqual(Array.from({ length: total }, (_, i) => total - i));
    const html = await (await engineer.fetch(`/venues/${venue}/${slug}/history`)).text();
    expect(html).toMatch(/Older revisions/);
  });
  it.each(['before=abc', 'before=1', 'before=-5', 'limit=0', 'limit=501'])('?%s is a 400 with a sentence', async (q) => {
    const { pages } = (await (await engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    const res = await engineer.fetch(`/api/venues/${venue}/pages/${pages[0].slug}/revisions?${q}`);
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error.length).toBeGreaterThan(10);
  });
});

describe('security headers on every response', () => {
  const REQUIRED = ['content-security-policy', 'x-content-type-options', 'referrer-policy', 'permissions-policy', 'x-frame-options'];
  async function assets(): Promise<string[]> {
    const html = await (await fetch(`${server.url}/calc/bandwidth`)).text();
    return [...html.matchAll(/(?:src|href)="(\/_astro\/[^"]+)"/g)].map((m) => m[1]).slice(0, 3);
  }
  it('static files, pages, API answers, errors and PDFs all carry them', async () => {
    const up = await uploadPdf(Buffer.concat([PDF_BYTES, Buffer.from('% headers\n')]), 'headers.pdf');
    const { file } = (await up.json()) as { file: { url: string } };
    const paths = ['/sw.js', '/favicon.svg', '/manifest.webmanifest', '/calc/bandwidth', '/api/calc/band?q=2', '/nowhere', '/api/venues', file.url, ...(await assets())];
    for (const path of paths) {
      for (const method of ['GET', 'HEAD']) {
        const res = await engineer.fetch(path, { method });
        for (const name of REQUIRED) expect(res.headers.get(name), `${method} ${path} ${name}`).toBeTruthy();
      }
    }
    const etag = (await engineer.fetch(file.url)).headers.get('etag');
    const notModified = await engineer.fetch(file.url, { headers: { 'if-none-match': etag ?? '' } });
    expect(notModified.status).toBe(304);
    for (const name of ['referrer-policy', 'permissions-policy']) expect(notModified.headers.get(name)).toBeTruthy();
  });
  it("no page lets inline script run without its hash: no 'unsafe-inline' for scripts", async () => {
    for (const path of ['/calc/bandwidth', '/signin', '/venues', `/venues/${venue}`]) {
      const csp = (await engineer.fetch(path)).headers.get('content-security-policy') ?? '';
      const script = csp.split(';').map((d) => d.trim()).find((d) => d.startsWith('script-src ')) ?? '';
      expect(script, path).toMatch(/^script-src 'self'/);
      expect(script, path).not.toContain('unsafe-inline');
      expect(csp).toContain("frame-ancestors 'none'");
    }
  });
  it('no HSTS unless configured; with HSTS_MAX_AGE it is on every response', async () => {
    expect((await fetch(`${server.url}/sw.js`)).headers.get('strict-transport-security')).toBeNull();
    const tls = await startServer({ HSTS_MAX_AGE: '31536000' });
    try {
      for (const path of ['/sw.js', '/calc/bandwidth', '/api/calc/band?q=2', '/favicon.svg']) {
        expect((await fetch(`${tls.url}${path}`)).headers.get('strict-transport-security'), path).toBe('max-age=31536000');
      }
    } finally {
      await tls.stop();
    }
  });
});

describe('a write from another site', () => {
  const evil = { origin: 'http://evil.example' };
  it('is refused with 403 JSON on JSON, multipart and DELETE routes, and changes nothing', async () => {
    const { pages } = (await (await engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string; currentRevision: number }[] };
    const target = pages[0];
    const attempts: [string, string, RequestInit][] = [
      ['PUT', `/api/venues/${venue}/pages/${target.slug}`, { headers: { ...evil, 'content-type': 'application/json' }, body: JSON.stringify({ baseRevision: target.currentRevision, doc: doc(para('evil')) }) }],
      ['POST', `/api/venues/${venue}/pages`, { headers: { ...evil, 'content-type': 'application/json' }, body: JSON.stringify({ title: 'Evil', section: 'stage', doc: doc(para('x')) }) }],
      ['POST', `/api/venues/${venue}/pages/${target.slug}/revisions/1/restore`, { headers: { ...evil, 'content-type': 'application/json' }, body: '{}' }],
      ['POST', `/api/venues/${venue}/files`, { headers: evil, body: (() => { const f = new FormData(); f.append('file', new Blob([new Uint8Array(PDF_BYTES)], { type: 'application/pdf' }), 'e.pdf'); return f; })() }],
      ['DELETE', `/api/venues/${venue}/files/whatever`, { headers: evil }],
      ['POST', '/api/calc/response', { headers: { ...evil, 'content-type': 'application/json' }, body: JSON.stringify({ sampleRate: 48000, filters: [] }) }],
      ['POST', '/api/venues', { headers: { origin: 'null', 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Evil hall' }) }],
    ];
    for (const [method, path, init] of attempts) {
      const res = await (path === '/api/venues' ? admin : engineer).fetch(path, { method, ...init });
      expect(res.status, `${method} ${path}`).toBe(403);
      expect(res.headers.get('content-type')).toMatch(/application\/json/);
      expect(((await res.json()) as { error: string }).error).toMatch(/another site/);
    }
    const after = (await getPage(engineer, venue, target.slug)).page.currentRevision;
    expect(after).toBe(target.currentRevision);
  });
  it('a multipart upload without any Origin is refused in the same JSON form; JSON without one passes', async () => {
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(PDF_BYTES)], { type: 'application/pdf' }), 'no-origin.pdf');
    const res = await fetch(`${server.url}/api/venues/${venue}/files`, { method: 'POST', body: form, headers: { cookie: engineer.jar.header() } });
    expect(res.status).toBe(403);
    expect(((await res.json()) as { error: string }).error).toMatch(/Origin header/);
    const calc = await fetch(`${server.url}/api/calc/response`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ sampleRate: 48000, filters: [] }) });
    expect(calc.status).toBeLessThan(500);
    expect(calc.status).not.toBe(403);
  });
  it('the same write from this site goes through', async () => {
    const { pages } = (await (await engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string; currentRevision: number }[] };
    const res = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${pages[0].slug}`, { baseRevision: pages[0].currentRevision, doc: doc(para('ours')) });
    expect(res.status).toBe(200);
  });
});

describe('a URL whose %-escapes do not decode', () => {
  it.each(['/api/venues/%zz/pages', '/api/search/%ED%A0%80', '/api/venues/%E0%A4%A/files', '/api/calc/band?q=%zz%ED%A0%80'])('%s answers in the JSON error form', async (path) => {
    const res = await engineer.fetch(path);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.headers.get('content-type')).toMatch(/application\/json/);
    expect(((await res.json()) as { error: string }).error.length).toBeGreaterThan(10);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
  });
  it('a page path with one is a 400 with the headers too', async () => {
    const res = await fetch(`${server.url}/venues/%zz`);
    expect(res.status).toBe(400);
    expect(res.headers.get('content-security-policy')).toBeTruthy();
  });
});

describe('a retried save', () => {
  it('with the same Idempotency-Key answers 200 with the revision it made, once', async () => {
    const slug = (await createTestPage(engineer, venue, `Retry page ${Date.now()}`, doc(para('one')))).page.slug;
    const body = JSON.stringify({ baseRevision: 1, doc: doc(para('two')), summary: 'second' });
    const put = () => engineer.fetch(`/api/venues/${venue}/pages/${slug}`, { method: 'PUT', headers: { 'content-type': 'application/json', 'idempotency-key': 'save-7f3a9c1e-0001' }, body });
    const first = await put();
    expect(first.status).toBe(200);
    const again = await put();
    expect(again.status).toBe(200);
    const a = (await first.json()) as { revision: { number: number } };
    const b = (await again.json()) as { revision: { number: number } };
    expect(b.revision.number).toBe(a.revision.number);
    expect((await getPage(engineer, venue, slug)).page.currentRevision).toBe(2);
    const other = await engineer.fetch(`/api/venues/${venue}/pages/${slug}`, {
      method: 'PUT',
      headers: { 'content-type': 'application/json', 'idempotency-key': 'save-7f3a9c1e-0001' },
      body: JSON.stringify({ baseRevision: 2, doc: doc(para('three')) }),
    });
    expect(other.status).toBe(422);
    const stale = await engineer.fetch(`/api/venues/${venue}/pages/${slug}`, { method: 'PUT', headers: { 'content-type': 'application/json', 'idempotency-key': 'save-7f3a9c1e-0002' }, body });
    expect(stale.status).toBe(409);
  });
  it.each(['short', 'has space in it', 'x'.repeat(101), 'bad\u00e9chars!'])('a malformed key %j is a 400', async (key) => {
    const { pages } = (await (await engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string; currentRevision: number }[] };
    const res = await engineer.fetch(`/api/venues/${venue}/pages/${pages[0].slug}`, {
      method: 'PUT',
      headers: { 'content-type': 'application/json', 'idempotency-key': key },
      body: JSON.stringify({ baseRevision: pages[0].currentRevision, doc: doc(para('k')) }),
    });
    expect(res.status).toBe(400);
  });
});

describe('an upload that stops sending', () => {
  it('gets a 408 after the idle time and leaves no temp file', async () => {
    const quick = await startServer({ UPLOAD_IDLE_SECONDS: '1' });
    try {
      const client = await signIn(quick.url, DEMO.engineer);
      const slug = ((await (await client.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
      const boundary = 'tl-stall-boundary';
      const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="slow.pdf"\r\nContent-Type: application/pdf\r\n\r\n`);
      const { port } = new URL(quick.url);
      const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
        const req = httpRequest(
          {
            host: '127.0.0.1',
            port: Number(port),
            method: 'POST',
            path: `/api/venues/${slug}/files`,
            headers: { cookie: client.jar.header(), origin: quick.url, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(head.length + 2_000_000) },
          },
          (res) => {
            let body = '';
            res.on('data', (d) => (body += d));
            res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
          },
        );
        req.on('error', reject);
        req.write(Buffer.concat([head, PDF_BYTES, Buffer.alloc(50_000, 0x20)]));
        // ...and then nothing more: the body never finishes.
      });
      expect(answer.status).toBe(408);
      expect(JSON.parse(answer.body).error).toMatch(/stopped sending/);
      const tmp = join(quick.uploadsDir, '.tmp');
      await new Promise((r) => setTimeout(r, 300));
      expect(existsSync(tmp) ? readdirSync(tmp) : []).toEqual([]);
    } finally {
      await quick.stop();
    }
  });
});
