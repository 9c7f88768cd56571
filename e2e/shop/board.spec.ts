import { expect, test } from '@playwright/test';
import { SHOP, signIn } from '../support';

test('the builder moves the paid bookcase on the board, drags it on, and logs hours against its budget', async ({
  page,
}) => {
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.goto('/board');
  const casework = page.getByRole('region', { name: 'Casework' });
  const card = casework.getByRole('article', { name: 'Job for Tomasz Wierzbicki' });
  await expect(card).toBeVisible();
  await expect(card.getByText('Builder: Idris Kane')).toBeVisible();

  await card.getByLabel('Move Tomasz Wierzbicki to').selectOption({ label: 'Drawers & doors' });
  const dd = page.getByRole('region', { name: 'Drawers & doors' });
  await expect(dd.getByRole('article', { name: 'Job for Tomasz Wierzbicki' })).toBeVisible();

  // drag the card by its title to the Finish column
  const handle = dd.getByRole('heading', { name: 'Tomasz Wierzbicki' });
  const target = page.getByRole('region', { name: 'Finish' });
  await target.scrollIntoViewIfNeeded();
  await page.waitForTimeout(300); // let the scroll settle before measuring
  const a = (await handle.boundingBox())!;
  const b = (await target.boundingBox())!;
  await page.mouse.move(a.x + 20, a.y + 5);
  await page.mouse.down();
  await page.mouse.move(a.x + 40, a.y + 5, { steps: 4 });
  await page.mouse.move(b.x + b.width / 2, b.y + 80, { steps: 20 });
  await page.mouse.up();
  const moved = target.getByRole('article', { name: 'Job for Tomasz Wierzbicki' });
  await expect(moved).toBeVisible();

  await moved.getByLabel('Hours', { exact: true }).fill('1.5');
  await moved.getByRole('button', { name: 'Log' }).click();
  await expect(moved.getByLabel('Hours used')).toContainText(/^1\.5 of \d+\.\d h used; this stage 1\.5 of/);
  await moved.getByLabel('Hours', { exact: true }).fill('30');
  await moved.getByRole('button', { name: 'Log' }).click();
  await expect(moved.getByText('enter between 0.1 and 24 hours')).toBeVisible();

  await page.reload();
  await expect(
    page.getByRole('region', { name: 'Finish' }).getByRole('article', { name: 'Job for Tomasz Wierzbicki' }),
  ).toBeVisible();
});

test('the builder opens the job’s traveller from its card: cut list, drawn sheets, pick list, cautions, no prices', async ({
  page,
}) => {
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.goto('/board');
  const card = page.getByRole('article', { name: 'Job for Tomasz Wierzbicki' });
  await card.getByRole('link', { name: /Traveller/ }).click();
  const paper = page.getByRole('article', { name: 'Traveller for Tomasz Wierzbicki' });
  await expect(paper.getByRole('heading', { name: 'Traveller: Tomasz Wierzbicki' })).toBeVisible();
  const cutList = paper.getByRole('table', { name: 'Cut list: Bookcase' });
  await expect(cutList.getByRole('row').nth(1)).toBeVisible();
  expect(await cutList.getByRole('row').count()).toBeGreaterThan(4);
  // each sheet is drawn to scale with its parts labelled
  const sheet = paper.getByRole('figure', { name: /sheet 1$/ }).first();
  await expect(sheet.locator('svg rect').first()).toBeVisible();
  await expect(paper.getByText(/Sheet 1: \d+ % used, \d+ cuts/).first()).toBeVisible();
  await expect(paper.getByRole('table', { name: 'Pick list' }).getByRole('row').nth(1)).toBeVisible();
  await expect(paper.getByText(/riving knife/)).toBeVisible();
  await expect(paper.getByText(/anchor this/i)).toBeVisible();
  await expect(paper).not.toContainText('$');
  // the same paper as a PDF
  const pdf = await page.request.get(
    await paper
      .getByRole('link', { name: 'Download PDF' })
      .getAttribute('href')
      .then((h) => new URL(h!, page.url()).href),
  );
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()['content-type']).toBe('application/pdf');
  expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
});
