import { expect, type Page } from '@playwright/test';

import { urls } from '../scripts/ports';

export const PORTAL = urls.portal;
export const SHOP = urls.shop;
export const MAILDEV = urls.mail;
export const STRIPE = urls.stripe;
export const DEMO_PASSWORD = 'bench-demo-2026';

/**
 * Deadlines scale with E2E_TIME_SCALE (default 1) on a machine busier than the usual two spare cores: every wait in
 * the specs is for a condition, so a longer deadline costs nothing when things are quick.
 */
export const TIME_SCALE = Number(process.env.E2E_TIME_SCALE ?? 1) || 1;
export const patient = (ms: number) => Math.round(ms * TIME_SCALE);

export const authFile = (who: string) => `e2e/.auth/${who}.json`;

interface Mail {
  id: string;
  subject: string;
  text: string;
  to: { address: string }[];
}

/** Waits for a mail to `to` whose subject matches, read from maildev's REST API. */
export async function mailTo(to: string, subject: RegExp, timeoutMs = patient(15_000)): Promise<Mail> {
  let found: Mail | undefined;
  await expect
    .poll(
      async () => {
        const mails = (await (await fetch(`${MAILDEV}/api/email`)).json()) as Mail[];
        found = mails.filter((m) => m.to.some((t) => t.address === to) && subject.test(m.subject)).at(-1);
        return found !== undefined;
      },
      { timeout: timeoutMs, message: `no mail to ${to} matching ${subject} within ${timeoutMs} ms` },
    )
    .toBe(true);
  return found!;
}

export function linkIn(mail: Mail): string {
  const m = /(http:\/\/\S+token=[A-Za-z0-9_-]+)/.exec(mail.text);
  if (!m) throw new Error(`no link in the mail "${mail.subject}"`);
  return m[1];
}

export async function signIn(page: Page, base: string, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${base}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('button', { name: 'Sign out' })).toBeVisible();
}
