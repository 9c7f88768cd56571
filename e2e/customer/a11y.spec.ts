import { expect, test } from '@playwright/test';
import { checkNarrow, checkPage } from '../a11y';
import { authFile } from '../support';

// every route of the portal: the public ones as anyone, all of them as a client
const PUBLIC = [
  '/',
  '/designs/assembly-bench',
  '/sign-up',
  '/sign-in',
  '/verify-email',
  '/forgot-password',
  '/reset-password',
  '/confirm-email',
];

test.describe('the portal, signed out', () => {
  for (const path of PUBLIC)
    test(`${path}: one h1, no serious or critical axe violation`, async ({ page }) => {
      await checkPage(page, path);
    });
});

test.describe('the portal, as a client', () => {
  test.use({ storageState: authFile('priya') });

  async function clientPaths(page: import('@playwright/test').Page) {
    const r = await page.request.get('/api/projects');
    expect(r.status()).toBe(200);
    const { projects } = (await r.json()) as { projects: { id: string }[] };
    expect(projects.length).toBeGreaterThan(0);
    return [
      ...PUBLIC.filter((p) => p !== '/sign-in' && p !== '/sign-up'),
      '/projects',
      `/projects/${projects[0]!.id}`,
      '/account',
    ];
  }

  test('every page: one h1, no serious or critical axe violation', async ({ page }) => {
    for (const path of await clientPaths(page)) await checkPage(page, path);
  });

  test('every page fits a 375 px phone without sideways scrolling', async ({ page }) => {
    for (const path of await clientPaths(page)) await checkNarrow(page, path);
  });
});
