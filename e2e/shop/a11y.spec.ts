import { expect, test, type Page } from '@playwright/test';
import { checkNarrow, checkPage } from '../a11y';
import { authFile } from '../support';

// every route of the shop app: the public ones as anyone, the rest as the owner and the builder, and a client
// (one test a page, so that a slow page has its own deadline)
const PUBLIC = ['/sign-in', '/accept-invitation', '/forgot-password', '/reset-password', '/confirm-email'];
const SIGNED_IN = [
  '/overview',
  '/board',
  '/jobs/:job',
  '/requests',
  '/requests/:project',
  '/team',
  '/payments',
  '/mail',
  '/account',
];
/** the owner's own pages (a builder is shown that they are the owner's) */
const OWNER = ['/clients', '/clients/:client', '/price-book', '/settings'];
const PHONE = ['/board', '/jobs/:job'];

/** The path with a job on the board (and its project) in place of `:job` and `:project`. */
async function resolve(page: Page, path: string) {
  if (!path.includes(':')) return path;
  if (path.includes(':client')) {
    const r = await page.request.get('/api/clients');
    expect(r.status()).toBe(200);
    const client = ((await r.json()) as { clients: { id: string }[] }).clients[0];
    expect(client, 'a client').toBeTruthy();
    return path.replace(':client', client!.id);
  }
  const r = await page.request.get('/api/jobs');
  expect(r.status()).toBe(200);
  const job = ((await r.json()) as { jobs: { id: string; project: { id: string } }[] }).jobs[0];
  expect(job, 'a job on the board').toBeTruthy();
  return path.replace(':job', job!.id).replace(':project', job!.project.id);
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
    for (const path of SIGNED_IN)
      test(`${path}: one h1, no serious or critical axe violation`, async ({ page }) => {
        await checkPage(page, await resolve(page, path));
      });
    for (const path of role === 'owner' ? OWNER : [])
      test(`${path}: one h1, no serious or critical axe violation`, async ({ page }) => {
        await checkPage(page, await resolve(page, path));
      });
    for (const path of PHONE)
      test(`${path}: fits a 375 px phone without sideways scrolling`, async ({ page }) => {
        await checkNarrow(page, await resolve(page, path));
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
