import { gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';

/**
 * What a phone on venue Wi-Fi downloads before a screen works: every script a page loads at once
 * (script tags, island components and renderers, and what those import statically), gzipped.
 * Dynamic import() is left out on purpose: that is code fetched only when someone uses it.
 */
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

function entryScripts(html: string): string[] {
  const found = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\bsrc="([^"]+)"/g)) found.add(m[1]);
  for (const m of html.matchAll(/\b(?:component-url|renderer-url|before-hydration-url)="([^"]+)"/g)) if (m[1]) found.add(m[1]);
  // Inline module scripts import their chunks statically too.
  for (const m of html.matchAll(/<script type="module"[^>]*>([\s\S]*?)<\/script>/g)) for (const i of staticImports(m[1])) found.add(i);
  return [...found].filter((s) => s.startsWith('/'));
}

function staticImports(js: string): string[] {
  const out: string[] = [];
  // `import x from "…"`, `import "…"`, `export … from "…"`; not `import("…")`.
  for (const m of js.matchAll(/(?:^|[;\s}])(?:import|export)\s*(?:[\w*{}\s,$]+from\s*)?["']([^"']+)["']/g)) out.push(m[1]);
  return out;
}

async function gzipBytesOfPage(client: Client, path: string): Promise<{ bytes: number; files: string[] }> {
  const res = await client.fetch(path);
  expect(res.status, path).toBe(200);
  const queue = entryScripts(await res.text());
  const seen = new Set<string>();
  let bytes = 0;
  while (queue.length) {
    const url = queue.pop()!;
    if (seen.has(url)) continue;
    seen.add(url);
    const js = await (await client.fetch(url)).text();
    bytes += gzipSync(js).length;
    for (const dep of staticImports(js)) queue.push(new URL(dep, `http://x${url}`).pathname);
  }
  return { bytes, files: [...seen] };
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
