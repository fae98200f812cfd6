// An engineer on a 390 × 844 touch phone moves a page to another section, archives it, finds it on
// the archived pages screen and restores it, through the screens alone.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';

let server: TestServer;
let browser: Browser;
let page: Page;
let venue: string;
let slug: string;

beforeAll(async () => {
  server = await startServer();
  const engineer = await signIn(server.url, DEMO.engineer);
  venue = ((await (await engineer.getJson('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  const made = await engineer.sendJson('POST', `/api/venues/${venue}/pages`, {
    title: 'Spare drum hardware',
    section: 'stage',
    doc: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Two snare stands in the blue case.' }] }] },
  });
  expect(made.status).toBe(201);
  slug = ((await made.json()) as { page: { slug: string } }).page.slug;
  browser = await launchBrowser({ viewport: { width: 390, height: 844 }, touch: true });
  page = await browser.context.newPage();
  await signInThroughPage(page, server.url, DEMO.engineer);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('moving, archiving and restoring a page on a phone', () => {
  it('moves the page to the power section', async () => {
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    await page.getByText('Move or archive this page').tap();
    // Every control of the read view's bar and of the move and archive box is thumb-sized.
    for (const control of [page.getByRole('link', { name: 'History', exact: true }), page.getByTestId('edit-page'), page.getByText('Move or archive this page'), page.getByTestId('move-section'), page.getByTestId('move-page'), page.getByTestId('archive-page')]) {
      expect((await control.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    }
    await expect(page.getByLabel('Section').count()).resolves.toBe(1);
    await page.getByTestId('move-section').selectOption('power');
    await Promise.all([page.waitForEvent('load'), page.getByTestId('move-page').tap()]);
    // The breadcrumb names the section the page is in now.
    await expect(page.locator('nav[aria-label="Breadcrumb"]').innerText()).resolves.toContain('Power');
    await expect(page.getByTestId('move-section').inputValue()).resolves.toBe('power');
  });

  it('archives it after asking, lands on the archived pages, and the venue home no longer lists it', async () => {
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    await page.getByText('Move or archive this page').tap();
    let asked = '';
    page.once('dialog', (d) => {
      asked = d.message();
      void d.accept();
    });
    await Promise.all([page.waitForURL(`${server.url}/venues/${venue}/archived`), page.getByTestId('archive-page').tap()]);
    expect(asked).toContain('Spare drum hardware');
    await expect(page.getByTestId('archived-list').innerText()).resolves.toContain('Spare drum hardware');
    await page.goto(`${server.url}/venues/${venue}`);
    await expect(page.locator(`a[href="/venues/${venue}/${slug}"]`).count()).resolves.toBe(0);
    await page.getByTestId('archived-link').tap();
    await page.waitForURL(`${server.url}/venues/${venue}/archived`);
  });

  it('restores it from the archived pages; it is back in its new section', async () => {
    const restore = page.getByRole('button', { name: 'Restore “Spare drum hardware”' });
    const box = await restore.boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(44);
    await Promise.all([page.waitForEvent('load'), restore.tap()]);
    await expect(page.getByTestId('archived-list').innerText()).resolves.toContain('No archived pages');
    await page.goto(`${server.url}/venues/${venue}`);
    await expect(page.locator(`a[href="/venues/${venue}/${slug}"]`).count()).resolves.toBeGreaterThan(0);
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    await expect(page.getByTestId('archived-note').count()).resolves.toBe(0);
    await expect(page.getByTestId('page-body').innerText()).resolves.toContain('Two snare stands');
  });

  it('an archived page opened by its address says so, and the keyboard restores it from there', async () => {
    const engineer = await signIn(server.url, DEMO.engineer);
    expect((await engineer.sendJson('PUT', `/api/venues/${venue}/pages/${slug}/archived`, { archived: true })).status).toBe(200);
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    await expect(page.getByTestId('archived-note').innerText()).resolves.toMatch(/Archived on/);
    await expect(page.getByTestId('edit-page').count()).resolves.toBe(0);
    const restore = page.getByRole('button', { name: 'Restore to the book' });
    expect((await restore.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await restore.focus();
    await Promise.all([page.waitForEvent('load'), page.keyboard.press('Enter')]);
    await expect(page.getByTestId('archived-note').count()).resolves.toBe(0);
    await expect(page.getByTestId('edit-page').count()).resolves.toBe(1);
  });

  it('nothing left 127.0.0.1', () => {
    expect(foreignRequests(browser.requests)).toEqual([]);
  });
});
