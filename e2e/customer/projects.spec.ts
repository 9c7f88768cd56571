import { expect, test } from '@playwright/test';
import { authFile, patient, PORTAL, STRIPE } from '../support';

test.use({ storageState: authFile('priya') });

test("a demo client sees her own request, and no one else's", async ({ page }) => {
  await page.goto('/projects');
  const list = page.getByRole('list', { name: 'My projects' });
  await expect(list.getByRole('heading', { name: 'Rolling assembly bench' })).toBeVisible();
  await expect(list.getByRole('listitem')).toHaveCount(1);
  await expect(page.getByText('Bookcase')).toHaveCount(0);
});

test('she reads the sent estimate, accepts it by typing her name, and pays the deposit on the test card page', async ({
  page,
}) => {
  await page.goto('/projects');
  await page.getByRole('link', { name: 'Rolling assembly bench' }).click();
  await expect(page.getByLabel('Status')).toHaveText('Estimate ready to review');
  await expect(page.getByRole('heading', { name: /Estimate E-[0-9A-F]{6}, revision 1/ })).toBeVisible();
  await expect(
    page.getByRole('table', { name: 'Priced items' }).getByRole('cell', { name: 'Total', exact: true }),
  ).toBeVisible();
  const pdf = page.getByRole('link', { name: 'Download the PDF' });
  const res = await page.request.get((await pdf.getAttribute('href')) as string);
  expect(res.headers()['content-type']).toBe('application/pdf');

  await page.getByRole('button', { name: 'Accept the estimate' }).click();
  await expect(page.getByText('type your full name to accept')).toBeVisible();
  await page.getByLabel('Your full name').fill('Priya Natarajan');
  await page.getByRole('button', { name: 'Accept the estimate' }).click();
  await expect(page.getByText(/^Accepted by Priya Natarajan\./)).toBeVisible();
  await expect(page.getByLabel('Status')).toHaveText('Accepted, deposit due');

  await page.getByRole('button', { name: 'Pay the deposit' }).click();
  await expect(page).toHaveURL((u) => u.href.startsWith(`${STRIPE}/pay/cs_test_`));
  await page.getByLabel('Card number').fill('4000 0000 0000 0002');
  await page.getByLabel('Expiry (MM/YY)').fill('12/34');
  await page.getByLabel('Security code').fill('123');
  await page.getByLabel('Name on card').fill('Priya Natarajan');
  await page.getByRole('button', { name: /^Pay \$/ }).click();
  await expect(page.getByRole('alert')).toContainText('Your card was declined');
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry (MM/YY)').fill('12/34');
  await page.getByLabel('Security code').fill('123');
  await page.getByLabel('Name on card').fill('Priya Natarajan');
  await page.getByRole('button', { name: /^Pay \$/ }).click();

  await expect(page).toHaveURL(
    (u) =>
      u.href.startsWith(`${PORTAL}/projects/`) && u.searchParams.get('session_id')?.startsWith('cs_test_') === true,
  );
  await expect(page.getByText('your deposit is paid and your piece is on our production board')).toBeVisible({
    timeout: patient(20_000),
  });
  await expect(page.getByLabel('Status')).toHaveText('Deposit paid');
  await expect(page.getByRole('list', { name: 'Timeline' })).toContainText('Deposit of');
});
