import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { pageScriptBytes } from '../helpers/page-scripts';

/** What a phone on venue Wi-Fi downloads before a screen works (see page-scripts.ts), gzipped. */
const BUDGET_GZIP_BYTES = 20 * 1024;

let server: TestServer;
let manager: Client;
let venue: string;
let pageSlug: string;

beforeAll(async () => {
  server = await startServer();
  manager = await signIn(server.url, DEMO.manager);
  venue = ((await (await manager.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  const { pages } = (await (await manager.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
  pageSlug = pages[0].slug;
});
afterAll(() => server?.stop());

async function gzipBytesOfPage(client: Client, path: string): Promise<{ bytes: number; files: string[] }> {
  const { gzipBytes, files } = await pageScriptBytes((p) => client.fetch(p), path);
  return { bytes: gzipBytes, files };
}

describe(`scripts a screen loads at once stay under ${BUDGET_GZIP_BYTES / 1024} KiB gzipped`, () => {
  it.each([
    ['the venue list', () => '/venues'],
    ['a venue index', () => `/venues/${venue}`],
    ['a page read view', () => `/venues/${venue}/${pageSlug}`],
    ['the search results page', () => '/search?q=stage'],
  ])('%s', async (_name, path) => {
    const { bytes, files } = await gzipBytesOfPage(manager, path());
    expect(bytes, files.join('\n')).toBeLessThanOrEqual(BUDGET_GZIP_BYTES);
    // The read screens ship no React runtime at all.
    expect(files.filter((f) => /client\.|react/i.test(f)), files.join('\n')).toEqual([]);
  });

  it('the measure sees islands: the editor is far over budget', async () => {
    const { bytes } = await gzipBytesOfPage(manager, `/venues/${venue}/${pageSlug}/edit`);
    expect(bytes).toBeGreaterThan(BUDGET_GZIP_BYTES);
  });
});
