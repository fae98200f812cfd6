// `npm start`: install what is missing, migrate, seed the demo on an empty database, build when
// stale, serve. Only Node's own modules at the top: dependencies may not be installed yet.
import { spawn } from 'node:child_process';
import { SERVE_SCRIPT, buildIfStale } from './build-if-stale.mjs';
import { ensureInstalled, run } from './ensure-install.mjs';

process.env.ASTRO_TELEMETRY_DISABLED = '1';
ensureInstalled();
run(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'src/cli/prepare-db.ts']);
buildIfStale();

const host = process.env.HOST || 'localhost';
const port = process.env.PORT || '4321';
console.log(`→ Throwline is starting on http://${host}:${port}/`);
// Production mode always: React and Astro choose their runtime from NODE_ENV when loaded.
const server = spawn(process.execPath, [SERVE_SCRIPT], {
  stdio: 'inherit',
  env: { ...process.env, HOST: host, PORT: port, NODE_ENV: 'production' },
});
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => process.exit(code ?? 0));
