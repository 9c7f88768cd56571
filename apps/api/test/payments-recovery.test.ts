import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createPaymentSweeper } from '../src/modules/payments/payments.sweeper';
import {
  checkout,
  deliveriesGivenUp,
  depositDue,
  ledger,
  payAtStripe,
  signIn,
  startHarness,
  type Harness,
} from './payments-harness';

vi.setConfig({ testTimeout: 60_000 }); // the estimate is priced and its PDF made for each case
let h: Harness;
beforeAll(async () => {
  h = await startHarness();
}, 60_000);
afterAll(() => h?.close());

/** The client pays while the API cannot take the stand-in's webhooks, and the stand-in gives up delivering. */
async function paidWhileDown(email: string, name: string) {
  const due = await depositDue(h, email, name);
  const { url, sessionId } = await checkout(due.client, due.estimateId);
  h.hooksDown = true;
  try {
    const back = await payAtStripe(url);
    expect(back).toContain(`session_id=${sessionId}`);
    await deliveriesGivenUp(h);
  } finally {
    h.hooksDown = false;
  }
  const l = ledger(h, due.projectId);
  expect(l.status).toBe('accepted');
  expect(l.payments.map((p) => p.status)).toEqual(['open']);
  return { ...due, sessionId };
}

describe('a payment made while the API could not take its webhook', () => {
  it('is recorded when the client returns to the portal (POST /api/payments/confirm), once', async () => {
    const { client, projectId, sessionId } = await paidWhileDown('guild@example.com', 'Alder Cross Guild');
    // another client, the owner, a malformed id
    const tomasz = await signIn(h, 'tomasz@example.com');
    expect((await tomasz.post('/api/payments/confirm').send({ sessionId })).status).toBe(404);
    expect(
      (await (await signIn(h, 'maren@fernhill.example')).post('/api/payments/confirm').send({ sessionId })).status,
    ).toBe(403);
    const bad = await client.post('/api/payments/confirm').send({ sessionId: 'not a session' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid_input');
    expect(ledger(h, projectId).paid).toHaveLength(0);

    const r = await client.post('/api/payments/confirm').send({ sessionId });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.payment).toMatchObject({ kind: 'deposit', status: 'paid' });
    // a second return (a reload) changes nothing
    expect((await client.post('/api/payments/confirm').send({ sessionId })).body.payment.status).toBe('paid');
    const l = ledger(h, projectId);
    expect(l.status).toBe('deposit_paid');
    expect(l.paid).toHaveLength(1);
    expect(l.jobs).toBe(1);
    expect(l.receipts).toBe(1);
    expect((await client.get(`/api/projects/${projectId}`)).body.project.status).toBe('deposit_paid');
  });

  it('is recorded by the sweep of open payments, once, and only once it is old enough', async () => {
    const { projectId } = await paidWhileDown('tomasz@example.com', 'Tomasz Wierzbicki');
    const warn = vi.fn();
    const young = createPaymentSweeper(h.app.services.payments, { everyMs: 60_000, olderThanMs: 5 * 60_000 }, { warn });
    expect((await young.tick()).recorded).toBe(0);
    expect(ledger(h, projectId).paid).toHaveLength(0);
    const sweeper = createPaymentSweeper(h.app.services.payments, { everyMs: 60_000, olderThanMs: 0 }, { warn });
    const out = await sweeper.tick();
    expect(out).toMatchObject({ recorded: 1, failed: 0 });
    expect((await sweeper.tick()).recorded).toBe(0);
    const l = ledger(h, projectId);
    expect(l.status).toBe('deposit_paid');
    expect(l.paid).toHaveLength(1);
    expect(l.jobs).toBe(1);
    expect(l.receipts).toBe(1);
    expect(warn).toHaveBeenCalledTimes(1);
  });

  it('asking for the checkout again records the paid one instead of refusing until a webhook comes', async () => {
    const { client, projectId, estimateId } = await paidWhileDown('priya@example.com', 'Priya Natarajan');
    const r = await client.post(`/api/estimates/${estimateId}/deposit-checkout`);
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/already paid/);
    const l = ledger(h, projectId);
    expect(l.status).toBe('deposit_paid');
    expect(l.jobs).toBe(1);
    expect(l.receipts).toBe(1);
  });
});
