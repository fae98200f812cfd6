/**
 * Lighthouse (from npm, on Debian's chromium, mobile settings: Moto G-class CPU slowdown and a
 * slow 4G link, Lighthouse's own defaults) on a calculator page and a signed-in page read view.
 * Reported, never asserted: scores move with the machine's load. Run by `npm run bench`, or
 * alone with `npx tsx tests/bench/lighthouse.ts`.
 */
import lighthouse from 'lighthouse';
import * as chromeLauncher from 'chrome-launcher';
import setup from '../setup/global-setup';
import { CHROMIUM_PATH } from '../helpers/browser';
import { DEMO } from '../helpers/paths';
import { startServer } from '../helpers/server';
import { signIn } from '../helpers/session';

interface Score {
  name: string;
  accessibility: number;
  performance: number;
  lcpMs: number;
  tbtMs: number;
  cls: number;
}

export async function benchLighthouse(): Promise<Score[]> {
  setup();
  const server = await startServer();
  const chrome = await chromeLauncher.launch({
    chromePath: CHROMIUM_PATH,
    chromeFlags: ['--headless=new', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const manager = await signIn(server.url, DEMO.manager);
    const { venues } = (await (await manager.fetch('/api/venues')).json()) as { venues: { slug: string }[] };
    const { pages } = (await (await manager.fetch(`/api/venues/${venues[0].slug}/pages`)).json()) as { pages: { slug: string }[] };
    const targets: [string, string, Record<string, string>][] = [
      ['calculator page /calc/bandwidth', '/calc/bandwidth', {}],
      ['page read view (signed in)', `/venues/${venues[0].slug}/${pages[0].slug}`, { cookie: manager.jar.header() }],
    ];
    const scores: Score[] = [];
    for (const [name, path, headers] of targets) {
      const result = await lighthouse(`${server.url}${path}`, {
        port: chrome.port,
        output: 'json',
        logLevel: 'error',
        onlyCategories: ['accessibility', 'performance'],
        extraHeaders: headers,
      });
      const lhr = result!.lhr;
      scores.push({
        name,
        accessibility: Math.round((lhr.categories.accessibility.score ?? 0) * 100),
        performance: Math.round((lhr.categories.performance.score ?? 0) * 100),
        lcpMs: lhr.audits['largest-contentful-paint'].numericValue ?? NaN,
        tbtMs: lhr.audits['total-blocking-time'].numericValue ?? NaN,
        cls: lhr.audits['cumulative-layout-shift'].numericValue ?? NaN,
      });
    }
    console.log('\nLighthouse 12, mobile settings (simulated slow 4G, 4× CPU slowdown)');
    for (const s of scores) {
      console.log(`${s.name.padEnd(36)} accessibility ${String(s.accessibility).padStart(3)}  performance ${String(s.performance).padStart(3)}  LCP ${s.lcpMs.toFixed(0)} ms  TBT ${s.tbtMs.toFixed(0)} ms  CLS ${s.cls.toFixed(3)}`);
    }
    return scores;
  } finally {
    chrome.kill();
    await server.stop();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await benchLighthouse();
