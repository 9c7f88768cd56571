import { defineConfig } from '@playwright/test';
import { urls } from '../scripts/ports';

// deadlines, not waits: a spec ends as soon as what it waits for is true (E2E_TIME_SCALE stretches them on a busy machine)
const scale = Number(process.env.E2E_TIME_SCALE ?? 1) || 1;

/** E2E specs against the stack as the start command runs it (scripts/stack.ts), in Debian's Chromium. */
export default defineConfig({
  testDir: '.',
  timeout: 90_000 * scale,
  expect: { timeout: 15_000 * scale },
  workers: 1,
  retries: 0,
  reporter: [['list'], ['json', { outputFile: process.env.PW_JSON ?? 'test-results/e2e.json' }]],
  use: {
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
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
  },
  projects: [
    { name: 'setup', testMatch: /auth\.setup\.ts/ },
    {
      name: 'customer',
      testMatch: /customer\/.*\.spec\.ts/,
      dependencies: ['setup'],
      use: { baseURL: urls.portal },
    },
    {
      name: 'shop',
      testMatch: /shop\/.*\.spec\.ts/,
      dependencies: ['setup'],
      use: { baseURL: urls.shop },
    },
  ],
});
