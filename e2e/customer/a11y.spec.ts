import { expect, test, type Page } from '@playwright/test';
import { checkNarrow, checkPage } from '../a11y';
import { authFile } from '../support';

// every route of the portal: the public ones as anyone, all of them as a client (one test a page, so that a slow
// page has its own deadline)
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
const SIGNED_IN = [
  ...PUBLIC.filter((p) => p !== '/sign-in' && p !== '/sign-up'),
  '/projects',
  '/projects/:id',
  '/account',
];

/** The path with the client's first project in place of `:id`. */
async function resolve(page: Page, path: string) {
  if (!path.includes(':id')) return path;
  const r = await page.request.get('/api/projects');
  expect(r.status()).toBe(200);
  const { projects } = (await r.json()) as { projects: { id: string }[] };
  expect(projects.length).toBeGreaterThan(0);
  return path.replace(':id', projects[0]!.id);
}

test.describe('the portal, signed out', () => {
  for (const path of PUBLIC)
    test(`${path}: one h1, no serious or critical axe violation`, async ({ page }) => {
      await checkPage(page, path);
    });
});

test.describe('the portal, as a client', () => {
  test.use({ storageState: authFile('priya') });
  for (const path of SIGNED_IN) {
    test(`${path}: one h1, no serious or critical axe violation`, async ({ page }) => {
      await checkPage(page, await resolve(page, path));
    });
    test(`${path}: fits a 375 px phone without sideways scrolling`, async ({ page }) => {
      await checkNarrow(page, await resolve(page, path));
    });
  }
});
