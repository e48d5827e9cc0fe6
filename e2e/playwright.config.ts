import { defineConfig } from '@playwright/test';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/**
 * Journeys run against the built client served by the real server on a fresh SQLite file.
 * Chromium comes from Debian (`apt-get install chromium`); Playwright never downloads one.
 */
const port = Number(process.env.E2E_PORT ?? 4319);
const dataDir = process.env.E2E_DATA_DIR ?? mkdtempSync(join(tmpdir(), 'hoverprint-e2e-'));
process.env.E2E_DATA_DIR = dataDir;

export default defineConfig({
  testDir: '.',
  testMatch: '**/*.spec.ts',
  outputDir: '../test-results',
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  // A journey walks several screens and runs real analyses in workers; on a busy 2-core
  // machine one took 33 s, so the per-journey allowance leaves room for load, not for slowness.
  timeout: 120_000,
  expect: { timeout: 15_000 },
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    trace: 'retain-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  webServer: {
    // The server itself, not a wrapper that forks it, so stopping it leaves nothing behind.
    command: 'node --import tsx server/index.ts',
    cwd: '..',
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    env: {
      NODE_ENV: 'production',
      PORT: String(port),
      DATA_DIR: dataDir,
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      // Every journey signs people up and in from one address; the production limit would
      // start refusing them part-way through the suite.
      AUTH_RATE_LIMIT: '1000',
      // Journeys read invite and reset links from the dev inbox.
      MAIL_FAKE: '1',
    },
  },
});
