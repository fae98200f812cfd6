import { readFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO } from '../helpers/paths';
import { startServer, type TestServer } from '../helpers/server';
import { signIn, type Client } from '../helpers/session';
import { createTestPage, doc, para, snapshot } from './pages-fixtures';

/**
 * Two server processes over one database (WEB_CONCURRENCY=2, node:cluster): writes from both
 * wait for each other through SQLite's busy timeout, and nothing any answer depends on lives in
 * one process's memory.
 */
let server: TestServer;
const editors: Client[] = [];
let viewer: Client;
let venue: string;

function workerPids(): number[] {
  const out = execFileSync('ps', ['-o', 'pid=', '--ppid', String(server.pid)], { encoding: 'utf8' });
  return out.split('\n').map((s) => Number(s.trim())).filter((n) => n > 0);
}
/** User + system CPU ticks a process has used so far. */
function cpuTicks(pid: number): number {
  const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return Number(fields[11]) + Number(fields[12]);
}

beforeAll(async () => {
  server = await startServer({ WEB_CONCURRENCY: '2' });
  for (const who of [DEMO.engineer, DEMO.manager, DEMO.engineer, DEMO.manager]) editors.push(await signIn(server.url, who));
  viewer = await signIn(server.url, DEMO.viewer);
  venue = ((await (await editors[0].fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
});
afterAll(() => server?.stop());

describe('two server processes', () => {
  it('run as two workers', () => {
    expect(workerPids()).toHaveLength(2);
  });

  it('an edit storm from both loses nothing: every save lands exactly once, in order, and both processes took part', async () => {
    const { page } = await createTestPage(editors[0], venue, 'Storm target', doc(para('Start.')));
    const before = await snapshot(server.dbPath, page.slug);
    const ticksBefore = workerPids().map(cpuTicks);
    const SAVES_EACH = 8;
    const landed: string[] = [];
    // Each editor saves its own numbered lines, re-reading and retrying on a 409 as the editor does.
    async function editor(client: Client, name: string) {
      for (let i = 0; i < SAVES_EACH; i++) {
        const marker = `${name} line ${i}`;
        for (let attempt = 0; ; attempt++) {
          const current = (await (await client.fetch(`/api/venues/${venue}/pages/${page.slug}`)).json()) as { page: { currentRevision: number } };
          const res = await client.sendJson('PUT', `/api/venues/${venue}/pages/${page.slug}`, { doc: doc(para(marker)), baseRevision: current.page.currentRevision, summary: marker });
          if (res.status === 200) {
            landed.push(marker);
            break;
          }
          expect(res.status, await res.text()).toBe(409);
          if (attempt > 200) throw new Error(`${marker} never landed`);
        }
      }
    }
    await Promise.all(editors.map((c, i) => editor(c, `editor ${i}`)));
    const total = editors.length * SAVES_EACH;
    expect(landed).toHaveLength(total);
    const after = await snapshot(server.dbPath, page.slug);
    expect(after.revisions - before.revisions).toBe(total);
    expect(after.page!.currentRevision).toBe(1 + total);
    const { revisions } = (await (await viewer.fetch(`/api/venues/${venue}/pages/${page.slug}/revisions`)).json()) as { revisions: { number: number; summary: string }[] };
    const summaries = revisions.filter((r) => r.number > 1).sort((a, b) => a.number - b.number).map((r) => r.summary);
    // Exactly the saves that answered 200, each once (answers may arrive in another order).
    expect([...summaries].sort()).toEqual([...landed].sort());
    // Each editor's own saves landed in the order it made them.
    for (let e = 0; e < editors.length; e++) {
      const mine = summaries.filter((s) => s.startsWith(`editor ${e} `));
      expect(mine).toEqual(Array.from({ length: SAVES_EACH }, (_, i) => `editor ${e} line ${i}`));
    }
    // The read view, from whichever process answers, shows the current revision.
    const last = summaries[summaries.length - 1];
    for (let i = 0; i < 6; i++) expect(await (await viewer.fetch(`/venues/${venue}/${page.slug}`)).text()).toContain(last);
    const ticksAfter = workerPids().map(cpuTicks);
    expect(ticksAfter.every((t, i) => t > ticksBefore[i])).toBe(true);
  });

  it('pages created at the same moment through both processes all exist, none twice', async () => {
    const before = await snapshot(server.dbPath);
    const results = await Promise.all(Array.from({ length: 12 }, (_, i) => editors[i % editors.length].sendJson('POST', `/api/venues/${venue}/pages`, { title: `Storm page ${i}`, section: 'stage', doc: doc(para(`Body ${i}`)) })));
    expect(results.map((r) => r.status)).toEqual(Array(12).fill(201));
    const after = await snapshot(server.dbPath);
    expect(after.pages - before.pages).toBe(12);
    // Two saves racing for one slug: one wins, the other is told to pick another, whichever process each hit.
    const twins = await Promise.all([0, 1, 2, 3].map((i) => editors[i].sendJson('POST', `/api/venues/${venue}/pages`, { title: 'Same title', slug: 'same-slug', section: 'stage', doc: doc(para('x')) })));
    expect(twins.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
  });

  it('a session made by one process is good in the other', async () => {
    const statuses = await Promise.all(Array.from({ length: 10 }, () => viewer.fetch('/api/venues').then((r) => r.status)));
    expect(statuses).toEqual(Array(10).fill(200));
  });
});
