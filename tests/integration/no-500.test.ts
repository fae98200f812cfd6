import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { anonymous, signIn, type Client } from '../helpers/session';

/**
 * API.md: "No route ever answers 500 to bad input." Every JSON route, for a signed-out visitor, a
 * viewer and an admin, gets hostile path segments, query strings and bodies; whatever it answers
 * must be a 2xx–4xx with a JSON `error` sentence on refusals, and the server must stay up.
 */
let server: TestServer;
let who: Record<'anonymous' | 'viewer' | 'admin', Client>;

const V = 'haverkin-hall';
const ROUTES: [method: string, path: string][] = [
  ['GET', '/api/venues'],
  ['POST', '/api/venues'],
  ['GET', `/api/venues/{v}/pages`],
  ['POST', `/api/venues/{v}/pages`],
  ['GET', `/api/venues/{v}/pages/{p}`],
  ['PUT', `/api/venues/{v}/pages/{p}`],
  ['GET', `/api/venues/{v}/pages/{p}/revisions`],
  ['GET', `/api/venues/{v}/pages/{p}/revisions/{n}`],
  ['POST', `/api/venues/{v}/pages/{p}/revisions/{n}/restore`],
  ['GET', `/api/venues/{v}/sections`],
  ['POST', `/api/venues/{v}/sections`],
  ['PATCH', `/api/venues/{v}/sections/{p}`],
  ['DELETE', `/api/venues/{v}/sections/{p}`],
  ['GET', `/api/venues/{v}/files`],
  ['PATCH', `/api/venues/{v}/files/{p}`],
  ['DELETE', `/api/venues/{v}/files/{p}`],
  ['GET', '/files/{p}'],
  ['GET', '/files/{p}/{n}'],
  ['GET', '/api/search'],
  ['POST', '/api/calc/response'],
  ...['band', 'bands', 'note', 'spl-sum', 'distance', 'background', 'weighting', 'exposure', 'delay', 'align'].map(
    (name) => ['GET', `/api/calc/${name}`] as [string, string],
  ),
];

const SEGMENTS = [V, 'pa-overview', '1', '0', '-1', '99999999999999999999', '%00', '..%2F..%2Fetc', '%E2%80%AE', 'a'.repeat(300), '%25', 'null', '__proto__', 'constructor'];
const BODIES: (string | undefined)[] = [
  undefined,
  '',
  '{',
  'null',
  '[]',
  '"text"',
  '1e309',
  '{"__proto__":{"isAdmin":true}}',
  '{"doc":null,"baseRevision":"1"}',
  '{"doc":{"type":"doc","content":[{"type":"paragraph","content":[{"type":"text","text":""}]}]},"baseRevision":1}',
  '{"title":' + '"x"'.repeat(3) + '}',
  JSON.stringify({ name: { $gt: '' }, title: ['a'], section: 12, filters: 'all', sampleRate: -1 }),
  JSON.stringify({ sampleRate: 48000, filters: [{ type: 'peaking', freq: 1e309 }] }),
];
const QUERIES = ['', '?q=', "?q=' OR 1=1--", '?q=%22%22%22', '?q=NEAR(a b)', '?levels=1,,2', '?freq=NaN&curve=A', '?q=' + 'a'.repeat(5000), '?fraction=3&from=-1&to=1e400', '?distance=1e999&temp=-300', '?a=1&a=2&a=3', '?__proto__=1&constructor=2'];

beforeAll(async () => {
  server = await startServer();
  who = { anonymous: anonymous(server.url), viewer: await signIn(server.url, DEMO.viewer), admin: await signIn(server.url, DEMO.admin) };
});
afterAll(() => server?.stop());

async function expectNo500(client: Client, method: string, path: string, body: string | undefined, contentType: string) {
  const headers: Record<string, string> = { accept: 'application/json' };
  if (body !== undefined) headers['content-type'] = contentType;
  const res = await client.fetch(path, { method, headers, body: method === 'GET' || method === 'DELETE' ? undefined : body });
  const text = await res.text();
  expect(res.status, `${method} ${path} (${contentType}) ${body?.slice(0, 60)} → ${res.status}: ${text.slice(0, 200)}`).toBeLessThan(500);
  if (res.status >= 400 && (res.headers.get('content-type') ?? '').includes('json')) {
    expect(JSON.parse(text).error, `${method} ${path}`).toMatch(/\w{3,}.*\w/);
  }
}

describe('no route answers 500 to bad input', () => {
  for (const role of ['anonymous', 'viewer', 'admin'] as const) {
    it(`as ${role}: a fixed set of hostile paths, queries and bodies`, async () => {
      for (const [method, template] of ROUTES) {
        for (const body of BODIES) {
          const path = template.replace('{v}', V).replace('{p}', 'pa-overview').replace('{n}', '1') + QUERIES[BODIES.indexOf(body) % QUERIES.length];
          await expectNo500(who[role], method, path, body, 'application/json');
        }
        for (const segment of SEGMENTS) {
          const path = template.replaceAll('{v}', segment).replaceAll('{p}', segment).replaceAll('{n}', segment);
          await expectNo500(who[role], method, path, '{"x":1}', 'application/json');
        }
      }
    });
  }

  it('as admin: random bodies and content types on every writing route (fast-check, fixed seed)', async () => {
    const writes = ROUTES.filter(([m]) => m !== 'GET');
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...writes),
        fc.oneof(fc.json(), fc.string({ maxLength: 200 }), fc.jsonValue().map((v) => JSON.stringify(v))),
        fc.constantFrom('application/json', 'text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/json; charset=latin1'),
        async ([method, template], body, contentType) => {
          const path = template.replace('{v}', V).replace('{p}', 'pa-overview').replace('{n}', '1');
          await expectNo500(who.admin, method, path, body, contentType);
        },
      ),
      { seed: 20261202, numRuns: 150 },
    );
  });

  it('the server is still up and the demo page still reads after all that', async () => {
    const res = await who.viewer.fetch(`/api/venues/${V}/pages/pa-overview`);
    expect(res.status).toBe(200);
    expect(server.output()).not.toMatch(/unhandled error/i);
  });
});
