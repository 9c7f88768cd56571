import { expect, test, type Page } from '@playwright/test';
import { checkNarrow, checkPage } from '../a11y';
import { authFile } from '../support';

// every route of the shop app: the public ones as anyone, the rest as the owner, the builder and a client
const PUBLIC = ['/sign-in', '/accept-invitation', '/forgot-password', '/reset-password', '/confirm-email'];

/** The shop's routes with a real job and request in them, read from the API as the signed-in page sees it. */
async function shopPaths(page: Page) {
  const jobs = await page.request.get('/api/jobs');
  expect(jobs.status()).toBe(200);
  const job = ((await jobs.json()) as { jobs: { id: string; project: { id: string } }[] }).jobs[0];
  expect(job, 'a job on the board').toBeTruthy();
  return {
    all: [
      '/overview',
      '/board',
      `/jobs/${job!.id}`,
      '/requests',
      `/requests/${job!.project.id}`,
      '/team',
      '/payments',
      '/mail',
      '/account',
    ],
    phone: ['/board', `/jobs/${job!.id}`],
  };
}

test.describe('the shop app, signed out', () => {
  for (const path of PUBLIC)
    test(`${path}: one h1, no serious or critical axe violation`, async ({ page }) => {
      await checkPage(page, path);
    });
});

for (const role of ['owner', 'builder'] as const) {
  test.describe(`the shop app, as the ${role}`, () => {
    test.use({ storageState: authFile(role) });

    test('every page: one h1, no serious or critical axe violation', async ({ page }) => {
      for (const path of (await shopPaths(page)).all) await checkPage(page, path);
    });

    test('the board and the job page fit a 375 px phone without sideways scrolling', async ({ page }) => {
      for (const path of (await shopPaths(page)).phone) await checkNarrow(page, path);
    });
  });
}

test.describe('the shop app, as a client', () => {
  test.use({ storageState: authFile('priya') });
  test('is told the app is for the shop, on a page that passes axe', async ({ page }) => {
    await checkPage(page, '/board');
    await expect(page.getByRole('heading', { level: 1 })).toHaveText('This app is for the shop');
  });
});
