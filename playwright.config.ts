import { defineConfig, devices } from '@playwright/test';
import { E2E } from './tests/helpers/test-services';

const baseURL = `http://127.0.0.1:${E2E.appPort}`;

// Debian's Chromium, never a downloaded browser. The flags keep it off the network it cannot reach.
const chromium = {
  executablePath: '/usr/bin/chromium',
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
};

export default defineConfig({
  testDir: 'tests/e2e',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  forbidOnly: Boolean(process.env.CI),
  timeout: 60_000,
  reporter: [['list'], ['json', { outputFile: '.data/reports/e2e.json' }]],
  use: { baseURL, trace: 'retain-on-failure', launchOptions: chromium },
  projects: [
    {
      name: 'desktop',
      use: { ...devices['Desktop Chrome'], launchOptions: chromium },
      testIgnore: /(mobile|my-wheels|runner|runner-procedure)\.spec/,
    },
    {
      name: 'phone',
      use: {
        ...devices['Pixel 5'],
        viewport: { width: 360, height: 640 },
        launchOptions: chromium,
      },
      testMatch: /(mobile|my-wheels|runner|runner-procedure)\.spec/,
    },
  ],
  webServer: {
    // Builds the app into .next-e2e and serves it against its own database and mail sink.
    command: 'node_modules/.bin/tsx --conditions=react-server tests/e2e/serve.ts',
    url: `${baseURL}/sign-in`,
    timeout: 240_000,
    reuseExistingServer: false,
    stdout: 'pipe',
    stderr: 'pipe',
  },
});
