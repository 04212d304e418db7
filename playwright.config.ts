import { defineConfig, devices } from '@playwright/test';

// Debian's Chromium, never a downloaded browser. The server is started by tests/e2e/global-setup.ts on a
// free port with a temporary data folder, and its URL reaches the workers through E2E_BASE_URL.
export const chromiumPath = process.env.CHROME_PATH ?? '/usr/bin/chromium';

export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  globalSetup: './tests/e2e/global-setup.ts',
  fullyParallel: false,
  workers: 1,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: process.env.PW_JSON_OUTPUT ? [['list'], ['json', { outputFile: process.env.PW_JSON_OUTPUT }]] : [['list']],
  use: {
    baseURL: process.env.E2E_BASE_URL,
    trace: 'off',
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: chromiumPath,
      args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    },
  },
  projects: [{ name: 'phone', use: { ...devices['Pixel 7'], browserName: 'chromium', viewport: { width: 390, height: 844 } } }],
});
