import { defineConfig, devices } from '@playwright/test';

// Browser tests run Debian's Chromium against the production build served by `vite preview`.
// No browser is downloaded: the executable path points at the system package.
// SEKUNDO_E2E_PORT lets a second checkout run its browser tests beside this one.
const PORT = Number(process.env.SEKUNDO_E2E_PORT ?? 4173);
const BASE_URL = `http://127.0.0.1:${PORT}`;

export default defineConfig({
  testDir: 'tests/e2e',
  testMatch: '**/*.spec.ts',
  outputDir: 'test-results',
  reporter: 'list',
  workers: 1,
  fullyParallel: false,
  forbidOnly: Boolean(process.env.CI),
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  use: {
    baseURL: BASE_URL,
    // Every test starts as a returning visitor, with the first-visit guides put away; tests of the
    // guides start from empty storage (tests/e2e/workspace-habits.spec.ts).
    storageState: {
      cookies: [],
      origins: [{ origin: BASE_URL, localStorage: [{ name: 'sekundo.prefs', value: '{"guides":"explorer,planner,converter,locate,resonator"}' }] }],
    },
    viewport: { width: 1280, height: 720 },
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
  },
  projects: [
    {
      name: 'chromium',
      use: {
        ...devices['Desktop Chrome'],
        viewport: { width: 1280, height: 720 },
        browserName: 'chromium',
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
    },
  ],
  webServer: {
    command: `npm run build && npx vite preview --config vite.config.ts --host 127.0.0.1 --port ${PORT} --strictPort`,
    url: BASE_URL,
    reuseExistingServer: !process.env.CI,
    timeout: 180_000,
    stdout: 'ignore',
    stderr: 'pipe',
  },
});
