import { defineConfig } from 'vitest/config';

// Three kinds of test: pure unit checks, integration over HTTP against the built server and a real
// PostgreSQL, and browser walks in Debian's chromium. The cluster and server start once, in globalSetup.
export default defineConfig({
  test: {
    projects: [
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts', 'src/**/*.test.ts'], environment: 'node' } },
      {
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
