import { expect, test, type Locator, type Page } from '@playwright/test';
import { SHOP, signIn, patient } from '../support';

/** The server's answer to the next move of a job. */
const savedMove = (page: Page) =>
  page.waitForResponse((r) => r.request().method() === 'PATCH' && /\/api\/jobs\/[^/]+$/.test(r.url()));

/** Picks a card up by its grip with the keyboard, moves it one column right, and drops it once `to` is the target. */
async function dragOneColumnRight(page: Page, from: Locator, client: string, to: Locator) {
  const card = from.getByRole('article', { name: `Job for ${client}` });
  await card.getByRole('button', { name: new RegExp(`^${client}`) }).focus();
  await page.keyboard.press('Space');
  await expect(card).toHaveAttribute('data-dragging', 'true');
  await page.keyboard.press('ArrowRight');
  await expect(to).toHaveAttribute('data-over', 'true');
  await page.keyboard.press('Space');
}

test('the builder moves the paid bookcase on the board, drags it on, and logs hours against its budget', async ({
  page,
}) => {
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.goto('/board');
  const casework = page.getByRole('region', { name: 'Casework' });
  const card = casework.getByRole('article', { name: 'Job for Tomasz Wierzbicki' });
  await expect(card).toBeVisible();
  await expect(card.getByText('Builder: Idris Kane')).toBeVisible();

  const saved = savedMove(page);
  await card.getByLabel('Move Tomasz Wierzbicki to').selectOption({ label: 'Drawers & doors' });
  expect((await saved).ok()).toBe(true);
  const dd = page.getByRole('region', { name: 'Drawers & doors' });
  await expect(dd.getByRole('article', { name: 'Job for Tomasz Wierzbicki' })).toBeVisible();

  // drag the card one column on, to Finish, with the keyboard: pick it up, wait for the column to be the
  // drop target, drop it (no pointer arithmetic, so the board's own scrolling cannot move the target)
  const target = page.getByRole('region', { name: 'Finish' });
  const dropped = savedMove(page);
  await dragOneColumnRight(page, dd, 'Tomasz Wierzbicki', target);
  expect((await dropped).ok()).toBe(true);
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

test('a move to Ready asks first, however it is made, and cancelling leaves the job where it was', async ({ page }) => {
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.goto('/board');
  const finish = page.getByRole('region', { name: 'Finish' });
  const ready = page.getByRole('region', { name: 'Ready' });
  const inFinish = finish.getByRole('article', { name: 'Job for Tomasz Wierzbicki' });
  await expect(inFinish).toBeVisible();
  // the seven columns do not fit: the board says there is more to the right
  await expect(page.getByText('More columns to the right: scroll sideways')).toBeVisible();

  // dragged (with the keyboard) onto Ready
  await dragOneColumnRight(page, finish, 'Tomasz Wierzbicki', ready);
  const ask = page.getByRole('dialog', { name: 'Move Tomasz Wierzbicki to Ready?' });
  await expect(ask).toBeVisible();
  await expect(ask).toContainText('ask for the balance');
  await ask.getByRole('button', { name: 'Cancel' }).click();
  await expect(ask).toBeHidden();
  await expect(inFinish).toBeVisible();
  await expect(ready.getByRole('article')).toHaveCount(0);

  // chosen in its "Move to" list; Escape cancels too
  await inFinish.getByLabel('Move Tomasz Wierzbicki to').selectOption({ label: 'Ready' });
  await expect(ask).toBeVisible();
  await page.keyboard.press('Escape');
  await expect(ask).toBeHidden();
  await expect(inFinish.getByLabel('Move Tomasz Wierzbicki to')).toHaveValue('finish');

  await page.reload();
  await expect(inFinish).toBeVisible();
  await expect(ready.getByRole('article')).toHaveCount(0);
});

test('the builder opens the job’s traveller from its card: cut list, drawn sheets, pick list, cautions, no prices', async ({
  page,
}) => {
  // the server lays the sheets out when the page opens: seconds on a busy machine
  test.setTimeout(patient(120_000));
  await signIn(page, SHOP, 'idris@fernhill.example');
  await page.goto('/board');
  const card = page.getByRole('article', { name: 'Job for Tomasz Wierzbicki' });
  await card.getByRole('link', { name: /Traveler/ }).click();
  const paper = page.getByRole('article', { name: 'Traveler for Tomasz Wierzbicki' });
  await expect(paper.getByRole('heading', { name: 'Traveler: Tomasz Wierzbicki' })).toBeVisible({
    timeout: patient(60_000),
  });
  const cutList = paper.getByRole('table', { name: 'Cut list: Bookcase' });
  await expect(cutList.getByRole('row').nth(1)).toBeVisible();
  expect(await cutList.getByRole('row').count()).toBeGreaterThan(4);
  // each sheet is drawn to scale with its parts labelled
  const sheet = paper.getByRole('figure', { name: /sheet 1$/ }).first();
  await expect(sheet.locator('svg rect').first()).toBeVisible();
  await expect(paper.getByText(/Sheet 1: \d+% used, \d+ cuts/).first()).toBeVisible();
  await expect(paper.getByRole('table', { name: 'Pick list' }).getByRole('row').nth(1)).toBeVisible();
  await expect(paper.getByText(/blade guard and riving knife on/)).toBeVisible();
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
