import { expect, test } from '@playwright/test';
import { authFile, mailTo } from '../support';

// runs after projects.spec.ts (which counts Priya's projects), so her new request does not disturb it
test.use({ storageState: authFile('priya') });

test('a client sets a wall cabinet to her space, sees the drawing and budget change, is told what cannot be built, and asks for an estimate', async ({
  page,
}) => {
  await page.goto('/');
  await page.getByRole('link', { name: 'Configure the wall cabinet' }).click();
  await expect(page.getByRole('heading', { name: 'Wall cabinet', level: 1 })).toBeVisible();
  const budget = page.getByLabel('Budget range');
  await expect(budget).toHaveText(/^\$[\d,]+\.\d\d to \$[\d,]+\.\d\d$/);
  await expect(page.getByRole('figure', { name: 'Drawing of the wall cabinet' }).locator('svg')).toBeVisible();
  const before = await budget.textContent();

  // wider costs more
  await page.getByLabel('Width', { exact: true }).fill('40');
  await expect(budget).not.toHaveText(before ?? '');
  // too tall is refused, with the limit
  await page.getByLabel('Height', { exact: true }).fill('60');
  await expect(page.getByText('This cannot be built as set:')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Request an estimate' })).toBeDisabled();
  await page.getByLabel('Height', { exact: true }).fill('30 1/2');
  await expect(page.getByText('This cannot be built as set:')).toHaveCount(0);
  await expect(budget).toBeVisible();
  // a typing slip is caught beside the field and changes nothing
  await page.getByLabel('Depth', { exact: true }).fill('12 ft deep');
  await expect(page.locator('#dim-depth-error')).toBeVisible();
  await page.getByLabel('Depth', { exact: true }).fill('12');

  // the standard piece comes back with one click, in the fields too
  await page.getByRole('button', { name: 'Back to our standard piece' }).click();
  await expect(page.getByLabel('Width', { exact: true })).toHaveValue('30"');
  await page.getByLabel('Width', { exact: true }).fill('40');
  await page.getByLabel('Anything the shop should know').fill('Over the laundry sink, painted later.');
  await page.getByRole('button', { name: 'Request an estimate' }).click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]+$/);
  await expect(page.getByText('We are working out your estimate')).toBeVisible();
  // she writes to the shop; it goes on the timeline and to the owner by e-mail
  await page.getByRole('textbox', { name: 'Write to the shop' }).fill('Could the doors be inset instead?');
  await page.getByRole('button', { name: 'Send' }).click();
  await expect(
    page.getByRole('list', { name: 'Timeline' }).getByText('Could the doors be inset instead?'),
  ).toBeVisible();
  await expect(page.getByRole('textbox', { name: 'Write to the shop' })).toHaveValue('');
  const mail = await mailTo('maren@fernhill.example', /A comment from Priya Natarajan/);
  expect(mail.text).toContain('Could the doors be inset instead?');
  await page.goto('/projects');
  await expect(page.getByRole('list').getByRole('listitem')).toHaveCount(2);
});
