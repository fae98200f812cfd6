import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LIMITS } from '~/lib/acoustics';
import { SplSumQuerySchema } from '~/lib/schemas/calc';
import { startServer, type TestServer } from '../helpers/server';

/**
 * Every calculator route refuses hostile input with a 400 and a sentence a person can act on —
 * never a 500, never a stack trace, never an echo of a huge input.
 */
let server: TestServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

async function expectRefusal(res: Response, field?: string): Promise<string> {
  const text = await res.text();
  expect(res.status, text).toBe(400);
  const body = JSON.parse(text) as { error: string; field?: string };
  expect(typeof body.error).toBe('string');
  // A sentence: words, a full stop, no internals, no runaway echo of what was sent.
  expect(body.error.length, body.error).toBeGreaterThan(20);
  expect(body.error.length, body.error).toBeLessThan(400);
  expect(body.error, body.error).toMatch(/[.!]$/);
  expect(body.error).not.toMatch(/undefined|\[object|Error:|Zod|at \w+ \(|NaN\b(?!")/);
  if (field) expect(body.field).toBe(field);
  return body.error;
}

const refuse = async (path: string, field?: string) => expectRefusal(await fetch(`${server.url}/api/calc/${path}`), field);

/** One valid query per route, and the numeric parameters to break one at a time. */
const ROUTES: { path: string; valid: Record<string, string>; numbers: string[] }[] = [
  { path: 'band', valid: { f0: '1000', q: '1.4' }, numbers: ['f0', 'q'] },
  { path: 'band', valid: { low: '707', high: '1414' }, numbers: ['low', 'high'] },
  { path: 'bands', valid: { fraction: '3', from: '20', to: '20000' }, numbers: ['from', 'to'] },
  { path: 'note', valid: { freq: '440', a4: '440' }, numbers: ['freq', 'a4'] },
  { path: 'spl-sum', valid: { levels: '94,91' }, numbers: ['levels'] },
  { path: 'distance', valid: { level: '100', from: '10', to: '20' }, numbers: ['level', 'from', 'to'] },
  { path: 'background', valid: { total: '96', background: '88' }, numbers: ['total', 'background'] },
  { path: 'weighting', valid: { freq: '1000', curve: 'A' }, numbers: ['freq'] },
  { path: 'exposure', valid: { level: '94', standard: 'niosh' }, numbers: ['level'] },
  { path: 'delay', valid: { distance: '10', temp: '20', rate: '48000' }, numbers: ['distance', 'temp', 'rate'] },
  { path: 'align', valid: { main: '30', fill: '8', temp: '20', offset: '5' }, numbers: ['main', 'fill', 'temp', 'offset'] },
];

const NOT_NUMBERS = ['NaN', 'Infinity', '-Infinity', '1e309', '-1e309', '', 'abc', '0x10', '1,5e', '12 dB', '1'.repeat(400)];

describe.each(ROUTES)('GET /api/calc/$path', ({ path, valid, numbers }) => {
  const query = (patch: Record<string, string | undefined>) => {
    const params = new URLSearchParams();
    for (const [k, v] of Object.entries({ ...valid, ...patch })) if (v !== undefined) params.set(k, v);
    return `${path}?${params}`;
  };

  it('answers the valid query', async () => {
    expect((await fetch(`${server.url}/api/calc/${query({})}`)).status).toBe(200);
  });

  it.each(numbers)('refuses a %s that is not a finite number', async (name) => {
    for (const bad of NOT_NUMBERS) await refuse(query({ [name]: bad }), name);
  });

  it.each(numbers)('refuses %s when missing (if required) or out of range', async (name) => {
    const optional = ['temp', 'rate', 'offset', 'a4', 'from', 'to', 'f0'].includes(name) && path !== 'distance';
    if (!optional) await refuse(query({ [name]: undefined }));
    for (const out of ['-1e6', '1e6']) await refuse(query({ [name]: out }), name);
  });
});

describe('named hostile inputs', () => {
  it('refuses negative distances', async () => {
    expect(await refuse('delay?distance=-1', 'distance')).toMatch(/distance/);
    await refuse('distance?level=100&from=-5&to=10', 'from');
    await refuse('distance?level=100&from=0&to=10', 'from');
    await refuse('align?main=-1&fill=8', 'main');
    await refuse('align?main=30&fill=-8&unit=ft', 'fill');
  });

  it('refuses 0 Hz', async () => {
    await refuse('weighting?freq=0&curve=A', 'freq');
    await refuse('note?freq=0', 'freq');
    await refuse('band?f0=0&q=1', 'f0');
    await refuse('band?low=0&high=100', 'low');
    await refuse('bands?fraction=3&from=0');
    await refuse('band?q=0', 'q');
    await refuse('band?octaves=0', 'octaves');
  });

  it('refuses −300 °C (and its °F twin), naming the range', async () => {
    expect(await refuse('delay?distance=10&temp=-300', 'temp')).toMatch(/at least -60 °C and at most 60 °C/);
    expect(await refuse('align?main=30&fill=8&temp=-300&tempUnit=F', 'temp')).toMatch(/°F/);
  });

  it('refuses a list of levels that is too long, checking its length before splitting it', async () => {
    // Within the 16 KiB request line Node accepts: the route itself refuses.
    const many = Array.from({ length: 5000 }, () => '94').join(',');
    expect(await refuse(`spl-sum?levels=${many}`, 'levels')).toMatch(new RegExp(`at most ${LIMITS.maxLevels}`));
    const justOver = Array.from({ length: LIMITS.maxLevels + 1 }, () => '94').join(',');
    expect(await refuse(`spl-sum?levels=${justOver}`, 'levels')).toMatch(/at most 64/);
    expect((await fetch(`${server.url}/api/calc/spl-sum?levels=${Array.from({ length: LIMITS.maxLevels }, () => '94').join(',')}`)).status).toBe(200);
  });

  it('refuses 200,000 levels: Node stops the request line, the schema stops the string', async () => {
    const huge = Array.from({ length: 200_000 }, () => '94').join(',');
    // The request line alone is 600 kB, past Node's header limit: a 431 before any app code runs.
    const res = await fetch(`${server.url}/api/calc/spl-sum?levels=${huge}`);
    expect(res.status).toBe(431);
    // The same text reaching the schema (a bigger header limit, a proxy) is refused by length.
    const parsed = SplSumQuerySchema.safeParse({ levels: huge });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0].message).toMatch(/too long \(599999 characters\).*at most 64/);
    // The server is still answering.
    expect((await fetch(`${server.url}/api/calc/spl-sum?levels=1,2`)).status).toBe(200);
  });

  it('refuses malformed lists, mismatched phases and unknown choices, listing what is allowed', async () => {
    await refuse('spl-sum?levels=94,,91', 'levels');
    await refuse('spl-sum?levels=94,91,', 'levels');
    await refuse('spl-sum?levels=94,NaN', 'levels');
    await refuse('spl-sum?levels=94,91&phases=0,180', 'phases');
    await refuse('spl-sum?levels=94,91&mode=coherent&phases=0', 'phases');
    await refuse('spl-sum?levels=94,91&mode=coherent&phases=0,720', 'phases');
    expect(await refuse('spl-sum?levels=94&mode=loud', 'mode')).toMatch(/incoherent, coherent/);
    expect(await refuse('weighting?freq=1000&curve=B', 'curve')).toMatch(/A, C, Z/);
    expect(await refuse('exposure?level=94&standard=iso', 'standard')).toMatch(/niosh, osha, eu/);
    await refuse('exposure?level=94', 'standard');
    expect(await refuse('delay?distance=10&unit=yd', 'unit')).toMatch(/m, ft/);
    await refuse('delay?distance=10&tempUnit=K', 'tempUnit');
    expect(await refuse('bands?fraction=5', 'fraction')).toMatch(/1, 3, 6, 12, 24/);
    await refuse('bands?fraction=3&from=1000&to=100', 'to');
    await refuse('note?note=H2', 'note');
    await refuse('note?note=C', 'note');
    await refuse('note?freq=440&note=A4');
    await refuse('note');
    await refuse('band');
    await refuse('band?f0=1000');
    await refuse('band?q=1&octaves=1');
    await refuse('band?low=100');
    await refuse('band?low=100&high=200&q=2');
    await refuse('band?low=200&high=100', 'high');
    await refuse('exposure?level=60&standard=osha', 'level');
  });

  it('passes the math’s own refusal through as a 400 with its sentence', async () => {
    expect(await refuse('background?total=96&background=94')).toMatch(/at least 3 dB below/);
    expect(await refuse('note?note=B12')).toMatch(/B12/);
    expect(await refuse('note?note=C-9')).toMatch(/C-9/);
  });
});

describe('POST /api/calc/response, hostile bodies', () => {
  const send = (body: string, type = 'application/json') =>
    fetch(`${server.url}/api/calc/response`, { method: 'POST', headers: { 'content-type': type, origin: server.url }, body });
  const sendJson = (body: unknown) => send(JSON.stringify(body));
  const peq = { type: 'peaking', freq: 1000, gain: -3, q: 1.4 };

  it('refuses malformed JSON, an empty body, and a body that is not JSON', async () => {
    expect(await expectRefusal(await send('{"sampleRate": 48000, "filters": ['))).toMatch(/JSON/);
    await expectRefusal(await send(''));
    await expectRefusal(await send('[1, 2, 3]'));
    await expectRefusal(await send('"hello"'));
    await expectRefusal(await send('null'));
    expect((await send('{}', 'text/plain')).status).toBe(415);
    // Without an Origin, a text/plain POST looks like a cross-site form and Astro refuses it first.
    const bare = await fetch(`${server.url}/api/calc/response`, { method: 'POST', headers: { 'content-type': 'text/plain' }, body: '{}' });
    expect(bare.status).toBe(403);
  });

  it('refuses an unknown filter type with the list of allowed ones', async () => {
    const message = await expectRefusal(await sendJson({ sampleRate: 48000, filters: [peq, { type: 'tilt', freq: 1000 }] }), 'filters.1.type');
    expect(message).toMatch(/Filter 2/);
    expect(message).toMatch(/peaking, lowshelf, highshelf, lowpass, highpass, bandpass, notch, allpass, crossover-low, crossover-high/);
  });

  it('refuses a filter at or above Nyquist, and 0 Hz', async () => {
    expect(await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'lowpass', freq: 30000 }] }), 'filters.0.freq')).toMatch(/half the sample rate/);
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'lowpass', freq: 24000 }] }), 'filters.0.freq');
    await expectRefusal(await sendJson({ sampleRate: 44100, filters: [{ type: 'crossover-high', freq: 22050 }] }), 'filters.0.freq');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'peaking', freq: 0 }] }), 'filters.0.freq');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [], freqs: [0] }), 'freqs');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [], freqs: [24001] }), 'freqs');
  });

  it('refuses non-finite and out-of-range numbers anywhere in the body', async () => {
    // JSON has no NaN; 1e309 parses to Infinity, which must not slip through.
    await expectRefusal(await send('{"sampleRate": 1e309, "filters": []}'), 'sampleRate');
    await expectRefusal(await send('{"sampleRate": 48000, "filters": [{"type": "peaking", "freq": 1e309}]}'), 'filters.0.freq');
    await expectRefusal(await send('{"sampleRate": 48000, "filters": [], "freqs": [100, -1e309]}'));
    await expectRefusal(await sendJson({ sampleRate: 'NaN', filters: [] }), 'sampleRate');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ ...peq, freq: '1000' }] }), 'filters.0.freq');
    await expectRefusal(await sendJson({ sampleRate: 1000, filters: [] }), 'sampleRate');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ ...peq, gain: 99 }] }), 'filters.0.gain');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ ...peq, q: 0 }] }), 'filters.0.q');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ ...peq, q: -1 }] }), 'filters.0.q');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'lowshelf', freq: 100, gain: 6, slope: 2 }] }), 'filters.0.slope');
    expect(await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'crossover-low', freq: 100, slope: 18 }] }), 'filters.0.slope')).toMatch(/12, 24, 36, 48/);
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'crossover-low', freq: 100, family: 'bessel' }] }), 'filters.0.family');
  });

  it('refuses too many filters or frequencies, counting before parsing', async () => {
    const filters = Array.from({ length: LIMITS.maxFilters + 1 }, () => peq);
    expect(await expectRefusal(await sendJson({ sampleRate: 48000, filters }), 'filters')).toMatch(/at most 32/);
    expect(await expectRefusal(await send(`{"sampleRate":48000,"filters":[${'0,'.repeat(199_999)}0]}`), 'filters')).toMatch(/got 200000/);
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [], freqs: Array.from({ length: LIMITS.maxResponsePoints + 1 }, () => 100) }), 'freqs');
  });

  it('refuses missing and unknown fields, and reserved keys', async () => {
    await expectRefusal(await sendJson({ filters: [] }), 'sampleRate');
    await expectRefusal(await sendJson({ sampleRate: 48000 }), 'filters');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: {} }), 'filters');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ freq: 100 }] }), 'filters.0.type');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ type: 'peaking' }] }), 'filters.0.freq');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [{ ...peq, bypass: true }] }), 'filters.0');
    await expectRefusal(await sendJson({ sampleRate: 48000, filters: [], extra: 1 }));
    await expectRefusal(await send('{"sampleRate":48000,"filters":[{"type":"peaking","freq":100,"__proto__":{"x":1}}]}'));
  });
});

it('never answered 500 or logged an unhandled error', () => {
  expect(server.output()).not.toMatch(/unhandled error/);
});
