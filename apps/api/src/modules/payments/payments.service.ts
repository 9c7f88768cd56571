import { randomUUID } from 'node:crypto';
import { and, desc, eq } from 'drizzle-orm';
import type Stripe from 'stripe';
import { canDo, type User } from '@benchwright/contracts';
import type { Db, Tx } from '../../db/client';
import { estimates, payments, projects, stripeEvents, users } from '../../db/schema';
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
import { AppError, Conflict, Invalid, NotFound } from '../../middleware/errors';
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
      const s = await stripe.checkout.sessions.retrieve(last.stripeSessionId);
      if (s.status === 'open' && s.url) return { url: s.url };
      if (s.status === 'complete')
        throw new Conflict(`The ${kind} payment is complete and being recorded; reload in a moment.`);
      db.update(payments).set({ status: 'expired', updatedAt: new Date() }).where(eq(payments.id, last.id)).run();
    }
    const attempt = (last?.attempt ?? 0) + 1;
    const paymentId = randomUUID();
    const meta = { projectId, estimateId, kind, paymentId };
    const shop = loadPricing(db).shopName;
    const session = await stripe.checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [
          {
            quantity: 1,
            price_data: {
              currency: 'usd',
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

  /** Applies a payment once, whichever of its events arrives first. */
  function markPaid(tx: Tx, meta: Stripe.Metadata | null, paymentIntentId: string | null): void {
    const paymentId = meta?.paymentId;
    if (!paymentId) return;
    const pay = tx.select().from(payments).where(eq(payments.id, paymentId)).get();
    if (!pay || pay.status === 'paid' || pay.status === 'refunded' || pay.status === 'partially_refunded') return;
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
        return;
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
  }

  function applyRefund(tx: Tx, charge: Stripe.Charge): void {
    const piId = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id;
    if (!piId) return;
    const pay = tx.select().from(payments).where(eq(payments.stripePaymentIntentId, piId)).get();
    if (!pay || charge.amount_refunded <= pay.refundedCents) return; // late or repeated news
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
      try {
        const r = await stripe.refunds.create(
          { payment_intent: pay.stripePaymentIntentId, amount, metadata: { paymentId } },
          { idempotencyKey: `refund-${paymentId}-${pay.refundedCents}-${amount}` },
        );
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
      } catch (err) {
        const e = err as { type?: string; message?: string };
        if (e.type === 'StripeInvalidRequestError')
          throw new Conflict(`The card processor refused the refund: ${e.message}`);
        throw new AppError(502, 'internal', 'The card processor could not be reached; try again.');
      }
    },

    /** Every payment, newest first, with its client; no card processor secrets, only its ids. */
    list() {
      return db
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
        .orderBy(desc(payments.createdAt))
        .all()
        .map((p) => ({ ...p, createdAt: p.createdAt.toISOString() }));
    },

    /**
     * A webhook: the signature checked on the raw body, the event id stored
     * once, its effect applied in the same transaction; unknown types are
     * acknowledged.
     */
    handleWebhook(raw: Buffer, signature: string | undefined): { duplicate: boolean; type: string } {
      let event: Stripe.Event;
      try {
        event = stripe.webhooks.constructEvent(raw, signature ?? '', webhookSecret);
      } catch {
        throw new Invalid('The webhook signature is missing, wrong or too old.');
      }
      let duplicate = false;
      db.transaction((tx) => {
        const r = tx.insert(stripeEvents).values({ id: event.id, type: event.type }).onConflictDoNothing().run();
        if (r.changes === 0) {
          duplicate = true;
          return;
        }
        switch (event.type) {
          case 'checkout.session.completed': {
            const s = event.data.object;
            if (s.payment_status === 'paid')
              markPaid(
                tx,
                s.metadata,
                typeof s.payment_intent === 'string' ? s.payment_intent : (s.payment_intent?.id ?? null),
              );
            break;
          }
          case 'payment_intent.succeeded':
            markPaid(tx, event.data.object.metadata, event.data.object.id);
            break;
          case 'checkout.session.expired': {
            const s = event.data.object;
            tx.update(payments)
              .set({ status: 'expired', updatedAt: new Date() })
              .where(and(eq(payments.stripeSessionId, s.id), eq(payments.status, 'open')))
              .run();
            break;
          }
          case 'charge.refunded':
            applyRefund(tx, event.data.object);
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
