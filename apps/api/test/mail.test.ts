import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { MailDev } from 'maildev';
import { afterEach, assert, describe, expect, it } from 'vitest';
import { createMailWorker } from '../src/lib/mailer';
import { freePort, testApp } from './helpers';

const SMTP = await freePort();
const WEB = await freePort();
const quiet = { warn: () => undefined };
let maildev: MailDev | null = null;

async function startMaildev() {
  maildev = new MailDev({
    smtp: SMTP,
    web: WEB,
    ip: '127.0.0.1',
    webIp: '127.0.0.1',
    mailDirectory: mkdtempSync(join(tmpdir(), 'bw-mail-')),
    silent: true,
  });
  await maildev.start();
}
async function inbox(): Promise<{ subject: string; to: { address: string }[]; headers: Record<string, string> }[]> {
  return (await (await fetch(`http://127.0.0.1:${WEB}/api/email`)).json()) as never;
}
afterEach(async () => {
  await maildev?.stop();
  maildev = null;
});

describe('the outbox worker over real SMTP (maildev)', () => {
  it('sends a queued message within one tick and marks it sent', async () => {
    await startMaildev();
    const t = await testApp();
    await t.agent().post('/api/auth/sign-up').send({ email: 'm@example.com', password: 'a-long-password', name: 'M' });
    const worker = createMailWorker(
      t.db,
      `smtp://127.0.0.1:${SMTP}`,
      'Fernhill Joinery <shop@fernhill.example>',
      quiet,
    );
    expect(await worker.tick()).toBe(1);
    const mails = await inbox();
    expect(mails).toHaveLength(1);
    expect(mails[0]?.subject).toMatch(/Confirm your e-mail/);
    expect(mails[0]?.to[0]?.address).toBe('m@example.com');
    expect(t.mails()[0]).toMatchObject({ status: 'sent', attempts: 1 });
    expect(await worker.tick()).toBe(0);
    await worker.stop();
  });

  it('while SMTP is down, keeps the message and retries with backoff; once it is up the message arrives once', async () => {
    const t = await testApp();
    await t.agent().post('/api/auth/forgot-password').send({ email: 'priya@example.com' });
    const worker = createMailWorker(
      t.db,
      `smtp://127.0.0.1:${SMTP}`,
      'Fernhill Joinery <shop@fernhill.example>',
      quiet,
    );
    expect(await worker.tick()).toBe(0);
    const failed = t.mails()[0];
    assert(failed);
    expect(failed).toMatchObject({ status: 'pending', attempts: 1 });
    expect(failed.lastError).toBeTruthy();
    expect(failed.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
    await startMaildev();
    expect(await worker.tick()).toBe(0); // not due yet: backoff
    t.db.$client.prepare('update outbox set next_attempt_at = 0').run();
    expect(await worker.tick()).toBe(1);
    const mails = await inbox();
    expect(mails).toHaveLength(1);
    expect(mails[0]?.headers['message-id']).toBe(failed.messageId);
    expect(await worker.tick()).toBe(0);
    expect((await inbox()).length).toBe(1);
    await worker.stop();
  });
});
