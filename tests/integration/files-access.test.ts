import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { createClient, type Client as DbClient } from '@libsql/client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';
import { PDF_BYTES, plainJpeg, storedEntries, tempEntries } from './files-fixtures';
import type { FileView } from '~/lib/schemas/file';


type Who = keyof typeof DEMO | 'signedOut';

let server: TestServer;
let db: DbClient;
const as = {} as Record<Who, Client>;
let venue: string;
let otherVenue: string;
let seed = 10;

beforeAll(async () => {
  server = await startServer();
  for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) as[who] = await signIn(server.url, DEMO[who]);
  as.signedOut = anonymous(server.url);
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  venue = mine.venues[0].slug;
  const all = (await (await as.admin.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  otherVenue = all.venues.find((v) => v.slug !== venue)!.slug;
  db = createClient({ url: `file:${server.dbPath}` });
});
afterAll(async () => {
  db?.close();
  await server?.stop();
});

async function upload(client: Client, options: { venueSlug?: string; caption?: string; page?: string; bytes?: Buffer; name?: string } = {}) {
  const form = new FormData();
  if (options.caption) form.append('caption', options.caption);
  if (options.page) form.append('page', options.page);
  form.append('file', new Blob([new Uint8Array(options.bytes ?? (await plainJpeg(160, 120, seed++)))], { type: 'image/jpeg' }), options.name ?? 'rack.jpg');
  return client.fetch(`/api/venues/${options.venueSlug ?? venue}/files`, { method: 'POST', body: form });
}

async function newFile(options: Parameters<typeof upload>[1] = {}): Promise<FileView> {
  const res = await upload(as.engineer, options);
  expect(res.status).toBe(201);
  return ((await res.json()) as { file: FileView }).file;
}

/** Makes a page's current revision show the file, as the editor would after inserting it. */
async function showOnPage(pageSlug: string, src: string): Promise<{ title: string }> {
  const page = (await db.execute({ sql: 'select p.id, p.title, p.current_revision as n, r.doc from pages p join venues v on v.id = p.venue_id join revisions r on r.page_id = p.id and r.number = p.current_revision where v.slug = ? and p.slug = ?', args: [venue, pageSlug] })).rows[0];
  const doc = JSON.parse(String(page.doc)) as { content: unknown[] };
  doc.content.push({ type: 'image', attrs: { src, alt: 'rack' } });
  const next = Number(page.n) + 1;
  await db.batch(
    [
      { sql: 'insert into revisions (id, page_id, number, doc, plain_text, summary, created_at) values (?, ?, ?, ?, ?, ?, ?)', args: [crypto.randomUUID(), page.id, next, JSON.stringify(doc), '', 'photo added', Date.now()] },
      { sql: 'update pages set current_revision = ? where id = ?', args: [next, page.id] },
    ],
    'write',
  );
  return { title: String(page.title) };
}

describe('permission matrix', () => {
  const upload201 = ['admin', 'manager', 'engineer'] as const;
  it.each([
    ['admin', 201],
    ['manager', 201],
    ['engineer', 201],
    ['viewer', 403],
    ['otherManager', 404],
    ['signedOut', 401],
  ] as [Who, number][])('upload: %s → %i', async (who, status) => {
    const before = storedEntries(server.uploadsDir).length;
    const res = await upload(as[who]);
    expect(res.status).toBe(status);
    if (!upload201.includes(who as never)) expect(storedEntries(server.uploadsDir).length).toBe(before);
    expect(tempEntries(server.uploadsDir)).toEqual([]);
  });

  it('a file of another venue stays in that venue: its members read it, this venue\'s engineer cannot', async () => {
    const res = await upload(as.admin, { venueSlug: otherVenue });
    expect(res.status).toBe(201);
    const { file } = (await res.json()) as { file: FileView };
    expect((await as.admin.fetch(file.url)).status).toBe(200);
    expect((await as.engineer.fetch(file.url)).status).toBe(404);
    expect((await as.engineer.fetch(`/api/venues/${venue}/files/${file.id}`)).status).toBe(404);
    const { files } = (await (await as.engineer.fetch(`/api/venues/${venue}/files`)).json()) as { files: FileView[] };
    expect(files.map((f) => f.id)).not.toContain(file.id);
  });

  it.each([
    ['admin', 200],
    ['manager', 200],
    ['engineer', 200],
    ['viewer', 200],
    ['otherManager', 404],
    ['signedOut', 401],
  ] as [Who, number][])('list: %s → %i', async (who, status) => {
    await newFile();
    const res = await as[who].fetch(`/api/venues/${venue}/files`);
    expect(res.status).toBe(status);
    if (status === 200) {
      const { files } = (await res.json()) as { files: FileView[] };
      expect(files.length).toBeGreaterThan(0);
      for (const f of files) expect(f).toMatchObject({ url: `/files/${f.id}`, sizeBytes: expect.any(Number) });
    }
  });

  it.each([
    ['admin', 200],
    ['manager', 200],
    ['engineer', 200],
    ['viewer', 200],
    ['otherManager', 404],
    ['signedOut', 401],
  ] as [Who, number][])('read the bytes (original, display, thumb): %s → %i', async (who, status) => {
    const file = await newFile();
    for (const url of [file.url, file.displayUrl!, file.thumbUrl!]) {
      const res = await as[who].fetch(url);
      expect(res.status).toBe(status);
      const body = Buffer.from(await res.arrayBuffer());
      if (status === 200) expect(body.subarray(0, 2).equals(Buffer.from([0xff, 0xd8])) || body.subarray(8, 12).toString() === 'WEBP').toBe(true);
      else expect(body.subarray(0, 2).equals(Buffer.from([0xff, 0xd8]))).toBe(false);
    }
  });

  it.each([
    ['admin', 200],
    ['manager', 200],
    ['engineer', 200],
    ['viewer', 403],
    ['otherManager', 404],
    ['signedOut', 401],
  ] as [Who, number][])('delete: %s → %i', async (who, status) => {
    const file = await newFile();
    const res = await as[who].fetch(`/api/venues/${venue}/files/${file.id}`, { method: 'DELETE' });
    expect(res.status).toBe(status);
    expect((await as.viewer.fetch(file.url)).status).toBe(status === 200 ? 404 : 200);
  });

  it.each([
    ['engineer', 200],
    ['manager', 200],
    ['viewer', 403],
    ['otherManager', 404],
    ['signedOut', 401],
  ] as [Who, number][])('edit a caption: %s → %i', async (who, status) => {
    const file = await newFile({ caption: 'before' });
    const res = await as[who].sendJson('PATCH', `/api/venues/${venue}/files/${file.id}`, { caption: 'after' });
    expect(res.status).toBe(status);
    const { file: now } = (await (await as.viewer.fetch(`/api/venues/${venue}/files/${file.id}`)).json()) as { file: FileView };
    expect(now.caption).toBe(status === 200 ? 'after' : 'before');
  });

  it('a file of another venue answers exactly like a file that does not exist', async () => {
    const file = await newFile();
    const hidden = await as.otherManager.fetch(file.url);
    const missing = await as.otherManager.fetch('/files/00000000-0000-0000-0000-000000000000');
    expect(hidden.status).toBe(404);
    expect(await hidden.json()).toEqual(await missing.json());
    const viaApi = await as.otherManager.fetch(`/api/venues/${otherVenue}/files/${file.id}`);
    expect(viaApi.status).toBe(404);
  });
});

describe('signed out', () => {
  it('an image request gets 401 and no bytes; a browser tab is sent to sign in and back', async () => {
    const file = await newFile();
    const res = await as.signedOut.fetch(file.url, { headers: { accept: 'image/avif,image/webp,*/*' } });
    expect(res.status).toBe(401);
    expect(res.headers.get('content-type')).toMatch(/json/);
    const page = await as.signedOut.fetch(file.url, { headers: { accept: 'text/html,application/xhtml+xml' } });
    expect(page.status).toBe(303);
    expect(page.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(file.url)}`);
  });

  it('the files screen sends a signed-out visitor to sign in', async () => {
    const res = await as.signedOut.fetch(`/venues/${venue}/files`);
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toMatch(/^\/signin\?next=/);
  });
});

describe('the files screen and the list', () => {
  it('lists newest first, with caption, page, uploader and URLs', async () => {
    const { pages } = (await (await as.engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string; title: string }[] };
    const file = await newFile({ caption: 'Patch bay, rear', page: pages[1].slug, name: 'patch.jpg' });
    const { files } = (await (await as.viewer.fetch(`/api/venues/${venue}/files`)).json()) as { files: (FileView & { uploadedBy: string })[] };
    expect(files[0]).toMatchObject({ id: file.id, caption: 'Patch bay, rear', originalName: 'patch.jpg', page: { slug: pages[1].slug, title: pages[1].title } });
    expect(files[0].uploadedBy).toEqual(expect.any(String));
  });

  it('the viewer sees the grid without upload, edit or delete controls; the engineer sees them', async () => {
    await newFile({ caption: 'Visible to all' });
    const viewerHtml = await (await as.viewer.fetch(`/venues/${venue}/files`)).text();
    expect(viewerHtml).toContain('Visible to all');
    expect(viewerHtml).toContain('data-testid="file-grid"');
    expect(viewerHtml).not.toContain('data-testid="uploader"');
    expect(viewerHtml).not.toContain('data-testid="delete-file"');
    const engineerHtml = await (await as.engineer.fetch(`/venues/${venue}/files`)).text();
    expect(engineerHtml).toContain('data-testid="uploader"');
    expect(engineerHtml).toContain('accept="image/*,application/pdf,text/plain,text/csv,.txt,.csv,.tsv"');
    expect(engineerHtml).toContain('data-testid="delete-file"');
  });

  it('the venue home links to the files screen', async () => {
    const html = await (await as.viewer.fetch(`/venues/${venue}`)).text();
    expect(html).toContain(`href="/venues/${venue}/files"`);
  });

  it('a caption is validated like any input', async () => {
    const file = await newFile();
    const long = await as.engineer.sendJson('PATCH', `/api/venues/${venue}/files/${file.id}`, { caption: 'x'.repeat(501) });
    expect(long.status).toBe(400);
    expect(((await long.json()) as { field: string }).field).toBe('caption');
    expect((await as.engineer.sendJson('PATCH', `/api/venues/${venue}/files/${file.id}`, { caption: 5 })).status).toBe(400);
    expect((await as.engineer.sendJson('PATCH', `/api/venues/${venue}/files/not-a-file`, { caption: 'x' })).status).toBe(404);
  });
});

describe('a file a page shows', () => {
  it('is listed with that page, and deleting it asks first (409 naming the page), then deletes with confirm', async () => {
    const file = await newFile({ caption: 'FOH rack' });
    const { pages } = (await (await as.engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    const target = pages[0].slug;
    const { title } = await showOnPage(target, file.displayUrl!);

    const { files } = (await (await as.viewer.fetch(`/api/venues/${venue}/files`)).json()) as { files: FileView[] };
    expect(files.find((f) => f.id === file.id)!.usedBy).toEqual([{ slug: target, title }]);
    const html = await (await as.engineer.fetch(`/venues/${venue}/files`)).text();
    expect(html).toContain(`href="/venues/${venue}/${target}"`);

    const asked = await as.engineer.fetch(`/api/venues/${venue}/files/${file.id}`, { method: 'DELETE' });
    expect(asked.status).toBe(409);
    const answer = (await asked.json()) as { error: string; usedBy: { slug: string }[] };
    expect(answer.error).toContain(title);
    expect(answer.usedBy.map((p) => p.slug)).toEqual([target]);
    expect((await as.viewer.fetch(file.url)).status).toBe(200);

    const storedBefore = storedEntries(server.uploadsDir).length;
    const done = await as.engineer.fetch(`/api/venues/${venue}/files/${file.id}?confirm=1`, { method: 'DELETE' });
    expect(done.status).toBe(200);
    expect((await as.viewer.fetch(file.url)).status).toBe(404);
    // Its three stored sizes are gone from the disk (no other row shares them).
    expect(storedEntries(server.uploadsDir).length).toBe(storedBefore - 3);

    const audit = await db.execute({ sql: "select actor_id, detail from audit_events where action = 'file.delete' and target_id = ?", args: [file.id] });
    expect(audit.rows).toHaveLength(1);
    expect(JSON.parse(String(audit.rows[0].detail))).toMatchObject({ caption: 'FOH rack', usedBy: [target] });
  });

  it('uploads are in the audit log too', async () => {
    const file = await newFile();
    const audit = await db.execute({ sql: "select action from audit_events where target_id = ?", args: [file.id] });
    expect(audit.rows.map((r) => r.action)).toEqual(['file.upload']);
  });
});

describe('disk hygiene', () => {
  it('a PDF and photos leave only content-addressed names and an empty temp folder', async () => {
    await newFile({ bytes: PDF_BYTES, name: 'plot.pdf' });
    const names = readdirSync(server.uploadsDir).filter((n) => n !== '.tmp');
    for (const name of names) expect(name).toMatch(/^[0-9a-f]{64}(\.(jpg|png|webp|pdf)|-display\.webp|-thumb\.webp)$/);
    expect(tempEntries(server.uploadsDir)).toEqual([]);
    expect(existsSync(join(server.uploadsDir, '.tmp'))).toBe(true);
  });
});
