import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { PDF_BYTES, plainJpeg } from './files-fixtures';
import { createTestPage, doc, getPage, para, snapshot, type Doc } from './pages-fixtures';
import type { FileView } from '~/lib/schemas/file';

/**
 * A page may show or link only to files of its own venue that exist: checked on create, save
 * and restore, inside the write, with one answer for "another venue's" and "no such file".
 */


let server: TestServer;
const as = {} as Record<'engineer' | 'viewer' | 'otherManager', Client>;
let venue: string;
let otherVenue: string;
let seed = 40;

beforeAll(async () => {
  server = await startServer();
  for (const who of ['engineer', 'viewer', 'otherManager'] as const) as[who] = await signIn(server.url, DEMO[who]);
  venue = ((await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  otherVenue = ((await (await as.otherManager.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  expect(otherVenue).not.toBe(venue);
});
afterAll(() => server?.stop());

async function upload(client: Client, venueSlug: string, bytes?: Buffer, name = 'rack.jpg', type = 'image/jpeg'): Promise<FileView> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes ?? (await plainJpeg(200, 150, seed++)))], { type }), name);
  const res = await client.fetch(`/api/venues/${venueSlug}/files`, { method: 'POST', body: form });
  expect(res.status).toBe(201);
  return ((await res.json()) as { file: FileView }).file;
}

const photo = (src: string, alt = 'Amp rack, stage left'): Doc => ({ type: 'image', attrs: { src, alt } });
const linkTo = (href: string, text = 'Stage plot'): Doc => para(text, [{ type: 'link', attrs: { href } }]);

async function freshPage(title: string) {
  const created = await createTestPage(as.engineer, venue, title, doc(para('Racks and stage boxes.')));
  return { slug: created.page.slug, base: created.revision.number };
}

const put = (slug: string, body: unknown) => as.engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, body);

describe('saving a page that points at files', () => {
  let foreign: FileView;
  let own: FileView;

  beforeAll(async () => {
    foreign = await upload(as.otherManager, otherVenue);
    own = await upload(as.engineer, venue);
  });

  it('a photo of another venue: 400 naming the photo, no revision, no audit', async () => {
    const { slug, base } = await freshPage('Amp racks');
    const before = await snapshot(server.dbPath, slug);
    const res = await put(slug, { doc: doc(para('Rack A:'), photo(foreign.displayUrl!)), baseRevision: base, summary: 'photo' });
    expect(res.status).toBe(400);
    const answer = (await res.json()) as { error: string; field?: string };
    expect(answer.error).toBe(`The photo “Amp rack, stage left” (${foreign.displayUrl}) is not a file of this venue; upload it here first, or remove it from the page.`);
    expect(answer.field).toBe('doc');
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
  });

  it('an id that does not exist gets the same answer as another venue’s file (no way to probe ids)', async () => {
    const { slug, base } = await freshPage('Patch bay');
    const before = await snapshot(server.dbPath, slug);
    const missingId = '00000000-0000-4000-8000-000000000000';
    const [missing, other] = await Promise.all([
      put(slug, { doc: doc(photo(`/files/${missingId}/display`)), baseRevision: base }),
      put(slug, { doc: doc(photo(`/files/${foreign.id}/display`)), baseRevision: base }),
    ]);
    expect(missing.status).toBe(400);
    expect(other.status).toBe(400);
    const missingError = ((await missing.json()) as { error: string }).error;
    const otherError = ((await other.json()) as { error: string }).error;
    expect(missingError).toMatch(/is not a file of this venue; upload it here first/);
    expect(missingError.replace(missingId, 'ID')).toBe(otherError.replace(foreign.id, 'ID'));
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
  });

  it('a link to another venue’s file is refused too; a link elsewhere or text that mentions /files/ is not', async () => {
    const { slug, base } = await freshPage('Stage plots');
    const before = await snapshot(server.dbPath, slug);
    const refused = await put(slug, { doc: doc(linkTo(foreign.url)), baseRevision: base });
    expect(refused.status).toBe(400);
    expect(((await refused.json()) as { error: string }).error).toBe(`The link “Stage plot” to ${foreign.url} is not a file of this venue; upload it here first, or remove it from the page.`);
    expect(await snapshot(server.dbPath, slug)).toEqual(before);

    const fine = await put(slug, { doc: doc(para(`The old address was ${foreign.url}/display.`), linkTo(`https://example.org${foreign.url}`, 'Hire company plot')), baseRevision: base });
    expect(fine.status).toBe(200);
  });

  it('creating a page with another venue’s photo: 400, no page', async () => {
    const before = await snapshot(server.dbPath);
    const res = await as.engineer.sendJson('POST', `/api/venues/${venue}/pages`, { title: 'Borrowed photo', section: 'stage', doc: doc(photo(foreign.displayUrl!)) });
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error).toMatch(/^The photo .* is not a file of this venue/);
    expect(await snapshot(server.dbPath)).toEqual(before);
  });

  it('a PDF used as a picture: 400 telling the person to link it instead', async () => {
    const pdf = await upload(as.engineer, venue, PDF_BYTES, 'plot.pdf', 'application/pdf');
    const { slug, base } = await freshPage('Drawings');
    const before = await snapshot(server.dbPath, slug);
    const res = await put(slug, { doc: doc(photo(pdf.url, 'Plot')), baseRevision: base });
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error).toMatch(/that file is a PDF; add it as a link instead\./);
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
    expect((await put(slug, { doc: doc(linkTo(pdf.url)), baseRevision: base })).status).toBe(200);
  });

  it('its own venue’s photo: 200, and the read view shows it to a viewer, who can load it', async () => {
    const { slug, base } = await freshPage('FOH rack');
    const res = await put(slug, { doc: doc(para('Rack A:'), photo(own.displayUrl!), linkTo(own.url, 'full size')), baseRevision: base, summary: 'Photo of rack A' });
    expect(res.status).toBe(200);
    expect((await getPage(as.viewer, venue, slug)).revision.number).toBe(base + 1);

    const html = await (await as.viewer.fetch(`/venues/${venue}/${slug}`)).text();
    expect(html).toContain(`<img src="${own.displayUrl}" alt="Amp rack, stage left"`);
    const img = await as.viewer.fetch(own.displayUrl!);
    expect(img.status).toBe(200);
    expect(img.headers.get('content-type')).toBe('image/webp');
  });
});

describe('restoring a revision whose photo is gone', () => {
  it('400 naming the revision and the photo; nothing changed', async () => {
    const file = await upload(as.engineer, venue);
    const { slug } = await freshPage('Wedges');
    expect((await put(slug, { doc: doc(photo(file.displayUrl!, 'Wedge mix')), baseRevision: 1 })).status).toBe(200);
    expect((await put(slug, { doc: doc(para('No photo now.')), baseRevision: 2 })).status).toBe(200);
    expect((await as.engineer.fetch(`/api/venues/${venue}/files/${file.id}`, { method: 'DELETE' })).status).toBe(200);

    const before = await snapshot(server.dbPath, slug);
    const res = await as.engineer.sendJson('POST', `/api/venues/${venue}/pages/${slug}/revisions/2/restore`, {});
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: string }).error).toBe(
      `Revision 2 has the photo “Wedge mix” (${file.displayUrl}), which is not a file of this venue any more; restore another revision, or edit the page and add the file again.`,
    );
    expect(await snapshot(server.dbPath, slug)).toEqual(before);
    // A revision without the photo restores as before.
    expect((await as.engineer.sendJson('POST', `/api/venues/${venue}/pages/${slug}/revisions/1/restore`, {})).status).toBe(201);
  });
});

describe('which pages use a file', () => {
  it('a page that only mentions the file’s address in its text is not listed; one that shows it is, and only it blocks a delete', async () => {
    const file = await upload(as.engineer, venue);
    const mention = await createTestPage(as.engineer, venue, 'Where the photos were', doc(para(`The old rack photo was at ${file.displayUrl} and /files/${file.id}.`)));
    const shows = await createTestPage(as.engineer, venue, 'Rack photo', doc(photo(file.displayUrl!)));
    const listed = async () => {
      const { files } = (await (await as.viewer.fetch(`/api/venues/${venue}/files`)).json()) as { files: FileView[] };
      return files.find((f) => f.id === file.id)!.usedBy.map((p) => p.slug);
    };
    expect(await listed()).toEqual([shows.page.slug]);
    expect(mention.page.slug).not.toBe(shows.page.slug);

    // Once the page that shows it stops doing so, nothing uses the file and a plain delete goes through.
    expect((await put(shows.page.slug, { doc: doc(para('No photo yet.')), baseRevision: shows.revision.number })).status).toBe(200);
    expect(await listed()).toEqual([]);
    const deleted = await as.engineer.fetch(`/api/venues/${venue}/files/${file.id}`, { method: 'DELETE' });
    expect(deleted.status).toBe(200);
  });
});

describe('a save and a delete of the same file at the same moment', () => {
  it('never both go through: either the page shows a file that still exists, or the save is refused', async () => {
    for (let round = 0; round < 4; round++) {
      const file = await upload(as.engineer, venue);
      const { slug, base } = await freshPage(`Race ${round}`);
      const [saved, deleted] = await Promise.all([
        put(slug, { doc: doc(photo(file.displayUrl!)), baseRevision: base }),
        as.engineer.fetch(`/api/venues/${venue}/files/${file.id}`, { method: 'DELETE' }),
      ]);
      if (saved.status >= 500 || deleted.status >= 500) throw new Error(`${saved.status} ${await saved.text()} / ${deleted.status} ${await deleted.text()}\n${server.output()}`);
      // Without confirm a delete refuses (409) once a page shows the file.
      expect([saved.status, deleted.status].sort()).toEqual(saved.status === 200 ? [200, 409] : [200, 400]);
      const stillThere = (await as.viewer.fetch(file.displayUrl!)).status === 200;
      expect(stillThere).toBe(saved.status === 200);
    }
  });
});

describe('the venue home', () => {
  it('links to the sections screen for people who may edit pages, not for viewers', async () => {
    const link = `href="/venues/${venue}/sections"`;
    expect(await (await as.engineer.fetch(`/venues/${venue}`)).text()).toContain(link);
    expect(await (await as.viewer.fetch(`/venues/${venue}`)).text()).not.toContain(link);
  });
});
