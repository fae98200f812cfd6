import { createClient } from '@libsql/client';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';

/** The hashed-script policy in a real browser: islands still run, nothing inline is refused; the long history pages. */
let server: TestServer;
let browser: Browser;
let page: Page;
const violations: string[] = [];
const pageErrors: string[] = [];

beforeAll(async () => {
  server = await startServer();
  browser = await launchBrowser();
  page = await browser.context.newPage();
  page.on('console', (msg) => {
    if (/Content Security Policy|Refused to (execute|apply|load)/i.test(msg.text())) violations.push(msg.text());
  });
  page.on('pageerror', (err) => pageErrors.push(err.message));
  await signInThroughPage(page, server.url, DEMO.engineer);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('a policy without inline scripts', () => {
  it('calculators, the venue, the editor and history run with no CSP refusal', async () => {
    await page.goto(`${server.url}/calc/bandwidth`);
    await page.locator('astro-island').first().waitFor({ state: 'attached' });
    await page.waitForFunction(() => [...document.querySelectorAll('astro-island')].every((i) => !i.hasAttribute('ssr')));
    const venues = (await (await page.request.get(`${server.url}/api/venues`)).json()) as { venues: { slug: string }[] };
    const venue = venues.venues[0].slug;
    const { pages } = (await (await page.request.get(`${server.url}/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    await page.goto(`${server.url}/venues/${venue}/${pages[0].slug}/edit`);
    await page.getByTestId('editor').waitFor();
    await page.goto(`${server.url}/venues/${venue}/${pages[0].slug}/history`);
    await page.getByTestId('revision-list').waitFor();
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toMatch(/^(dark|light)$/);
    expect(violations).toEqual([]);
    expect(pageErrors).toEqual([]);
  });
});

describe('a history of 250 revisions', () => {
  it('shows the newest 100 and loads older ones until revision 1', async () => {
    const venues = (await (await page.request.get(`${server.url}/api/venues`)).json()) as { venues: { slug: string }[] };
    const venue = venues.venues[0].slug;
    const { pages } = (await (await page.request.get(`${server.url}/api/venues/${venue}/pages`)).json()) as { pages: { slug: string }[] };
    const slug = pages[1].slug;
    const db = createClient({ url: `file:${server.dbPath}` });
    try {
      const p = (await db.execute({ sql: 'SELECT id, current_revision FROM pages WHERE slug = ?', args: [slug] })).rows[0];
      const from = Number(p.current_revision);
      const first = (await db.execute({ sql: 'SELECT doc, plain_text, author_id FROM revisions WHERE page_id = ? AND number = 1', args: [p.id] })).rows[0];
      const stmts = [];
      for (let n = from + 1; n <= 250; n++) {
        stmts.push({ sql: 'INSERT INTO revisions (id, page_id, number, doc, plain_text, summary, author_id, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)', args: [`e2e-${n}`, p.id, n, first.doc, first.plain_text, `step ${n}`, first.author_id, Date.now()] });
      }
      stmts.push({ sql: 'UPDATE pages SET current_revision = 250 WHERE id = ?', args: [p.id] });
      await db.batch(stmts, 'write');
    } finally {
      db.close();
    }
    await page.goto(`${server.url}/venues/${venue}/${slug}/history`);
    await page.getByTestId('revision-250').waitFor();
    expect(await page.locator('[data-testid^="revision-"]:not([data-testid="revision-list"])').count()).toBe(100);
    await expect(page.getByTestId('revision-1').count()).resolves.toBe(0);
    await page.getByTestId('older-revisions').click();
    await page.getByTestId('revision-100').waitFor();
    await page.getByTestId('older-revisions').click();
    await page.getByTestId('revision-1').waitFor();
    expect(await page.locator('[data-testid^="revision-"]:not([data-testid="revision-list"])').count()).toBe(250);
    expect(await page.getByTestId('older-revisions').count()).toBe(0);
    expect(violations).toEqual([]);
  });
});
