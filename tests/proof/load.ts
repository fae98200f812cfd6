import { signIn } from '../helpers/session';
import { DEMO } from '../helpers/paths';

export interface LoadResult {
  readers: number;
  writers: number;
  seconds: number;
  requests: number;
  status5xx: number;
  statusOther: number;
}

const docOf = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

/** Twelve readers (pages, page views, search, files, history) and four writers at once; counts 5xx. */
export async function load(url: string, venue: string, seconds: number): Promise<LoadResult> {
  const reader = await signIn(url, DEMO.viewer);
  const writer = await signIn(url, DEMO.engineer);
  const { pages } = (await (await reader.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
  const slugs = pages.map((p) => p.slug);
  const reads: ((i: number) => string)[] = [
    () => `/api/venues/${venue}/pages`,
    (i: number) => `/api/venues/${venue}/pages/${slugs[i % slugs.length]}`,
    (i: number) => `/venues/${venue}/${slugs[i % slugs.length]}`,
    (i: number) => `/api/search?q=${['stage', 'amp', 'patch', 'power'][i % 4]}`,
    () => `/api/venues/${venue}/files`,
    (i: number) => `/api/venues/${venue}/pages/${slugs[i % slugs.length]}/revisions`,
    () => `/calc/bandwidth`,
  ];
  let requests = 0;
  let status5xx = 0;
  let statusOther = 0;
  const until = Date.now() + seconds * 1000;
  const count = (status: number, ok: (s: number) => boolean) => {
    requests++;
    if (status >= 500) status5xx++;
    else if (!ok(status)) statusOther++;
  };
  const readers = Array.from({ length: 12 }, async (_, r) => {
    for (let i = r; Date.now() < until; i++) {
      const res = await reader.fetch(reads[i % reads.length](i));
      await res.arrayBuffer();
      count(res.status, (s) => s === 200);
    }
  });
  const writers = Array.from({ length: 4 }, async (_, w) => {
    const slug = slugs[w % slugs.length];
    let base = ((await (await writer.fetch(`/api/venues/${venue}/pages/${slug}`)).json()) as { page: { currentRevision: number } }).page.currentRevision;
    for (let i = 0; Date.now() < until; i++) {
      const res = await writer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}`, { baseRevision: base, doc: docOf(`load writer ${w} save ${i}`) });
      const body = (await res.json()) as { revision?: { number: number }; current?: { number: number } };
      count(res.status, (s) => s === 200 || s === 409);
      base = body.revision?.number ?? body.current?.number ?? base;
    }
  });
  await Promise.all([...readers, ...writers]);
  return { readers: 12, writers: 4, seconds, requests, status5xx, statusOther };
}
