import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, TMP_ROOT } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn } from '../helpers/session';
import { eqCurves } from '~/lib/doc/blocks/block-curves';
import type { EqBlockAttrs } from '~/lib/doc/blocks/block-data';
import { parseTrace } from '~/lib/traces/parse-trace';

/** `npm start` on an empty database seeds the demo drawings through the real upload pipeline. */
let dir: string;
let server: TestServer;

beforeAll(async () => {
  mkdirSync(TMP_ROOT, { recursive: true });
  dir = mkdtempSync(join(TMP_ROOT, 'demo-photos-'));
  const env = { ...process.env, DATABASE_URL: `file:${join(dir, 'throwline.db')}`, UPLOADS_DIR: join(dir, 'uploads'), SEED_DEMO: '1', SEED_DEMO_PHOTOS: '1', AUTH_SECRET: 'y'.repeat(40) };
  const prepared = spawnSync(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/cli/prepare-db.ts'], { env, encoding: 'utf8' });
  expect(prepared.status, prepared.stderr).toBe(0);
  expect(prepared.stdout).toContain('2 demo drawings uploaded');
  server = await startServer({ DATABASE_URL: env.DATABASE_URL, UPLOADS_DIR: env.UPLOADS_DIR });
});
afterAll(async () => {
  await server?.stop();
  rmSync(dir, { recursive: true, force: true });
});

describe('demo drawings', () => {
  it('are files of the first venue, each shown on its page, readable by the viewer', async () => {
    const viewer = await signIn(server.url, DEMO.viewer);
    const { files } = (await (await viewer.fetch('/api/venues/haverkin-hall/files')).json()) as { files: { caption: string; displayUrl: string; kind: string }[] };
    expect(files.filter((f) => f.kind === 'image').map((f) => f.caption).sort()).toEqual(['Amp rack B after the B2 swap', 'Where the stage box tails land (house layout)']);

    const html = await (await viewer.fetch('/venues/haverkin-hall/stage-box-patch')).text();
    const src = html.match(/<img src="(\/files\/[A-Za-z0-9_-]+\/display)"/)?.[1];
    expect(src).toBeDefined();
    const image = await viewer.fetch(src!);
    expect(image.status).toBe(200);
    expect(image.headers.get('content-type')).toBe('image/webp');
  });

  it('were added as a new revision by the demo engineer, so history tells the story', async () => {
    const engineer = await signIn(server.url, DEMO.engineer);
    const { revisions } = (await (await engineer.fetch('/api/venues/haverkin-hall/pages/amp-racks/revisions')).json()) as {
      revisions: { summary: string; author: { name: string } }[];
    };
    expect(revisions[0].summary).toBe('Added a front view of rack B');
  });

  it('a drawing deleted after confirming shows as a note on its page, not a broken image', async () => {
    const engineer = await signIn(server.url, DEMO.engineer);
    const { files } = (await (await engineer.fetch('/api/venues/haverkin-hall/files')).json()) as { files: { id: string; caption: string }[] };
    const rack = files.find((f) => f.caption.startsWith('Amp rack B'))!;
    expect((await engineer.fetch(`/api/venues/haverkin-hall/files/${rack.id}`, { method: 'DELETE' })).status).toBe(409);
    expect((await engineer.fetch(`/api/venues/haverkin-hall/files/${rack.id}?confirm=1`, { method: 'DELETE' })).status).toBeLessThan(300);
    const html = await (await engineer.fetch('/venues/haverkin-hall/amp-racks')).text();
    expect(html).toContain('Photo removed: Amp rack B after the B2 swap');
    expect(html).not.toContain(`/files/${rack.id}`);
  });

  it('the processing page carries invented before/after traces whose difference is the mains EQ', async () => {
    const viewer = await signIn(server.url, DEMO.viewer);
    const { files } = (await (await viewer.fetch('/api/venues/haverkin-hall/files')).json()) as { files: { id: string; caption: string; kind: string; url: string }[] };
    const traces = files.filter((f) => f.kind === 'trace');
    expect(traces.map((f) => f.caption).sort()).toEqual(['Demo data (invented): mains after retune', 'Demo data (invented): mains before retune']);
    const html = await (await viewer.fetch('/venues/haverkin-hall/system-processing')).text();
    expect(html).toContain('data-label="before retune (demo)"');
    expect(html).toContain('data-label="after retune (demo)"');
    expect(html).toContain('tl-curve-difference');

    const { revision } = (await (await viewer.fetch('/api/venues/haverkin-hall/pages/system-processing')).json()) as { revision: { doc: { content: { type: string; attrs: EqBlockAttrs }[] } } };
    const block = revision.doc.content.find((n) => n.type === 'eqBlock')!.attrs;
    const text = async (caption: string) => (await viewer.fetch(traces.find((f) => f.caption.endsWith(caption))!.url)).text();
    const beforeText = await text('before retune');
    expect(beforeText).toMatch(/^# DEMO DATA/);
    const before = parseTrace(beforeText);
    const after = parseTrace(await text('after retune'));
    const eq = eqCurves(block);
    // Each point carries at most ±0.2 dB of seeded noise, so after − before is the EQ within 0.4 dB.
    let checked = 0;
    before.freqHz.forEach((hz, i) => {
      const k = eq.freqs.findIndex((f) => Math.abs(f - hz) < 0.01);
      if (k < 0) return;
      expect(Math.abs(after.magnitudeDb[i]! - before.magnitudeDb[i]! - eq.total[k]!)).toBeLessThanOrEqual(0.41);
      checked++;
    });
    expect(checked).toBeGreaterThan(100);
  });
});
