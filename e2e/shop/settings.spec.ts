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
    // a request the owner takes by phone for a client (other specs leave drafts on the demo's requests)
    const clients = (await (await page.request.get('/api/clients')).json()) as { clients: { id: string }[] };
    const bookcase = (await (await page.request.get('/api/designs/bookcase')).json()) as {
      design: { defaults: unknown };
    };
    const made = await page.request.post('/api/projects', {
      data: {
        clientId: clients.clients[0]!.id,
        notes: 'Taken by phone: a bookcase like the one in the gallery.',
        items: [{ spec: bookcase.design.defaults, quantity: 1 }],
      },
    });
    expect(made.status()).toBe(201);
    const { project } = (await made.json()) as { project: { id: string } };
    await page.goto(`/requests/${project.id}`);
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
