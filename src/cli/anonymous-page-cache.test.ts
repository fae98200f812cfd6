import { createServer, request, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { gunzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { acceptsGzip, anonymousPageCache, carriesCredentials } from './anonymous-page-cache.mjs';

describe('acceptsGzip', () => {
  it('reads names and weights, including the wildcard', () => {
    expect(acceptsGzip('gzip, deflate, br')).toBe(true);
    expect(acceptsGzip('br;q=1, GZIP;q=0.5')).toBe(true);
    expect(acceptsGzip('*')).toBe(true);
    expect(acceptsGzip('gzip;q=0, br')).toBe(false);
    expect(acceptsGzip('identity')).toBe(false);
    expect(acceptsGzip(undefined)).toBe(false);
  });
});

describe('carriesCredentials', () => {
  it('is true for a session cookie or any Authorization header, false otherwise', () => {
    expect(carriesCredentials({ cookie: 'authjs.session-token=abc' })).toBe(true);
    expect(carriesCredentials({ cookie: 'a=1; __Secure-authjs.session-token=abc' })).toBe(true);
    expect(carriesCredentials({ authorization: 'Bearer x' })).toBe(true);
    expect(carriesCredentials({ cookie: 'authjs.csrf-token=abc' })).toBe(false);
    expect(carriesCredentials({})).toBe(false);
  });
});

/** A real HTTP server: the cache in front of an "app" that counts its renders. */
describe('anonymousPageCache', () => {
  let server: Server;
  let base = '';
  const renders = new Map<string, number>();
  beforeAll(async () => {
    const cache = anonymousPageCache({ maxEntries: 2, maxEntryBytes: 64 * 1024 });
    const app = (req: IncomingMessage, res: ServerResponse) => {
      const url = req.url ?? '/';
      const n = (renders.get(url) ?? 0) + 1;
      renders.set(url, n);
      const signedIn = carriesCredentials(req.headers);
      res.writeHead(url.startsWith('/missing') ? 404 : 200, {
        'content-type': 'text/html; charset=utf-8',
        ...(url.startsWith('/calc') && !signedIn ? { 'x-throwline-offline': 'anonymous' } : {}),
        ...(url.startsWith('/calc/cookie') ? { 'set-cookie': 'x=1' } : {}),
      });
      res.write(`<p>${url} render ${n}</p>`);
      res.end(url.startsWith('/calc/big') ? 'x'.repeat(100 * 1024) : `<p>${signedIn ? 'Ana Vell' : 'Sign in'}</p>`);
    };
    server = createServer((req, res) => cache(req, res, () => app(req, res)));
    await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
    base = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
  });
  afterAll(() => new Promise<void>((done) => server.close(() => done())));

  function get(path: string, headers: Record<string, string> = {}): Promise<{ status: number; headers: IncomingMessage['headers']; body: Buffer }> {
    return new Promise((resolve, reject) => {
      const req = request(`${base}${path}`, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: Buffer.concat(chunks) }));
      });
      req.on('error', reject);
      req.end();
    });
  }

  it('renders a marked page once and answers later signed-out requests with the same bytes', async () => {
    const first = await get('/calc/spl');
    const second = await get('/calc/spl');
    expect(second.body.toString()).toBe(first.body.toString());
    expect(second.body.toString()).toContain('render 1');
    expect(second.headers['x-throwline-offline']).toBe('anonymous');
    expect(second.headers['content-type']).toMatch(/text\/html/);
    expect(renders.get('/calc/spl')).toBe(1);
  });

  it('sends its gzip to a client that takes gzip, and says the answer varies', async () => {
    const packed = await get('/calc/spl', { 'accept-encoding': 'gzip, br' });
    expect(packed.headers['content-encoding']).toBe('gzip');
    expect(packed.headers.vary).toMatch(/accept-encoding/i);
    expect(Number(packed.headers['content-length'])).toBe(packed.body.length);
    expect(gunzipSync(packed.body).toString()).toContain('render 1');
  });

  it('never answers a signed-in request from memory, nor keeps what it rendered', async () => {
    const cookie = { cookie: 'authjs.session-token=abc' };
    const mine = await get('/calc/spl', cookie);
    expect(mine.body.toString()).toContain('Ana Vell');
    expect((await get('/calc/spl')).body.toString()).not.toContain('Ana Vell');
    const before = renders.get('/calc/spl')!;
    await get('/calc/spl', { authorization: 'Bearer t' });
    expect(renders.get('/calc/spl')).toBe(before + 1);
  });

  it('keeps nothing unmarked, failed, cookie-setting or too big', async () => {
    for (const path of ['/venues/x', '/missing/calc', '/calc/cookie', '/calc/big']) {
      await get(path);
      await get(path);
      expect(renders.get(path), path).toBe(2);
    }
  });

  it('forgets the least recently used address beyond its bound', async () => {
    await get('/calc/a');
    await get('/calc/b');
    await get('/calc/c');
    await get('/calc/a');
    expect(renders.get('/calc/a')).toBe(2);
    expect(renders.get('/calc/c')).toBe(1);
  });

  it('lets other methods through untouched', async () => {
    await new Promise<void>((resolve, reject) => {
      const req = request(`${base}/calc/post`, { method: 'POST' }, (res) => {
        res.resume();
        res.on('end', resolve);
      });
      req.on('error', reject);
      req.end();
    });
    await get('/calc/post');
    expect(renders.get('/calc/post')).toBe(2);
  });
});
