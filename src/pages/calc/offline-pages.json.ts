import type { APIRoute } from 'astro';
import { getCollection } from 'astro:content';
import { CALCULATORS, OFFLINE_STATIC } from '~/components/calc/calculators';

/** What the service worker saves on install: every calculator screen, every guide, the app icons. */
export const GET: APIRoute = async () => {
  const guides = await getCollection('guides');
  const pages = ['/calc', ...CALCULATORS.map((c) => c.path), ...guides.map((g) => `/calc/guide/${g.id}`)];
  return new Response(JSON.stringify({ pages, static: OFFLINE_STATIC }), {
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' },
  });
};
