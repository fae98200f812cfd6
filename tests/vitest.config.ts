import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('..', import.meta.url));

export default defineConfig({
  // The same "~/" alias as tsconfig.json's paths (Astro and tsx read it from there).
  resolve: { alias: { '~': fileURLToPath(new URL('../src', import.meta.url)) } },
  test: {
    root,
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          root,
          // Layers run one after another (cheapest first), each with its own worker count.
          sequence: { groupOrder: 0 },
          include: ['src/**/*.test.ts'],
          environment: 'node',
          // Password hashing and property tests are CPU-bound; on a loaded 2-core runner 5 s is
          // not enough, and a time-out there says nothing about correctness.
          testTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          root,
          sequence: { groupOrder: 1 },
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/setup/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // Each file starts its own server; two at a time fits the two cores.
          maxWorkers: 2,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          root,
          sequence: { groupOrder: 2 },
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/setup/global-setup.ts'],
          testTimeout: 90_000,
          hookTimeout: 120_000,
          maxWorkers: 1,
          fileParallelism: false,
        },
      },
    ],
  },
});
