import { defineConfig } from '@playwright/test'

// The browser suite runs against the app as `npm start` serves it (built web app, API, fake SMTP),
// but on the e2e test database that scripts/test.mjs prepares. Never `playwright install`: Debian's chromium is used.
const port = Number(process.env.E2E_PORT ?? 3100)
export const baseURL = `http://127.0.0.1:${port}`

export default defineConfig({
  testDir: 'tests/e2e',
  outputDir: 'tests/artifacts/results',
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [['list'], ['json', { outputFile: '.data/playwright-report.json' }]],
  use: {
    baseURL,
    testIdAttribute: 'data-test',
    screenshot: 'only-on-failure',
    trace: 'off',
    viewport: { width: 1280, height: 800 },
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--disable-dev-shm-usage',
      ],
    },
  },
  webServer: {
    command: 'node_modules/.bin/tsx apps/api/src/server.ts',
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    stdout: 'ignore',
    stderr: 'pipe',
    env: {
      NODE_ENV: 'test',
      PORT: String(port),
      PUBLIC_URL: baseURL,
      DATABASE_URL: process.env.E2E_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/ebullio_e2e_test',
      FAKE_SMTP: 'true',
      FAKE_SMTP_PORT: String(port + 26),
      SERVE_WEB: 'true',
      LOG_LEVEL: 'warn',
      RATE_LIMIT_SIGNIN_PER_IP: '1000',
      // markup in the configured lab name must stay text (tests/e2e/accounts.spec.ts)
      LAB_NAME: 'Halvorsen <b>Solvent</b> Recovery Lab',
    },
  },
})
