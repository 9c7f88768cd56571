import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { outbox } from '../src/db/schema';
import {
  checkout,
  deliver,
  deliveriesGivenUp,
  depositDue,
  eventsOf,
  ledger,
  payAtStripe,
  startHarness,
  type Harness,
  type StripeEvent,
} from './payments-harness';

/**
 * Webhook reliability: the stand-in's own deliveries are refused (as if the API were down) so that the
 * test delivers the real, signed events itself, in the order and number it wants.
 */
vi.setConfig({ testTimeout: 60_000 }); // the estimate is priced and its PDF made for each case
let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 60_000);
afterAll(() => h?.close());

async function paidQuietly(email: string, name: string) {
  const due = await depositDue(h, email, name);
  const { url, sessionId } = await checkout(due.client, due.estimateId);
  if (!sessionId) throw new Error('the checkout answered no session id');
  h.hooksDown = true;
  try {
    await payAtStripe(url);
    await deliveriesGivenUp(h);
  } finally {
    h.hooksDown = false;
  }
  const events = await eventsOf(h, sessionId);
  const of = (type: string) => events.find((e) => e.type === type)!;
  expect(ledger(h, due.projectId).paid).toHaveLength(0);
  return { ...due, sessionId, events, of };
}

const ok = async (r: Promise<Response>) => expect((await r).status).toBe(200);

function expectOnePaidDeposit(projectId: string) {
  const l = ledger(h, projectId);
  expect(l.status).toBe('deposit_paid');
  expect(l.paid).toHaveLength(1);
  expect(l.jobs).toBe(1);
  expect(l.receipts).toBe(1);
  expect(l.mismatches).toHaveLength(0);
  return l;
}

describe('webhooks, delivered the way Stripe may deliver them', () => {
  it('the same paid event 10 times at once: one payment paid, one job, one receipt', async () => {
    const { projectId, of } = await paidQuietly('guild@example.com', 'Alder Cross Guild');
    const completed = of('checkout.session.completed');
    const answers = await Promise.all(Array.from({ length: 10 }, () => deliver(h, completed)));
    expect(answers.map((r) => r.status)).toEqual(Array(10).fill(200));
    const bodies = (await Promise.all(answers.map((r) => r.json()))) as { duplicate: boolean }[];
    expect(bodies.filter((b) => !b.duplicate)).toHaveLength(1);
    // and its payment intent's event, also 10 times at once
    await Promise.all(Array.from({ length: 10 }, () => ok(deliver(h, of('payment_intent.succeeded')))));
    expectOnePaidDeposit(projectId);
  });

  it('payment_intent.succeeded before checkout.session.completed: paid on the first, once', async () => {
    const { projectId, of } = await paidQuietly('tomasz@example.com', 'Tomasz Wierzbicki');
    await ok(deliver(h, of('payment_intent.succeeded')));
    expectOnePaidDeposit(projectId);
    await ok(deliver(h, of('checkout.session.completed')));
    const l = expectOnePaidDeposit(projectId);
    expect(l.paid[0]?.stripePaymentIntentId).toBe(of('payment_intent.succeeded').data.object.id);
  });

  it('a refund reported before its payment: the payment ends paid with the refund applied', async () => {
    const { projectId, sessionId, depositCents } = await paidQuietly('priya@example.com', 'Priya Natarajan');
    // the owner refunds part of it from the processor's dashboard before any event got through
    const pi = (await h.sdk.checkout.sessions.retrieve(sessionId)).payment_intent as string;
    h.hooksDown = true;
    try {
      await h.sdk.refunds.create({ payment_intent: pi, amount: 2500 });
      await deliveriesGivenUp(h);
    } finally {
      h.hooksDown = false;
    }
    const events = await eventsOf(h, sessionId);
    const of = (type: string) => events.find((e) => e.type === type)!;
    // the charge need not carry our metadata: the payment is found through its payment intent
    const refunded: StripeEvent = structuredClone(of('charge.refunded'));
    refunded.data.object.metadata = {};
    await ok(deliver(h, refunded));
    for (const type of ['checkout.session.completed', 'payment_intent.succeeded', 'refund.created'])
      await ok(deliver(h, of(type)));
    await ok(deliver(h, refunded)); // a redelivery changes nothing
    const l = ledger(h, projectId);
    expect(l.jobs).toBe(1);
    expect(l.receipts).toBe(1);
    expect(l.paid).toHaveLength(1);
    expect(l.paid[0]).toMatchObject({ status: 'partially_refunded', refundedCents: 2500, amountCents: depositCents });
    expect(
      h.db
        .select()
        .from(outbox)
        .all()
        .filter((m) => m.to === 'priya@example.com' && /Refund of \$25\.00/.test(m.subject)),
    ).toHaveLength(1);
  });

  it('a refund whose payment Stripe does not show as paid is not stored as processed (503), so it comes again', async () => {
    const { client, estimateId, projectId } = await depositDue(h, 'guild@example.com', 'Alder Cross Guild');
    await checkout(client, estimateId);
    const pay = ledger(h, projectId).payments[0]!;
    const event = {
      id: 'evt_refund_too_early',
      object: 'event',
      type: 'charge.refunded',
      data: {
        object: {
          id: 'ch_test_early',
          object: 'charge',
          amount: pay.amountCents,
          amount_refunded: 100,
          refunded: false,
          currency: 'usd',
          payment_intent: 'pi_test_early',
          metadata: { paymentId: pay.id },
        },
      },
    };
    const r = await deliver(h, event);
    expect(r.status).toBe(503);
    expect(((await r.json()) as { error: { code: string } }).error.code).toBe('unavailable');
    expect(
      h.db.$client.prepare("select count(*) as n from stripe_events where id = 'evt_refund_too_early'").get(),
    ).toEqual({
      n: 0,
    });
    expect(ledger(h, projectId).payments[0]).toMatchObject({ status: 'open', refundedCents: 0 });
  });
});
