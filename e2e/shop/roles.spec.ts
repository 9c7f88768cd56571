import { expect, test } from '@playwright/test';
import { authFile, linkIn, mailTo, signIn, SHOP, patient } from '../support';

test.describe('the owner', () => {
  test.use({ storageState: authFile('owner') });

  test('invites a builder, whose mail leads to a set-password page; the builder then sees only the board', async ({
    page,
    browser,
  }) => {
    const email = `builder-${Date.now()}@fernhill.example`;
    await page.goto('/team');
    await page.getByLabel("Builder's name").fill('Sam Reed');
    await page.getByLabel("Builder's e-mail").fill(email);
    await page.getByRole('button', { name: 'Send invitation' }).click();
    await expect(page.getByText(`Invitation sent to ${email}.`)).toBeVisible();
    await expect(page.getByRole('cell', { name: email })).toBeVisible();

    const mail = await mailTo(email, /invited to the Fernhill Joinery shop app/);
    const builder = await browser.newPage();
    await builder.goto(linkIn(mail));
    await expect(builder.getByRole('heading', { name: 'Set your password' })).toBeVisible();
    await builder.getByLabel('Password', { exact: true }).fill('sawdust-and-glue');
    await builder.getByRole('button', { name: 'Set password and sign in' }).click();
    const nav = builder.getByRole('navigation', { name: 'Shop' });
    await expect(nav.getByRole('link')).toHaveText(['Board']);
    await expect(builder.getByRole('heading', { name: 'Production board' })).toBeVisible();
    await builder.goto(`${SHOP}/team`);
    await expect(builder.getByText('Your role does not include this page.')).toBeVisible();
    await builder.close();
  });

  test('sees the open requests, and the paid job on the board', async ({ page }) => {
    await page.goto('/requests');
    // (the other specs move Priya's bench to the board and send the guild's estimate; the guild stays a request)
    await expect(page.getByRole('cell', { name: "Alder Cross Makers' Guild" })).toBeVisible();
    await expect(page.getByRole('cell', { name: 'Tomasz Wierzbicki' })).toHaveCount(0);
    await page.goto('/board');
    await expect(page.getByRole('article', { name: 'Job for Tomasz Wierzbicki' })).toBeVisible();
  });

  test('reads the overview: money accepted and collected this month, the share of estimates accepted, hours by job', async ({
    page,
  }) => {
    await page.goto('/requests');
    await page.getByRole('navigation', { name: 'Shop' }).getByRole('link', { name: 'Overview' }).click();
    await expect(page.getByRole('group', { name: /^Accepted in / })).toContainText(/\$[1-9][\d,]*\.\d\d/);
    await expect(page.getByRole('group', { name: /^Deposits collected in / })).toContainText(/\$[1-9][\d,]*\.\d\d/);
    await expect(page.getByRole('group', { name: 'Estimates accepted' })).toContainText(/\d+%/);
    await expect(
      page.getByRole('table', { name: 'Hours by job' }).getByRole('row', { name: /Tomasz Wierzbicki/ }),
    ).toBeVisible();
  });

  test('sets the job’s due date on its traveller, and the board shows it', async ({ page }) => {
    await page.goto('/board');
    await page
      .getByRole('article', { name: 'Job for Tomasz Wierzbicki' })
      .getByRole('link', { name: /Traveler/ })
      .click();
    const form = page.getByRole('form', { name: 'Assign the job' });
    await expect(form.getByLabel('Builder')).toHaveValue(/.+/);
    await form.getByLabel('Due').fill('2026-12-24');
    await form.getByRole('button', { name: 'Save' }).click();
    await expect(form.getByText('Saved.')).toBeVisible();
    await expect(page.getByText(/due Dec 24, 2026/).first()).toBeVisible();
    await page.goto('/board');
    await expect(
      page.getByRole('article', { name: 'Job for Tomasz Wierzbicki' }).getByText(/due Dec 24, 2026/),
    ).toBeVisible();
  });
});

test('the demo builder sees only the board', async ({ page }) => {
  await signIn(page, SHOP, 'idris@fernhill.example');
  await expect(page.getByRole('navigation', { name: 'Shop' }).getByRole('link')).toHaveText(['Board']);
});

test('a client who signs in to the shop app is told it is for the shop', async ({ page }) => {
  await page.goto(`${SHOP}/sign-in`);
  await page.getByLabel('E-mail').fill('tomasz@example.com');
  await page.getByLabel('Password').fill('bench-demo-2026');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'This app is for the shop' })).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'Shop' })).toHaveCount(0);
});

test.describe('the owner, on payments', () => {
  test.use({ storageState: authFile('owner') });

  test('refunds part of a paid deposit through the card processor and sees it confirmed', async ({ page }) => {
    await page.goto('/payments');
    const table = page.getByRole('table', { name: 'Payments' });
    // Tomasz's deposit, paid in the seed
    const row = table.getByRole('row').filter({ hasText: 'Tomasz Wierzbicki' }).filter({ hasText: 'deposit' });
    await expect(row.getByRole('cell', { name: 'paid', exact: true })).toBeVisible();
    const form = row.getByRole('form', { name: /Refund Tomasz Wierzbicki's deposit/ });
    await form.getByLabel('Amount to refund').fill('99999');
    await form.getByRole('button', { name: 'Refund' }).click();
    await expect(form.getByRole('alert')).toHaveText(/at most \$[\d,]+\.\d\d is left to refund/);
    await form.getByLabel('Amount to refund').fill('25');
    page.once('dialog', (d) => void d.accept());
    await form.getByRole('button', { name: 'Refund' }).click();
    await expect(row.getByRole('cell', { name: 'partly refunded' })).toBeVisible({ timeout: patient(20_000) });
    await expect(row.getByRole('cell', { name: '$25.00' })).toBeVisible();
  });
});
