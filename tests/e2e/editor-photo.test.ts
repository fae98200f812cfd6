import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

/** A phone at the desk: the engineer puts a photo into a page from inside the editor. */

const PHONE = { width: 390, height: 844 };
const CAPTION = 'Amp rack B, stage left';
const PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 200 200]>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);

let server: TestServer;
let engineer: Browser;
let viewer: Browser;
let jpeg: Buffer;
let venue: string;
let pageSlugs: string[];
let displayUrl: string;
const pageErrors: string[] = [];

beforeAll(async () => {
  server = await startServer();
  // Photo-sized and noisy (about a megabyte), so the throttled upload below takes a few seconds.
  jpeg = await sharp({ create: { width: 1400, height: 1050, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 110, sigma: 45 } } })
    .jpeg({ quality: 92 })
    .toBuffer();
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

/** Every value the progress bar and the upload panel showed, recorded as React updates them. */
async function recordUpload(page: Page) {
  await page.evaluate(() => {
    const w = window as unknown as { progressSeen: number[]; stagesSeen: string[] };
    w.progressSeen = [];
    w.stagesSeen = [];
    new MutationObserver((mutations) => {
      for (const m of mutations) {
        const el = m.target as HTMLElement;
        if (el.tagName === 'PROGRESS') w.progressSeen.push((el as HTMLProgressElement).value);
        if (el.dataset.testid === 'photo-upload') w.stagesSeen.push(el.dataset.status ?? '');
      }
    }).observe(document.body, { subtree: true, attributes: true, attributeFilter: ['value', 'data-status'] });
  });
}

/** The image is in the document, has been fetched and decoded. */
async function imageLoaded(page: Page, selector: string) {
  const img = page.locator(selector).first();
  await img.waitFor({ state: 'attached' });
  // The read view lazy-loads images; bring it on screen as a reader scrolling down would.
  await img.evaluate((el) => el.scrollIntoView());
  await page.waitForFunction((sel) => {
    const el = document.querySelector<HTMLImageElement>(sel);
    return !!el && el.complete && el.naturalWidth > 0;
  }, selector);
  return img;
}

describe('a photo into a page from inside the editor, on a phone', () => {
  let page: Page;

  beforeAll(async () => {
    page = await openAs(engineer, DEMO.engineer);
    venue = ((await (await page.request.get(`${server.url}/api/venues`)).json()) as { venues: { slug: string }[] }).venues[0].slug;
    pageSlugs = ((await (await page.request.get(`${server.url}/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] }).pages.map((p) => p.slug);
  });

  it('the engineer taps Photo, picks a JPEG, watches the bar reach the end, and the photo is in the text', async () => {
    await page.goto(`${server.url}/venues/${venue}/${pageSlugs[0]}/edit`);
    const editor = page.getByTestId('editor');
    await editor.waitFor();
    await editor.click();
    await page.keyboard.press('Control+End');
    await page.keyboard.press('Enter');
    await page.keyboard.type('Rack B, photographed before the show:');
    await page.keyboard.press('Enter');

    const photoButton = page.getByTestId('tool-photo');
    const box = (await photoButton.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(44);
    expect(box.width).toBeGreaterThanOrEqual(44);
    await photoButton.click();
    const dialog = page.getByTestId('photo-dialog');
    await dialog.waitFor();
    await expect(page.getByTestId('photo-file-input').getAttribute('accept')).resolves.toBe('image/*,application/pdf');
    // The dialog fits the phone's width.
    expect((await dialog.boundingBox())!.width).toBeLessThanOrEqual(PHONE.width);

    await page.getByTestId('photo-file-input').setInputFiles({ name: 'rack-b.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    await page.getByLabel(/^Caption/).fill(CAPTION);

    // A slow uplink, like a venue's Wi-Fi from the stage, so the bar has something to show.
    const cdp = await engineer.context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 300 * 1024 });
    await recordUpload(page);
    await page.getByTestId('photo-send').click();
    await page.locator('[data-testid="photo-upload"][data-status="done"]').waitFor({ timeout: 60_000 });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    const seen = await page.evaluate(() => {
      const w = window as unknown as { progressSeen: number[]; stagesSeen: string[] };
      return { progressSeen: w.progressSeen, stagesSeen: w.stagesSeen };
    });
    expect(seen.progressSeen.some((v) => v > 0 && v < 1), JSON.stringify(seen.progressSeen)).toBe(true);
    expect(seen.stagesSeen).toEqual(expect.arrayContaining(['sending', 'done']));
    expect(await page.getByTestId('photo-progress').evaluate((el) => (el as HTMLProgressElement).value)).toBe(1);
    await expect(page.getByTestId('photo-stage').innerText()).resolves.toBe('Added to the page');
    await expect(page.getByTestId('photo-error').count()).resolves.toBe(0);

    // The new file heads the venue's grid in the same panel.
    const picks = page.getByTestId('photo-pick');
    await picks.first().waitFor();
    await expect(picks.first().getAttribute('aria-label')).resolves.toBe(`Add “${CAPTION}” to the page`);

    await page.getByTestId('photo-done').click();
    await dialog.waitFor({ state: 'detached' });
    const inEditor = await imageLoaded(page, '[data-testid="editor"] img[src^="/files/"]');
    displayUrl = (await inEditor.getAttribute('src'))!;
    expect(displayUrl).toMatch(/^\/files\/[A-Za-z0-9_-]+\/display$/);
    await expect(inEditor.getAttribute('alt')).resolves.toBe(CAPTION);
    // Inserted where the cursor was: after the line typed just before.
    const order = await editor.evaluate((el) => [...el.children].map((c) => (c.tagName === 'IMG' || c.querySelector('img') ? 'IMG' : c.textContent)).filter(Boolean));
    expect(order[order.indexOf('IMG') - 1]).toBe('Rack B, photographed before the show:');
  });

  it('the save goes through and the read view shows the photo, served with 200', async () => {
    await page.getByTestId('summary-input').fill('Photo of rack B');
    await Promise.all([page.waitForURL(new RegExp(`/venues/${venue}/${pageSlugs[0]}$`)), page.getByTestId('save-page').click()]);
    const img = await imageLoaded(page, `[data-testid="page-body"] img[src="${displayUrl}"]`);
    await expect(img.getAttribute('alt')).resolves.toBe(CAPTION);
    expect(await page.getByText('Photo of rack B').count()).toBe(1);
    const res = await page.request.get(`${server.url}${displayUrl}`);
    expect(res.status()).toBe(200);
    expect(res.headers()['content-type']).toBe('image/webp');
  });

  it('the same photo can be picked from the venue’s files for another page', async () => {
    await page.goto(`${server.url}/venues/${venue}/${pageSlugs[1]}/edit`);
    await page.getByTestId('editor').waitFor();
    // Never clicked into: the photo goes at the end rather than before the first line.
    await page.getByTestId('tool-photo').click();
    const pick = page.locator(`[data-testid="photo-pick"][data-file-id="${displayUrl.split('/')[2]}"]`);
    await pick.waitFor();
    await pick.click();
    await page.getByTestId('photo-dialog').waitFor({ state: 'detached' });
    // After the image there may only be the empty line the editor keeps at the end.
    const tail = await page.getByTestId('editor').evaluate((el) => {
      const kids = [...el.children];
      const at = kids.findLastIndex((c) => c.tagName === 'IMG' || !!c.querySelector('img'));
      const img = kids[at]?.tagName === 'IMG' ? kids[at] : kids[at]?.querySelector('img');
      return { src: img?.getAttribute('src'), after: kids.slice(at + 1).map((c) => c.textContent) };
    });
    expect(tail.src).toBe(displayUrl);
    expect(tail.after.every((t) => t === '')).toBe(true);
    await Promise.all([page.waitForURL(new RegExp(`/venues/${venue}/${pageSlugs[1]}$`)), page.getByTestId('save-page').click()]);
    await imageLoaded(page, `[data-testid="page-body"] img[src="${displayUrl}"]`);
  });

  it('a file the server refuses shows its sentence; a slow upload can be stopped, and nothing is added', async () => {
    await page.goto(`${server.url}/venues/${venue}/${pageSlugs[2]}/edit`);
    await page.getByTestId('editor').waitFor();
    await page.getByTestId('tool-photo').click();
    await page.getByTestId('photo-file-input').setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('FOH notes, not a photo') });
    await page.getByTestId('photo-send').click();
    const refusal = page.getByTestId('photo-error');
    await refusal.waitFor();
    await expect(refusal.innerText()).resolves.toMatch(/^[A-Z].*Export it as JPEG or PDF.* and upload it again\.$/);
    await expect(page.getByTestId('photo-upload').getAttribute('data-status')).resolves.toBe('error');

    await page.getByTestId('photo-file-input').setInputFiles({ name: 'rack-c.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    const cdp = await engineer.context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 40 * 1024 });
    await page.getByTestId('photo-send').click();
    await page.waitForFunction(() => (document.querySelector<HTMLProgressElement>('[data-testid="photo-progress"]')?.value ?? 0) > 0);
    await page.getByTestId('photo-cancel-upload').click();
    await page.locator('[data-testid="photo-upload"][data-status="ready"]').waitFor();
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    await page.getByTestId('photo-cancel').click();
    await page.getByTestId('photo-dialog').waitFor({ state: 'detached' });
    expect(await page.locator('[data-testid="editor"] img').count()).toBe(0);
    const { files } = (await (await page.request.get(`${server.url}/api/venues/${venue}/files`)).json()) as { files: unknown[] };
    expect(files).toHaveLength(1);
  });

  it('a PDF goes in as a link named after the file, and the saved page links to it', async () => {
    await page.getByTestId('editor').click();
    await page.keyboard.press('Control+End');
    await page.keyboard.press('Enter');
    await page.keyboard.type('Drawing: ');
    await page.getByTestId('tool-photo').click();
    await page.getByTestId('photo-file-input').setInputFiles({ name: 'stage-plot.pdf', mimeType: 'application/pdf', buffer: PDF });
    await page.getByTestId('photo-send').click();
    await page.locator('[data-testid="photo-upload"][data-status="done"]').waitFor();
    await page.getByTestId('photo-done').click();
    const link = page.locator('[data-testid="editor"] a[href^="/files/"]');
    await expect(link.innerText()).resolves.toBe('stage-plot.pdf');
    const href = (await link.getAttribute('href'))!;
    expect(href).toMatch(/^\/files\/[A-Za-z0-9_-]+$/);
    await Promise.all([page.waitForURL(new RegExp(`/venues/${venue}/${pageSlugs[2]}$`)), page.getByTestId('save-page').click()]);
    await expect(page.getByTestId('page-body').locator(`a[href="${href}"]`).innerText()).resolves.toBe('stage-plot.pdf');
    const res = await page.request.get(`${server.url}${href}`);
    expect(res.status()).toBe(200);
    expect(res.headers()['content-type']).toBe('application/pdf');
  });

  it('the viewer opens the page and sees the photo', async () => {
    const reader = await openAs(viewer, DEMO.viewer);
    const statuses: number[] = [];
    reader.on('response', (r) => new URL(r.url()).pathname === displayUrl && statuses.push(r.status()));
    await reader.goto(`${server.url}/venues/${venue}/${pageSlugs[0]}`);
    const img = await imageLoaded(reader, `[data-testid="page-body"] img[src="${displayUrl}"]`);
    await expect(img.getAttribute('alt')).resolves.toBe(CAPTION);
    expect(statuses).toEqual([200]);
    expect(await img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);
  });

  it('no request left 127.0.0.1 and no script error was thrown', () => {
    expect(foreignRequests(engineer.requests)).toEqual([]);
    expect(foreignRequests(viewer.requests)).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});
