import { expect, test } from '@playwright/test';
import { authFile, patient, SHOP } from '../support';

// a 1 x 1 px PNG: a photo of the space, as far as the upload is concerned
const PHOTO = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

test.use({ storageState: authFile('priya') });

test('a client sets a bench with walnut trim, a rear case, a finish, a door hinged on the right and a working load in pounds, attaches a photo and asks for an estimate; the owner sees the photo and the choices', async ({
  page,
  browser,
}) => {
  await page.goto('/');
  await page.getByRole('link', { name: 'Configure the rolling assembly bench' }).click();
  await expect(page.getByRole('heading', { name: 'Rolling assembly bench', level: 1 })).toBeVisible();
  const budget = page.getByLabel('Budget range');
  await expect(budget).toBeVisible({ timeout: patient(20_000) });

  // the trim's wood, from the shop's lumber by name
  await page.getByLabel('Trim wood').selectOption('walnut-4-4');
  await expect(page.getByLabel('Trim wood')).toHaveValue('walnut-4-4');
  // a rear case back to back with the main case
  await expect(page.getByRole('group', { name: /^Case \d: / })).toHaveCount(3);
  await page.getByRole('button', { name: 'Add a rear case, back to back' }).click();
  await expect(page.getByRole('group', { name: /^Case 4: back row, facing the back/ })).toBeVisible();
  // a finish and its coats
  await page.getByLabel('Finish', { exact: true }).selectOption('hardwax-oil');
  await page.getByLabel('Coats').selectOption('2');
  await expect(page.getByText('This cannot be built as set:')).toHaveCount(0);
  await expect(budget).toHaveText(/^\$[\d,]+\.\d\d to \$[\d,]+\.\d\d$/, { timeout: patient(20_000) });

  // the first rear cabinet's door hinged on the right: the drawing's door swings the other way
  const drawing = page.getByRole('figure', { name: 'Drawing of the rolling assembly bench' });
  await expect(drawing).not.toHaveClass(/opacity-60/, { timeout: patient(20_000) });
  const drawn = await drawing.innerHTML();
  const hinge = page.getByLabel('Case 2, Bay 1, Section 1 Hinged on');
  await expect(hinge).toHaveValue('left');
  await hinge.selectOption('right');
  await expect.poll(() => drawing.innerHTML(), { timeout: patient(20_000) }).not.toBe(drawn);

  // the working load in pounds, with its caution; the casters' check follows it, in pounds
  const load = page.getByLabel(/^Working load/);
  await expect(load).toHaveValue('441 lb');
  await expect(page.getByText(/the shop’s estimate, not a rating: the casters’ own rated load governs/)).toBeVisible();
  const casters = page.getByText(/^Each caster carries up to [\d,.]+ lb \(one assumed off the floor\)/);
  await expect(casters).toBeVisible({ timeout: patient(20_000) });
  const perCaster = (text: string | null) => Number(/up to ([\d,.]+) lb/.exec(text ?? '')?.[1]?.replace(',', ''));
  const heavier = perCaster(await casters.textContent());
  await load.fill('300');
  await expect
    .poll(async () => perCaster(await casters.textContent()), { timeout: patient(20_000) })
    .toBeLessThan(heavier);
  await expect(page.getByText('This cannot be built as set:')).toHaveCount(0);
  await expect(budget).toHaveText(/^\$[\d,]+\.\d\d to \$[\d,]+\.\d\d$/);

  await page.getByLabel('Anything the shop should know').fill('For the garage; a rear case for clamps.');
  await page.getByRole('button', { name: 'Request an estimate' }).click();
  await expect(page).toHaveURL(/\/projects\/[0-9a-f-]+$/);
  const projectId = page.url().split('/').at(-1)!;
  await page.getByLabel('Attach a photo, sketch or PDF').setInputFiles({
    name: 'garage-corner.png',
    mimeType: 'image/png',
    buffer: PHOTO,
  });
  await expect(page.getByRole('img', { name: 'garage-corner.png' })).toBeVisible({ timeout: patient(20_000) });

  // the owner opens the request: the photo, the piece, and its choices in the priced lines
  const shop = await browser.newContext({ storageState: authFile('owner'), baseURL: SHOP });
  const owner = await shop.newPage();
  await owner.goto(`/requests/${projectId}`);
  await expect(owner.getByText('1 x Rolling assembly bench')).toBeVisible();
  await expect(owner.getByText('For the garage; a rear case for clamps.')).toBeVisible();
  await expect(owner.getByRole('img', { name: 'garage-corner.png' })).toBeVisible();
  await owner.getByRole('button', { name: 'Price an estimate' }).click();
  await expect(owner.getByRole('heading', { name: /Estimate E-[0-9A-F]{6}, revision 1 \(draft\)/ })).toBeVisible({
    timeout: patient(60_000),
  });
  await expect(owner.getByText(/Black walnut, 4\/4/).first()).toBeVisible();
  await expect(owner.getByText(/Hardwax oil/).first()).toBeVisible();
  await expect(owner.getByText(/door hinged on the right/).first()).toBeVisible();
  // four cases under the top: the cut list names them
  await owner.getByRole('button', { name: 'Show the cut list and sheet layouts' }).click();
  await expect(owner.getByRole('table', { name: /Cut list: Rolling assembly bench/ })).toBeVisible({
    timeout: patient(30_000),
  });
  await shop.close();
});
