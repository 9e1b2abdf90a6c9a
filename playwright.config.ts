import { defineConfig, devices } from '@playwright/test';

// The test orchestrator (packages/devstack, `npm test`) starts the app; this file only points at it.
export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '*.test.ts',
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  forbidOnly: true,
  outputDir: process.env.PLAYWRIGHT_ARTIFACTS ?? '.data/test/playwright-artifacts',
  reporter: [['list'], ['json', { outputFile: process.env.PLAYWRIGHT_JSON ?? '.data/test/playwright.json' }]],
  use: {
    ...devices['Desktop Chrome'],
    baseURL: process.env.BASE_URL ?? 'http://localhost:5173',
    locale: 'en-GB',
    timezoneId: 'Europe/London',
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
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
});
