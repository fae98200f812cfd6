import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import {
  CAMERA_MODEL,
  HTML_PAGE,
  PDF_BYTES,
  SERIAL,
  SVG_WITH_SCRIPT,
  ZIP_BYTES,
  blankPng,
  heicTheServerCannotRead,
  heifTheServerCanRead,
  multipartBody,
  photoWithGps,
  plainJpeg,
  pngWithHtml,
  storedEntries,
  tempEntries,
  truncatedJpeg,
} from './files-fixtures';
import type { FileView } from '~/lib/schemas/file';


let server: TestServer;
const as: Record<keyof typeof DEMO, Client> = {} as never;
let venue: string;
let pageSlug: string;

beforeAll(async () => {
  server = await startServer();
  for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) as[who] = await signIn(server.url, DEMO[who]);
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  venue = mine.venues[0].slug;
  const { pages } = (await (await as.engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
  pageSlug = pages[0].slug;
});
afterAll(() => server?.stop());

afterEach(() => {
  // Every upload, accepted or refused, leaves the temp folder empty before it answers.
  expect(tempEntries(server.uploadsDir)).toEqual([]);
});

function upload(client: Client, bytes: Buffer, filename: string, fields: Record<string, string> = {}, type = 'application/octet-stream', venueSlug = venue) {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) form.append(key, value);
  form.append('file', new Blob([new Uint8Array(bytes)], { type }), filename);
  return client.fetch(`/api/venues/${venueSlug}/files`, { method: 'POST', body: form });
}

async function uploadOk(client: Client, bytes: Buffer, filename: string, fields: Record<string, string> = {}): Promise<FileView> {
  const res = await upload(client, bytes, filename, fields);
  const body = await res.json();
  expect(res.status, JSON.stringify(body)).toBe(201);
  return (body as { file: FileView }).file;
}

async function bytesOf(client: Client, path: string): Promise<Buffer> {
  const res = await client.fetch(path);
  expect(res.status).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

/** No EXIF, no GPS, no camera serial or model, in the bytes as served. */
async function expectNoMetadata(bytes: Buffer) {
  const meta = await sharp(bytes).metadata();
  expect(meta.exif).toBeUndefined();
  expect(meta.xmp).toBeUndefined();
  expect(meta.iptc).toBeUndefined();
  expect(meta.orientation ?? 1).toBe(1);
  const text = bytes.toString('latin1');
  expect(text).not.toContain(SERIAL);
  expect(text).not.toContain(CAMERA_MODEL);
  // Not the bare letters "GPS": compressed noise contains them now and then by chance (EXIF tags
  // are numbers, never those letters). An EXIF block and the camera's make are exact markers.
  expect(text).not.toContain('Exif\u0000\u0000');
  expect(text).not.toContain('Throwline Test Optics');
}

async function expectRefused(res: Response, status: number, message: RegExp) {
  const body = (await res.json()) as { error: string };
  expect(res.status, JSON.stringify(body)).toBe(status);
  expect(body.error).toMatch(message);
}

describe('a photo straight off a phone', () => {
  it('the fixture really carries GPS, a serial and a rotation (so the next test can fail)', async () => {
    const meta = await sharp(await photoWithGps()).metadata();
    expect(meta.orientation).toBe(6);
    expect(meta.exif?.toString('latin1')).toContain(SERIAL);
    expect(meta.exif?.toString('latin1')).toMatch(/N\0/);
  });

  it('is stored upright, with no location, serial or camera data, in three sizes', async () => {
    const file = await uploadOk(as.engineer, await photoWithGps(1200, 900), 'IMG_2041.JPG', { caption: 'Amp rack, stage left', page: pageSlug });
    expect(file).toMatchObject({ kind: 'image', mime: 'image/jpeg', caption: 'Amp rack, stage left', originalName: 'IMG_2041.JPG', width: 900, height: 1200 });
    expect(file.page?.slug).toBe(pageSlug);
    expect(file.url).toBe(`/files/${file.id}`);
    expect(file.displayUrl).toBe(`/files/${file.id}/display`);
    expect(file.thumbUrl).toBe(`/files/${file.id}/thumb`);

    const original = await bytesOf(as.viewer, file.url);
    await expectNoMetadata(original);
    expect(await sharp(original).metadata()).toMatchObject({ format: 'jpeg', width: 900, height: 1200 });
    for (const [url, longEdge] of [
      [file.displayUrl!, 1200],
      [file.thumbUrl!, 400],
    ] as const) {
      const bytes = await bytesOf(as.viewer, url);
      await expectNoMetadata(bytes);
      const meta = await sharp(bytes).metadata();
      expect(meta.format).toBe('webp');
      expect(Math.max(meta.width!, meta.height!)).toBe(longEdge);
      expect(meta.height! > meta.width!).toBe(true);
    }
    // And on disk: every stored file is free of the camera's metadata too.
    for (const name of storedEntries(server.uploadsDir)) {
      const bytes = readFileSync(join(server.uploadsDir, name));
      if (name.endsWith('.pdf')) continue;
      await expectNoMetadata(bytes);
    }
  });

  it('a large photo gets a display size of 1600 px on the long edge', async () => {
    const file = await uploadOk(as.engineer, await plainJpeg(3000, 2000), 'wide.jpg');
    const display = await sharp(await bytesOf(as.engineer, file.displayUrl!)).metadata();
    expect([display.width, display.height]).toEqual([1600, 1067]);
  });

  it('is served with its real type, nosniff, long private caching and an RFC 6266 name', async () => {
    const file = await uploadOk(as.engineer, await plainJpeg(), 'Bühne links.jpg');
    const res = await as.viewer.fetch(file.url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('cache-control')).toBe('private, max-age=31536000, immutable');
    expect(res.headers.get('content-disposition')).toBe(`inline; filename="Buhne links.jpg"; filename*=UTF-8''B%C3%BChne%20links.jpg`);
    const etag = res.headers.get('etag')!;
    expect(etag).toMatch(/^"[0-9a-f]{64}\.jpg"$/);
    expect((await as.viewer.fetch(file.url, { headers: { 'if-none-match': etag } })).status).toBe(304);
    const download = await as.viewer.fetch(`${file.url}?download=1`);
    expect(download.headers.get('content-disposition')).toMatch(/^attachment; /);
    const thumb = await as.viewer.fetch(file.thumbUrl!);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    expect(thumb.headers.get('content-disposition')).toContain(`filename*=UTF-8''B%C3%BChne%20links-thumb.webp`);
    expect((await as.viewer.fetch(`/files/${file.id}/original`)).headers.get('etag')).toBe(etag);
    expect((await as.viewer.fetch(`/files/${file.id}/poster`)).status).toBe(404);
  });
});

describe('hostile and broken uploads', () => {
  it('a PNG with HTML appended is re-encoded: the HTML never reaches the disk', async () => {
    const file = await uploadOk(as.engineer, await pngWithHtml(), 'diagram.png');
    expect(file.mime).toBe('image/png');
    const served = await bytesOf(as.engineer, file.url);
    expect(served.toString('latin1')).not.toMatch(/<script|<html/i);
    for (const name of storedEntries(server.uploadsDir)) expect(readFileSync(join(server.uploadsDir, name)).toString('latin1')).not.toContain('<script>alert');
  });

  it.each([
    ['an SVG with a script', SVG_WITH_SCRIPT, 'logo.svg', 'image/svg+xml'],
    ['an SVG with a script, named .jpg', SVG_WITH_SCRIPT, 'logo.jpg', 'image/jpeg'],
    ['an HTML page named photo.jpg', HTML_PAGE, 'photo.jpg', 'image/jpeg'],
    ['a zip archive', ZIP_BYTES, 'rig.zip', 'application/zip'],
  ])('%s → 415', async (_label, bytes, name, type) => {
    const before = storedEntries(server.uploadsDir).length;
    await expectRefused(await upload(as.engineer, bytes, name, {}, type), 415, /JPEG|PDF/);
    expect(storedEntries(server.uploadsDir).length).toBe(before);
  });

  it('a GIF (an image, but not one we take) → 415 naming the type', async () => {
    const gif = await sharp({ create: { width: 10, height: 10, channels: 3, background: '#000' } }).gif().toBuffer();
    await expectRefused(await upload(as.engineer, gif, 'anim.gif', {}, 'image/gif'), 415, /GIF/);
  });

  it('a 20,000 × 20,000 PNG is refused from its header → 422 with the size and the limit', async () => {
    const bomb = blankPng(20_000, 20_000);
    expect(bomb.length).toBeLessThan(200_000);
    await expectRefused(await upload(as.engineer, bomb, 'bomb.png'), 422, /20000 × 20000.*400 megapixels.*limit is 64 megapixels/);
  });

  it('a truncated JPEG → 422 "incomplete"', async () => {
    await expectRefused(await upload(as.engineer, await truncatedJpeg(), 'half.jpg'), 422, /^The file is incomplete; upload it again\.$/);
  });

  it('a file named ../../etc/passwd.jpg is stored under its hash; the name is only text', async () => {
    const res = await as.engineer.fetch(`/api/venues/${venue}/files`, {
      method: 'POST',
      headers: { 'content-type': 'multipart/form-data; boundary=xyzzy' },
      body: multipartBody('xyzzy', [{ name: 'file', filename: '../../etc/passwd.jpg', type: 'image/jpeg', value: await plainJpeg(320, 240, 90) }]),
    });
    const { file } = (await res.json()) as { file: FileView };
    expect(res.status).toBe(201);
    expect(file.originalName).toBe('passwd.jpg');
    expect(existsSync(join(server.uploadsDir, '..', '..', 'etc'))).toBe(false);
    expect(existsSync(join(server.dir, 'etc'))).toBe(false);
    for (const name of storedEntries(server.uploadsDir)) expect(name).toMatch(/^[0-9a-f]{64}(\.(jpg|png|webp|pdf)|-display\.webp|-thumb\.webp)$/);
    const served = await as.engineer.fetch(file.url);
    expect(served.headers.get('content-disposition')).toBe(`inline; filename="passwd.jpg"; filename*=UTF-8''passwd.jpg`);
  });

  it('control characters and quotes in a name are cleaned and cannot break the header', async () => {
    const res = await as.engineer.fetch(`/api/venues/${venue}/files`, {
      method: 'POST',
      headers: { 'content-type': 'multipart/form-data; boundary=b0undary' },
      // RFC 5987 form, so the hostile characters survive the header parser: BEL, RLO, a quote, a semicolon, CR LF.
      body: multipartBody('b0undary', [{ name: 'file', filenameParam: "filename*=UTF-8''rack%07%E2%80%AEgpj.exe%22%3B%20x%3D1%0D%0AX-Evil%3A%201.jpg", type: 'image/jpeg', value: await plainJpeg(320, 240, 70) }]),
    });
    const { file } = (await res.json()) as { file: FileView };
    expect(res.status).toBe(201);
    expect(file.originalName).toBe('rackgpj.exe"; x=1X-Evil: 1.jpg');
    const disposition = (await as.engineer.fetch(file.url)).headers.get('content-disposition')!;
    expect(disposition).toMatch(/^inline; filename="[^"]*"; filename\*=UTF-8''[A-Za-z0-9%!#$&+\-.^_`|~]+$/);
  });

  it('a 26 MiB body with its length declared → 413 before reading, nothing stored', async () => {
    const before = storedEntries(server.uploadsDir).length;
    const body = multipartBody('big', [{ name: 'file', filename: 'huge.jpg', type: 'image/jpeg', value: Buffer.alloc(26 * 1024 * 1024, 7) }]);
    const res = await as.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', headers: { 'content-type': 'multipart/form-data; boundary=big', 'content-length': String(body.length) }, body });
    await expectRefused(res, 413, /25 MiB/);
    expect(storedEntries(server.uploadsDir).length).toBe(before);
  });

  it('a 26 MiB chunked body without a length → 413 while reading, nothing stored', async () => {
    const before = storedEntries(server.uploadsDir).length;
    const boundary = 'chunky';
    const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
    const jpegStart = await plainJpeg(64, 64);
    let sent = 0;
    const total = 26 * 1024 * 1024;
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(head);
        controller.enqueue(jpegStart.subarray(0, 100));
      },
      pull(controller) {
        if (sent >= total) {
          controller.enqueue(Buffer.from(`\r\n--${boundary}--\r\n`));
          controller.close();
          return;
        }
        const chunk = Buffer.alloc(256 * 1024, 0x41);
        sent += chunk.length;
        controller.enqueue(chunk);
      },
    });
    const res = await as.engineer.fetch(`/api/venues/${venue}/files`, {
      method: 'POST',
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}` },
      body,
      duplex: 'half',
    } as RequestInit);
    await expectRefused(res, 413, /25 MiB/);
    expect(storedEntries(server.uploadsDir).length).toBe(before);
  });

  it('a small chunked body without a length is taken', async () => {
    const payload = multipartBody('small', [
      { name: 'caption', value: 'sent in chunks' },
      { name: 'file', filename: 'chunked.jpg', type: 'image/jpeg', value: await plainJpeg(200, 150, 60) },
    ]);
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < payload.length; i += 1000) controller.enqueue(payload.subarray(i, i + 1000));
        controller.close();
      },
    });
    const res = await as.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', headers: { 'content-type': 'multipart/form-data; boundary=small' }, body, duplex: 'half' } as RequestInit);
    expect(res.status).toBe(201);
    expect(((await res.json()) as { file: FileView }).file.caption).toBe('sent in chunks');
  });

  it('a HEIC photo this server cannot decode → 415 that says to export as JPEG', async () => {
    await expectRefused(await upload(as.engineer, await heicTheServerCannotRead(), 'IMG_0042.HEIC', {}, 'image/heic'), 415, /export the photo as JPEG/i);
  });

  it('a HEIF photo the server can decode is taken and stored as JPEG', async () => {
    const file = await uploadOk(as.engineer, await heifTheServerCanRead(), 'IMG_0043.HEIC');
    expect(file).toMatchObject({ mime: 'image/jpeg', originalName: 'IMG_0043.jpg', width: 64, height: 48 });
    expect((await sharp(await bytesOf(as.engineer, file.url)).metadata()).format).toBe('jpeg');
  });

  it('a PDF is stored byte for byte and served as a PDF; it has no display size', async () => {
    const file = await uploadOk(as.engineer, PDF_BYTES, 'Stage plot v3.pdf', { caption: 'Stage plot' });
    expect(file).toMatchObject({ kind: 'pdf', mime: 'application/pdf', sizeBytes: PDF_BYTES.length, displayUrl: null, thumbUrl: null });
    const res = await as.viewer.fetch(file.url);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(Buffer.from(await res.arrayBuffer()).equals(PDF_BYTES)).toBe(true);
    expect((await as.viewer.fetch(`${file.url}/display`)).status).toBe(404);
  });

  describe('bad requests are a 4xx with a sentence', () => {
    it('an empty file → 400', async () => {
      await expectRefused(await upload(as.engineer, Buffer.alloc(0), 'empty.jpg'), 400, /empty/);
    });
    it('no file field → 400', async () => {
      const form = new FormData();
      form.append('caption', 'where is it');
      await expectRefused(await as.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form }), 400, /Choose a file/);
    });
    it('two files in one request → 400', async () => {
      const form = new FormData();
      form.append('file', new Blob([new Uint8Array(await plainJpeg(50, 50))]), 'a.jpg');
      form.append('file', new Blob([new Uint8Array(await plainJpeg(50, 50))]), 'b.jpg');
      await expectRefused(await as.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form }), 400, /one file/);
    });
    it('a file in a field not named "file" → 400, and the server carries on', async () => {
      const form = new FormData();
      form.append('photo', new Blob([new Uint8Array(await plainJpeg(1600, 1200))]), 'a.jpg');
      await expectRefused(await as.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form }), 400, /field named "file"/);
      expect((await as.engineer.fetch(`/api/venues/${venue}/files`)).status).toBe(200);
    });
    it('JSON instead of multipart → 415', async () => {
      await expectRefused(await as.engineer.sendJson('POST', `/api/venues/${venue}/files`, { file: 'x' }), 415, /multipart/);
    });
    it('a caption over 500 characters → 400 on the caption', async () => {
      const res = await upload(as.engineer, await plainJpeg(50, 50), 'a.jpg', { caption: 'x'.repeat(501) });
      expect(res.status).toBe(400);
      expect(((await res.json()) as { field: string }).field).toBe('caption');
    });
    it('a page that is not in this venue → 400 on the page', async () => {
      const res = await upload(as.engineer, await plainJpeg(50, 50), 'a.jpg', { page: 'no-such-page' });
      expect(res.status).toBe(400);
      expect(((await res.json()) as { field: string }).field).toBe('page');
    });
    it('a multipart body cut off in the middle → 400', async () => {
      const whole = multipartBody('cut', [{ name: 'file', filename: 'cut.jpg', type: 'image/jpeg', value: await plainJpeg(200, 200) }]);
      const res = await as.engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', headers: { 'content-type': 'multipart/form-data; boundary=cut' }, body: whole.subarray(0, whole.length - 200) });
      expect(res.status).toBe(400);
    });
  });

  it('the same photo twice shares its bytes; deleting one keeps the other working', async () => {
    const bytes = await plainJpeg(300, 200, 33);
    const a = await uploadOk(as.engineer, bytes, 'same-a.jpg');
    const b = await uploadOk(as.engineer, bytes, 'same-b.jpg');
    expect(a.id).not.toBe(b.id);
    const etag = (await as.engineer.fetch(a.url)).headers.get('etag');
    expect((await as.engineer.fetch(b.url)).headers.get('etag')).toBe(etag);
    expect((await as.engineer.fetch(`/api/venues/${venue}/files/${a.id}`, { method: 'DELETE' })).status).toBe(200);
    expect((await as.engineer.fetch(a.url)).status).toBe(404);
    expect(await sharp(await bytesOf(as.engineer, b.url)).metadata()).toMatchObject({ width: 300, height: 200 });
  });
});
