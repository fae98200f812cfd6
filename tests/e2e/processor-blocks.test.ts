import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';

/** An engineer documents an EQ change on a phone; the read view and the history show it. */

const PHONE = { width: 390, height: 844 };
let server: TestServer;
let engineer: Browser;
let viewer: Browser;
let venue: string;
let slug: string;
const pageErrors: string[] = [];

beforeAll(async () => {
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

async function save(page: Page, summary: string) {
  await page.getByTestId('summary-input').fill(summary);
  await Promise.all([page.waitForURL(new RegExp(`/venues/${venue}/${slug}$`)), page.getByTestId('save-page').click()]);
}

describe('an EQ block on a phone', () => {
  let page: Page;

  it('the engineer inserts an EQ block from the toolbar, adds and edits bands, sees errors beside the field, saves', async () => {
    page = await openAs(engineer, DEMO.engineer);
    await page.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    await page.getByTestId('editor').waitFor();
    await page.getByTestId('insert-eq').click();
    const block = page.getByTestId('eq-block');
    await block.waitFor();
    const box = (await block.boundingBox())!;
    expect(box.width).toBeLessThanOrEqual(PHONE.width);
    await page.getByTestId('eq-add-band').click();
    const freq = page.getByTestId('eq-band-2-freq');
    expect(await freq.getAttribute('inputmode')).toBe('decimal');
    const curveBefore = await page.locator('[data-testid="block-live-plot"] .tl-curve-total').first().getAttribute('d');
    await freq.fill('30000');
    await expect(page.getByTestId('eq-band-2-freq-error').innerText()).resolves.toMatch(/below 23520 Hz/);
    await freq.fill('315');
    await expect(page.getByTestId('eq-band-2-freq-error').count()).resolves.toBe(0);
    await page.getByTestId('eq-band-2-gain').fill('-4,5'); // a phone keypad's decimal comma
    await page.getByTestId('eq-band-2-q').fill('2');
    const curveAfter = await page.locator('[data-testid="block-live-plot"] .tl-curve-total').first().getAttribute('d');
    expect(curveAfter).not.toBe(curveBefore);
    // Nothing on the page is wider than the phone.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
    await save(page, 'House EQ block');
  });

  it('the read view shows the block as a server-drawn SVG and a table, with no script for it', async () => {
    const scripts: string[] = [];
    page.on('response', async (res) => {
      if (res.request().resourceType() === 'script') scripts.push(await res.text().catch(() => ''));
    });
    await page.reload();
    const section = page.locator('section[data-block="eqBlock"]');
    await section.waitFor();
    await expect(section.locator('svg.tl-plot[role="img"]').count()).resolves.toBe(1);
    await expect(section.locator('table tbody tr').count()).resolves.toBe(3);
    await expect(section.locator('tbody tr').nth(2).innerText()).resolves.toMatch(/315.*−4\.5.*2/s);
    await expect(section.locator('script').count()).resolves.toBe(0);
    expect(scripts.some((s) => s.includes('eqBlock') || s.includes('tl-curve'))).toBe(false);
  });

  it('a second edit changes a band; the history names it and overlays both curves', async () => {
    await page.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    await page.getByTestId('eq-block').waitFor();
    await page.getByTestId('eq-band-2-gain').fill('-6');
    await save(page, 'Deeper cut at 315 Hz');
    await page.goto(`${server.url}/venues/${venue}/${slug}/history`);
    const changes = page.getByTestId('structural-changes');
    await changes.waitFor();
    await expect(changes.innerText()).resolves.toContain('Band 3: −4.5 → −6.0 dB');
    const overlay = page.getByTestId('diff-curves');
    // The curves carry their label; the legend's sample strokes do not.
    await expect(overlay.locator('.tl-curve-before[data-label="Before"]').count()).resolves.toBe(1);
    await expect(overlay.locator('.tl-curve-after[data-label="After"]').count()).resolves.toBe(1);
  });

  it('save into a page from the delay calculator lands as a delay block in a new revision', async () => {
    await page.goto(`${server.url}/calc/delay`);
    await page.getByTestId('travel-distance').waitFor();
    await page.getByTestId('travel-save').click();
    await page.getByTestId('travel-save-page').waitFor();
    await page.getByTestId('travel-save-page').selectOption(slug);
    await page.getByTestId('travel-save-save').click();
    await expect(page.getByTestId('travel-save-done').innerText()).resolves.toMatch(/^Saved as revision \d+ of /);
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    await expect(page.locator('section[data-block="delayBlock"]').count()).resolves.toBe(1);
  });

  it('the demo processing page (four blocks) ships no script for its blocks; how much script it ships is measured', async () => {
    let bytes = 0;
    const bodies: string[] = [];
    page.on('response', async (res) => {
      if (res.request().resourceType() !== 'script') return;
      const body = await res.text().catch(() => '');
      bytes += body.length;
      bodies.push(body);
    });
    await page.goto(`${server.url}/venues/${venue}/system-processing`, { waitUntil: 'networkidle' });
    await expect(page.locator('svg.tl-plot').count()).resolves.toBeGreaterThanOrEqual(3);
    expect(bodies.some((b) => b.includes('tl-curve'))).toBe(false);
    console.log(`read page with processor blocks: ${bodies.length} scripts, ${bytes} bytes of JavaScript (uncompressed)`);
  });

  it('a viewer reads the block but gets no way to edit', async () => {
    const v = await openAs(viewer, DEMO.viewer);
    await v.goto(`${server.url}/venues/${venue}/${slug}`);
    await v.locator('section[data-block="eqBlock"] svg.tl-plot').waitFor();
    await expect(v.getByTestId('edit-page').count()).resolves.toBe(0);
    // Nor from a calculator: no venue where a viewer edits is offered.
    await v.goto(`${server.url}/calc/delay`);
    await v.getByTestId('travel-save').click();
    await expect(v.getByTestId('travel-save-error').innerText()).resolves.toMatch(/no venue where you may edit/);
    expect(pageErrors).toEqual([]);
  });
});
