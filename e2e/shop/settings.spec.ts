import { expect, test, type Page } from '@playwright/test';
import { authFile, patient } from '../support';

test.use({ storageState: authFile('owner') });

/** Sets the tax rate on the settings page and waits for the save. */
async function setTaxRate(page: Page, percent: string) {
  await page.goto('/settings');
  const field = page.getByLabel('Sales tax rate (%)');
  await expect(field).toHaveValue(/\d/);
  await field.fill(percent);
  const saved = page.waitForResponse((r) => r.request().method() === 'PATCH' && r.url().endsWith('/api/settings'));
  await page.getByRole('button', { name: 'Save the settings' }).click();
  expect((await saved).ok()).toBe(true);
  await expect(page.getByText('Settings saved.', { exact: false })).toBeVisible();
  await expect(field).toHaveValue(percent);
}

test('the owner changes the tax rate and sees it on a newly priced revision', async ({ page }) => {
  await page.goto('/overview');
  await page.getByRole('link', { name: 'Settings' }).click();
  await expect(page.getByRole('heading', { name: 'Settings' })).toBeVisible();
  // every section of the page
  for (const section of ['The shop', 'Money', 'The shop floor', 'The board', 'Capacity'])
    await expect(page.getByRole('heading', { name: section, exact: true })).toBeVisible();

  // a rate the engine refuses is named beside its field, and nothing is saved
  await page.getByLabel('Sales tax rate (%)').fill('90');
  await page.getByRole('button', { name: 'Save the settings' }).click();
  await expect(page.getByText('Some settings need attention', { exact: false })).toBeVisible();
  await expect(page.getByLabel('Sales tax rate (%)')).toHaveAttribute('aria-invalid', 'true');

  // no tax at all: the next revision shows it exactly
  await setTaxRate(page, '0');
  try {
    await page.goto('/requests');
    await page.getByRole('link', { name: "Alder Cross Makers' Guild" }).click();
    await page.getByRole('button', { name: /^Price (an estimate|a new revision)$/ }).click();
    const draft = page.getByRole('heading', { name: /Estimate E-[0-9A-F]{6}, revision (\d+) \(draft\)/ });
    await expect(draft).toBeVisible({ timeout: patient(20_000) });
    await expect(page.getByLabel('Tax')).toHaveText('$0.00');
    await expect(page.getByLabel('Total')).not.toHaveText('$0.00');
  } finally {
    // the demo's rate again, for the specs after this one
    await setTaxRate(page, '8.25');
  }
});
