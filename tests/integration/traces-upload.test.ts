// Measurement traces through the real upload pipeline: the same streamed, capped, checked path
// as photos and PDFs, parsed on the server, refused with the line that is wrong.
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';
import { storedEntries, tempEntries } from './files-fixtures';

let server: TestServer;
const as: Record<keyof typeof DEMO, Client> = {} as never;
let venue: string;

beforeAll(async () => {
  server = await startServer();
  for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) as[who] = await signIn(server.url, DEMO[who]);
  const mine = (await (await as.engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
  venue = mine.venues[0].slug;
});
afterAll(() => server?.stop());
afterEach(() => expect(tempEntries(server.uploadsDir)).toEqual([]));

function upload(client: Client, text: string | Buffer, filename: string): Promise<Response> {
  const form = new FormData();
  const bytes = Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8');
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'text/plain' }), filename);
  return client.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
}

const GOOD = '# demo sweep, mix position\nHz;dB;deg;coh\n20;-6,5;170,0;0,62\n1000;0,0;-12,5;0,99\n16000;-2,25;40,0;0,91\n';

describe('trace uploads', () => {
  it('an engineer uploads a semicolon / decimal-comma export: 201, kept as text, parsed beside it', async () => {
    const res = await upload(as.engineer, GOOD, 'mix-position-before.csv');
    const body = (await res.json()) as { file: { id: string; kind: string; url: string; displayUrl: string | null; thumbUrl: string | null } };
    expect(res.status, JSON.stringify(body)).toBe(201);
    expect(body.file.kind).toBe('trace');
    expect(body.file.thumbUrl).toBeNull();

    const original = await as.viewer.fetch(body.file.url);
    expect(original.status).toBe(200);
    expect(original.headers.get('content-type')).toBe('text/plain; charset=utf-8');
    expect(original.headers.get('x-content-type-options')).toBe('nosniff');
    expect(await original.text()).toBe(GOOD);

    const parsed = await as.viewer.fetch(`${body.file.url}/display`);
    expect(parsed.headers.get('content-type')).toBe('application/json');
    expect(await parsed.json()).toEqual({ v: 1, f: [20, 1000, 16000], m: [-6.5, 0, -2.25], p: [170, -12.5, 40], c: [0.62, 0.99, 0.91] });
  });

  it('a viewer may read a trace but not upload one; signed out gets nothing', async () => {
    expect((await upload(as.viewer, GOOD, 'x.txt')).status).toBe(403);
    const other = await signIn(server.url, DEMO.otherManager);
    const { file } = (await (await upload(as.engineer, GOOD.replace('16000', '17000'), 'y.txt')).json()) as { file: { url: string } };
    expect((await other.fetch(file.url)).status).toBe(404);
    expect((await anonymous(server.url).fetch(file.url)).status).not.toBe(200);
  });

  it.each([
    ['falling frequencies', '100\t1\n200\t2\n150\t3\n', /Line 3: the frequency 150 Hz does not rise/],
    ['NaN in a magnitude', '100\t1\n200\tNaN\n', /Line 2: "NaN" is not a number/],
    ['mixed separators', '100\t1\n200,2\n', /Line 2: found 1 values/],
    ['a negative frequency', '-5\t1\n200\t2\n', /Line 1: the frequency -5 Hz/],
  ])('%s → 422 naming the line, nothing stored', async (_label, text, message) => {
    const before = storedEntries(server.uploadsDir).length;
    const res = await upload(as.engineer, text, 'bad.txt');
    const body = (await res.json()) as { error: string; field?: string };
    expect(res.status, JSON.stringify(body)).toBe(422);
    expect(body.error).toMatch(message);
    expect(body.field).toBe('file');
    expect(storedEntries(server.uploadsDir).length).toBe(before);
  });

  it('text with no numbers, and bytes that are not UTF-8, → 415 saying what is taken', async () => {
    for (const bytes of [Buffer.from('Dear venue,\nplease find attached…\n'), Buffer.from([0x31, 0x30, 0x30, 0x09, 0xff, 0xfe, 0x0a, 0x32])]) {
      const res = await upload(as.engineer, bytes, 'letter.txt');
      const body = (await res.json()) as { error: string };
      expect(res.status, JSON.stringify(body)).toBe(415);
      expect(body.error).toMatch(/measurement traces/);
    }
  });
});
