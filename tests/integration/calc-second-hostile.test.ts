import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServer, type TestServer } from '../helpers/server';

/** The second-round calculator routes refuse hostile input with a 400 and a sentence, never a 500. */
let server: TestServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

async function refuse(path: string, field?: string): Promise<string> {
  const res = await fetch(`${server.url}/api/calc/${path}`);
  const text = await res.text();
  expect(res.status, `${path}: ${text}`).toBe(400);
  const body = JSON.parse(text) as { error: string; field?: string };
  expect(body.error.length, body.error).toBeGreaterThan(20);
  expect(body.error.length, body.error).toBeLessThan(400);
  expect(body.error, body.error).toMatch(/[.!]$/);
  expect(body.error).not.toMatch(/undefined|\[object|Error:|Zod|at \w+ \(|NaN\b(?!")/);
  if (field) expect(body.field, path).toBe(field);
  return body.error;
}

/** One valid query per route; `numbers` are broken one at a time; `required` must be present. */
const ROUTES: { path: string; valid: Record<string, string>; numbers: string[]; required: string[] }[] = [
  { path: 'sub-top', valid: { freq: '80', phase: '180' }, numbers: ['freq', 'phase'], required: ['freq', 'phase'] },
  { path: 'level', valid: { value: '4', unit: 'dBu', fullScaleDbu: '24', ohms: '8' }, numbers: ['value', 'fullScaleDbu', 'ohms'], required: ['value', 'unit'] },
  { path: 'wavelength', valid: { freq: '100', temp: '20', rh: '50' }, numbers: ['freq', 'temp', 'rh'], required: ['freq'] },
  { path: 'comb', valid: { delayMs: '1', upTo: '20000', temp: '20' }, numbers: ['delayMs', 'upTo', 'temp'], required: [] },
  { path: 'comb', valid: { distance: '0.34', unit: 'm' }, numbers: ['distance'], required: [] },
  { path: 'impedance', valid: { ohms: '8,8', wiring: 'parallel', minLoad: '4' }, numbers: ['ohms', 'minLoad'], required: ['ohms', 'wiring'] },
  { path: 'max-spl', valid: { sensitivity: '100', power: '1000', distance: '32', boxes: '2' }, numbers: ['sensitivity', 'power', 'distance', 'boxes'], required: ['sensitivity', 'power', 'distance'] },
  { path: 'dose', valid: { segments: '95:2,90:4', standard: 'osha' }, numbers: [], required: ['segments', 'standard'] },
  { path: 'leq', valid: { levels: '98,101', limit: '100' }, numbers: ['levels', 'limit'], required: ['levels'] },
  { path: 'air', valid: { freq: '4000', distance: '50', temp: '20', rh: '50' }, numbers: ['freq', 'distance', 'temp', 'rh'], required: ['freq', 'distance'] },
  { path: 'sub-array', valid: { freq: '60', kind: 'gradient', temp: '20' }, numbers: ['freq', 'temp'], required: ['freq', 'kind'] },
];

const NOT_NUMBERS = ['NaN', 'Infinity', '-Infinity', '1e309', '', 'abc', '0x10', '12 dB', '1'.repeat(400)];

describe.each(ROUTES)('GET /api/calc/$path', ({ path, valid, numbers, required }) => {
  const query = (patch: Record<string, string | undefined>) => {
    const params = new URLSearchParams();
    for (const [k, v] of Object.entries({ ...valid, ...patch })) if (v !== undefined) params.set(k, v);
    return `${path}?${params}`;
  };

  it('answers the valid query', async () => {
    const res = await fetch(`${server.url}/api/calc/${query({})}`);
    expect(res.status, await res.clone().text()).toBe(200);
  });

  it.each(numbers)('refuses a %s that is not a finite number', async (name) => {
    for (const bad of NOT_NUMBERS) await refuse(query({ [name]: bad }), name);
  });

  it.each(numbers)('refuses %s out of range', async (name) => {
    for (const out of ['-1e6', '1e6']) await refuse(query({ [name]: out }), name);
  });

  it.each(required.length ? required : ['(none)'])('refuses the query without %s', async (name) => {
    if (name !== '(none)') await refuse(query({ [name]: undefined }));
  });
});

describe('named hostile inputs on the new routes', () => {
  it('refuses unknown choices, listing what is allowed', async () => {
    expect(await refuse('level?value=4&unit=dBm', 'unit')).toMatch(/dBu, dBV, V, dBFS, W/);
    expect(await refuse('impedance?ohms=8&wiring=star', 'wiring')).toMatch(/parallel, series/);
    expect(await refuse('dose?segments=90:8&standard=who', 'standard')).toMatch(/osha, niosh, eu/);
    expect(await refuse('sub-array?freq=60&kind=line', 'kind')).toMatch(/end-fire, gradient/);
    await refuse('max-spl?sensitivity=100&power=1&distance=1&sensitivityRef=1V', 'sensitivityRef');
  });

  it('refuses inputs that contradict or are missing their partner', async () => {
    await refuse('comb', 'delayMs');
    await refuse('comb?delayMs=1&distance=1');
    await refuse('comb?delayMs=0', 'delayMs');
    await refuse('level?value=100&unit=W', 'ohms');
    await refuse('max-spl?sensitivity=90&sensitivityRef=2.83V&power=100&distance=10', 'ohms');
    await refuse('max-spl?sensitivity=90&power=100&distance=10&boxes=1.5', 'boxes');
    await refuse('max-spl?sensitivity=90&power=100&distance=0', 'distance');
  });

  it('refuses malformed and over-long segments and lists', async () => {
    await refuse('dose?segments=95&standard=osha', 'segments');
    await refuse('dose?segments=95:2,,90:4&standard=osha', 'segments');
    await refuse('dose?segments=95:-2&standard=osha', 'segments');
    await refuse('dose?segments=95:NaN&standard=osha', 'segments');
    expect(await refuse('dose?segments=95:20,90:5&standard=niosh', 'segments')).toMatch(/more than a day/);
    await refuse(`dose?segments=${Array.from({ length: 49 }, () => '90:0.1').join(',')}&standard=eu`, 'segments');
    await refuse(`impedance?ohms=${Array.from({ length: 65 }, () => '8').join(',')}&wiring=parallel`, 'ohms');
    await refuse('impedance?ohms=8,0&wiring=parallel', 'ohms');
    await refuse('leq?levels=90,,91', 'levels');
    await refuse('dose?segments=0:0&standard=eu');
  });

  it('refuses a °F temperature in °F and humidity outside 0–100 %', async () => {
    expect(await refuse('wavelength?freq=100&temp=150&tempUnit=F', 'temp')).toMatch(/°F/);
    await refuse('air?freq=1000&distance=10&rh=101', 'rh');
    await refuse('delay?distance=10&rh=-1', 'rh');
    await refuse('align?main=30&fill=8&latency=-1', 'latency');
  });

  it('the server still answers after all of it', async () => {
    expect((await fetch(`${server.url}/api/calc/leq?levels=90`)).status).toBe(200);
  });
});
