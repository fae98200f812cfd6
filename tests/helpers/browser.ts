import { mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { DEMO_PASSWORD, TMP_ROOT } from './paths';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export interface Browser {
  context: BrowserContext;
  /** Every URL the browser asked for, so a test can prove nothing left the machine. */
  requests: string[];
  close: () => Promise<void>;
}

/** Debian's Chromium, headless, in a fresh profile, with its background chatter switched off. */
/** `touch` makes a phone of it: a touch screen, so tests can `tap()` as a thumb would. */
export async function launchBrowser(options: { viewport?: { width: number; height: number }; offline?: boolean; touch?: boolean } = {}): Promise<Browser> {
  const profile = mkdtempSync(join(TMP_ROOT, 'chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    viewport: options.viewport ?? { width: 1280, height: 900 },
    ...(options.touch ? { hasTouch: true } : {}),
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  const requests: string[] = [];
  context.on('request', (req) => requests.push(req.url()));
  return {
    context,
    requests,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function signInThroughPage(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/signin`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await Promise.all([page.waitForURL(/\/venues/), page.getByRole('button', { name: 'Sign in' }).click()]);
}

/** Hosts other than the test server's loopback address that the browser contacted. */
export function foreignRequests(requests: string[]): string[] {
  return requests.filter((u) => !/^(https?:\/\/127\.0\.0\.1(:\d+)?\/|data:|blob:|about:|chrome-extension:)/.test(u));
}
