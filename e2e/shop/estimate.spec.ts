import { expect, test } from '@playwright/test';
import { authFile, mailTo, patient } from '../support';

test.use({ storageState: authFile('owner') });

test("the owner prices the guild's request, changes a line with a reason, and sends it as a PDF by e-mail", async ({
  page,
}) => {
  await page.goto('/requests');
  await page.getByRole('link', { name: "Alder Cross Makers' Guild" }).click();
  await expect(page.getByText('2 x Wall cabinet')).toBeVisible();
  await page.getByRole('button', { name: 'Price an estimate' }).click();
  await expect(page.getByRole('heading', { name: /Estimate E-[0-9A-F]{6}, revision 1 \(draft\)/ })).toBeVisible({
    timeout: patient(20_000),
  });
  await expect(page.getByText(/Sheets: 3\/4 in birch plywood \d+ \(least possible \d+, yield \d+ ?%\)/)).toBeVisible();
  // the cut list and every sheet behind the sheet count
  await page.getByRole('button', { name: 'Show the cut list and sheet layouts' }).click();
  await expect(page.getByRole('table', { name: 'Cut list: Wall cabinet' }).getByRole('row').nth(1)).toBeVisible({
    timeout: patient(20_000),
  });
  await expect(page.getByRole('figure', { name: /3\/4 in birch plywood, sheet 1$/ }).locator('svg')).toBeVisible();
  const before = await page.getByLabel('Total').textContent();

  await page.getByLabel('Line 1 quantity').fill('3');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByText('say why this computed line changed')).toBeVisible();
  await expect(page.getByLabel('Line 1 quantity')).toHaveValue('3');
  await page.getByLabel('Line 1 reason').fill('one spare sheet for the grain match');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByText('Saved.')).toBeVisible();
  await expect(page.getByLabel('Total')).not.toHaveText(before ?? '');

  await page.getByRole('button', { name: 'Send to the client' }).click();
  await expect(page.getByRole('heading', { name: /revision 1 \(sent\)/ })).toBeVisible({ timeout: patient(20_000) });
  const mail = await mailTo('guild@example.com', /Your estimate from Fernhill Joinery \(revision 1\)/, 20_000);
  expect(mail.text).toContain('The PDF is attached');
});
