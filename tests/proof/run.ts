/**
 * `npm run proof` (full) or `npm run proof -- --short` (the form CI and `npm test` run): the
 * reliability proof. Loopback only, bounded in time, each part on its own copy of the seeded
 * database. Prints one table; exits 1 when anything was lost, wrong or a 5xx.
 */
import { copyFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import setup from '../setup/global-setup';
import { DEMO, TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';
import { signIn } from '../helpers/session';
import { accessMatrix } from './access-matrix';
import { crashLoop } from './crash-loop';
import { diskFull } from './disk-full';
import { hostileSweep } from './hostile';
import { load } from './load';
import { startOn } from './proof-server';
import { editStorm } from './storm';

const short = process.argv.includes('--short');
const plan = short ? { stormSeconds: 8, loadSeconds: 5, kills: 5 } : { stormSeconds: 60, loadSeconds: 30, kills: 20 };

function freshCopy(root: string, name: string) {
  const dir = join(root, name);
  mkdirSync(join(dir, 'uploads'), { recursive: true });
  copyFileSync(TEMPLATE_DB, join(dir, 'throwline.db'));
  return { dir, dbPath: join(dir, 'throwline.db'), uploadsDir: join(dir, 'uploads') };
}

async function main() {
  process.env.ASTRO_TELEMETRY_DISABLED = '1';
  setup();
  mkdirSync(TMP_ROOT, { recursive: true });
  const root = mkdtempSync(join(TMP_ROOT, 'proof-'));
  const rows: [string, string, string][] = [];
  let bad = 0;
  const check = (ok: boolean) => {
    if (!ok) bad++;
    return ok ? 'ok' : 'FAILED';
  };
  try {
    const main = freshCopy(root, 'main');
    const server = await startOn(main.dbPath, main.uploadsDir);
    let venue = '';
    try {
      const engineer = await signIn(server.url, DEMO.engineer);
      venue = ((await (await engineer.fetch('/api/venues')).json()) as { venues: { slug: string }[] }).venues[0].slug;
      const { pages } = (await (await engineer.fetch(`/api/venues/${venue}/pages`)).json()) as { pages: { slug: string; section: { slug: string } | string }[] };
      const page = pages[0].slug;
      const section = typeof pages[0].section === 'string' ? pages[0].section : pages[0].section.slug;

      const s = await editStorm(server.url, main.dbPath, venue, plan.stormSeconds);
      rows.push(['edit storm', `${s.clients} clients, ${s.pages} pages, ${s.seconds} s: ${s.saves} saves acknowledged, ${s.conflicts} conflicts answered 409`, check(s.lost === 0 && s.mismatched === 0 && s.brokenChains === 0 && s.duplicates === 0)]);
      rows.push(['', `lost ${s.lost} · stored differently ${s.mismatched} · broken chains ${s.brokenChains} · numbers given twice ${s.duplicates}`, '']);

      const l = await load(server.url, venue, plan.loadSeconds);
      rows.push(['load', `${l.readers} readers + ${l.writers} writers, ${l.seconds} s: ${l.requests} requests, 5xx ${l.status5xx}, other unexpected ${l.statusOther}`, check(l.status5xx === 0 && l.statusOther === 0)]);

      const h = await hostileSweep(server.url, venue, page);
      rows.push(['hostile input', `${h.requests} requests: 5xx ${h.status5xx}, hostile accepted ${h.acceptedHostile}`, check(h.status5xx === 0 && h.acceptedHostile === 0)]);
      for (const c of h.cases.slice(0, 10)) rows.push(['', `  ${c}`, '']);

      const m = await accessMatrix(server.url, venue, page, section);
      rows.push(['access matrix', `${m.checks} checks over ${m.routeFiles} route files × 6 people: wrong ${m.wrong}`, check(m.wrong === 0)]);
      for (const c of m.wrongCases.slice(0, 10)) rows.push(['', `  ${c}`, '']);
      if (m.notCovered.length) rows.push(['', `  routes with no row yet: ${m.notCovered.join(', ')}`, '']);
    } finally {
      await server.stop();
    }

    const crash = freshCopy(root, 'crash');
    const c = await crashLoop(crash.dbPath, crash.uploadsDir, venue, plan.kills);
    rows.push(['crash loop', `${c.kills} × kill -9 during saves, uploads, deletes: integrity_check ok ${c.integrityOk}/${c.kills + 1}`, check(c.integrityOk === c.kills + 1 && c.lostWrites === 0 && c.rowsWithoutBytes === 0 && c.orphansAfterSweep === 0)]);
    rows.push(['', `acknowledged: ${c.ackedSaves} saves, ${c.ackedUploads} uploads, ${c.ackedDeletes} deletes · lost ${c.lostWrites} · rows without bytes ${c.rowsWithoutBytes} · orphans after sweep ${c.orphansAfterSweep}`, '']);
    rows.push(['', `back to ready after a kill: median ${c.readyMsMedian} ms, slowest ${c.readyMsMax} ms (shared machine; not asserted)`, '']);

    const disk = freshCopy(root, 'disk');
    const d = await diskFull(disk.dbPath, disk.dir, venue);
    if (d.ran) rows.push(['full disk', `${d.attempts} uploads into a full 2 MiB tmpfs: 507 ${d.answered507}/${d.attempts}, half-written ${d.halfWritten}`, check(d.answered507 === d.attempts && d.halfWritten === 0)]);
    else rows.push(['full disk', `not run: ${d.reason}`, 'skipped']);
  } finally {
    rmSync(root, { recursive: true, force: true });
  }

  const width = Math.max(...rows.map((r) => r[0].length));
  const lines = [`Throwline proof (${short ? 'short' : 'full'} form)`, ...rows.map(([a, b, c]) => `${a.padEnd(width)}  ${c.padEnd(7)} ${b}`)];
  console.log(lines.join('\n'));
  writeFileSync(join(TMP_ROOT, `proof-${short ? 'short' : 'full'}.txt`), lines.join('\n') + '\n');
  process.exit(bad ? 1 : 0);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
