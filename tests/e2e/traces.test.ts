import type { Page } from 'playwright-core';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { tmpdir } from 'node:os';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';

/** An engineer uploads a measurement from a phone, attaches it to an EQ block; a viewer reads it overlaid. */

const PHONE = { width: 390, height: 844 };
let server: TestServer;
let engineer: Browser;
let viewer: Browser;
let venue: string;
let slug: string;
const pageErrors: string[] = [];
const traceFile = join(tmpdir(), `throwline-e2e-trace-${process.pid}.txt`);

beforeAll(async () => {
  // An invented measurement: a gentle rise towards the low end, one column pair per line.
  const lines = ['# invented test measurement', 'Hz,dB'];
  for (let i = 0; i <= 200; i++) {
    const hz = 20 * 1000 ** (i / 200);
    lines.push(`${hz.toFixed(3)},${(3 * Math.exp(-hz / 200)).toFixed(3)}`);
  }
  writeFileSync(traceFile, lines.join('\n'));
  server = await startServer();
  const api = await signIn(server.url, DEMO.engineer);
  venue = ((await (await api.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0]!.slug;
  const { pages } = (await (await api.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
  slug = pages.find((p) => p.slug !== 'system-processing')!.slug;
  engineer = await launchBrowser({ viewport: PHONE });
  viewer = await launchBrowser({ viewport: PHONE });
});
afterAll(async () => {
  await engineer?.close();
  await viewer?.close();
  await server?.stop();
});

async function openAs(browser: Browser, email: string): Promise<Page> {
  const page = await browser.context.newPage();
  page.on('pageerror', (err) => pageErrors.push(`${email}: ${err.message}`));
  await signInThroughPage(page, server.url, email);
  return page;
}

describe('a measured trace on an EQ block, on a phone', () => {
  it('the engineer uploads a trace in the block, labels it, saves; the read view overlays it', async () => {
    const page = await openAs(engineer, DEMO.engineer);
    await page.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    await page.getByTestId('editor').waitFor();
    await page.getByTestId('insert-eq').click();
    await page.getByTestId('eq-block').waitFor();
    await page.getByTestId('eq-block-trace-upload').setInputFiles(traceFile);
    await page.getByTestId('eq-block-trace-0-label').waitFor();
    await page.getByTestId('eq-block-trace-0-label').fill('stage left check');
    await page.getByTestId('eq-block-trace-0-position').fill('mix position');
    await page.getByTestId('eq-block-trace-0-smoothing').selectOption('3');
    // Every trace control is at least 44 px tall on the phone.
    for (const id of ['label', 'position', 'smoothing', 'offset']) {
      const box = (await page.getByTestId(`eq-block-trace-0-${id}`).boundingBox())!;
      expect(box.height).toBeGreaterThanOrEqual(44);
    }
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await page.getByTestId('summary-input').fill('Measured the room');
    await Promise.all([page.waitForURL(new RegExp(`/venues/${venue}/${slug}$`)), page.getByTestId('save-page').click()]);

    const svg = page.locator('section[data-block="eqBlock"] svg').first();
    const path = svg.locator('path.tl-curve-trace[data-label="stage left check"]');
    expect(await path.count()).toBe(1);
    expect((await path.getAttribute('d'))!.length).toBeGreaterThan(20);
    await expect(svg.locator('text', { hasText: 'stage left check' }).count()).resolves.toBeGreaterThan(0);

    const link = page.locator('section[data-block="eqBlock"] a[download]').first();
    const href = (await link.getAttribute('href'))!;
    const res = await page.request.get(new URL(href, server.url).toString());
    expect(res.status()).toBe(200);
    expect(await res.text()).toContain('invented test measurement');
  });

  it('a viewer reads the same overlay', async () => {
    const page = await openAs(viewer, DEMO.viewer);
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    await expect(page.locator('section[data-block="eqBlock"] path.tl-curve-trace[data-label="stage left check"]').count()).resolves.toBe(1);
    expect(pageErrors).toEqual([]);
  });
});
