// `npm test`: install what is missing (npm packages, and Debian's chromium for the browser
// tests), then run every test: unit, integration against a real server, end to end in Chromium.
import { existsSync } from 'node:fs';
import { ensureInstalled, run } from './ensure-install.mjs';

process.env.ASTRO_TELEMETRY_DISABLED = '1';
ensureInstalled();

const CHROMIUM = '/usr/bin/chromium';
if (!existsSync(CHROMIUM)) {
  if (process.getuid?.() === 0) {
    console.log('→ installing Debian chromium for the browser tests…');
    run('apt-get', ['update', '-qq']);
    run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium'], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  } else {
    console.error(`✗ ${CHROMIUM} is missing. Install it (sudo apt-get install chromium) and run npm test again.`);
    process.exit(1);
  }
}

// The type check and the linter (which enforces the layers) run first: a broken boundary or a
// type error fails CI before a single server starts.
console.log('→ type check (astro sync + tsc)…');
run(process.execPath, ['node_modules/astro/astro.js', 'sync']);
run(process.execPath, ['node_modules/typescript/bin/tsc', '--noEmit', '-p', 'tsconfig.json']);
console.log('→ lint (eslint, layer boundaries)…');
run(process.execPath, ['node_modules/eslint/bin/eslint.js', '--max-warnings', '0', '.']);

run(process.execPath, ['node_modules/vitest/vitest.mjs', 'run', '--config', 'tests/vitest.config.ts', ...process.argv.slice(2)]);

// The whole suite also runs the short form of the reliability proof (a few minutes; the full
// form is `npm run proof`). A filtered run (`npm test -- some/file`) skips it.
if (process.argv.length <= 2) {
  console.log('→ reliability proof, short form (npm run proof -- --short)…');
  run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'tests/proof/run.ts', '--short']);
}
