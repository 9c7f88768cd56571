import { expect, test, type Page } from '@playwright/test';
import { authFile, patient } from '../support';

test.use({ storageState: authFile('owner') });

/** The unit price of the estimate line whose description starts with `what`, once the editor shows it. */
async function unitPriceOf(page: Page, what: string): Promise<string | undefined> {
  // an engine line's description is text in its row; a line the owner added has it in a field
  const row = page.getByRole('table', { name: 'Line items' }).getByRole('row').filter({ hasText: what }).first();
  if ((await row.count()) === 0) return undefined;
  return row.getByLabel(/^Line \d+ unit price$/).inputValue();
}

test('the owner changes the price of 3/4 in plywood and a new revision is priced with it', async ({ page }) => {
  await page.goto('/requests');
  await page.getByRole('navigation', { name: 'Shop' }).getByRole('link', { name: 'Price book' }).click();
  const sheets = page.getByRole('table', { name: 'Sheet goods' });
  await expect(sheets.getByRole('row', { name: /birch-ply-18/ })).toBeVisible();

  // a bad price is refused beside the field, and nothing changes
  await sheets.getByRole('button', { name: 'Edit birch-ply-18' }).click();
  await page.getByLabel('Price ($) of birch-ply-18').fill('-1');
  await sheets.getByRole('button', { name: 'Save' }).click();
  await expect(sheets.getByRole('alert')).toBeVisible();

  // $100.00 a sheet; with the demo shop's 35 % material markup (from demo-data.ts) a line prices it at $135.00
  await page.getByLabel('Price ($) of birch-ply-18').fill('100.00');
  await sheets.getByRole('button', { name: 'Save' }).click();
  await expect(sheets.getByRole('row', { name: /birch-ply-18/ })).toContainText('100.00');
  await expect(sheets.getByRole('button', { name: 'Edit birch-ply-18' })).toBeVisible();

  // the guild's wall cabinets are of 3/4 in birch plywood (revision 1 is priced by estimate.spec when it runs first)
  await page.goto('/requests');
  await page.getByRole('link', { name: "Alder Cross Makers' Guild" }).click();
  await page.getByRole('button', { name: /^Price (a new revision|an estimate)$/ }).click();
  await expect(page.getByRole('heading', { name: /Estimate E-[0-9A-F]{6}, revision \d+ \(draft\)/ })).toBeVisible({
    timeout: patient(30_000),
  });
  await expect.poll(() => unitPriceOf(page, '3/4 in birch plywood'), { timeout: patient(15_000) }).toBe('135.00');
});

test('the demo shop, being imperial, reads its price book in inches, feet and pounds', async ({ page }) => {
  await page.goto('/price-book');
  // the demo's 3/4 in birch plywood is 18.26 mm thick (demo-data.ts): 23/32 in to the nearest 1/32
  const sheets = page.getByRole('table', { name: 'Sheet goods' });
  await expect(sheets.getByRole('columnheader', { name: 'Thickness (in)', exact: true })).toBeVisible({
    timeout: patient(15_000),
  });
  await expect(sheets.getByRole('row', { name: /birch-ply-18/ })).toContainText('23/32');
  await expect(sheets.getByRole('row', { name: /birch-ply-18/ })).not.toContainText('18.26');
  // banding bought by the lineal foot: $0.80 a metre is $0.244 a foot
  const banding = page.getByRole('table', { name: 'Edge banding' });
  await expect(banding.getByRole('columnheader', { name: 'Price per ft ($)' })).toBeVisible();
  await expect(banding.getByRole('row', { name: /walnut-banding-22/ })).toContainText('0.244');
  // a 100 kg caster rating reads 220 lb
  const hardware = page.getByRole('table', { name: 'Hardware' });
  await expect(hardware.getByRole('columnheader', { name: 'Rated load (lb)' })).toBeVisible();
  await expect(hardware.getByRole('row', { name: /caster-locking-5in/ })).toContainText('220');
  // labour standards by what they count, per foot of banding
  const labour = page.getByRole('table', { name: 'Labour operations' });
  await expect(labour.getByText('foot banded').first()).toBeVisible();
  await expect(labour.getByText('banding_metre')).toHaveCount(0);
});

test('the owner imports a CSV with one bad row and is shown the row; nothing can be confirmed', async ({ page }) => {
  const csv = await (await page.request.get('/api/price-book/lumber.csv')).text();
  const lines = csv.split('\r\n');
  const header = cells(lines[0]!);
  const price = header.indexOf('price_per_board_foot_usd');
  expect(price).toBeGreaterThan(0);
  const bad = cells(lines[2]!);
  bad[price] = '-1';
  const edited = [...lines.slice(0, 2), bad.join(','), ...lines.slice(3)].join('\r\n');

  await page.goto('/price-book');
  await page.getByLabel('Import lumber CSV').setInputFiles({
    name: 'lumber.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(edited, 'utf8'),
  });
  const preview = page.getByRole('region', { name: 'Import preview' });
  const errors = preview.getByRole('table', { name: 'Errors' });
  await expect(errors.getByRole('row', { name: /^3 price_per_board_foot_usd / })).toBeVisible({
    timeout: patient(15_000),
  });
  await expect(errors.getByRole('row')).toHaveCount(2);
  await expect(preview.getByRole('button', { name: 'Confirm the import' })).toBeDisabled();
});

/** A CSV line's cells as written (quotes kept), so that joining them with commas gives the line back. */
function cells(line: string): string[] {
  const out: string[] = [];
  let cur = '';
  let quoted = false;
  for (const ch of line) {
    if (ch === '"') quoted = !quoted;
    if (ch === ',' && !quoted) {
      out.push(cur);
      cur = '';
    } else cur += ch;
  }
  out.push(cur);
  return out;
}
