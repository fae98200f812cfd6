// A guest on a pass sees measured traces only on the pages the advance sheet carries.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';
import { newEqBlock, newTraceRef } from '~/lib/doc/blocks/block-data';
import { signInEveryone, type People } from './people-fixtures';

let server: TestServer;
let people: People;

const sweep = ['Hz\tdB', ...Array.from({ length: 100 }, (_, i) => `${(20 * 1000 ** (i / 99)).toFixed(3)}\t${(80 - i / 20).toFixed(2)}`)].join('\n');

async function tracedPage(title: string, label: string) {
  const form = new FormData();
  form.append('file', new Blob([sweep], { type: 'text/plain' }), `${label}.txt`);
  const up = await people.as.engineer.fetch(`/api/venues/${people.venue}/files`, { method: 'POST', body: form });
  expect(up.status).toBe(201);
  const { file } = (await up.json()) as { file: { id: string } };
  const doc = { type: 'doc', content: [{ type: 'eqBlock', attrs: { ...newEqBlock(), traces: [newTraceRef(file.id, label)] } }] };
  const res = await people.as.engineer.sendJson('POST', `/api/venues/${people.venue}/pages`, { title, section: 'stage', doc });
  expect(res.status).toBe(201);
  return { slug: ((await res.json()) as { page: { slug: string } }).page.slug, fileId: file.id };
}

beforeAll(async () => {
  server = await startServer();
  people = await signInEveryone(server);
});
afterAll(async () => {
  people?.db.close();
  await server?.stop();
});

describe('traces and guest passes', () => {
  it('draws the trace of a page on the sheet and offers its file; a page off the sheet stays hidden', async () => {
    const on = await tracedPage('Traced advance page', 'advance sweep');
    const off = await tracedPage('Traced house page', 'house sweep');
    const put = await people.as.manager.sendJson('PUT', `/api/venues/${people.venue}/advance`, { pages: [on.slug] });
    expect(put.status).toBe(200);
    const made = await people.as.manager.sendJson('POST', `/api/venues/${people.venue}/passes`, { label: 'Touring FOH' });
    expect(made.status).toBe(201);
    const token = ((await made.json()) as { pass: { url: string } }).pass.url.split('/').pop()!;

    const html = await (await fetch(`${server.url}/advance/${token}`)).text();
    expect(html).toContain('data-label="advance sweep"');
    expect(html).not.toContain('house sweep');
    expect((await fetch(`${server.url}/advance/${token}/files/${on.fileId}`)).status).toBe(200);
    expect((await fetch(`${server.url}/advance/${token}/files/${off.fileId}`)).status).toBe(404);
    // A pass is not a session: the venue's own file route stays closed to it.
    expect((await fetch(`${server.url}/files/${on.fileId}`, { headers: { authorization: `Bearer ${token}` } })).status).not.toBe(200);
  });
});
