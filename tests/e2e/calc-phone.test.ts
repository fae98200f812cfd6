import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, type Browser } from '../helpers/browser';
import { startServer, type TestServer } from '../helpers/server';

/** The calculators on a phone held in one hand: 390×844, signed out. */
let server: TestServer;
let browser: Browser;
const pageErrors: string[] = [];

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser({ viewport: { width: 390, height: 844 } });
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function open(path: string): Promise<Page> {
  const page = await browser.context.newPage();
  page.on('pageerror', (err) => pageErrors.push(`${path}: ${err.message}`));
  await page.goto(`${server.url}${path}`);
  // Astro drops the island's ssr attribute once React has hydrated it.
  await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
  return page;
}

const text = (page: Page, testId: string) => page.getByTestId(testId).innerText();

async function expectNoSideScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(391);
}

describe('Delay and alignment', () => {
  it('answers as you type, toggles units, keeps everything in the link and restores it on reload', async () => {
    const page = await open('/calc/delay');
    const distance = page.getByTestId('travel-distance');
    await distance.fill('');
    await distance.pressSequentially('34.3');
    // c(20 °C) = 343.2 m/s: 34.3 m takes 99.94 ms, 4797 samples at 48 kHz.
    await expect.poll(() => text(page, 'travel-ms')).toMatch(/^99\.94/);
    await expect.poll(() => text(page, 'travel-samples')).toMatch(/^4797\.0/);
    expect(new URL(page.url()).searchParams.get('dist')).toBe('34.3');
    await expectNoSideScroll(page);

    // m → ft converts the typed value and keeps the answer.
    await page.getByTestId('length-unit').getByRole('button', { name: 'ft' }).click();
    await expect.poll(() => distance.inputValue()).toBe('112.53');
    await expect.poll(() => text(page, 'travel-ms')).toMatch(/^99\.9/);
    expect(new URL(page.url()).searchParams.get('unit')).toBe('ft');

    // A warmer room: 30 °C, ms → samples for the display.
    await page.getByTestId('temp').fill('30');
    await page.getByTestId('time-unit').getByRole('button', { name: 'samples' }).click();
    await expect.poll(() => text(page, 'speed-result')).toMatch(/349\.0/);
    const before = await text(page, 'travel-result');

    await page.reload();
    await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
    expect(await distance.inputValue()).toBe('112.53');
    expect(await page.getByTestId('temp').inputValue()).toBe('30');
    expect(await page.getByTestId('length-unit').getByRole('button', { name: 'ft' }).getAttribute('aria-pressed')).toBe('true');
    await expect.poll(() => text(page, 'travel-result')).toBe(before);
    await page.close();
  });

  it('remembers temperature and units on the next visit, but a shared link wins', async () => {
    const fresh = await open('/calc/delay');
    // The remembered values are applied after hydration, then written into the URL: wait for both.
    await expect.poll(() => fresh.getByTestId('temp').inputValue()).toBe('30');
    await expect.poll(() => new URL(fresh.url()).searchParams.get('unit')).toBe('ft');
    await fresh.close();

    // The sound-level screen shares the remembered length unit.
    const spl = await open('/calc/spl');
    expect(await spl.getByTestId('distance-unit').getByRole('button', { name: 'ft' }).getAttribute('aria-pressed')).toBe('true');
    await spl.close();

    const shared = await open('/calc/delay?dist=20&unit=m&temp=20&tempUnit=C&timeUnit=ms');
    // 20 m at 343.2 m/s = 58.27 ms.
    await expect.poll(() => text(shared, 'travel-ms')).toMatch(/^58\.27/);
    expect(await shared.getByTestId('length-unit').getByRole('button', { name: 'm', exact: true }).getAttribute('aria-pressed')).toBe('true');
    await shared.close();
  });

  it('is rendered on the server from the link, before any script runs', async () => {
    const html = await (await fetch(`${server.url}/calc/delay?dist=34.321462268&temp=20&timeUnit=ms`)).text();
    expect(html).toMatch(/100\.00/);
    expect(html).toMatch(/astro-island/);
  });

  it('aligns a fill and explains when it cannot, with the formula one tap away', async () => {
    const page = await open('/calc/delay?main=30&fill=8&offset=5&unit=m&temp=20&tempUnit=C&timeUnit=ms');
    // (30 − 8) m / 343.2 m/s + 5 ms = 69.10 ms.
    await expect.poll(() => text(page, 'fill-delay')).toMatch(/^69\.10/);
    await page.getByTestId('fill-fill').fill('40');
    await expect.poll(() => text(page, 'fill-result')).toMatch(/farther/);
    await page.getByTestId('fill-panel').getByRole('link', { name: 'Formula & sources' }).click();
    await page.waitForURL(/\/calc\/guide\/delay#fill-alignment$/);
    await expect.poll(() => page.locator('#fill-alignment').isVisible()).toBe(true);
    expect(await page.getByTestId('guide-body').innerText()).toMatch(/Haas/);
    await page.close();
  });
});

describe('Sound level', () => {
  it('keeps OSHA and NIOSH apart with the caution on screen, and refuses a buried source', async () => {
    const page = await open('/calc/spl');
    await page.getByTestId('exposure-level').fill('100');
    // 29 CFR 1910.95 Table G-16: 100 dBA → 2 h; NIOSH 98-126: 100 dBA → 15 min.
    await expect.poll(() => text(page, 'exposure-osha-time')).toMatch(/^2 h/);
    await expect.poll(() => text(page, 'exposure-niosh-time')).toMatch(/^15 min/);
    const caution = page.getByTestId('exposure-caution');
    expect(await caution.isVisible()).toBe(true);
    expect(await caution.innerText()).toMatch(/estimates[\s\S]*calibrated[\s\S]*differ by country/);

    await page.getByTestId('background-total').fill('96');
    await page.getByTestId('background-bg').fill('95');
    await expect.poll(() => text(page, 'background-result')).toMatch(/at least 3 dB below/);

    await page.getByTestId('sum-level-0').fill('94');
    await page.getByTestId('sum-level-1').fill('94');
    await expect.poll(() => text(page, 'sum-total')).toMatch(/^97\.0/);
    await page.getByTestId('sum-mode').getByRole('button', { name: 'Same signal' }).click();
    await expect.poll(() => text(page, 'sum-total')).toMatch(/^100\.0/);
    expect(new URL(page.url()).searchParams.get('mode')).toBe('coherent');
    await expectNoSideScroll(page);
    await page.close();
  });
});

describe('Band and Q', () => {
  it('converts as you type and lists bands', async () => {
    const page = await open('/calc/bandwidth');
    await page.getByTestId('width-start').getByRole('button', { name: 'Octaves' }).click();
    await page.getByTestId('width-oct').fill('0.333333');
    await expect.poll(() => text(page, 'width-q-result')).toBe('4.318');
    await page.getByTestId('bands-fraction').getByRole('button', { name: '1', exact: true }).click();
    await expect.poll(() => page.getByTestId('bands-table').locator('tbody tr').count()).toBe(10);
    await page.getByTestId('note-freq').fill('445');
    await expect.poll(() => text(page, 'note-result-cents')).toMatch(/\+19\.6/);
    await expectNoSideScroll(page);
    await page.close();
  });
});

describe('Filter response', () => {
  it('redraws the plot as a filter changes and refuses a filter above Nyquist', async () => {
    const page = await open('/calc/response');
    const curve = page.getByTestId('plot-magnitude-curve');
    const before = await curve.getAttribute('d');
    await page.getByTestId('filter-1-gain').fill('-9');
    await expect.poll(() => curve.getAttribute('d')).not.toBe(before);
    expect(new URL(page.url()).searchParams.get('f')).toMatch(/peaking_250_-9_1\.4/);

    await page.getByTestId('filter-1-freq').fill('30000');
    await expect.poll(() => text(page, 'response-problem')).toMatch(/half the sample rate/);
    await page.getByTestId('filter-1-freq').fill('300');
    await expect.poll(() => page.getByTestId('response-problem').count()).toBe(0);
    await expectNoSideScroll(page);
    await page.close();
  });
});

describe('Test signal', () => {
  it('starts quiet with a caution, caps a loud link, and stops', async () => {
    const page = await open('/calc/signal?sig=sine&freq=440&level=-6');
    expect(await page.getByTestId('signal-caution').isVisible()).toBe(true);
    await expect.poll(() => text(page, 'signal-level-value')).toBe('-30 dBFS');
    await page.getByTestId('signal-start').click();
    await expect.poll(() => text(page, 'signal-status')).toMatch(/Playing a 440 Hz sine at -30 dBFS/);
    await page.getByTestId('signal-stop').click();
    await expect.poll(() => text(page, 'signal-status')).toBe('Stopped.');
    await page.close();
  });
});

describe('the index', () => {
  it('lists every calculator with its guide, and nothing left 127.0.0.1', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${server.url}/calc`);
    expect(await page.getByTestId('calculator-list').getByRole('listitem').count()).toBe(8);
    await page.getByRole('link', { name: /Filter response/ }).click();
    await page.waitForURL(/\/calc\/response/);
    await page.close();
    expect(pageErrors).toEqual([]);
    expect(foreignRequests(browser.requests)).toEqual([]);
  });
});
