import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { MailDev } from 'maildev';
import { afterAll, expect, it } from 'vitest';
import { freePort } from './helpers';
import { signInCookie, startApi, waitFor, type ChildApi } from './child-api';

/**
 * Mail through an outage and a restart (issue 13): the API in a process of its own queues mail while SMTP (a
 * maildev of the test's own, on free ports) is down, is killed and started again before SMTP comes back; then
 * every queued message arrives, each exactly once by its Message-ID.
 */
const dir = mkdtempSync(join(tmpdir(), 'bw-mail-outage-'));
let api: ChildApi | undefined;
let maildev: MailDev | undefined;
afterAll(async () => {
  await api?.kill();
  await maildev?.stop();
  rmSync(dir, { recursive: true, force: true });
});

interface Inboxed {
  messageId?: string;
  headers?: Record<string, string>;
  subject: string;
}

it(
  'delivers every message queued while SMTP was down exactly once, across a restart of the API',
  async () => {
    const smtp = await freePort();
    const web = await freePort();
    const dbPath = join(dir, 'mail.db');
    const env = {
      DATABASE_PATH: dbPath,
      UPLOADS_DIR: join(dir, 'uploads'),
      PDF_DIR: join(dir, 'pdf'),
      SMTP_URL: `smtp://127.0.0.1:${smtp}`,
      STRIPE_API_BASE: `http://127.0.0.1:${await freePort()}`,
      SEED_DEMO: 'true',
    };
    api = await startApi(env);
    const owner = await signInCookie(api.url, 'maren@fernhill.example');
    const priya = await signInCookie(api.url, 'priya@example.com');
    const listed = (await (await fetch(`${api.url}/api/projects`, { headers: { Cookie: owner } })).json()) as {
      projects: { id: string; client: { name: string } }[];
    };
    const project = listed.projects.find((p) => p.client.name.startsWith('Priya'))!.id;
    const comment = async (cookie: string, message: string) => {
      const r = await fetch(`${api!.url}/api/projects/${project}/comments`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Cookie: cookie },
        body: JSON.stringify({ message }),
      });
      expect(r.status, await r.text()).toBe(201);
    };
    // each comment is mailed to the other side
    for (let i = 0; i < 6; i++) {
      await comment(priya, `Question ${i} about the drawer runners`);
      await comment(owner, `Answer ${i}: full-extension, soft-close`);
    }
    const outbox = () => {
      const db = new Database(dbPath, { readonly: true });
      try {
        return db.prepare('select message_id as messageId, status, attempts from outbox').all() as {
          messageId: string;
          status: string;
          attempts: number;
        }[];
      } finally {
        db.close();
      }
    };
    // the worker has met the outage: some attempt has failed
    await waitFor('a failed attempt to send', 60_000, () => (outbox().some((m) => m.attempts > 0) ? true : undefined));
    expect(outbox().every((m) => m.status !== 'sent')).toBe(true);

    // the API goes down and comes back while SMTP is still down
    await api.kill();
    api = await startApi({ ...env, SEED_DEMO: 'false' });
    const downSince = Date.now();
    const queued = outbox();
    expect(queued.length).toBeGreaterThanOrEqual(12);
    expect(queued.every((m) => m.status !== 'sent')).toBe(true);

    // SMTP comes back
    maildev = new MailDev({
      smtp,
      web,
      ip: '127.0.0.1',
      webIp: '127.0.0.1',
      mailDirectory: join(dir, 'maildev'),
      silent: true,
    });
    await maildev.start();
    // the worker backs off while SMTP is down (1 s doubling); no message waits longer than the outage lasted
    const outage = Date.now() - downSince + 60_000;
    await waitFor('every queued message sent', Math.max(120_000, 2 * outage), () =>
      outbox().every((m) => m.status === 'sent') ? true : undefined,
    );
    // one more message after the backlog, so that anything the worker would send twice has been sent by now
    const owner2 = await signInCookie(api.url, 'maren@fernhill.example');
    await comment(owner2, 'Last one: the finish is cured.');
    const inbox = async () => (await (await fetch(`http://127.0.0.1:${web}/api/email`)).json()) as Inboxed[];
    const total = outbox().length;
    await waitFor('the last message in the inbox', 120_000, async () =>
      (await inbox()).length >= total ? true : undefined,
    );

    const clean = (id: string | undefined) => (id ?? '').replace(/^<|>$/g, '');
    const got = (await inbox()).map((m) => clean(m.messageId ?? m.headers?.['message-id']));
    const counts = new Map<string, number>();
    for (const id of got) counts.set(id, (counts.get(id) ?? 0) + 1);
    const wrong = outbox()
      .map((m) => clean(m.messageId))
      .filter((id) => counts.get(id) !== 1)
      .map((id) => `${id}: ${counts.get(id) ?? 0} times`);
    console.log(
      `mail through an outage and a restart: ${queued.length} queued while SMTP was down, ${total} in all, ${got.length} received, ${new Set(got).size} distinct Message-IDs`,
    );
    expect(wrong).toEqual([]);
    expect(got.length).toBe(total);
  },
  10 * 60_000,
);
