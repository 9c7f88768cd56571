/**
 * The portal's first load, cold, in Chromium: bytes transferred (as sent on the wire, so gzipped where the server
 * compresses) and the time until the configurator is usable (its Width field enabled and its drawing visible).
 * A fresh browser per load, so nothing is cached. Against a stack already running (dev or --prod):
 *
 *   pnpm exec tsx e2e/bench/first-load.ts [--runs 5] [--url http://127.0.0.1:5173/designs/assembly-bench]
 */
import { chromium } from '@playwright/test';
import { parseArgs } from 'node:util';
import { urls } from '../../scripts/ports';

const { values } = parseArgs({
  options: {
    runs: { type: 'string', default: '5' },
    url: { type: 'string', default: `${urls.portal}/designs/assembly-bench` },
  },
});
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const kb = (n: number) => `${(n / 1024).toFixed(1)} KB`;

const results: { ms: number; total: number; app: number; requests: number }[] = [];
for (let i = 0; i < Number(values.runs); i++) {
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking'],
  });
  try {
    const page = await browser.newPage();
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
    const urls = new Map<string, string>();
    let total = 0;
    let app = 0;
    let requests = 0;
    cdp.on('Network.requestWillBeSent', (e) => urls.set(e.requestId, e.request.url));
    cdp.on('Network.loadingFinished', (e) => {
      requests++;
      total += e.encodedDataLength;
      if (!new URL(urls.get(e.requestId) ?? 'http://x/').pathname.startsWith('/api/')) app += e.encodedDataLength;
    });
    const started = performance.now();
    await page.goto(values.url, { waitUntil: 'commit' });
    await page.getByLabel('Width', { exact: true }).and(page.locator(':enabled')).waitFor({ timeout: 120_000 });
    await page
      .getByRole('figure', { name: /^Drawing of the/ })
      .locator('svg')
      .first()
      .waitFor({ timeout: 120_000 });
    const ms = performance.now() - started;
    results.push({ ms, total, app, requests });
    console.log(
      `load ${i + 1}: usable in ${Math.round(ms)} ms; ${requests} requests, ${kb(total)} (app files ${kb(app)})`,
    );
  } finally {
    await browser.close();
  }
}
console.log(
  `median of ${results.length}: usable in ${Math.round(median(results.map((r) => r.ms)))} ms; transfer ${kb(median(results.map((r) => r.total)))} (app files ${kb(median(results.map((r) => r.app)))}), ${median(results.map((r) => r.requests))} requests`,
);
