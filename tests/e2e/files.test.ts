import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { foreignRequests, launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO, TMP_ROOT } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

let server: TestServer;
let fixtureDir: string;
let venue: string;
const photos: string[] = [];

beforeAll(async () => {
  server = await startServer();
  mkdirSync(TMP_ROOT, { recursive: true });
  fixtureDir = mkdtempSync(join(TMP_ROOT, 'photos-'));
  // Photo-sized and noisy, so each takes a few seconds on the throttled connection below.
  for (const [i, name] of ['amp-rack.jpg', 'patch-bay.jpg'].entries()) {
    const bytes = await sharp({ create: { width: 1400, height: 1050, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 100 + i * 30, sigma: 45 } } }).jpeg({ quality: 92 }).toBuffer();
    const path = join(fixtureDir, name);
    writeFileSync(path, bytes);
    photos.push(path);
  }
});
afterAll(async () => {
  await server?.stop();
  if (fixtureDir) rmSync(fixtureDir, { recursive: true, force: true });
});

/** Every value each progress bar showed, recorded in the page as React updates it. */
async function recordProgress(page: Page) {
  await page.evaluate(() => {
    const seen: Record<string, number[]> = {};
    (window as unknown as { progressSeen: typeof seen }).progressSeen = seen;
    new MutationObserver((mutations) => {
      for (const m of mutations) {
        const el = m.target as HTMLProgressElement;
        if (el.tagName !== 'PROGRESS') continue;
        const key = el.getAttribute('aria-label') ?? '?';
        (seen[key] ??= []).push(el.value);
      }
    }).observe(document.body, { subtree: true, attributes: true, attributeFilter: ['value'] });
  });
}

describe('photos from the files screen into a page', () => {
  let engineer: Browser;
  let viewer: Browser;
  let anonymousBrowser: Browser;
  let uploaded: { id: string; caption: string; displayUrl: string }[] = [];

  beforeAll(async () => {
    engineer = await launchBrowser({ viewport: { width: 390, height: 844 } });
    viewer = await launchBrowser();
    anonymousBrowser = await launchBrowser();
  });
  afterAll(async () => {
    await engineer?.close();
    await viewer?.close();
    await anonymousBrowser?.close();
  });

  it('the engineer, on a phone-sized screen, uploads two photos with captions and sees each bar move', async () => {
    const page = await engineer.context.newPage();
    await signInThroughPage(page, server.url, DEMO.engineer);
    await page.getByTestId('venue-list').getByRole('link').first().click();
    await page.waitForURL(/\/venues\/[a-z0-9-]+$/);
    venue = new URL(page.url()).pathname.split('/')[2];
    await page.getByTestId('files-link').click();
    await page.waitForURL(new RegExp(`/venues/${venue}/files$`));
    await page.getByRole('heading', { name: 'Photos and files', level: 1 }).waitFor();

    const input = page.getByTestId('file-input');
    expect(await input.getAttribute('accept')).toBe('image/*,application/pdf,text/plain,text/csv,.txt,.csv,.tsv');
    expect(await input.getAttribute('multiple')).not.toBeNull();
    await input.setInputFiles(photos);
    const rows = page.getByTestId('upload-row');
    await expect(rows.count()).resolves.toBe(2);
    await page.getByLabel('Caption for amp-rack.jpg').fill('Amp rack, stage left');
    await page.getByLabel('Caption for patch-bay.jpg').fill('Patch bay behind FOH');

    // A slow uplink, like a venue's Wi-Fi from the stage, so the bars have something to show.
    const cdp = await engineer.context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 400 * 1024 });
    await recordProgress(page);
    await page.getByTestId('upload-start').click();
    await page.waitForFunction(() => [...document.querySelectorAll('[data-testid="upload-row"]')].every((r) => r.getAttribute('data-status') === 'done'), null, { timeout: 60_000 });
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    const seen = (await page.evaluate(() => (window as unknown as { progressSeen: Record<string, number[]> }).progressSeen)) as Record<string, number[]>;
    for (const name of ['amp-rack.jpg', 'patch-bay.jpg']) {
      const values = seen[`Upload progress for ${name}`] ?? [];
      expect(values.some((v) => v > 0 && v < 1), `${name}: ${JSON.stringify(values)}`).toBe(true);
      expect(values.at(-1)).toBe(1);
    }
    for (const row of await rows.all()) await expect(row.getAttribute('data-status')).resolves.toBe('done');

    const cards = page.getByTestId('file-card');
    await expect(cards.count()).resolves.toBe(2);
    const captions = await page.getByTestId('file-caption').allInnerTexts();
    expect(captions.sort()).toEqual(['Amp rack, stage left', 'Patch bay behind FOH']);
    await page.waitForFunction(() => [...document.querySelectorAll<HTMLImageElement>('[data-testid="file-thumb"]')].every((img) => img.complete && img.naturalWidth > 0));
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(391);

    const list = await page.request.get(`${server.url}/api/venues/${venue}/files`);
    uploaded = ((await list.json()) as { files: typeof uploaded }).files;
    expect(uploaded).toHaveLength(2);
  });

  it('one photo goes into a page (through the page API, as the editor saves it)', async () => {
    const page = engineer.context.pages()[0];
    const pages = ((await (await page.request.get(`${server.url}/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] }).pages;
    const target = pages[0].slug;
    const current = (await (await page.request.get(`${server.url}/api/venues/${venue}/pages/${target}`)).json()) as { revision: { number: number; doc: { content: unknown[] } } };
    const photo = uploaded.find((f) => f.caption === 'Amp rack, stage left')!;
    const doc = { ...current.revision.doc, content: [...current.revision.doc.content, { type: 'image', attrs: { src: photo.displayUrl, alt: photo.caption } }] };
    const saved = await page.request.put(`${server.url}/api/venues/${venue}/pages/${target}`, { data: { doc, baseRevision: current.revision.number, summary: 'Photo of the amp rack' } });
    expect(saved.status()).toBe(200);

    await page.goto(`${server.url}/venues/${venue}/files`);
    const card = page.locator(`[data-file-id="${photo.id}"]`);
    await expect(card.getByTestId('file-used-by').innerText()).resolves.toMatch(/Shown on/);
    // Deleting it asks first, naming the page.
    await card.getByTestId('delete-file').click();
    const dialog = page.getByTestId('confirm-delete');
    await dialog.waitFor();
    await expect(dialog.getByTestId('confirm-delete-pages').innerText()).resolves.toMatch(/\w/);
    await dialog.getByRole('button', { name: 'Keep it' }).click();
    await expect(page.getByTestId('file-card').count()).resolves.toBe(2);
    (globalThis as { targetPage?: string }).targetPage = target;
  });

  it('the viewer sees the photo on the page and both on the files screen, with no upload controls', async () => {
    const page = await viewer.context.newPage();
    await signInThroughPage(page, server.url, DEMO.viewer);
    const target = (globalThis as { targetPage?: string }).targetPage!;
    const photo = uploaded.find((f) => f.caption === 'Amp rack, stage left')!;
    await page.goto(`${server.url}/venues/${venue}/${target}`);
    const img = page.getByTestId('page-body').locator(`img[src="${photo.displayUrl}"]`);
    await img.waitFor({ state: 'attached' });
    // The read view lazy-loads images; bring it on screen as a reader scrolling down would.
    await img.evaluate((el) => el.scrollIntoView());
    await page.waitForFunction((src) => {
      const el = document.querySelector<HTMLImageElement>(`img[src="${src}"]`);
      return !!el && el.complete && el.naturalWidth > 0;
    }, photo.displayUrl);

    await page.goto(`${server.url}/venues/${venue}/files`);
    const captions = await page.getByTestId('file-caption').allInnerTexts();
    expect(captions.sort()).toEqual(['Amp rack, stage left', 'Patch bay behind FOH']);
    await expect(page.getByTestId('uploader').count()).resolves.toBe(0);
    await expect(page.getByTestId('delete-file').count()).resolves.toBe(0);
  });

  it('a signed-out request for the file is refused: 401 for the bytes, sign-in for a browser tab', async () => {
    const photo = uploaded[0];
    const res = await fetch(`${server.url}${photo.displayUrl}`);
    expect(res.status).toBe(401);
    expect(res.headers.get('content-type')).not.toMatch(/image/);
    const page = await anonymousBrowser.context.newPage();
    await page.goto(`${server.url}/files/${photo.id}`);
    await page.waitForURL(/\/signin\?next=/);
    expect(new URL(page.url()).searchParams.get('next')).toBe(`/files/${photo.id}`);
  });

  it('a venue of many photos shows them 60 at a time, the rest one tap away', async () => {
    // 128 more rows sharing one stored photo: what matters here is the grid, not the bytes.
    const { createClient } = await import('@libsql/client');
    const db = createClient({ url: `file:${server.dbPath}` });
    const [source] = (await db.execute({ sql: 'select * from files where id = ?', args: [uploaded[0].id] })).rows;
    const columns = Object.keys(source).filter((c) => c !== 'id');
    for (let i = 0; i < 128; i++) {
      await db.execute({
        sql: `insert into files (id, ${columns.join(', ')}) values (?, ${columns.map(() => '?').join(', ')})`,
        args: [crypto.randomUUID(), ...columns.map((c) => (c === 'caption' ? `Spare photo ${i}` : (source[c] as string | number | null)))],
      });
    }
    db.close();
    const page = await viewer.context.newPage();
    await page.goto(`${server.url}/venues/${venue}/files`);
    const cards = page.getByTestId('file-caption');
    await expect(cards.count()).resolves.toBe(60);
    await expect(page.getByText('60 of 130 shown').count()).resolves.toBe(1);
    await page.getByTestId('files-more').click();
    await page.getByText('120 of 130 shown').waitFor();
    await expect(cards.count()).resolves.toBe(120);
    await expect(page.getByTestId('files-more').innerText()).resolves.toBe('Show 10 more');
    await page.getByTestId('files-more').click();
    await page.getByTestId('files-more').waitFor({ state: 'detached' });
    await expect(cards.count()).resolves.toBe(130);
    await page.close();
  });

  it('nothing left 127.0.0.1', () => {
    for (const b of [engineer, viewer, anonymousBrowser]) expect(foreignRequests(b.requests)).toEqual([]);
  });
});
