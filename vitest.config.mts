import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));

export default defineConfig({
  resolve: { alias: { '@': root, 'server-only': `${root}tests/support/server-only-stub.ts` } },
  test: {
    environment: 'node',
    projects: [
      {
        extends: true,
        // React's development build (act, the Profiler): npm test runs with the production profile's NODE_ENV.
        test: { name: 'unit', include: ['tests/unit/**/*.test.{ts,tsx}'], setupFiles: ['tests/unit/setup.ts'], env: { NODE_ENV: 'test' } },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/integration/global-setup.ts'],
          setupFiles: ['tests/integration/support/env.ts'],
          // One MariaDB, shared tables: run files one after another.
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
