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

const desktop = { ...devices['Desktop Chrome'], launchOptions: chromium };
const phone = {
  ...devices['Pixel 5'],
  viewport: { width: 360, height: 640 },
  launchOptions: chromium,
};

export default defineConfig({
  testDir: 'tests/e2e',
  // Every test makes or reuses what it needs (tests/e2e/roles.ts), so tests run in any order, on two
  // workers (the machine's two cores; the server and the database share them). E2E_WORKERS=1 to compare.
  fullyParallel: true,
  workers: Number(process.env.E2E_WORKERS ?? 2),
  retries: 0,
  forbidOnly: Boolean(process.env.CI),
  timeout: 60_000,
  reporter: [['list'], ['json', { outputFile: '.data/reports/e2e.json' }]],
  use: { baseURL, trace: 'retain-on-failure', launchOptions: chromium },
  projects: [
    // Signs up one shop and its people through the product once and saves each role's signed-in
    // state under .data/e2e-auth (tests/e2e/roles.ts); every other project waits for it.
    { name: 'setup', testMatch: /auth\.setup\.ts/, use: desktop },
    {
      name: 'desktop',
      use: desktop,
      dependencies: ['setup'],
      testIgnore: /(mobile|my-wheels|runner|runner-procedure|offline|redeploy)\.spec/,
    },
    {
      name: 'phone',
      use: phone,
      dependencies: ['setup'],
      testMatch: /(mobile|my-wheels|runner|runner-procedure|offline)\.spec/,
    },
    // Stops the server and builds the app again mid-test: alone, after every other test.
    {
      name: 'redeploy',
      use: phone,
      dependencies: ['desktop', 'phone'],
      testMatch: /redeploy\.spec/,
    },
  ],
  webServer: {
    // Builds the app into .next-e2e and serves it against its own database and mail sink.
    command: 'node_modules/.bin/tsx --conditions=react-server tests/e2e/serve.ts',
    url: `${baseURL}/sign-in`,
    // ≈30 s to build on an idle machine; several minutes when other builds and checks share the cores.
    timeout: 600_000,
    reuseExistingServer: false,
    stdout: 'pipe',
    stderr: 'pipe',
  },
});
