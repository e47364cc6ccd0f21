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
      { extends: true, test: { name: 'unit', include: ['tests/unit/**/*.test.ts', 'src/**/*.test.ts'], environment: 'node' } },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts', 'tests/browser/**/*.test.ts', 'tests/hostile/**/*.test.ts'],
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
