import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';

/**
 * Opens a page and checks it as a person with a screen reader or a phone would meet it: one `h1`, and no serious or
 * critical axe violation (labelled controls included). Waits for the page's heading, then for the network to settle,
 * so the page is checked as it stands once loaded.
 */
export async function checkPage(page: Page, path: string) {
  await page.goto(path);
  await expect(page.locator('h1').first(), `${path} has an h1`).toBeVisible();
  await page.waitForLoadState('networkidle');
  await expect(page.locator('h1'), `${path} has one h1`).toHaveCount(1);
  const { violations } = await new AxeBuilder({ page }).analyze();
  const bad = violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.impact} ${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`);
  expect(bad, `axe on ${path}`).toEqual([]);
}

/** The page fits a 375 px wide phone: nothing makes the whole page scroll sideways. */
export async function checkNarrow(page: Page, path: string) {
  await page.setViewportSize({ width: 375, height: 740 });
  await page.goto(path);
  await expect(page.locator('h1').first()).toBeVisible();
  await page.waitForLoadState('networkidle');
  const { scrollWidth, innerWidth } = await page.evaluate(() => ({
    scrollWidth: document.scrollingElement!.scrollWidth,
    innerWidth: window.innerWidth,
  }));
  expect(scrollWidth, `${path} at 375 px scrolls sideways`).toBeLessThanOrEqual(innerWidth);
}
