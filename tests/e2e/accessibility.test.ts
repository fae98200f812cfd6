// Every screen, checked by axe-core against the WCAG 2.2 A/AA rules in both themes, at a laptop
// and a phone size. A serious or critical finding fails the test with the rule, the screen and
// the first offending elements, so the fix is findable from the CI log alone.
import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInThroughPage, type Browser } from '../helpers/browser';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { DEMO, TMP_ROOT } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa'];
const SIZES = { laptop: { width: 1280, height: 900 }, phone: { width: 390, height: 844 } } as const;
const THEMES = ['light', 'dark'] as const;

let server: TestServer;
const browsers: Browser[] = [];

interface Finding {
  screen: string;
  rule: string;
  impact: string;
  targets: string[];
}

async function audit(page: Page, screen: string): Promise<Finding[]> {
  const result = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  return result.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => ({ screen, rule: v.id, impact: v.impact ?? '', targets: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
}

async function openAs(theme: (typeof THEMES)[number], size: keyof typeof SIZES, email?: string): Promise<Page> {
  const browser = await launchBrowser({ viewport: SIZES[size] });
  browsers.push(browser);
  await browser.context.addInitScript((t) => localStorage.setItem('throwline-theme', t), theme);
  const page = await browser.context.newPage();
  if (email) await signInThroughPage(page, server.url, email);
  return page;
}

async function visit(page: Page, path: string, ready?: (page: Page) => Promise<unknown>): Promise<void> {
  const res = await page.goto(`${server.url}${path}`, { waitUntil: 'load' });
  // The advance sheet keeps fetching for offline use (its photos, via the service worker), so the
  // network may not fall quiet; a few seconds is enough for anything that paints.
  await page.waitForLoadState('networkidle', { timeout: 5000 }).catch(() => undefined);
  expect(res?.status(), path).toBeLessThan(500);
  if (ready) await ready(page);
}

let venue: string;
let pageSlug: string;
let signedOutScreens: string[];

beforeAll(async () => {
  server = await startServer();
  const offline = (await (await fetch(`${server.url}/calc/offline-pages.json`)).json()) as { pages: string[] };
  signedOutScreens = ['/signin', '/signin/link', '/signin/forgot', '/no-such-page', ...offline.pages];
  const probe = await openAs('light', 'laptop', DEMO.manager);
  await probe.goto(`${server.url}/api/venues`);
  venue = (JSON.parse((await probe.textContent('body')) ?? '{}') as { venues: { slug: string }[] }).venues[0].slug;
  await probe.goto(`${server.url}/api/venues/${venue}/pages`);
  pageSlug = (JSON.parse((await probe.textContent('body')) ?? '{}') as { pages: { slug: string }[] }).pages[0].slug;
  // A visiting engineer's view: the advance sheet through a guest pass, with no session.
  const manager = await signIn(server.url, DEMO.manager);
  const pass = await manager.sendJson('POST', `/api/venues/${venue}/passes`, { label: 'Accessibility check, touring act' });
  expect(pass.status).toBe(201);
  signedOutScreens.push(((await pass.json()) as { pass: { url: string } }).pass.url);
});
afterAll(async () => {
  for (const b of browsers) await b.close();
  await server?.stop();
});

/** Signed-in screens, each with what to wait for before auditing (islands must have hydrated). */
function signedInScreens(): [string, ((page: Page) => Promise<unknown>) | undefined][] {
  return [
    ['/venues', undefined],
    [`/venues/${venue}`, undefined],
    [`/venues/${venue}/${pageSlug}`, undefined],
    [`/venues/${venue}/${pageSlug}/edit`, (p) => p.getByTestId('editor').waitFor()],
    // The processing page's EQ and crossover blocks open with their measured-trace controls.
    [`/venues/${venue}/system-processing/edit`, (p) => p.getByTestId('eq-block-traces').first().waitFor()],
    [`/venues/${venue}/${pageSlug}/history`, (p) => p.waitForLoadState('networkidle')],
    [`/venues/${venue}/files`, (p) => p.waitForLoadState('networkidle')],
    [`/venues/${venue}/sections`, undefined],
    [`/venues/${venue}/new`, (p) => p.getByTestId('editor').waitFor()],
    ['/search?q=stage', undefined],
    ['/admin/outbox', undefined],
    // The people and advance-sheet screens.
    [`/venues/${venue}/members`, undefined],
    [`/venues/${venue}/passes`, undefined],
    [`/venues/${venue}/audit`, undefined],
    [`/venues/${venue}/advance`, undefined],
    [`/venues/${venue}/advance/edit`, undefined],
    [`/venues/${venue}/changes`, undefined],
    [`/venues/${venue}/archived`, undefined],
    [`/venues/${venue}/settings`, undefined],
    ['/account', undefined],
  ];
}

describe.each(THEMES)('axe-core, WCAG 2.2 AA, %s theme', (theme) => {
  it.each(Object.keys(SIZES) as (keyof typeof SIZES)[])('every screen at %s size has no serious or critical finding', async (size) => {
    const findings: Finding[] = [];
    const out = await openAs(theme, size);
    for (const path of signedOutScreens) {
      await visit(out, path);
      findings.push(...(await audit(out, path)));
    }
    const admin = await openAs(theme, size, DEMO.admin);
    for (const [path, ready] of signedInScreens()) {
      await visit(admin, path, ready);
      findings.push(...(await audit(admin, path)));
    }
    // The whole list, for whoever fixes them (the assertion message shows only the start).
    writeFileSync(join(TMP_ROOT, `axe-${theme}-${size}.json`), JSON.stringify(findings, null, 1));
    expect(findings, JSON.stringify(findings, null, 1)).toEqual([]);
  }, 600_000);
});

describe('touch targets on a 390 × 844 phone', () => {
  it('header items, breadcrumb links and every control in the main area are at least 44 px tall', async () => {
    const small: string[] = [];
    const out = await openAs('light', 'phone');
    const admin = await openAs('light', 'phone', DEMO.admin);
    const screens: [Page, string][] = [
      [out, '/calc'],
      [out, '/calc/bandwidth'],
      [out, '/signin'],
      ...signedInScreens().map(([path]) => [admin, path] as [Page, string]),
    ];
    for (const [page, path] of screens) {
      await visit(page, path);
      const found = await page.evaluate(() => {
        const selector = [
          'header a', 'header button', 'header summary', 'header input',
          'nav[aria-label="Breadcrumb"] a',
          'main button', 'main select', 'main summary',
          'main input:not([type=hidden]):not([type=checkbox]):not([type=radio])',
        ].join(',');
        return [...document.querySelectorAll<HTMLElement>(selector)]
          // Visually hidden inputs (a file picker behind its label) are reached through the label.
          .filter((el) => el.offsetParent !== null && !el.closest('.ProseMirror, .prose-book') && !el.classList.contains('sr-only'))
          .map((el) => ({ h: el.getBoundingClientRect().height, what: `${el.tagName.toLowerCase()} "${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 40)}"` }))
          .filter((x) => x.h > 0 && x.h < 44);
      });
      small.push(...found.map((f) => `${path}: ${f.what} is ${f.h.toFixed(0)} px`));
    }
    expect(small).toEqual([]);
  }, 300_000);
});
