import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

let server: TestServer;
const browsers: Browser[] = [];
const pageErrors: string[] = [];

async function open(email: string, viewport?: { width: number; height: number }): Promise<Page> {
  const browser = await launchBrowser(viewport ? { viewport } : {});
  browsers.push(browser);
  const page = await browser.context.newPage();
  page.on('pageerror', (err) => pageErrors.push(`${email}: ${err.message}`));
  await signInThroughPage(page, server.url, email);
  return page;
}

async function editorReady(page: Page) {
  await page.getByTestId('editor').waitFor();
}

async function typeAtEnd(page: Page, text: string) {
  await page.getByTestId('editor').click();
  await page.keyboard.press('Control+End');
  await page.keyboard.press('Enter');
  await page.keyboard.type(text);
}

let venue: string;
let slug: string;

beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  for (const b of browsers) await b.close();
  await server?.stop();
});

describe('editing a page, a conflict, history and restore', () => {
  let engineer: Page;
  let manager: Page;

  beforeAll(async () => {
    engineer = await open(DEMO.engineer);
    const venues = (await (await engineer.request.get(`${server.url}/api/venues`)).json()) as { venues: { slug: string }[] };
    venue = venues.venues[0].slug;
    const { pages } = (await (await engineer.request.get(`${server.url}/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    slug = pages[0].slug;
    manager = await open(DEMO.manager);
  });

  it('the read view carries no editor code; the engineer edits, adds a table and saves', async () => {
    const requests: string[] = [];
    engineer.on('request', (r) => requests.push(r.url()));
    await engineer.goto(`${server.url}/venues/${venue}/${slug}`);
    await engineer.getByTestId('page-body').waitFor();
    expect(await engineer.locator('.ProseMirror').count()).toBe(0);
    expect(requests.filter((u) => /PageEditor|tiptap|prosemirror/i.test(u))).toEqual([]);

    // The manager opens the same page first, so their base goes stale when the engineer saves.
    await manager.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    await editorReady(manager);

    await engineer.getByTestId('edit-page').click();
    await engineer.waitForURL(/\/edit$/);
    await editorReady(engineer);
    await typeAtEnd(engineer, 'Amp rack B now feeds the balcony fills.');
    await engineer.keyboard.press('Enter');
    await engineer.getByTestId('table-insert').click();
    await engineer.keyboard.type('Input');
    await engineer.keyboard.press('Tab');
    await engineer.keyboard.type('Source');
    await engineer.getByTestId('table-add-row').click();
    await engineer.getByTestId('summary-input').fill('Balcony fills and a new input table');
    await Promise.all([engineer.waitForURL(new RegExp(`/venues/${venue}/${slug}$`)), engineer.getByTestId('save-page').click()]);

    const body = engineer.getByTestId('page-body');
    expect(await body.innerText()).toContain('Amp rack B now feeds the balcony fills.');
    expect(await body.locator('table th').allInnerTexts()).toEqual(expect.arrayContaining(['Input', 'Source']));
    expect(await engineer.getByText('Balcony fills and a new input table').count()).toBe(1);
  });

  it('a save on the stale base shows the conflict view with both texts, and survives a reload', async () => {
    await typeAtEnd(manager, 'Manager note: check the limiter before doors.');
    await manager.getByTestId('save-page').click();
    const conflict = manager.getByTestId('conflict');
    await conflict.waitFor();
    expect(await manager.getByTestId('conflict-theirs').innerText()).toContain('Amp rack B now feeds the balcony fills.');
    expect(await manager.getByTestId('editor').innerText()).toContain('Manager note: check the limiter before doors.');
    expect(await manager.getByTestId('editor').innerText()).not.toContain('Amp rack B now feeds');

    // Nothing typed is lost on a reload: the draft comes back beside the newer version.
    await manager.reload();
    await manager.getByTestId('draft-notice').waitFor();
    await manager.getByTestId('draft-restore').click();
    await conflict.waitFor();
    expect(await manager.getByTestId('editor').innerText()).toContain('Manager note: check the limiter before doors.');
    expect(await manager.getByTestId('conflict-theirs').innerText()).toContain('Amp rack B now feeds the balcony fills.');

    await Promise.all([manager.waitForURL(new RegExp(`/venues/${venue}/${slug}$`)), manager.getByTestId('conflict-keep-mine').click()]);
    expect(await manager.getByTestId('page-body').innerText()).toContain('Manager note: check the limiter before doors.');
  });

  it('history shows the word-level diff, and restore brings the engineer’s version back', async () => {
    await engineer.goto(`${server.url}/venues/${venue}/${slug}/history`);
    await engineer.getByTestId('revision-list').waitFor();
    const diff = engineer.getByTestId('diff');
    await diff.waitFor();
    expect((await diff.locator('ins').allInnerTexts()).join(' ')).toContain('Manager note');
    expect((await diff.locator('del').allInnerTexts()).join(' ')).toContain('balcony fills');

    const { page } = (await (await engineer.request.get(`${server.url}/api/venues/${venue}/pages/${slug}`)).json()) as { page: { currentRevision: number } };
    const engineersRevision = page.currentRevision - 1;
    await engineer.getByTestId(`restore-${engineersRevision}`).click();
    await engineer.getByTestId(`restore-confirm-${engineersRevision}`).click();
    await engineer.getByTestId('history-message').waitFor();
    expect(await engineer.getByTestId('history-message').innerText()).toContain(`saved as revision ${page.currentRevision + 1}`);
    await engineer.getByTestId(`revision-${page.currentRevision + 1}`).waitFor();
    expect(await engineer.getByTestId(`revision-${page.currentRevision + 1}`).innerText()).toContain(`restored from ${engineersRevision}`);

    await engineer.goto(`${server.url}/venues/${venue}/${slug}`);
    const body = await engineer.getByTestId('page-body').innerText();
    expect(body).toContain('Amp rack B now feeds the balcony fills.');
    expect(body).not.toContain('Manager note');
  });

  it('the viewer sees no edit or restore control, is refused the editor, and a direct PUT answers 403', async () => {
    const viewer = await open(DEMO.viewer);
    await viewer.goto(`${server.url}/venues/${venue}/${slug}`);
    await viewer.getByTestId('page-body').waitFor();
    expect(await viewer.getByTestId('edit-page').count()).toBe(0);
    await viewer.goto(`${server.url}/venues/${venue}/${slug}/history`);
    await viewer.getByTestId('revision-list').waitFor();
    expect(await viewer.locator('[data-testid^="restore-"]').count()).toBe(0);
    const editor = await viewer.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    expect(editor?.status()).toBe(403);
    const current = (await (await viewer.request.get(`${server.url}/api/venues/${venue}/pages/${slug}`)).json()) as { page: { currentRevision: number } };
    const put = await viewer.request.put(`${server.url}/api/venues/${venue}/pages/${slug}`, {
      data: { doc: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Viewer was here' }] }] }, baseRevision: current.page.currentRevision },
    });
    expect(put.status()).toBe(403);
  });
});

describe('search', () => {
  it('on a laptop: suggestions from three letters, fetched only once the field is focused; arrows and Enter open a page', async () => {
    const page = await open(DEMO.viewer);
    const scripts: string[] = [];
    page.on('request', (r) => {
      if (r.resourceType() === 'script') scripts.push(r.url());
    });
    await page.goto(`${server.url}/venues`);
    const input = page.getByTestId('search-input');
    await page.waitForLoadState('networkidle');
    const beforeFocus = scripts.length;
    await input.click();
    await expect.poll(() => scripts.length).toBeGreaterThan(beforeFocus);
    await input.pressSequentially('ba');
    expect(await page.getByTestId('search-results').getByRole('option').count()).toBe(0);
    await input.pressSequentially('lcony fills');
    const first = page.getByTestId('search-results').getByRole('option').first();
    await first.waitFor();
    expect(await first.locator('mark').count()).toBeGreaterThan(0);
    // No link inside an option: the option itself is what is chosen.
    expect(await page.getByTestId('search-results').locator('a').count()).toBe(0);
    await page.keyboard.press('ArrowDown');
    expect(await first.getAttribute('aria-selected')).toBe('true');
    expect(await input.getAttribute('aria-activedescendant')).toBe(await first.getAttribute('id'));
    await Promise.all([page.waitForURL(/\/venues\/[a-z0-9-]+\/[a-z0-9-]+$/), page.keyboard.press('Enter')]);
    expect(await page.getByTestId('page-body').innerText()).toMatch(/balcony fills/i);
  });

  it('Enter with nothing chosen opens the results page', async () => {
    const page = await open(DEMO.viewer);
    await page.goto(`${server.url}/venues`);
    await page.getByTestId('search-input').fill('balcony');
    await Promise.all([page.waitForURL(/\/search\?q=balcony$/), page.getByTestId('search-input').press('Enter')]);
    expect(await page.getByTestId('search-hits').locator('li').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('search-page-input').inputValue()).toBe('balcony');
  });

  it('on a phone: the search icon leads to the results page, which works without any script', async () => {
    const page = await open(DEMO.viewer, { width: 390, height: 844 });
    await page.goto(`${server.url}/venues`);
    await Promise.all([page.waitForURL(/\/search$/), page.getByRole('link', { name: 'Search pages' }).click()]);
    await page.getByTestId('search-page-input').fill('balcony fills');
    await Promise.all([page.waitForURL(/\/search\?q=/), page.getByTestId('search-page-input').press('Enter')]);
    const first = page.getByTestId('search-hits').locator('li a').first();
    expect(await page.getByTestId('search-hits').locator('mark').count()).toBeGreaterThan(0);
    await Promise.all([page.waitForURL(/\/venues\/[a-z0-9-]+\/[a-z0-9-]+$/), first.click()]);
    expect(await page.getByTestId('page-body').innerText()).toMatch(/balcony fills/i);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(391);
  });
});

describe('on a phone', () => {
  it('the editor fits a phone screen', async () => {
    const page = await open(DEMO.engineer, { width: 390, height: 844 });
    await page.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    await editorReady(page);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(391);
    const sizes = await page.getByTestId('editor-toolbar').locator('button').evaluateAll((els) => els.map((e) => e.getBoundingClientRect().height));
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(44);
  });

  it('no page error and nothing loaded from another host', () => {
    expect(pageErrors).toEqual([]);
    expect(browsers.flatMap((b) => foreignRequests(b.requests))).toEqual([]);
  });
});
