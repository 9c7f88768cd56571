import { randomUUID } from 'node:crypto';
import { resolve } from 'node:path';
import { and, asc, eq, lte } from 'drizzle-orm';
import nodemailer, { type Transporter } from 'nodemailer';
import type { Db } from '../db/client';
import { outbox, shopSettings, type MailAttachment } from '../db/schema';
import { LOGO_MARK, LOGO_CID, signMail, type MailContent } from './mail-templates';
import { logoPath } from './shop-logo';

type Tx = Pick<Db, 'insert' | 'select'>;
export type { MailAttachment };

/** Queues a message in the caller's transaction, signed with the shop's name, address and phone as they stand
 * in the shop settings; the worker sends it. Attachment paths are relative to the worker's `filesDir` (the PDF
 * folder). The shop's logo, when it has one, goes inline where the layout marks it. */
export function queueMail(tx: Tx, to: string, unsigned: MailContent, attachments: MailAttachment[] = []): string {
  const shop = tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
  const content = shop
    ? signMail(unsigned, { name: shop.shopName, address: shop.address, phone: shop.phone })
    : unsigned;
  const id = randomUUID();
  const logo = content.html.includes(LOGO_MARK) ? logoPath(tx) : null;
  const html = content.html.replace(
    LOGO_MARK,
    logo
      ? `<img src="cid:${LOGO_CID}" alt="" style="display:block;max-height:56px;max-width:240px;margin:0 0 8px">`
      : '',
  );
  if (logo)
    attachments = [...attachments, { filename: 'logo.png', path: logo, contentType: 'image/png', cid: LOGO_CID }];
  tx.insert(outbox)
    .values({
      id,
      messageId: `<${id}@benchwright.local>`,
      to,
      subject: content.subject,
      text: content.text,
      html,
      attachments,
    })
    .run();
  return id;
}

export interface MailWorker {
  /** sends what is due once; resolves with the count sent */
  tick(): Promise<number>;
  start(intervalMs?: number): void;
  stop(): Promise<void>;
}

/** How many due messages one read of the outbox takes, and how many are in flight at once over the pool. */
const BATCH = 100;
const IN_FLIGHT = 4;
/** A tick drains what is due for at most this long, so stop() never waits on a long backlog. */
const TICK_BUDGET_MS = 5_000;

/**
 * The outbox worker: sends due messages over a pooled SMTP transport (a few connections, reused), several at a time,
 * and keeps reading the outbox while messages are due, so a burst of writes does not queue behind the tick interval.
 * Each message is marked sent only once the server has accepted it, and retried with backoff (1 s doubling to 5 min)
 * while SMTP is down. Every attempt carries the same Message-ID, so delivery is at least once: a crash between the
 * server's acceptance and the outbox's update sends the message again with that Message-ID.
 */
export function createMailWorker(
  db: Db,
  smtpUrl: string,
  from: string,
  log: { warn: (o: object, m: string) => void },
  filesDir = '.',
): MailWorker {
  const url = new URL(smtpUrl);
  const transport: Transporter = nodemailer.createTransport({
    pool: true,
    maxConnections: IN_FLIGHT,
    maxMessages: 100,
    host: url.hostname,
    port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 25)),
    secure: url.protocol === 'smtps:',
    ignoreTLS: url.protocol === 'smtp:' && (url.hostname === '127.0.0.1' || url.hostname === 'localhost'),
    auth: url.username ? { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } : undefined,
    connectionTimeout: 3000,
    greetingTimeout: 3000,
    socketTimeout: 10000,
  });
  let timer: NodeJS.Timeout | null = null;
  let running: Promise<number> | null = null;

  /** Sends one message and records the outcome; false when SMTP refused it (it waits for its backoff). */
  async function sendOne(m: typeof outbox.$inferSelect): Promise<boolean> {
    try {
      await transport.sendMail({
        from,
        to: m.to,
        subject: m.subject,
        text: m.text,
        html: m.html,
        messageId: m.messageId,
        attachments: m.attachments?.map((a) =>
          'path' in a ? { ...a, path: resolve(filesDir, a.path) } : { ...a, encoding: 'base64' },
        ),
      });
      db.update(outbox)
        .set({ status: 'sent', sentAt: new Date(), attempts: m.attempts + 1, lastError: null })
        .where(eq(outbox.id, m.id))
        .run();
      return true;
    } catch (err) {
      const attempts = m.attempts + 1;
      const delay = Math.min(300_000, 1000 * 2 ** Math.min(attempts - 1, 9));
      db.update(outbox)
        .set({
          attempts,
          lastError: String((err as Error).message ?? err).slice(0, 500),
          nextAttemptAt: new Date(Date.now() + delay),
        })
        .where(eq(outbox.id, m.id))
        .run();
      log.warn({ outboxId: m.id, attempts, retryInMs: delay }, 'mail not sent; will retry');
      return false;
    }
  }

  async function tick(): Promise<number> {
    if (running) return running;
    running = (async () => {
      let sent = 0;
      const until = Date.now() + TICK_BUDGET_MS;
      for (;;) {
        const due = db
          .select()
          .from(outbox)
          .where(and(eq(outbox.status, 'pending'), lte(outbox.nextAttemptAt, new Date())))
          .orderBy(asc(outbox.createdAt))
          .limit(BATCH)
          .all();
        let refused = false;
        for (let i = 0; i < due.length && !refused; i += IN_FLIGHT) {
          const results = await Promise.all(due.slice(i, i + IN_FLIGHT).map(sendOne));
          sent += results.filter(Boolean).length;
          refused = results.includes(false); // SMTP is likely down: the rest wait for the next tick
        }
        if (refused || due.length < BATCH || Date.now() > until) return sent;
      }
    })().finally(() => {
      running = null;
    });
    return running;
  }

  return {
    tick,
    start(intervalMs = 500) {
      if (timer) return;
      timer = setInterval(() => void tick().catch(() => undefined), intervalMs);
      timer.unref();
    },
    async stop() {
      if (timer) clearInterval(timer);
      timer = null;
      if (running) await running.catch(() => undefined);
      transport.close();
    },
  };
}
