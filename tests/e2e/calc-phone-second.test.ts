import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, type Browser } from '../helpers/browser';
import { startServer, type TestServer } from '../helpers/server';

/** The second-round screens and fixes on a phone held in one hand: 390×844, signed out. */
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
  await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
  return page;
}

const text = (page: Page, testId: string) => page.getByTestId(testId).innerText();

async function expectNoSideScroll(page: Page) {
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(391);
}

describe('Levels and loads', () => {
  it('converts line levels, warns under the amplifier’s minimum, and shows the max-SPL caution', async () => {
    const page = await open('/calc/levels');
    await page.getByTestId('line-value').fill('4');
    // +4 dBu = 1.228 V, and −20 dBFS with 0 dBFS = +24 dBu (definitions of dBu and dBFS).
    await expect.poll(() => text(page, 'line-volts')).toMatch(/^1\.228/);
    await expect.poll(() => text(page, 'line-dbfs')).toMatch(/^−20\.00/);
    // The ± key gives the minus a decimal keypad lacks: −10 dBu = 0.2449 V.
    await page.getByTestId('line-value-sign').click();
    expect(await page.getByTestId('line-value').inputValue()).toBe('-4');
    expect(await page.getByTestId('line-value').getAttribute('inputmode')).toBe('decimal');

    // Four 8 Ω boxes in parallel are 2 Ω, below a 4 Ω amplifier (Kirchhoff).
    await page.getByTestId('load-add').click();
    await page.getByTestId('load-add').click();
    await expect.poll(() => text(page, 'load-ohms')).toMatch(/^2\b/);
    await expect.poll(() => text(page, 'load-warning')).toMatch(/below the amplifier’s 4 Ω minimum/);

    await page.getByTestId('maxspl-sens').fill('100');
    await page.getByTestId('maxspl-power').fill('1000');
    await page.getByTestId('maxspl-distance').fill('32');
    // Issue 13's check: 100 dB, 1000 W, 32 m → 99.90 dB.
    await expect.poll(() => text(page, 'maxspl-level')).toMatch(/^99\.9/);
    expect(await text(page, 'maxspl-caution')).toMatch(/power compression/);
    expect(new URL(page.url()).searchParams.get('mdist')).toBe('32');
    await expectNoSideScroll(page);
    await page.close();
  });
});

describe('Wavelength and air', () => {
  it('answers wavelength, comb nulls, air absorption and sub-array spacing from one air', async () => {
    const page = await open('/calc/waves?temp=20&tempUnit=C&rh=50&unit=m');
    await page.getByTestId('wavelength-freq').fill('1000');
    // λ = c/f: 343.99 m/s (Cramer, 20 °C, 50 % RH) / 1000 Hz = 0.344 m.
    await expect.poll(() => text(page, 'wavelength-value')).toMatch(/^0\.344/);
    await page.getByTestId('comb-ms').fill('1');
    await expect.poll(() => text(page, 'comb-nulls')).toMatch(/500, 1\.5k, 2\.5k/);
    await page.getByTestId('airloss-freq').fill('4000');
    await page.getByTestId('airloss-distance').fill('100');
    // 4 kHz nominal snaps to 3981 Hz (ISO 9613-1 exact midbands): ≈ 29 dB/km at 20 °C / 50 % (computed; ISO 9613-2 Table 2 brackets it).
    await expect.poll(() => text(page, 'airloss-exact')).toMatch(/3981/);
    await expect.poll(() => text(page, 'airloss-db')).toMatch(/^2\.9/);
    await page.getByTestId('subarray-freq').fill('60');
    // λ/4 at 60 Hz: 343.99 / 240 = 1.43 m; T/4 = 4.17 ms; rear inverted.
    await expect.poll(() => text(page, 'subarray-spacing')).toMatch(/^1\.43/);
    await expect.poll(() => text(page, 'subarray-delay')).toMatch(/^4\.17/);
    expect(await text(page, 'subarray-polarity')).toBe('Inverted');
    // 150 °F is refused in °F.
    await page.getByTestId('waves-temp-unit').getByRole('button', { name: '°F' }).click();
    await page.getByTestId('waves-temp').fill('150');
    await expect.poll(() => text(page, 'waves-speed')).toMatch(/at most 140 °F; got 150 °F/);
    await expectNoSideScroll(page);
    await page.close();
  });
});

describe('Show dose', () => {
  it('gives the dose under each rule and an Leq against a limit, with the hearing caution', async () => {
    const page = await open('/calc/dose?seg=110:0.25,100:0.5,90:1.5');
    // 29 CFR 1910.95 Appendix A example (from memory): 93.8 %, TWA 89.5 dBA.
    await expect.poll(() => text(page, 'dose-osha-value')).toMatch(/^93\.8 %[\s\S]*TWA 89\.5 dBA/);
    await page.getByTestId('dose-add').click();
    await page.getByTestId('dose-level-3').fill('120');
    await expect.poll(() => text(page, 'dose-osha-value')).toMatch(/not permitted/);
    expect(await page.getByTestId('dose-caution').isVisible()).toBe(true);
    await page.getByTestId('leq-readings').fill('90 100');
    await page.getByTestId('leq-limit').fill('97');
    // Energy average of 90 and 100 dB: 97.4 dB (IEC 61672-1 time-average level).
    await expect.poll(() => text(page, 'leq-value')).toMatch(/^97\.4/);
    await expect.poll(() => text(page, 'leq-verdict')).toMatch(/0\.4 dB over/);
    await expectNoSideScroll(page);
    await page.close();
  });
});

describe('fixes on the first-round screens', () => {
  it('exposure: not permitted above 115 dBA, no daily limit at 70, and the EU rule beside the US ones', async () => {
    const page = await open('/calc/spl?exp=130');
    await expect.poll(() => text(page, 'exposure-osha-time')).toBe('Not permitted');
    await page.getByTestId('exposure-level').fill('70');
    await expect.poll(() => text(page, 'exposure-osha-time')).toBe('No daily limit');
    await page.getByTestId('exposure-level').fill('87');
    // 2003/10/EC: 87 dB(A) for 8 h reaches the limit value.
    await expect.poll(() => text(page, 'exposure-eu-time')).toMatch(/^8 h/);
    await page.close();
  });

  it('sum: equal sources at 0° and 180° read as a null; background 3 dB apart is accepted with a warning', async () => {
    const page = await open('/calc/spl?mode=coherent&levels=94,94&phases=0,180&total=64.1&bg=61.1');
    await expect.poll(() => text(page, 'sum-total')).toMatch(/Null/);
    await expect.poll(() => text(page, 'background-source')).toMatch(/^61\.1/);
    expect(await text(page, 'background-warning')).toMatch(/ISO 3744/);
    await page.close();
  });

  it('weighting at 16 Hz says it used the exact 15.85 Hz and answers −56.7 dB (IEC 61672-1 Table 3)', async () => {
    const page = await open('/calc/spl?wfreq=16&curve=A');
    await expect.poll(() => text(page, 'weighting-db')).toMatch(/^−56\.7/);
    expect(await text(page, 'weighting-exact')).toMatch(/15\.849/);
    await page.close();
  });

  it('delay: humidity, candidates for sub and top, "no delay needed", and a copy-link button', async () => {
    const page = await open('/calc/delay?dist=34.32&temp=30&tempUnit=C&rh=90&unit=m&timeUnit=ms&main=5&fill=9&offset=10&xover=80&phase=180');
    // Cramer (1993): 30 °C / 90 % RH over 34.32 m → 97.71 ms.
    await expect.poll(() => text(page, 'travel-ms')).toMatch(/^97\.71/);
    await expect.poll(() => text(page, 'fill-delay')).toBe('No delay needed');
    await expect.poll(() => text(page, 'subtop-candidate-0')).toMatch(/Invert the sub/);
    expect(await text(page, 'subtop-candidates')).toMatch(/Delay the top by 6\.25 ms/);
    await page.getByTestId('subtop-phase-sign').click();
    expect(await page.getByTestId('subtop-phase').inputValue()).toBe('-180');
    await page.getByTestId('travel-result').getByTestId('copy-link').click();
    // Either the clipboard took it, or the link is shown to copy by hand.
    await expect
      .poll(async () => (await page.getByTestId('travel-result').innerText()).includes('Link copied') || (await page.getByRole('textbox', { name: 'Link to this result' }).count()) > 0)
      .toBe(true);
    await page.close();
  });

  it('accepts "1/3" as a width in octaves: Q 4.318 (Audio EQ Cookbook relation)', async () => {
    const page = await open('/calc/bandwidth');
    await page.getByTestId('width-start').getByRole('button', { name: 'Octaves' }).click();
    await page.getByTestId('width-oct').fill('1/3');
    await expect.poll(() => text(page, 'width-q-result')).toBe('4.318');
    await page.close();
    expect(pageErrors).toEqual([]);
    expect(foreignRequests(browser.requests)).toEqual([]);
  });
});
