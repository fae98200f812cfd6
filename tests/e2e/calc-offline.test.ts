import type { Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

/**
 * Flight mode at FOH: after one visit to /calc, every calculator page, guide and script comes from
 * the service worker's cache. The check is strict: the browser is set offline AND the server
 * process is stopped, so nothing can be answered by the network even if a request slipped past
 * the offline emulation.
 */
let server: TestServer;
let browser: Browser;
/** stop() waits for an exit that a process already killed will never emit again, so call it once. */
let serverStopped = false;
const pageErrors: string[] = [];

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser({ viewport: { width: 390, height: 844 } });
});
afterAll(async () => {
  await browser?.close();
  if (!serverStopped) await server?.stop();
});

const hydrated = (page: Page) => page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });

it('keeps nothing of a signed-in person: calculator pages are saved as anyone would see them', async () => {
  const own = await launchBrowser({ viewport: { width: 390, height: 844 } });
  try {
    const page = await own.context.newPage();
    await signInThroughPage(page, server.url, DEMO.engineer);
    const venueLink = page.getByTestId('venue-list').getByRole('link').first();
    await venueLink.click();
    await page.waitForURL(/\/venues\/[a-z0-9-]+$/);
    await page.goto(`${server.url}/calc/delay`);
    await page.waitForSelector('[data-offline-status="ready"]', { timeout: 60_000 });
    // The live page knows who is signed in…
    expect(await page.getByTestId('account-menu').count()).toBe(1);
    // …the saved copy does not, and no signed-in page was saved at all.
    const saved = await page.evaluate(async () => {
      const keys: string[] = [];
      let delay = '';
      for (const name of await caches.keys()) {
        const cache = await caches.open(name);
        for (const request of await cache.keys()) keys.push(new URL(request.url).pathname);
        const hit = await cache.match('/calc/delay');
        if (hit) delay = await hit.text();
      }
      return { keys, delay };
    });
    expect(saved.delay).toMatch(/Delay and alignment/);
    expect(saved.delay).not.toMatch(/engineer@throwline\.test|account-menu/);
    expect(saved.keys.filter((k) => k.startsWith('/venues') || k.startsWith('/api/') || k.startsWith('/signin'))).toEqual([]);
    expect(foreignRequests(own.requests)).toEqual([]);
  } finally {
    await own.close();
  }
});

it('works with no network after one visit', async () => {
  const url = server.url;
  const page = await browser.context.newPage();
  page.on('pageerror', (err) => pageErrors.push(err.message));

  // One visit with a network.
  await page.goto(`${url}/calc`);
  await page.waitForSelector('[data-offline-status="ready"]', { timeout: 60_000 });
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
  const list = (await (await fetch(`${url}/calc/offline-pages.json`)).json()) as { pages: string[] };
  expect(list.pages).toEqual(
    expect.arrayContaining(['/calc', '/calc/bandwidth', '/calc/spl', '/calc/delay', '/calc/response', '/calc/signal', '/calc/guide/delay', '/calc/levels', '/calc/waves', '/calc/dose', '/calc/guide/levels-and-loads', '/calc/guide/wavelength-and-air', '/calc/guide/show-dose']),
  );
  const saved = await page.evaluate(async () => {
    const names = await caches.keys();
    const keys: string[] = [];
    for (const name of names) for (const request of await (await caches.open(name)).keys()) keys.push(new URL(request.url).pathname);
    return { names, keys };
  });
  for (const path of list.pages) expect(saved.keys).toContain(path);
  expect(saved.keys.some((k) => k.startsWith('/_astro/') && k.endsWith('.js'))).toBe(true);
  // Nothing from the signed-in side of the app, and no API answers that were never asked for.
  expect(saved.keys.filter((k) => !k.startsWith('/calc') && !k.startsWith('/_astro/') && !['/manifest.webmanifest', '/favicon.svg'].includes(k) && !k.startsWith('/icons/'))).toEqual([]);

  // Flight mode, and the server gone.
  await browser.context.setOffline(true);
  await server.stop();
  serverStopped = true;

  await page.reload();
  expect(await page.getByTestId('calculator-list').getByRole('listitem').count()).toBe(8);
  await page.getByRole('link', { name: /Delay and alignment/ }).first().click();
  await page.waitForURL(/\/calc\/delay/);
  await hydrated(page);
  await page.getByTestId('travel-distance').fill('34.3');
  await expect.poll(() => page.getByTestId('travel-ms').innerText()).toMatch(/^99\.94/);

  // A shared link with its own state, opened offline.
  await page.goto(`${url}/calc/spl?exp=100&levels=94,94&mode=incoherent`);
  await hydrated(page);
  await expect.poll(() => page.getByTestId('sum-total').innerText()).toMatch(/^97\.0/);
  await expect.poll(() => page.getByTestId('exposure-niosh-time').innerText()).toMatch(/^15 min/);

  await page.goto(`${url}/calc/response?rate=96000`);
  await hydrated(page);
  await page.getByTestId('filter-1-gain').fill('-12');
  await expect.poll(() => page.getByTestId('plot-magnitude-curve').getAttribute('d')).toMatch(/^M/);

  await page.goto(`${url}/calc/bandwidth`);
  await hydrated(page);
  await page.getByTestId('width-q').fill('4.318');
  await expect.poll(() => page.getByTestId('width-oct-result').innerText()).toMatch(/^0\.333/);

  // The second-round screens, offline, from links with their own state.
  await page.goto(`${url}/calc/levels?sens=100&power=1000&mdist=32&unit=m&boxes=1&sref=1W`);
  await hydrated(page);
  // 100 dB + 10·log10(1000) − 20·log10(32) = 99.90 dB.
  await expect.poll(() => page.getByTestId('maxspl-level').innerText()).toMatch(/^99\.9/);
  await page.goto(`${url}/calc/waves?cmode=time&cms=1`);
  await hydrated(page);
  await expect.poll(() => page.getByTestId('comb-nulls').innerText()).toMatch(/500, 1\.5k, 2\.5k/);
  await page.goto(`${url}/calc/dose?seg=88:4`);
  await hydrated(page);
  await expect.poll(() => page.getByTestId('dose-niosh-value').innerText()).toMatch(/^100\.0 %/);
  await page.goto(`${url}/calc/guide/show-dose`);
  expect(await page.getByRole('heading', { name: 'Average level' }).isVisible()).toBe(true);

  await page.goto(`${url}/calc/guide/sound-level`);
  expect(await page.getByRole('heading', { name: 'Daily exposure' }).isVisible()).toBe(true);

  // A page that was never saved says so instead of failing silently.
  await page.goto(`${url}/calc/guide/not-a-guide`);
  expect(await page.getByRole('heading', { level: 1 }).innerText()).toBe('No network');

  expect(pageErrors).toEqual([]);
  expect(foreignRequests(browser.requests)).toEqual([]);
});
