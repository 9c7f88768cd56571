import { expect, test } from '@playwright/test';
import { linkIn, mailTo } from '../support';

test('a new client signs up, follows the link in the verification mail, and is verified', async ({ page }) => {
  const email = `e2e-${Date.now()}@example.com`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Noor Example');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('short');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('use at least 10 characters')).toBeVisible();
  await expect(page.getByLabel('E-mail')).toHaveValue(email);
  await page.getByLabel('Password').fill('a-long-enough-password');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText(`We have sent a link to ${email}`)).toBeVisible();
  await expect(page.getByText(/No projects yet/)).toBeVisible();

  const mail = await mailTo(email, /Confirm your e-mail/);
  await page.goto(linkIn(mail));
  await expect(page.getByText(`your e-mail address ${email} is confirmed`)).toBeVisible();
  await page.getByRole('link', { name: 'Go to my projects' }).click();
  await expect(page.getByText(/not confirmed yet/)).toHaveCount(0);
});

test('a taken e-mail is refused, and what was typed stays', async ({ page }) => {
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Priya again');
  await page.getByLabel('E-mail').fill('priya@example.com');
  await page.getByLabel('Password').fill('a-long-enough-password');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText(/already exists/)).toBeVisible();
  await expect(page.getByLabel('Your name')).toHaveValue('Priya again');
});
