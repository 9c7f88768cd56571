import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { loadEnv } from '../src/env';
import { checkout, deliver, depositDue, ledger, startHarness, until, type Harness } from './payments-harness';

vi.setConfig({ testTimeout: 60_000 }); // the estimate is priced and its PDF made for each case
let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 60_000);
afterAll(() => h?.close());

describe('the local default secrets', () => {
  it('refuse to start in production with the local webhook secret or secret key, with a clear message', () => {
    const real = {
      NODE_ENV: 'production',
      STRIPE_SECRET_KEY: 'sk_live_51abc',
      STRIPE_WEBHOOK_SECRET: 'whsec_real_0123',
    };
    expect(() => loadEnv({ NODE_ENV: 'production' })).toThrow(
      /production.*STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET/,
    );
    expect(() => loadEnv({ ...real, STRIPE_WEBHOOK_SECRET: undefined })).toThrow(/STRIPE_WEBHOOK_SECRET/);
    expect(() => loadEnv({ ...real, STRIPE_SECRET_KEY: 'sk_test_local_benchwright' })).toThrow(/STRIPE_SECRET_KEY/);
    expect(loadEnv(real).STRIPE_WEBHOOK_SECRET).toBe('whsec_real_0123');
    // on a laptop and in tests the local values stay the defaults
    expect(loadEnv({}).STRIPE_WEBHOOK_SECRET).toBe('whsec_local_benchwright');
  });
});

describe('a correctly signed payment report that does not match the payment', () => {
  it('with amount_total 1: nothing is paid, no job, acknowledged, and the owner sees it on the timeline', async () => {
    const { client, owner, estimateId, projectId, depositCents } = await depositDue(h);
    const { sessionId } = await checkout(client, estimateId);
    const pay = ledger(h, projectId).payments[0]!;
    const session = (amount: number, over: Record<string, unknown> = {}) => ({
      id: sessionId,
      object: 'checkout.session',
      amount_total: amount,
      currency: 'usd',
      status: 'complete',
      payment_status: 'paid',
      payment_intent: 'pi_test_forged',
      metadata: { projectId, estimateId, kind: 'deposit', paymentId: pay.id },
      ...over,
    });
    const event = (id: string, type: string, object: object) => ({ id, object: 'event', type, data: { object } });

    const cheap = await deliver(h, event('evt_cheap', 'checkout.session.completed', session(1)));
    expect(cheap.status).toBe(200);
    let l = ledger(h, projectId);
    expect(l.paid).toHaveLength(0);
    expect(l.jobs).toBe(0);
    expect(l.status).toBe('accepted');
    expect(l.receipts).toBe(0);
    expect(l.mismatches).toHaveLength(1);
    expect(l.mismatches[0]?.message).toMatch(/amount \$0\.01 instead of/);

    // the right amount, but another session; then another currency
    const other = await deliver(
      h,
      event('evt_other', 'checkout.session.completed', session(depositCents, { id: 'cs_test_someoneelse' })),
    );
    expect(other.status).toBe(200);
    const euros = await deliver(
      h,
      event('evt_euros', 'checkout.session.completed', session(depositCents, { currency: 'eur' })),
    );
    expect(euros.status).toBe(200);
    // a payment intent with the right amount whose checkout Stripe says is not paid
    const pi = await deliver(
      h,
      event('evt_pi_forged', 'payment_intent.succeeded', {
        id: 'pi_test_forged',
        object: 'payment_intent',
        amount: depositCents,
        amount_received: depositCents,
        currency: 'usd',
        status: 'succeeded',
        metadata: { projectId, estimateId, kind: 'deposit', paymentId: pay.id },
      }),
    );
    expect(pi.status).toBe(200);
    l = ledger(h, projectId);
    expect(l.paid).toHaveLength(0);
    expect(l.jobs).toBe(0);
    expect(l.mismatches.map((m) => m.message).join('\n')).toMatch(/checkout cs_test_someoneelse instead of/);
    expect(l.mismatches.map((m) => m.message).join('\n')).toMatch(/currency eur instead of usd/);

    // the owner reads it on the project's timeline
    const timeline = (await owner.get(`/api/projects/${projectId}`)).body.project.timeline as { kind: string }[];
    expect(timeline.filter((e) => e.kind === 'payment_mismatch')).toHaveLength(3);
    // and the client's checkout is still open and payable
    expect((await client.post(`/api/estimates/${estimateId}/deposit-checkout`)).status).toBe(200);
  });
});

describe('the card processor down', () => {
  it('answers 503 `unavailable` with a plain message on checkout, and gives the checkout once it is back', async () => {
    const { client, estimateId, projectId } = await depositDue(h, 'tomasz@example.com', 'Tomasz Wierzbicki');
    await h.stopStripe();
    try {
      const r = await client.post(`/api/estimates/${estimateId}/deposit-checkout`);
      expect(r.status).toBe(503);
      expect(r.body.error.code).toBe('unavailable');
      expect(r.body.error.message).toMatch(/Payments are unavailable for a moment/);
      expect(JSON.stringify(r.body)).not.toMatch(/ECONNREFUSED|stack|Stripe/);
    } finally {
      await h.startStripe();
    }
    const again = await until(
      () => client.post(`/api/estimates/${estimateId}/deposit-checkout`),
      (r) => r.status === 200,
      'the checkout once the processor is back',
    );
    expect(again.body.url).toContain('/pay/cs_test_');
    expect(ledger(h, projectId).payments).toHaveLength(1);
  });
});
