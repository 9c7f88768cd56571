import { randomUUID } from 'node:crypto';
import { and, desc, eq, lt, sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import { canDo, type PaymentsQuery, type User } from '@benchwright/contracts';
import type { Db, Tx } from '../../db/client';
import { estimates, payments, projectEvents, projects, stripeEvents, users } from '../../db/schema';
import { loadPricing } from '../../lib/engine';
import { queueMail } from '../../lib/mailer';
import {
  balanceReceiptMail,
  depositReceiptMail,
  dollars,
  ownerDepositNotice,
  refundMail,
} from '../../lib/mail-templates';
import { addEvent } from '../../lib/timeline';
import { decodeCursor, encodeCursor } from '../../lib/cursor';
import { Conflict, Invalid, NotFound, Unavailable } from '../../lib/errors';
import { estimateNumber } from '../estimates/estimates.service';
import { openJob } from '../jobs/jobs.service';
import { closeIfSettled, moveProject } from '../projects/lifecycle';

export interface PaymentDeps {
  db: Db;
  stripe: Stripe;
  webhookSecret: string;
  portalUrl: string;
  shopUrl: string;
}

type Kind = 'deposit' | 'balance';
type Payment = typeof payments.$inferSelect;

/** Every Checkout Session is made in this currency; a payment reported in another is not ours to apply. */
const CURRENCY = 'usd';
const DOWN_MESSAGE = 'Payments are unavailable for a moment; nothing was charged. Try again in a few minutes.';
const UNREACHABLE = 'Payments are unavailable for a moment; try again in a few minutes.';

/** The card processor could not be reached or failed on its side (not a refusal of what we asked). */
function processorDown(err: unknown): boolean {
  const e = err as { type?: string; statusCode?: number };
  return (
    e.type === 'StripeConnectionError' ||
    e.type === 'StripeAPIError' ||
    e.type === 'StripeRateLimitError' ||
    (e.statusCode ?? 0) >= 500
  );
}

/** Calls the card processor; its being down answers 503 `unavailable` (a webhook is then redelivered by Stripe). */
async function ask<T>(call: () => Promise<T>, message = UNREACHABLE): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (processorDown(err)) throw new Unavailable(message);
    throw err;
  }
}

const idOf = (v: string | { id: string } | null | undefined): string | null =>
  typeof v === 'string' ? v : (v?.id ?? null);

/** What the card processor says was paid, to be checked against the stored payment. */
interface Reported {
  via: string;
  sessionId?: string;
  amount: number | null;
  currency: string | null;
}

export function createPaymentsService({ db, stripe, webhookSecret, portalUrl, shopUrl }: PaymentDeps) {
  const projectUrl = (id: string) => `${portalUrl}/projects/${id}`;

  function ownProject(client: User, projectId: string) {
    const p = db.select().from(projects).where(eq(projects.id, projectId)).get();
    if (!p || p.clientId !== client.id) throw new NotFound('The project');
    return p;
  }

  function acceptedEstimate(projectId: string) {
    return db
      .select()
      .from(estimates)
      .where(and(eq(estimates.projectId, projectId), eq(estimates.status, 'accepted')))
      .orderBy(desc(estimates.revision))
      .get();
  }

  /**
   * A Checkout Session for the deposit or the balance. While a session is
   * open the same one is given again; once it has expired, a new attempt.
   */
  async function checkout(client: User, projectId: string, estimateId: string, kind: Kind): Promise<{ url: string }> {
    const est = db.select().from(estimates).where(eq(estimates.id, estimateId)).get()!;
    const amount = kind === 'deposit' ? est.depositCents : est.balanceCents;
    if (amount <= 0) throw new Conflict(`There is no ${kind} to pay on this estimate.`);
    const last = db
      .select()
      .from(payments)
      .where(and(eq(payments.estimateId, estimateId), eq(payments.kind, kind)))
      .orderBy(desc(payments.attempt))
      .get();
    if (last?.status === 'paid' || last?.status === 'refunded' || last?.status === 'partially_refunded')
      throw new Conflict(`The ${kind} is already paid.`);
    if (last?.status === 'open' && last.stripeSessionId) {
      const s = await ask(() => stripe.checkout.sessions.retrieve(last.stripeSessionId!), DOWN_MESSAGE);
      if (s.status === 'open' && s.url) return { url: s.url };
      if (s.status === 'complete') {
        // paid, but its webhook has not been applied yet: record it now rather than refuse until it comes
        const outcome = db.transaction((tx) => recordSession(tx, s, 'checkout'));
        if (outcome === 'mismatch')
          throw new Conflict(`The last ${kind} payment did not match this estimate; the shop has been told.`);
        if (outcome === 'unpaid')
          throw new Conflict(`The ${kind} payment is still being processed by the card processor; reload in a moment.`);
        throw new Conflict(`The ${kind} is already paid.`);
      }
      db.update(payments).set({ status: 'expired', updatedAt: new Date() }).where(eq(payments.id, last.id)).run();
    }
    const attempt = (last?.attempt ?? 0) + 1;
    const paymentId = randomUUID();
    const meta = { projectId, estimateId, kind, paymentId };
    const shop = loadPricing(db).shopName;
    const session = await ask(
      () =>
        stripe.checkout.sessions.create(
          {
            mode: 'payment',
            line_items: [
              {
                quantity: 1,
                price_data: {
                  currency: CURRENCY,
                  unit_amount: amount,
                  product_data: {
                    name: `${kind === 'deposit' ? 'Deposit' : 'Balance'}: ${shop} estimate ${estimateNumber(projectId)}, revision ${est.revision}`,
                  },
                },
              },
            ],
            customer_email: client.email,
            client_reference_id: projectId,
            metadata: meta,
            payment_intent_data: { metadata: meta },
            success_url: `${projectUrl(projectId)}?session_id={CHECKOUT_SESSION_ID}`,
            cancel_url: projectUrl(projectId),
            expires_at: Math.floor(Date.now() / 1000) + 23 * 3600,
          },
          { idempotencyKey: `${kind}-${estimateId}-r${est.revision}-a${attempt}` },
        ),
      DOWN_MESSAGE,
    );
    db.insert(payments)
      .values({
        id: paymentId,
        projectId,
        estimateId,
        kind,
        amountCents: amount,
        attempt,
        stripeSessionId: session.id,
        checkoutUrl: session.url,
      })
      .run();
    return { url: session.url! };
  }

  const settled = (p: Payment) => p.status === 'paid' || p.status === 'refunded' || p.status === 'partially_refunded';

  function paymentById(tx: Pick<Db, 'select'>, id: string | null | undefined): Payment | undefined {
    return id ? tx.select().from(payments).where(eq(payments.id, id)).get() : undefined;
  }

  /** What does not match between the report and the stored payment, in words; null when all matches. */
  function mismatchOf(pay: Payment, r: Reported): string | null {
    const wrong: string[] = [];
    if (r.sessionId !== undefined && r.sessionId !== pay.stripeSessionId)
      wrong.push(`checkout ${r.sessionId} instead of ${pay.stripeSessionId ?? 'none'}`);
    if (r.amount !== pay.amountCents)
      wrong.push(`amount ${r.amount === null ? 'missing' : dollars(r.amount)} instead of ${dollars(pay.amountCents)}`);
    if ((r.currency ?? '').toLowerCase() !== CURRENCY)
      wrong.push(`currency ${r.currency ?? 'missing'} instead of ${CURRENCY}`);
    return wrong.length ? wrong.join(', ') : null;
  }

  /**
   * A report that does not match its payment is not applied; the owner sees it on the project's timeline
   * (kind `payment_mismatch`), once per distinct report.
   */
  function recordMismatch(tx: Tx, pay: Payment, r: Reported, what: string): void {
    const message = `A payment report (${r.via}) for the ${pay.kind} did not match and was not applied: ${what}.`;
    const seen = tx
      .select({ id: projectEvents.id })
      .from(projectEvents)
      .where(
        and(
          eq(projectEvents.projectId, pay.projectId),
          eq(projectEvents.kind, 'payment_mismatch'),
          eq(projectEvents.message, message),
        ),
      )
      .get();
    if (!seen) addEvent(tx, pay.projectId, 'payment_mismatch', message);
  }

  type Outcome = 'applied' | 'already' | 'mismatch' | 'unpaid' | 'unknown';

  /**
   * The one path that records a Checkout Session as paid, from the webhook, the client's return and the
   * sweep alike: the session must be the payment's own, for its amount and currency, and paid.
   */
  function recordSession(tx: Tx, s: Stripe.Checkout.Session, via: string): Outcome {
    const pay =
      paymentById(tx, s.metadata?.paymentId) ??
      tx.select().from(payments).where(eq(payments.stripeSessionId, s.id)).get();
    if (!pay) return 'unknown';
    const reported: Reported = { via, sessionId: s.id, amount: s.amount_total, currency: s.currency };
    const wrong = mismatchOf(pay, reported);
    if (wrong) {
      recordMismatch(tx, pay, reported, wrong);
      return 'mismatch';
    }
    if (s.status !== 'complete' || s.payment_status !== 'paid') return 'unpaid';
    return markPaid(tx, pay, idOf(s.payment_intent)) ? 'applied' : 'already';
  }

  /** Applies a payment once, whichever of its reports arrives first; false when it was already applied. */
  function markPaid(tx: Tx, checked: Payment, paymentIntentId: string | null): boolean {
    // read again inside the transaction: another report may have applied it meanwhile
    const pay = paymentById(tx, checked.id);
    if (!pay || settled(pay)) return false;
    tx.update(payments)
      .set({
        status: 'paid',
        stripePaymentIntentId: paymentIntentId ?? pay.stripePaymentIntentId,
        updatedAt: new Date(),
      })
      .where(eq(payments.id, pay.id))
      .run();
    const project = tx.select().from(projects).where(eq(projects.id, pay.projectId)).get()!;
    const client = tx.select().from(users).where(eq(users.id, project.clientId)).get()!;
    const shop = loadPricing(tx).shopName;
    if (pay.kind === 'deposit') {
      const est = tx.select().from(estimates).where(eq(estimates.id, pay.estimateId!)).get()!;
      if (est.status !== 'accepted' || !canDo(project.status, 'pay_deposit')) {
        // money came in for a revision that no longer stands (withdrawn meanwhile) or a second deposit: the owner refunds it
        addEvent(
          tx,
          project.id,
          'deposit_unmatched',
          `A deposit of ${dollars(pay.amountCents)} came in for revision ${est.revision}, which is ${est.status} while the project is ${project.status.replace(/_/g, ' ')}; no job was made. Refund it from the payments page.`,
        );
        return true; // the payment is recorded; only the job is withheld
      }
      moveProject(tx, project.id, 'pay_deposit');
      openJob(tx, project.id, est.hoursByStage);
      addEvent(
        tx,
        project.id,
        'deposit_paid',
        `Deposit of ${dollars(pay.amountCents)} received; the job is on the board.`,
      );
      queueMail(tx, client.email, depositReceiptMail(shop, client.name, pay.amountCents, projectUrl(project.id)));
      for (const owner of tx.select().from(users).where(eq(users.role, 'owner')).all())
        queueMail(tx, owner.email, ownerDepositNotice(shop, client.name, pay.amountCents, `${shopUrl}/board`));
    } else {
      addEvent(tx, project.id, 'balance_paid', `Balance of ${dollars(pay.amountCents)} received.`);
      closeIfSettled(tx, project.id);
      queueMail(tx, client.email, balanceReceiptMail(shop, client.name, pay.amountCents, projectUrl(project.id)));
    }
    return true;
  }

  /**
   * Applies a charge's refunded total to its payment. The payment must be recorded as paid first (the
   * caller reconciles it from Stripe when the refund comes before the payment's own events); if it still is
   * not, the event is refused (503) so that it is not stored as processed and Stripe delivers it again.
   */
  function applyRefund(tx: Tx, paymentId: string, charge: Stripe.Charge): void {
    const pay = paymentById(tx, paymentId)!;
    if (!settled(pay)) throw new Unavailable('The payment of this refund is not recorded yet; send it again later.');
    const piId = idOf(charge.payment_intent);
    const reported: Reported = { via: 'event charge.refunded', amount: charge.amount, currency: charge.currency };
    const wrong =
      mismatchOf(pay, reported) ??
      (pay.stripePaymentIntentId !== piId ? `payment ${piId} instead of ${pay.stripePaymentIntentId}` : null);
    if (wrong) return recordMismatch(tx, pay, reported, wrong);
    if (charge.amount_refunded <= pay.refundedCents) return; // late or repeated news
    const delta = charge.amount_refunded - pay.refundedCents;
    tx.update(payments)
      .set({
        refundedCents: charge.amount_refunded,
        status: charge.refunded ? 'refunded' : 'partially_refunded',
        updatedAt: new Date(),
      })
      .where(eq(payments.id, pay.id))
      .run();
    const project = tx.select().from(projects).where(eq(projects.id, pay.projectId)).get()!;
    const client = tx.select().from(users).where(eq(users.id, project.clientId)).get()!;
    addEvent(tx, project.id, 'refund', `${dollars(delta)} of the ${pay.kind} refunded.`);
    queueMail(tx, client.email, refundMail(loadPricing(tx).shopName, client.name, delta, projectUrl(project.id)));
  }

  /** Asks Stripe for the payment's session and records it if paid (or marks it expired). */
  async function reconcile(pay: Payment, via: string): Promise<Outcome | 'expired'> {
    if (!pay.stripeSessionId) return 'unknown';
    const s = await ask(() => stripe.checkout.sessions.retrieve(pay.stripeSessionId!));
    if (s.status === 'expired') {
      db.update(payments)
        .set({ status: 'expired', updatedAt: new Date() })
        .where(and(eq(payments.id, pay.id), eq(payments.status, 'open')))
        .run();
      return 'expired';
    }
    return db.transaction((tx) => recordSession(tx, s, via));
  }

  /**
   * What an event needs from Stripe before it can be applied: the payment it concerns, and that payment's
   * session when the payment is not recorded as paid yet (events come in any order; Stripe's own objects
   * are the truth).
   */
  async function factsFor(event: Stripe.Event): Promise<{ payment?: Payment; session?: Stripe.Checkout.Session }> {
    let pay: Payment | undefined;
    if (event.type === 'payment_intent.succeeded') {
      const pi = event.data.object;
      pay =
        paymentById(db, pi.metadata?.paymentId) ??
        db.select().from(payments).where(eq(payments.stripePaymentIntentId, pi.id)).get();
    } else if (event.type === 'charge.refunded') {
      const charge = event.data.object;
      const piId = idOf(charge.payment_intent);
      if (!piId) return {};
      pay =
        db.select().from(payments).where(eq(payments.stripePaymentIntentId, piId)).get() ??
        paymentById(db, charge.metadata?.paymentId);
      if (!pay) {
        // the charge may not carry the metadata: its payment intent does (set at checkout)
        const pi = await ask(() => stripe.paymentIntents.retrieve(piId)).catch((err: unknown) => {
          if (err instanceof Unavailable) throw err;
          return null; // not a payment intent of this account: not ours
        });
        pay = paymentById(db, pi?.metadata?.paymentId);
      }
    } else return {};
    if (!pay || settled(pay) || !pay.stripeSessionId) return { payment: pay };
    const session = await ask(() => stripe.checkout.sessions.retrieve(pay.stripeSessionId!));
    return { payment: pay, session };
  }

  return {
    /**
     * Before the owner withdraws an accepted revision: every open deposit
     * checkout for it is expired at the card processor, so it can no longer be
     * paid; one already completed refuses the withdrawal (409).
     */
    async closeDepositCheckouts(estimateId: string): Promise<void> {
      const open = db
        .select()
        .from(payments)
        .where(and(eq(payments.estimateId, estimateId), eq(payments.kind, 'deposit'), eq(payments.status, 'open')))
        .all();
      for (const pay of open) {
        if (pay.stripeSessionId) {
          const s = await stripe.checkout.sessions.retrieve(pay.stripeSessionId);
          if (s.status === 'complete')
            throw new Conflict(
              'The client has just paid the deposit; it is being recorded, so it cannot be withdrawn.',
            );
          if (s.status === 'open') await stripe.checkout.sessions.expire(pay.stripeSessionId);
        }
        db.update(payments)
          .set({ status: 'expired', updatedAt: new Date() })
          .where(and(eq(payments.id, pay.id), eq(payments.status, 'open')))
          .run();
      }
    },

    async depositCheckout(client: User, estimateId: string) {
      const est = db.select().from(estimates).where(eq(estimates.id, estimateId)).get();
      if (!est) throw new NotFound('The estimate');
      const project = ownProject(client, est.projectId);
      if (est.status === 'draft') throw new NotFound('The estimate');
      if (est.status !== 'accepted' || !canDo(project.status, 'pay_deposit'))
        throw new Conflict(
          project.status === 'deposit_paid' || project.status === 'in_production'
            ? 'The deposit is already paid.'
            : 'Accept the estimate before paying the deposit.',
        );
      return checkout(client, project.id, est.id, 'deposit');
    },

    async balanceCheckout(client: User, projectId: string) {
      const project = ownProject(client, projectId);
      if (project.status !== 'ready') throw new Conflict('The balance is asked for once your piece is ready.');
      const est = acceptedEstimate(projectId);
      if (!est) throw new Conflict('This project has no accepted estimate.');
      return checkout(client, projectId, est.id, 'balance');
    },

    async refund(owner: User, paymentId: string, amountCents?: number) {
      const pay = db.select().from(payments).where(eq(payments.id, paymentId)).get();
      if (!pay) throw new NotFound('The payment');
      if (!['paid', 'partially_refunded'].includes(pay.status) || !pay.stripePaymentIntentId)
        throw new Conflict(`A ${pay.status} payment cannot be refunded.`);
      const left = pay.amountCents - pay.refundedCents;
      const amount = amountCents ?? left;
      if (amount > left)
        throw new Invalid(`At most ${dollars(left)} is left to refund.`, [
          { path: 'amountCents', message: `at most ${left}` },
        ]);
      const r = await ask(() =>
        stripe.refunds.create(
          { payment_intent: pay.stripePaymentIntentId!, amount, metadata: { paymentId } },
          { idempotencyKey: `refund-${paymentId}-${pay.refundedCents}-${amount}` },
        ),
      ).catch((err: { type?: string; message?: string }) => {
        if (err.type === 'StripeInvalidRequestError')
          throw new Conflict(`The card processor refused the refund: ${err.message}`);
        throw err;
      });
      db.transaction((tx) =>
        addEvent(
          tx,
          pay.projectId,
          'refund_requested',
          `Refund of ${dollars(amount)} asked of the card processor by ${owner.name}.`,
          owner.id,
        ),
      );
      return { id: r.id, amountCents: r.amount, status: r.status };
    },

    /** Every payment, newest first, with its client; no card processor secrets, only its ids. */
    /** The payments, the latest first, a keyset page at a time (created_at, id). */
    list(query: PaymentsQuery) {
      const at = query.cursor ? decodeCursor(query.cursor, 'payments', 'desc', 'number') : null;
      const rows = db
        .select({
          id: payments.id,
          projectId: payments.projectId,
          clientName: users.name,
          kind: payments.kind,
          status: payments.status,
          amountCents: payments.amountCents,
          refundedCents: payments.refundedCents,
          stripePaymentIntentId: payments.stripePaymentIntentId,
          createdAt: payments.createdAt,
        })
        .from(payments)
        .innerJoin(projects, eq(projects.id, payments.projectId))
        .innerJoin(users, eq(users.id, projects.clientId))
        .where(at ? sql`(${payments.createdAt}, ${payments.id}) < (${at.key}, ${at.id})` : undefined)
        .orderBy(desc(payments.createdAt), desc(payments.id))
        .limit(query.limit + 1)
        .all();
      const more = rows.length > query.limit;
      const page = more ? rows.slice(0, query.limit) : rows;
      const last = page.at(-1);
      return {
        payments: page.map((p) => ({ ...p, createdAt: p.createdAt.toISOString() })),
        nextCursor:
          more && last
            ? encodeCursor({ sort: 'payments', dir: 'desc', key: last.createdAt.getTime(), id: last.id })
            : null,
      };
    },

    /**
     * The client's return from Checkout (`success_url?session_id=`): the session is asked of Stripe and
     * recorded if paid, through the same path as the webhook. Only the project's client may ask.
     */
    async confirm(client: User, sessionId: string) {
      const pay = db.select().from(payments).where(eq(payments.stripeSessionId, sessionId)).get();
      if (!pay) throw new NotFound('The payment');
      ownProject(client, pay.projectId);
      if (pay.status === 'open' || pay.status === 'expired') await reconcile(pay, 'return from checkout');
      const now = paymentById(db, pay.id)!;
      return { id: now.id, kind: now.kind, status: now.status, amountCents: now.amountCents };
    },

    /**
     * Asks Stripe about every open payment older than `olderThanMs` and records those paid (or marks
     * those expired): a payment whose webhook never came is not lost. Returns how many were recorded.
     */
    async sweep(olderThanMs: number): Promise<{ checked: number; recorded: number; failed: number }> {
      const due = db
        .select()
        .from(payments)
        .where(and(eq(payments.status, 'open'), lt(payments.createdAt, new Date(Date.now() - olderThanMs))))
        .all();
      let recorded = 0;
      let failed = 0;
      for (const pay of due) {
        try {
          if ((await reconcile(pay, 'sweep')) === 'applied') recorded++;
        } catch {
          failed++;
        }
      }
      return { checked: due.length, recorded, failed };
    },

    /**
     * A webhook: the signature checked on the raw body; what the event needs from Stripe is asked first
     * (the session of a payment intent, the payment of a refund that came before it); then the event id is
     * stored once and its effect applied in one transaction. An event that cannot take effect yet is not
     * stored (503, so Stripe delivers it again); a report that does not match its payment is recorded for
     * the owner and acknowledged; unknown types are acknowledged.
     */
    async handleWebhook(raw: Buffer, signature: string | undefined): Promise<{ duplicate: boolean; type: string }> {
      let event: Stripe.Event;
      try {
        event = stripe.webhooks.constructEvent(raw, signature ?? '', webhookSecret);
      } catch {
        throw new Invalid('The webhook signature is missing, wrong or too old.');
      }
      const seen = () => !!db.select().from(stripeEvents).where(eq(stripeEvents.id, event.id)).get();
      if (seen()) return { duplicate: true, type: event.type };
      const facts = await factsFor(event);
      let duplicate = false;
      db.transaction((tx) => {
        const r = tx.insert(stripeEvents).values({ id: event.id, type: event.type }).onConflictDoNothing().run();
        if (r.changes === 0) {
          duplicate = true;
          return;
        }
        const via = `event ${event.type}`;
        switch (event.type) {
          case 'checkout.session.completed':
          case 'checkout.session.async_payment_succeeded':
            recordSession(tx, event.data.object, via);
            break;
          case 'payment_intent.succeeded': {
            const pi = event.data.object;
            const pay = facts.payment && paymentById(tx, facts.payment.id);
            if (!pay) break;
            const reported: Reported = { via, amount: pi.amount_received, currency: pi.currency };
            const wrong =
              mismatchOf(pay, reported) ??
              (facts.session && idOf(facts.session.payment_intent) && idOf(facts.session.payment_intent) !== pi.id
                ? `payment ${pi.id} is not the one of checkout ${facts.session.id}`
                : null);
            if (wrong) recordMismatch(tx, pay, reported, wrong);
            else if (facts.session) recordSession(tx, facts.session, via);
            break;
          }
          case 'checkout.session.expired': {
            const s = event.data.object;
            tx.update(payments)
              .set({ status: 'expired', updatedAt: new Date() })
              .where(and(eq(payments.stripeSessionId, s.id), eq(payments.status, 'open')))
              .run();
            break;
          }
          case 'charge.refunded':
            if (!facts.payment) break; // not one of ours
            if (facts.session && recordSession(tx, facts.session, `${via} (payment asked of Stripe)`) === 'mismatch')
              break; // recorded for the owner; acknowledged
            applyRefund(tx, facts.payment.id, event.data.object);
            break;
          default:
            break; // acknowledged
        }
      });
      return { duplicate, type: event.type };
    },
  };
}
export type PaymentsService = ReturnType<typeof createPaymentsService>;
