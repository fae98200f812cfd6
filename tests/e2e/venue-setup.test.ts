// The admin on a 390 × 844 phone adds a venue, is asked for its first manager and invites one,
// then renames the venue and tightens its check interval on the settings screen.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

let server: TestServer;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser({ viewport: { width: 390, height: 844 } });
  page = await browser.context.newPage();
  await signInThroughPage(page, server.url, DEMO.admin);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('setting up a new venue', () => {
  it('adds the venue and lands on its members screen, asked for the first manager', async () => {
    await page.goto(`${server.url}/venues`);
    await page.getByText('Add a venue').click();
    await page.getByLabel('Name').fill('Quillmoor Barn');
    await page.getByLabel('Town').fill('Quillmoor');
    await Promise.all([page.waitForURL(/\/venues\/quillmoor-barn\/members$/), page.getByRole('button', { name: 'Create' }).click()]);
    await expect(page.getByTestId('no-manager').innerText()).resolves.toContain('no manager yet');
    await expect(page.getByTestId('invite-form').locator('select[name="role"]').inputValue()).resolves.toBe('manager');
  });

  it('invites the first manager; the invitation waits in the list', async () => {
    await page.getByLabel('Invite by e-mail').fill('orla.penhallow@throwline.test');
    await Promise.all([page.waitForEvent('load'), page.getByRole('button', { name: 'Send invitation' }).click()]);
    const pending = await page.getByTestId('invitation-list').innerText();
    expect(pending).toContain('orla.penhallow@throwline.test');
    expect(pending).toContain('manager');
  });

  it('renames the venue and sets its check interval; the address stays', async () => {
    await page.goto(`${server.url}/venues/quillmoor-barn/settings`);
    const form = page.getByTestId('venue-settings');
    await form.getByLabel('Name').fill('Quillmoor Old Barn');
    await form.getByLabel(/not checked on site for/).fill('3');
    await Promise.all([page.waitForEvent('load'), form.getByRole('button', { name: 'Save settings' }).click()]);
    await expect(form.getByLabel('Name').inputValue()).resolves.toBe('Quillmoor Old Barn');
    await expect(form.getByLabel(/not checked on site for/).inputValue()).resolves.toBe('3');
    await page.goto(`${server.url}/venues/quillmoor-barn`);
    await expect(page.locator('h1').innerText()).resolves.toBe('Quillmoor Old Barn');
  });

  it('a bad interval is refused with a sentence and nothing saved', async () => {
    await page.goto(`${server.url}/venues/quillmoor-barn/settings`);
    const form = page.getByTestId('venue-settings');
    // Past the field's own limits, as a script or an old browser would send it.
    await form.getByLabel(/not checked on site for/).evaluate((el: HTMLInputElement) => {
      el.removeAttribute('max');
      el.value = '99';
    });
    await form.getByRole('button', { name: 'Save settings' }).click();
    await form.locator('[data-form-error]').filter({ hasText: 'at most 36 months' }).waitFor();
    await page.reload();
    await expect(form.getByLabel(/not checked on site for/).inputValue()).resolves.toBe('3');
  });

  it('nothing left 127.0.0.1', () => {
    expect(foreignRequests(browser.requests)).toEqual([]);
  });
});
