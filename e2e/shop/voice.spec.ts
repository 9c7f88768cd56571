import { expect, test } from '@playwright/test';
import { SHOP, signIn, patient } from '../support';

test('the traveler reads in pounds, feet and 1/32 in, and opens with the piece', async ({ page }) => {
  // the server lays the sheets out when the page opens: seconds on a busy machine
  test.setTimeout(patient(120_000));
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.goto('/board');
  await page
    .getByRole('article', { name: 'Job for Tomasz Wierzbicki' })
    .getByRole('link', { name: /Traveler/ })
    .click();
  const paper = page.getByRole('article', { name: 'Traveler for Tomasz Wierzbicki' });
  await expect(paper.getByRole('heading', { name: 'Traveler: Tomasz Wierzbicki' })).toBeVisible({
    timeout: patient(60_000),
  });
  await expect(paper.getByText(/about [\d,.]+ lb finished/)).toBeVisible();
  await expect(paper.getByText(/: [\d.]+ ft of edges to band/).first()).toBeVisible();
  await expect(
    paper
      .getByRole('table', { name: 'Cut list: Bookcase' })
      .getByRole('cell', { name: /\/32"$/ })
      .first(),
  ).toBeVisible();
  const piece = paper.getByRole('region', { name: 'Piece: Bookcase' });
  await expect(piece).toContainText(/" W x .*" H x .*" D/);
  await expect(piece).toContainText(/coats?/);
  await expect(piece).toContainText('reveal');
  await expect(
    paper.getByRole('table', { name: 'Pick list' }).getByRole('columnheader', { name: 'Qty' }),
  ).toBeVisible();
  await expect(paper.getByText(/4 x 8 sheets/)).toBeVisible();
  await expect(paper).not.toContainText(/\d kg\b| m of edges/);
});
