import { defineConfig } from '@playwright/test';

const port = Number(process.env['E2E_PORT'] ?? 4310);

/** Browser tests in Debian's chromium against the real server and a fresh PostgreSQL database (npm test creates it). */
export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: 'test-results/e2e',
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    browserName: 'chromium',
    headless: true,
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    viewport: { width: 1280, height: 800 },
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    },
  },
  webServer: {
    command: 'npx tsx --tsconfig tsconfig.server.json server/main.ts',
    url: `http://127.0.0.1:${port}/api/health`,
    env: {
      PORT: String(port),
      PGDATABASE: process.env['PGDATABASE'] ?? 'osmolane_e2e',
      PGPORT: process.env['PGPORT'] ?? '55432',
      SEED_DEMO: '1',
      DEMO_PASSWORD: 'osmolane-demo',
      LOG_REQUESTS: '0',
      // One sweep worker process beside the server, as npm start runs it.
      START_WORKER: '1',
    },
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'pipe',
    stderr: 'pipe',
  },
});
