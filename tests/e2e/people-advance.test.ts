import type { Page } from 'playwright-core';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { linkIn, mailTo } from '../integration/people-fixtures';

/**
 * The two people this work is for, end to end in Chromium: the manager invites a new engineer,
 * who accepts from the e-mail and edits a page; the manager builds the advance sheet and makes a
 * guest pass; the visiting engineer opens it on a phone, prints it, goes offline and reopens it;
 * after the pass is revoked the link is a 404.
 */
let server: TestServer;
const browsers: Browser[] = [];
const pageErrors: string[] = [];
const venue = 'haverkin-hall';

async function fresh(viewport?: { width: number; height: number }): Promise<Page> {
  const browser = await launchBrowser(viewport ? { viewport } : {});
  browsers.push(browser);
  const page = await browser.context.newPage();
  page.on('pageerror', (err) => pageErrors.push(err.message));
  return page;
}

beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  for (const b of browsers) await b.close();
  await server?.stop();
});

let manager: Page;
let passUrl: string;

it('the manager invites a new engineer; the engineer accepts from the e-mail and edits a page', async () => {
  manager = await fresh();
  await signInThroughPage(manager, server.url, DEMO.manager);
  await manager.goto(`${server.url}/venues/${venue}`);
  await manager.getByTestId('members-link').click();
  await manager.waitForURL(/\/members$/);
  const form = manager.getByTestId('invite-form');
  await form.getByLabel('Invite by e-mail').fill('sam.fenwright@throwline.test');
  await form.getByLabel('Role').selectOption('engineer');
  await Promise.all([manager.waitForEvent('load'), form.getByRole('button', { name: 'Send invitation' }).click()]);
  await manager.getByTestId('invitation-list').getByText('sam.fenwright@throwline.test').waitFor();

  const link = linkIn((await mailTo(server, 'sam.fenwright@throwline.test')).text, '/invite/');
  const engineer = await fresh();
  await engineer.goto(link);
  await engineer.getByLabel('Your name').fill('Sam Fenwright');
  await engineer.getByLabel(/Choose a password/).fill('loading-dock-2026');
  await engineer.getByTestId('accept').click();
  await engineer.waitForURL(new RegExp(`/venues/${venue}$`), { timeout: 5000 }).catch(async () => {
    throw new Error(`not redirected: ${engineer.url()} ${(await engineer.content()).replace(/<script[\s\S]*?<\/script>|<style[\s\S]*?<\/style>/g, "").replace(/<[^>]+>/g, " ").replace(/\s+/g, " ").slice(0, 600)}`);
  });
  await engineer.goto(`${server.url}/venues/${venue}/load-in-and-access/edit`);
  await engineer.getByTestId('editor').waitFor();
  await engineer.getByTestId('editor').click();
  await engineer.keyboard.press('Control+End');
  await engineer.keyboard.press('Enter');
  await engineer.keyboard.type('Dock door code changes every Monday; ask the duty manager.');
  await engineer.getByTestId('summary-input').fill('Dock door note');
  await Promise.all([engineer.waitForURL(new RegExp(`/venues/${venue}/load-in-and-access$`)), engineer.getByTestId('save-page').click()]);
  expect(await engineer.getByTestId('page-body').innerText()).toContain('Dock door code changes every Monday');
});

it('the manager builds the advance sheet and creates a pass', async () => {
  await manager.goto(`${server.url}/venues/${venue}/advance/edit`);
  const list = manager.getByTestId('advance-list');
  const row = (slug: string) => list.locator(`li[data-slug="${slug}"]`);
  // Put the load-in page on the sheet and move it to the top.
  await row('load-in-and-access').locator('[data-include]').check();
  await row('venue-contacts').locator('[data-include]').uncheck();
  for (let i = 0; i < 30; i++) {
    if ((await list.locator('li').first().getAttribute('data-slug')) === 'load-in-and-access') break;
    await row('load-in-and-access').locator('[data-move="up"]').click();
  }
  await manager.getByTestId('advance-save').click();
  await manager.getByText(/^Saved: \d+ pages on the sheet\.$/).waitFor();
  await manager.goto(`${server.url}/venues/${venue}/advance`);
  expect(await manager.getByTestId('advance-page').first().getAttribute('data-slug')).toBe('load-in-and-access');

  await manager.goto(`${server.url}/venues/${venue}/passes`);
  const form = manager.getByTestId('pass-form');
  await form.getByLabel('Act or tour, and show').fill('The Lantern Choir, Friday');
  await form.getByRole('button', { name: 'Create pass' }).click();
  const shown = manager.getByTestId('pass-url');
  await shown.waitFor();
  passUrl = (await shown.innerText()).trim();
  expect(passUrl).toMatch(/\/advance\/[A-Za-z0-9_-]{43}$/);
});

it('the guest opens it on a phone, prints it light, goes offline and reopens it; revoked it is a 404', async () => {
  const guest = await fresh({ width: 390, height: 844 });
  // A phone in dark mode: the printout must still be ink on white.
  await guest.addInitScript(() => localStorage.setItem('throwline-theme', 'dark'));
  await guest.goto(passUrl);
  await guest.getByTestId('advance-sheet').waitFor();
  expect(await guest.getByTestId('advance-page').first().innerText()).toContain('Dock door code changes every Monday');
  expect(await guest.evaluate(() => document.documentElement.dataset.theme)).toBe('dark');
  // No sideways scrolling on the phone.
  expect(await guest.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);

  await guest.emulateMedia({ media: 'print' });
  const printed = await guest.evaluate(() => {
    const body = getComputedStyle(document.body);
    const article = getComputedStyle(document.querySelector('[data-testid="advance-page"]')!);
    const head = getComputedStyle(document.querySelector('.print-head')!);
    return { bg: body.backgroundColor, fg: body.color, article: article.color, head: head.display, headText: document.querySelector('.print-head')!.textContent };
  });
  expect(printed.bg).toBe('rgb(255, 255, 255)');
  expect(printed.fg).toBe('rgb(0, 0, 0)');
  expect(printed.article).toBe('rgb(0, 0, 0)');
  expect(printed.head).toBe('block');
  expect(printed.headText).toMatch(/The Haverkin Hall · advance sheet · printed \d/);
  const pdf = await guest.pdf({ format: 'A4' });
  expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
  await guest.emulateMedia({ media: 'screen' });

  await guest.waitForFunction(() => document.documentElement.getAttribute('data-advance-saved') === '1', undefined, { timeout: 30_000 });
  const context = guest.context();
  await context.setOffline(true);
  await guest.reload();
  await guest.getByTestId('advance-sheet').waitFor();
  expect(await guest.getByTestId('saved-at').innerText()).toMatch(/^Saved copy from \d{4}-\d\d-\d\d \d\d:\d\d UTC/);
  expect(await guest.getByTestId('advance-page').first().innerText()).toContain('Dock door code changes every Monday');
  // A page never saved shows our own offline page, not the browser's error.
  await guest.goto(`${server.url}/venues/${venue}`).catch(() => undefined);
  expect(await guest.locator('h1').innerText()).toBe('No network');
  await context.setOffline(false);

  await manager.goto(`${server.url}/venues/${venue}/passes`);
  manager.once('dialog', (d) => void d.accept());
  await Promise.all([manager.waitForEvent('load'), manager.getByTestId('pass-list').locator('li', { hasText: 'The Lantern Choir, Friday' }).getByRole('button', { name: 'Revoke' }).click()]);
  const after = await guest.goto(passUrl);
  expect(after?.status()).toBe(404);
  expect(foreignRequests(browsers.flatMap((b) => b.requests))).toEqual([]);
  expect(pageErrors).toEqual([]);
});
