import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { newCrossoverBlock, newEqBlock } from '~/lib/doc/blocks/block-data';

let server: TestServer;
let engineer: Client;
let viewer: Client;
let venue: string;
const PAGE = 'system-processing';

beforeAll(async () => {
  server = await startServer();
  engineer = await signIn(server.url, DEMO.engineer);
  viewer = await signIn(server.url, DEMO.viewer);
  venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0]!.slug;
});
afterAll(() => server?.stop());

const current = async () => ((await (await engineer.fetch(`/api/venues/${venue}/pages/${PAGE}`)).json()) as { revision: { number: number; doc: { type: string; content: unknown[] } } }).revision;

describe('the demo processing page is kept in blocks', () => {
  it('the read view draws each block as an SVG on the server, with tables, and loads no script for them', async () => {
    const res = await viewer.fetch(`/venues/${venue}/${PAGE}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect((html.match(/<svg class="tl-plot"/g) ?? []).length).toBeGreaterThanOrEqual(3);
    expect(html).toContain('Sum of the ways');
    expect(html).toContain('<caption>Bands at 96 kHz</caption>');
    expect(html).toMatch(/role="img" aria-labelledby="blk-1-t blk-1-d"/);
    const article = html.slice(html.indexOf('data-block="'), html.lastIndexOf('</section>'));
    expect(article).not.toMatch(/<script|on\w+=/i);
  });
});

describe('saving blocks through the page API', () => {
  it('an engineer saves a new EQ block; hostile attributes are refused naming the band; a stale base is a 409; a viewer is refused', async () => {
    const rev = await current();
    const eq = { ...newEqBlock(), label: 'Test EQ', bands: [{ type: 'peaking', freq: 315, gain: -4.5, q: 2, on: true }] };
    const hostile = { ...eq, bands: [eq.bands[0], { type: 'peaking', freq: 1e9, gain: 0, q: 1, on: true }] };
    const bad = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${PAGE}`, { doc: { ...rev.doc, content: [...rev.doc.content, { type: 'eqBlock', attrs: hostile }] }, baseRevision: rev.number });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: string }).error).toMatch(/^EQ block "Test EQ": band 2, frequency \(Hz\) must be from 1 to 100000/);
    const body = { doc: { ...rev.doc, content: [...rev.doc.content, { type: 'eqBlock', attrs: eq }] }, baseRevision: rev.number, summary: 'Test EQ' };
    expect((await viewer.sendJson('PUT', `/api/venues/${venue}/pages/${PAGE}`, body)).status).toBe(403);
    const ok = await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${PAGE}`, body);
    expect(ok.status).toBe(200);
    expect((await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${PAGE}`, body)).status).toBe(409);
    const saved = await current();
    expect(saved.doc.content.at(-1)).toEqual({ type: 'eqBlock', attrs: eq });
  });
});

describe('POST /api/calc/response with ways', () => {
  const send = (body: unknown) => fetch(`${server.url}/api/calc/response`, { method: 'POST', headers: { 'content-type': 'application/json', origin: server.url }, body: JSON.stringify(body) });

  it('answers each way and the sum; LR24 sums flat (Linkwitz 1976) and BW12 both normal nulls at fc', async () => {
    const lr = newCrossoverBlock().ways;
    const r = (await (await send({ sampleRate: 48_000, filters: [], freqs: [45, 90, 180], ways: lr })).json()) as { sum: { magnitudeDb: number[] }; ways: unknown[] };
    expect(r.ways).toHaveLength(2);
    for (const m of r.sum.magnitudeDb) expect(Math.abs(m)).toBeLessThan(0.01);
    const bw = { family: 'butterworth', slope: 12, freq: 90 };
    const n = (await (await send({ sampleRate: 48_000, filters: [], freqs: [90], ways: [{ ...lr[0], lowPass: bw }, { ...lr[1], highPass: bw }] })).json()) as { sum: { magnitudeDb: number[]; phaseDeg: (number | null)[] } };
    expect(n.sum.magnitudeDb[0]).toBeLessThan(-100);
  });

  it('refuses a filter at or above 0.49·fs with a clear 400, and names a bad way', async () => {
    const near = await send({ sampleRate: 48_000, filters: [{ type: 'peaking', freq: 23_600, gain: 3, q: 1 }] });
    expect(near.status).toBe(400);
    expect(((await near.json()) as { error: string }).error).toMatch(/below 23520 Hz.*0\.49 × the sample rate/);
    const way = await send({ sampleRate: 48_000, filters: [], ways: [{ highPass: null, lowPass: null, gain: 0, polarity: 'sideways', delayMs: 0 }] });
    expect(way.status).toBe(400);
    expect(((await way.json()) as { error: string; field: string }).error).toMatch(/^Way 1, polarity must be normal or inverted/);
  });

  it('leaves phase out where the magnitude is at its floor', async () => {
    // A cookbook low-pass has an exact zero at Nyquist (numerator 1 + 2z⁻¹ + z⁻² at z = −1).
    const r = (await (await send({ sampleRate: 48_000, filters: [{ type: 'lowpass', freq: 1000, q: 0.7 }], freqs: [24_000, 100] })).json()) as { phaseDeg: (number | null)[] };
    expect(r.phaseDeg[0]).toBeNull();
    expect(typeof r.phaseDeg[1]).toBe('number');
  });
});
