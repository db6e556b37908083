import { defineConfig, devices } from '@playwright/test';

// Runs against the production build on the test profile's port, in Debian's Chromium (no download).
// `npm test` starts MariaDB, migrates and seeds before Playwright runs; the webServer only serves.
const port = Number(process.env.PORT || 3100);
const baseURL = `http://127.0.0.1:${port}`;

export default defineConfig({
  testDir: 'tests/e2e',
  workers: 1,
  retries: 0,
  timeout: 30_000,
  reporter: [['list'], ['json']],
  use: {
    baseURL,
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-dev-shm-usage',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
        '--disable-quic',
      ],
    },
  },
  projects: [{ name: 'phone', use: { ...devices['Pixel 7'], browserName: 'chromium' } }],
  webServer: {
    command: `node --import ./scripts/lib/refuse-trace.mjs node_modules/next/dist/bin/next start -H 127.0.0.1 -p ${port}`,
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    // Server errors show in the test output, prefixed [WebServer].
    stdout: 'pipe',
    stderr: 'pipe',
    timeout: 60_000,
    env: { ...(process.env as Record<string, string>), NODE_ENV: 'production' },
  },
});
