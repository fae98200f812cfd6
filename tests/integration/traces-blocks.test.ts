// Traces attached to processor blocks, through the real server: who may attach and read them,
// what a save refuses, the read view's overlay and the curve download.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';
import { newEqBlock, newTraceRef } from '~/lib/doc/blocks/block-data';
import { parseTrace } from '~/lib/traces/parse-trace';

let server: TestServer;
let engineer: Client;
let viewer: Client;
let other: Client;
let venue: string;
const PAGE = 'system-processing';

async function upload(client: Client, text: string, name: string, venueSlug = venue) {
  const form = new FormData();
  form.append('file', new Blob([text], { type: 'text/plain' }), name);
  const res = await client.fetch(`/api/venues/${venueSlug}/files`, { method: 'POST', body: form });
  return { status: res.status, body: (await res.json()) as { file: { id: string; kind: string } } };
}

const sweep = (offsetDb: number) => ['Hz\tdB', ...Array.from({ length: 200 }, (_, i) => `${(20 * 1000 ** (i / 199)).toFixed(3)}\t${(80 + offsetDb).toFixed(2)}`)].join('\n');

async function current() {
  const r = (await (await engineer.fetch(`/api/venues/${venue}/pages/${PAGE}`)).json()) as { revision: { number: number; doc: { type: string; content: unknown[] } } };
  return r.revision;
}

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  viewer = await signIn(server.url, DEMO.viewer);
  other = await signIn(server.url, DEMO.otherManager);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0]!.slug;
});
afterAll(() => server?.stop());

describe('attaching measured traces to an EQ block', () => {
  it('an engineer attaches before/after traces; the read view overlays them with their difference; a viewer reads them', async () => {
    const before = await upload(engineer, sweep(0), 'before.txt');
    const after = await upload(engineer, sweep(2), 'after.txt');
    expect([before.status, after.status]).toEqual([201, 201]);
    const rev = await current();
    const block = {
      ...newEqBlock(),
      label: 'Traced EQ',
      traces: [
        { ...newTraceRef(before.body.file.id, 'before retune'), offsetDb: -80, date: '2026-11-30', position: 'FOH' },
        { ...newTraceRef(after.body.file.id, 'after retune'), offsetDb: -80, date: '2026-12-01', position: 'FOH' },
      ],
      compare: { before: before.body.file.id, after: after.body.file.id },
    };
    const saved = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${PAGE}`, { doc: { ...rev.doc, content: [...rev.doc.content, { type: 'eqBlock', attrs: block }] }, baseRevision: rev.number, summary: 'Traces' });
    expect(saved.status, await saved.clone().text()).toBe(200);

    const html = await (await viewer.fetch(`/venues/${venue}/${PAGE}`)).text();
    expect(html).toContain('class="tl-curve tl-curve-trace tl-trace-1"');
    expect(html).toContain('class="tl-curve tl-curve-difference"');
    expect(html).toContain('data-label="after retune − before retune"');
    expect(html).toContain(`href="/files/${after.body.file.id}?download=1"`);
    // The trace is a file the viewer may download, byte for byte as uploaded.
    expect(await (await viewer.fetch(`/files/${after.body.file.id}?download=1`)).text()).toBe(sweep(2));
  });

  it('refuses a photo attached as a trace, and another venue’s trace, with a sentence', async () => {
    const rev = await current();
    const theirVenue = ((await (await other.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0]!.slug;
    expect(theirVenue).not.toBe(venue);
    const foreign = await upload(other, sweep(0), 'theirs.txt', theirVenue);
    expect(foreign.status).toBe(201);
    const attach = (fileId: string) =>
      engineer.sendJson('PUT', `/api/venues/${venue}/pages/${PAGE}`, { doc: { ...rev.doc, content: [...rev.doc.content, { type: 'eqBlock', attrs: { ...newEqBlock(), traces: [newTraceRef(fileId, 'x')] } }] }, baseRevision: rev.number });
    const theirs = await attach(foreign.body.file.id);
    expect(theirs.status).toBe(400);
    expect(((await theirs.json()) as { error: string }).error).toMatch(/is not a file of this venue/);
    const form = new FormData();
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#888' } }).png().toBuffer();
    form.append('file', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'rack.png');
    const photo = ((await (await engineer.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form })).json()) as { file: { id: string; kind: string } }).file;
    expect(photo.kind).toBe('image');
    const wrong = await attach(photo.id);
    expect(wrong.status).toBe(400);
    expect(((await wrong.json()) as { error: string }).error).toMatch(/as a measured trace, but that file is not a trace/);
  });
});

describe('downloading a block’s computed curve', () => {
  it('gives readers text columns that read back as a trace; unknown blocks are 404; signed out gets nothing', async () => {
    const html = await (await viewer.fetch(`/venues/${venue}/${PAGE}`)).text();
    const href = /href="(\/venues\/[^"]+\/curves\/\d+\.txt)"/.exec(html)?.[1];
    expect(href).toBeDefined();
    const res = await viewer.fetch(href!);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment/);
    expect(parseTrace(await res.text()).freqHz.length).toBeGreaterThan(100);
    expect((await viewer.fetch(`/venues/${venue}/${PAGE}/curves/999.txt`)).status).toBe(404);
    expect((await anonymous(server.url).fetch(href!)).status).not.toBe(200);
  });
});
