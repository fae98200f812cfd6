// Astro integration: bundles src/server/search-worker.ts into the server build as
// search-worker.mjs. A worker thread starts from a file Node can load as it is, and Astro's own
// server bundle has no entry for one; esbuild (the bundler Astro and Vite already use) makes a
// single file of it and our pure modules, leaving packages such as @libsql/client to be loaded
// from node_modules like the rest of the server.
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';
import { SEARCH_WORKER_FILE } from './build-if-stale.mjs';

export const SEARCH_WORKER_SOURCE = 'src/server/search-worker.ts';

export function searchWorkerBuild() {
  let serverDir;
  return {
    name: 'throwline-search-worker',
    hooks: {
      'astro:config:done': ({ config }) => {
        serverDir = fileURLToPath(config.build.server);
      },
      'astro:build:done': async ({ logger }) => {
        const outfile = `${serverDir}/${SEARCH_WORKER_FILE}`;
        await build({
          entryPoints: [SEARCH_WORKER_SOURCE],
          outfile,
          bundle: true,
          platform: 'node',
          format: 'esm',
          target: 'node20',
          packages: 'external',
          tsconfig: 'tsconfig.json',
          logLevel: 'warning',
          legalComments: 'none',
        });
        logger.info(`search thread bundled into ${SEARCH_WORKER_FILE}`);
      },
    },
  };
}
