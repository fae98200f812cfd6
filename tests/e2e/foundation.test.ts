import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(() => server?.stop());

const viewports = [
  { name: 'desktop', viewport: { width: 1280, height: 900 } },
  { name: 'phone 390×844', viewport: { width: 390, height: 844 } },
];

describe.each(viewports)('the demo manager on $name', ({ viewport }) => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser({ viewport });
  });
  afterAll(() => browser?.close());

  it('signs in, opens the venue and a page, signs out; nothing leaves 127.0.0.1', async () => {
    const page = await browser.context.newPage();
    await signInThroughPage(page, server.url, DEMO.manager);
    await expect(page.getByTestId('venue-list').getByRole('link').count()).resolves.toBe(2);

    await page.getByTestId('venue-list').getByRole('link').first().click();
    await page.waitForURL(/\/venues\/[a-z0-9-]+$/);
    const heading = await page.getByRole('heading', { level: 1 }).textContent();
    expect(heading?.length).toBeGreaterThan(2);

    await page.locator('main ul a').first().click();
    await page.waitForURL(/\/venues\/[a-z0-9-]+\/[a-z0-9-]+$/);
    await expect(page.getByTestId('page-body').innerText()).resolves.toMatch(/\w{3,}/);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(viewport.width + 1);

    await page.getByTestId('account-menu').click();
    await page.getByRole('link', { name: 'Sign out' }).click();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/signin\?signedout=1/);
    await page.goto(`${server.url}/venues`);
    await page.waitForURL(/\/signin/);

    expect(foreignRequests(browser.requests)).toEqual([]);
  });
});

describe('signing out everywhere', () => {
  it('the button on the account screen ends the session on another device too', async () => {
    const laptop = await launchBrowser({ viewport: { width: 1280, height: 900 } });
    const phone = await launchBrowser({ viewport: { width: 390, height: 844 }, touch: true });
    try {
      const foh = await laptop.context.newPage();
      await signInThroughPage(foh, server.url, DEMO.viewer);
      const mine = await phone.context.newPage();
      await signInThroughPage(mine, server.url, DEMO.viewer);
      await mine.goto(`${server.url}/account`);
      const button = mine.getByTestId('signout-everywhere');
      expect((await button.boundingBox())!.height).toBeGreaterThanOrEqual(44);
      await Promise.all([mine.waitForURL(/\/signin\?signedout=1$/), button.tap()]);
      // The laptop left signed in at FOH is signed out on its next request.
      await foh.goto(`${server.url}/venues`);
      await foh.waitForURL(/\/signin/);
      expect(foreignRequests([...laptop.requests, ...phone.requests])).toEqual([]);
    } finally {
      await laptop.close();
      await phone.close();
    }
  });
});
