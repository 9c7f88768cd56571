import { expect, test } from '@playwright/test';
import { authFile, patient } from '../support';

// the demo shop works in inches: what the client reads is in pounds and feet, not kilograms and metres
test.use({ storageState: authFile('priya') });

test('the configurator gives the weight in pounds and promises no exact price', async ({ page }) => {
  await page.goto('/');
  await page.getByRole('link', { name: 'Configure the bookcase' }).click();
  await expect(page.getByLabel('Budget range')).toHaveText(/^\$[\d,]+\.\d\d to \$[\d,]+\.\d\d$/, {
    timeout: patient(15_000),
  });
  await expect(page.getByText(/About [\d,.]+ lb each\./)).toBeVisible();
  await expect(page.getByText(/Your estimate comes from the shop/)).toBeVisible();
  await expect(page.getByText(/\bkg\b/)).toHaveCount(0);
  await expect(page.getByText(/will be exact|real cut list/)).toHaveCount(0);
});

test('the estimate page counts sheets and banding by the foot', async ({ page }) => {
  await page.goto('/projects');
  await page.getByRole('link', { name: 'Rolling assembly bench' }).click();
  const lines = page.getByRole('table', { name: 'Priced items' });
  await expect(lines.getByRole('cell', { name: /^\d+ sheets?$/ }).first()).toBeVisible();
  await expect(lines.getByRole('cell', { name: /^[\d.]+ ft$/ }).first()).toBeVisible();
  await expect(lines.getByRole('cell', { name: /^[\d.]+ m$/ })).toHaveCount(0);
  await expect(lines.getByRole('cell', { name: /^Shop time: Cutting$/ })).toBeVisible();
});
