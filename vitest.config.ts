import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// The same aliases as tsconfig.json: `@/` is src/, `@db/` is db/.
const alias = {
  '@/': fileURLToPath(new URL('./src/', import.meta.url)),
  '@db/': fileURLToPath(new URL('./db/', import.meta.url)),
  // Unit tests run server modules without Astro: their settings come from tests/support/astro-env.ts.
  'astro:env/server': fileURLToPath(new URL('./tests/support/astro-env.ts', import.meta.url)),
};

// Three kinds of test: pure unit checks, integration over HTTP against the built server and a real
// PostgreSQL, and browser walks in Debian's chromium. The cluster and server start once, in globalSetup.
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      // Test files share one worker and its module cache (none mocks modules or changes globals), rather than
      // each paying for a fresh process and fresh imports.
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts', 'src/**/*.test.ts'], environment: 'node', isolate: false } },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts', 'tests/browser/**/*.test.ts', 'tests/hostile/**/*.test.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // One file at a time against the one server, all in one worker with one module cache (as for unit).
          fileParallelism: false,
          isolate: false,
          // After the unit files, whatever number of workers they get on a bigger machine.
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
});
