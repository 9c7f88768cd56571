import { expect, test } from '@playwright/test';
import { authFile } from '../support';

test.use({ storageState: authFile('priya') });

test("a demo client sees her own request, and no one else's", async ({ page }) => {
  await page.goto('/projects');
  const list = page.getByRole('list', { name: 'My projects' });
  await expect(list.getByRole('heading', { name: 'Rolling assembly bench' })).toBeVisible();
  await expect(list.getByText('Estimate ready to review')).toBeVisible();
  await expect(list.getByRole('listitem')).toHaveCount(1);
  await expect(page.getByText('Bookcase')).toHaveCount(0);
});
