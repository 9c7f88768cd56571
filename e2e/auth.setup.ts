import { test as setup } from '@playwright/test';
import { authFile, PORTAL, SHOP, signIn } from './support';

// Signed-in state per role, saved once and reused by the specs.
setup('the owner signs in to the shop app', async ({ page }) => {
  await signIn(page, SHOP, 'maren@fernhill.example');
  await page.context().storageState({ path: authFile('owner') });
});

setup('a demo client signs in to the portal', async ({ page }) => {
  await signIn(page, PORTAL, 'priya@example.com');
  await page.context().storageState({ path: authFile('priya') });
});

setup('the builder signs in to the shop app', async ({ page }) => {
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.context().storageState({ path: authFile('builder') });
});
