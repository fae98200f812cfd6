// Reading and editing at FOH on a 390 × 844 phone: photos read as figures, long pages get a
// contents list, wide tables can be scrolled from the keyboard and keep their header row in
// view, the editor leaves the screen to the text, and a wrong password keeps the e-mail.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { plainJpeg } from '../integration/files-fixtures';
import { launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { signIn, type Client } from '../helpers/session';
import { startServer, type TestServer } from '../helpers/server';

const PHONE = { width: 390, height: 844 };
let server: TestServer;
let browser: Browser;
let page: Page;
let venue: string;
let slug: string;
let photoId: string;

const t = (text: string) => ({ type: 'text', text });
const p = (text: string) => ({ type: 'paragraph', content: [t(text)] });
const h = (level: number, text: string) => ({ type: 'heading', attrs: { level }, content: [t(text)] });
const cell = (type: string, text: string) => ({ type, content: [p(text)] });
const row = (type: string, cells: string[]) => ({ type: 'tableRow', content: cells.map((c) => cell(type, c)) });

async function uploadPhoto(client: Client): Promise<{ id: string; displayUrl: string }> {
  const form = new FormData();
  form.append('caption', 'Amp rack C, stage right');
  form.append('file', new Blob([new Uint8Array(await plainJpeg(1200, 800))], { type: 'image/jpeg' }), 'IMG_0042.jpg');
  const res = await client.fetch(`/api/venues/${venue}/files`, { method: 'POST', body: form });
  expect(res.status).toBe(201);
  return ((await res.json()) as { file: { id: string; displayUrl: string } }).file;
}

beforeAll(async () => {
  server = await startServer();
  const engineer = await signIn(server.url, DEMO.engineer);
  venue = ((await (await engineer.getJson('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
  const photo = await uploadPhoto(engineer);
  photoId = photo.id;
  const patch = { type: 'table', content: [row('tableHeader', ['Ch', 'Source', 'Mic', 'Stand', 'Insert', 'Notes']), ...Array.from({ length: 40 }, (_, i) => row('tableCell', [String(i + 1), `Source ${i + 1}`, 'Dyn 57-ish', 'Short boom', 'none', 'Keep clear of the wedge line'])) ] };
  const doc = {
    type: 'doc',
    content: [
      h(2, 'Mains distribution'), p('63 A three-phase, stage left.'),
      // Photo size comes from the stored file: this node carries none.
      { type: 'image', attrs: { src: photo.displayUrl, alt: 'Amp rack C, stage right', title: null } },
      h(2, 'Patch'), patch,
      h(3, 'Spare lines'), p('Lines 41–48 are spare.'),
    ],
  };
  const res = await engineer.sendJson('POST', `/api/venues/${venue}/pages`, { title: 'FOH reading check', section: 'stage', doc });
  expect(res.status).toBe(201);
  slug = ((await res.json()) as { page: { slug: string } }).page.slug;
  browser = await launchBrowser({ viewport: PHONE });
  page = await browser.context.newPage();
  await signInThroughPage(page, server.url, DEMO.engineer);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('the read view on a phone', () => {
  it('shows a photo as a figure: visible caption, intrinsic size, a tap opens the whole photo', async () => {
    await page.goto(`${server.url}/venues/${venue}/${slug}`);
    const figure = page.locator('[data-testid="page-body"] figure.photo').first();
    await expect(figure.locator('figcaption').textContent()).resolves.toBe('Amp rack C, stage right');
    const img = figure.locator('img');
    expect(await img.getAttribute('width')).toBe('1200');
    expect(await img.getAttribute('height')).toBe('800');
    const href = await figure.locator('a.photo-open').getAttribute('href');
    expect(href).toMatch(/^\/files\/[A-Za-z0-9_-]+$/);
    const full = await page.request.get(`${server.url}${href}`);
    expect(full.status()).toBe(200);
    expect(full.headers()['content-type']).toMatch(/^image\//);
  });

  it('lists the headings as jump links that land on them', async () => {
    const links = page.locator('[data-testid="page-contents"] a');
    expect(await links.allTextContents()).toEqual(['Mains distribution', 'Patch', 'Spare lines']);
    await links.nth(1).click();
    await page.waitForFunction(() => location.hash === '#h-patch');
    const top = await page.locator('#h-patch').evaluate((el) => el.getBoundingClientRect().top);
    expect(top).toBeGreaterThanOrEqual(0);
    expect(top).toBeLessThan(200);
  });

  it('lets a keyboard reach the wide table and keeps its header row in view while it scrolls', async () => {
    const wrap = page.locator('[data-testid="page-body"] .table-wrap').first();
    expect(await wrap.getAttribute('tabindex')).toBe('0');
    expect(await wrap.getAttribute('role')).toBe('region');
    await wrap.focus();
    expect(await page.evaluate(() => document.activeElement?.classList.contains('table-wrap'))).toBe(true);
    const before = await wrap.evaluate((el) => el.scrollTop);
    await page.keyboard.press('PageDown');
    await page.waitForFunction(() => (document.querySelector('.table-wrap')?.scrollTop ?? 0) > 0);
    const after = await wrap.evaluate((el) => ({ scroll: el.scrollTop, wrapTop: el.getBoundingClientRect().top, headTop: el.querySelector('th')!.getBoundingClientRect().top }));
    expect(after.scroll).toBeGreaterThan(before);
    // The header row sticks to the top of the scrolling box instead of leaving with the rows.
    expect(Math.abs(after.headTop - after.wrapTop)).toBeLessThan(3);
  });
});

describe('the editor on a phone', () => {
  it('gives the text most of the screen: header hidden, toolbar on top, a one-row save bar', async () => {
    await page.goto(`${server.url}/venues/${venue}/${slug}/edit`);
    await page.getByTestId('editor').waitFor();
    expect(await page.locator('header[data-shell]').isVisible()).toBe(false);
    const bar = await page.getByTestId('save-bar').boundingBox();
    expect(bar!.height).toBeLessThanOrEqual(72);
    const toolbar = await page.getByTestId('editor-toolbar').boundingBox();
    expect(toolbar!.height).toBeLessThanOrEqual(60);
    // Scrolled into the text, what is left between the toolbar and the save bar is for typing.
    await page.getByTestId('editor').locator('p').last().scrollIntoViewIfNeeded();
    const free = await page.evaluate(() => {
      const top = document.querySelector('[data-testid="editor-toolbar"]')!.getBoundingClientRect().bottom;
      const bottom = document.querySelector('[data-testid="save-bar"]')!.getBoundingClientRect().top;
      return (bottom - top) / window.innerHeight;
    });
    expect(free).toBeGreaterThan(0.7);
  });

  it('puts the table tools first while the cursor is in a table', async () => {
    await page.getByTestId('editor').locator('td').first().click();
    await page.getByTestId('table-add-row').waitFor();
    const firstTool = await page.locator('[role="toolbar"] > *').first().getAttribute('data-testid');
    expect(firstTool).toBe('table-add-row');
    expect(await page.getByTestId('table-add-row').isVisible()).toBe(true);
    const box = await page.getByTestId('table-add-row').boundingBox();
    expect(box!.x).toBeGreaterThanOrEqual(0);
    expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE.width);
  });

  it('keeps the save bar and the cursor in view with the keyboard open (the layout shrinks to 390 × 500)', async () => {
    await page.getByTestId('editor').locator('td').nth(30).click();
    await page.setViewportSize({ width: 390, height: 500 });
    await page.keyboard.type(' checked');
    const bar = await page.getByTestId('save-bar').boundingBox();
    expect(bar!.y + bar!.height).toBeLessThanOrEqual(501);
    expect(bar!.y).toBeGreaterThan(300);
    const caret = await page.evaluate(() => window.getSelection()!.getRangeAt(0).getBoundingClientRect().top);
    expect(caret).toBeGreaterThan(0);
    expect(caret).toBeLessThan(bar!.y);
    await page.setViewportSize(PHONE);
  });

  it('puts a photo inserted from inside a table after the table, not in the cell', async () => {
    await page.getByTestId('editor').locator('td').first().click();
    await page.getByTestId('tool-photo').click();
    // The venue's photos are offered in the dialog; the one uploaded above is there.
    const pick = page.locator(`[data-testid="photo-pick"][data-file-id="${photoId}"]`);
    await pick.waitFor();
    await pick.click();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="editor"] img').length === 2);
    const placed = await page.evaluate(() => {
      const table = document.querySelector('[data-testid="editor"] table')!;
      const wrapper = table.closest('.tableWrapper') ?? table;
      const next = wrapper.nextElementSibling;
      return { inCell: !!document.querySelector('[data-testid="editor"] td img, [data-testid="editor"] th img'), afterTable: !!next && (next.tagName === 'IMG' || !!next.querySelector('img')) };
    });
    expect(placed.afterTable).toBe(true);
    expect(placed.inCell).toBe(false);
  });
});

describe('the advance sheet', () => {
  it('prints from its Print button under the strict content security policy', async () => {
    const blocked: string[] = [];
    page.on('console', (m) => { if (/Content Security Policy/i.test(m.text())) blocked.push(m.text()); });
    await page.goto(`${server.url}/venues/${venue}/advance`);
    await page.evaluate(() => { (window as unknown as { printed: number }).printed = 0; window.print = () => void (window as unknown as { printed: number }).printed++; });
    await page.locator('button[data-print]').click();
    expect(await page.evaluate(() => (window as unknown as { printed: number }).printed)).toBe(1);
    expect(blocked).toEqual([]);
  });
});

describe('signing in', () => {
  it('keeps the e-mail after a wrong password, with the password field ready', async () => {
    const fresh = await launchBrowser({ viewport: PHONE });
    try {
      const p2 = await fresh.context.newPage();
      await p2.goto(`${server.url}/signin`);
      await p2.fill('input[name="email"]', DEMO.viewer);
      await p2.fill('input[name="password"]', 'not-the-password');
      await Promise.all([p2.waitForURL(/error=/), p2.click('button[type="submit"]')]);
      await p2.getByTestId('signin-error').waitFor();
      expect(await p2.inputValue('input[name="email"]')).toBe(DEMO.viewer);
      expect(await p2.evaluate(() => (document.activeElement as HTMLInputElement | null)?.name)).toBe('password');
    } finally {
      await fresh.close();
    }
  });
});
