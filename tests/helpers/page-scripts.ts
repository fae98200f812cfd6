import { gzipSync } from 'node:zlib';

/**
 * What a browser downloads before a screen works: every script a page loads at once (script
 * tags, island components and renderers, and what those import statically). Dynamic import()
 * is left out on purpose: that is code fetched only when someone uses it.
 */
export function entryScripts(html: string): string[] {
  const found = new Set<string>();
  for (const m of html.matchAll(/<script[^>]*\bsrc="([^"]+)"/g)) found.add(m[1]);
  for (const m of html.matchAll(/\b(?:component-url|renderer-url|before-hydration-url)="([^"]+)"/g)) if (m[1]) found.add(m[1]);
  // Inline module scripts import their chunks statically too.
  for (const m of html.matchAll(/<script type="module"[^>]*>([\s\S]*?)<\/script>/g)) for (const i of staticImports(m[1])) found.add(i);
  return [...found].filter((s) => s.startsWith('/'));
}

export function staticImports(js: string): string[] {
  const out: string[] = [];
  // `import x from "…"`, `import "…"`, `export … from "…"`; not `import("…")`.
  for (const m of js.matchAll(/(?:^|[;\s}])(?:import|export)\s*(?:[\w*{}\s,$]+from\s*)?["']([^"']+)["']/g)) out.push(m[1]);
  return out;
}

/** Gzipped bytes of every script `path` loads at once, and which files those are. */
export async function pageScriptBytes(fetchPath: (path: string) => Promise<Response>, path: string): Promise<{ gzipBytes: number; rawBytes: number; files: string[] }> {
  const res = await fetchPath(path);
  if (res.status !== 200) throw new Error(`${path}: ${res.status}`);
  const queue = entryScripts(await res.text());
  const seen = new Set<string>();
  let gzipBytes = 0;
  let rawBytes = 0;
  while (queue.length) {
    const url = queue.pop()!;
    if (seen.has(url)) continue;
    seen.add(url);
    const js = await (await fetchPath(url)).text();
    gzipBytes += gzipSync(js).length;
    rawBytes += Buffer.byteLength(js);
    for (const dep of staticImports(js)) queue.push(new URL(dep, `http://x${url}`).pathname);
  }
  return { gzipBytes, rawBytes, files: [...seen] };
}
