import { spawnSync } from 'node:child_process';
import { mkdirSync, rmSync } from 'node:fs';
import { buildIfStale } from '~/cli/build-if-stale.mjs';
import { TEMPLATE_DB, TMP_ROOT } from '../helpers/paths';

/**
 * Once per run: build the app when sources changed, and migrate + seed one template database
 * that every test server copies, so each test file starts from the same known demo data.
 */
export default function setup() {
  // Both the integration and the e2e project name this setup; the second call must not
  // rebuild or replace the template while the first project's servers copy it.
  const flag = globalThis as { __throwlineSetupDone?: boolean };
  if (flag.__throwlineSetupDone) return;
  flag.__throwlineSetupDone = true;
  buildIfStale();
  mkdirSync(TMP_ROOT, { recursive: true });
  rmSync(TEMPLATE_DB, { force: true });
  for (const suffix of ['-wal', '-shm']) rmSync(TEMPLATE_DB + suffix, { force: true });
  const result = spawnSync(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/cli/prepare-db.ts'], {
    env: { ...process.env, DATABASE_URL: `file:${TEMPLATE_DB}`, SEED_DEMO: '1', SEED_DEMO_PHOTOS: '0', DEMO_PASSWORD: 'throwline-demo', AUTH_SECRET: 'x'.repeat(40) },
    encoding: 'utf8',
  });
  if (result.status !== 0) throw new Error(`Preparing the template database failed:\n${result.stdout}\n${result.stderr}`);
}
