// Uses only Node's own modules: it runs before any dependency is installed.
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';

export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.status !== 0) {
    console.error(`\n✗ ${command} ${args.join(' ')} failed (exit ${result.status ?? result.signal}).`);
    process.exit(result.status ?? 1);
  }
}

/** npm ci when node_modules is absent or older than the lock file. */
export function ensureInstalled() {
  const marker = 'node_modules/.package-lock.json';
  const stale = !existsSync(marker) || statSync('package-lock.json').mtimeMs > statSync(marker).mtimeMs;
  if (!stale) return;
  console.log('→ installing dependencies (npm ci)…');
  run('npm', ['ci', '--no-audit', '--no-fund']);
}
