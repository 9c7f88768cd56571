import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signPayload } from '@benchwright/stripe-fake';
import { freePort, testApp } from './helpers';
import { waitFor } from './child-api';
import { EMAILS, seededWorld, type World } from './world';

/**
 * The payment routes one by one, each describe on a fresh demo (seeded through the real services with the
 * Stripe stand-in: Priya's estimate sent, Tomasz's deposit paid and his job in Casework): the happy path,
 * then the refusals. The whole scenario, with webhooks in every order, runs in flow.test.ts.
 */
type Agent = Awaited<ReturnType<World['signIn']>>;
interface Ctx {
  w: World;
  owner: Agent;
  priya: Agent;
  tomasz: Agent;
  builder: Agent;
}
async function fresh(): Promise<Ctx> {
  const w = await seededWorld();
  return {
    w,
    owner: await w.signIn(EMAILS.owner),
    priya: await w.signIn(EMAILS.priya),
    tomasz: await w.signIn(EMAILS.tomasz),
    builder: await w.signIn(EMAILS.builder),
  };
}
function world() {
  const box = {} as { c: Ctx };
  beforeAll(async () => {
    box.c = await fresh();
  }, 120_000);
  afterAll(async () => {
    await box.c?.w.close();
  });
  return box;
}

describe('GET /api/payments', () => {
  const box = world();
  it('gives the owner every payment with its client and no checkout address', async () => {
    const { w, owner } = box.c;
    const r = await owner.get('/api/payments');
    expect(r.status).toBe(200);
    expect(r.body.payments).toEqual([
      expect.objectContaining({
        id: w.ids.tomaszDeposit,
        projectId: w.ids.tomaszProject,
        clientName: 'Tomasz Wierzbicki',
        kind: 'deposit',
        status: 'paid',
        refundedCents: 0,
      }),
    ]);
    expect(JSON.stringify(r.body)).not.toMatch(/"url"|checkout\.stripe|\/pay\//);
  });
  it('refuses clients and the builder with 403, no session with 401', async () => {
    const { w, priya, tomasz, builder } = box.c;
    expect((await tomasz.get('/api/payments')).status).toBe(403);
    expect((await priya.get('/api/payments')).status).toBe(403);
    expect((await builder.get('/api/payments')).status).toBe(403);
    expect((await fetch(`${w.api}/api/payments`)).status).toBe(401);
  });
});

describe('POST /api/payments/:id/refund', () => {
  const box = world();
  it('when the payment is paid, asks the card processor for the refund, and records it once confirmed', async () => {
    const { w, owner } = box.c;
    const r = await owner.post(`/api/payments/${w.ids.tomaszDeposit}/refund`).send({ amountCents: 2500 });
    expect(r.status).toBe(202);
    expect(r.body.refund).toMatchObject({ amountCents: 2500 });
    // the refund is recorded when the processor's webhook comes back
    const p = await waitFor('the refund recorded', 20_000, async () => {
      const x = (await owner.get('/api/payments')).body.payments[0];
      return x.refundedCents === 2500 ? x : undefined;
    });
    expect(p.status).toBe('partially_refunded');
  });
  it('refuses more than is left with 400 on amountCents', async () => {
    const { w, owner } = box.c;
    const r = await owner.post(`/api/payments/${w.ids.tomaszDeposit}/refund`).send({ amountCents: 100_000_000 });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe('amountCents');
  });
  it('refuses a malformed amount with 400', async () => {
    const { w, owner } = box.c;
    for (const amountCents of [0, -5, 1.5, '100'])
      expect((await owner.post(`/api/payments/${w.ids.tomaszDeposit}/refund`).send({ amountCents })).status).toBe(400);
  });
  it('answers 404 for a payment that does not exist', async () => {
    expect((await box.c.owner.post('/api/payments/no-such-payment/refund').send({})).status).toBe(404);
  });
  it('refuses the client and the builder with 403', async () => {
    const { w, tomasz, builder } = box.c;
    expect((await tomasz.post(`/api/payments/${w.ids.tomaszDeposit}/refund`).send({})).status).toBe(403);
    expect((await builder.post(`/api/payments/${w.ids.tomaszDeposit}/refund`).send({})).status).toBe(403);
  });
});

describe('POST /api/estimates/:id/deposit-checkout', () => {
  const box = world();
  it('before the estimate is accepted, refuses with 409', async () => {
    const { w, priya } = box.c;
    const r = await priya.post(`/api/estimates/${w.ids.priyaEstimate}/deposit-checkout`);
    expect(r.status).toBe(409);
  });
  it('when the estimate is accepted, gives the client the address of a checkout for the deposit', async () => {
    const { w, priya } = box.c;
    const a = await priya
      .post(`/api/estimates/${w.ids.priyaEstimate}/accept`)
      .send({ acceptedName: 'Priya Natarajan' });
    expect(a.status).toBe(200);
    const r = await priya.post(`/api/estimates/${w.ids.priyaEstimate}/deposit-checkout`);
    expect(r.status).toBe(200);
    expect(r.body.url.startsWith(w.stripeBase)).toBe(true);
  });
  it('when the deposit is paid already, refuses with 409', async () => {
    const { w, tomasz } = box.c;
    expect((await tomasz.post(`/api/estimates/${w.ids.tomaszEstimate}/deposit-checkout`)).status).toBe(409);
  });
  it("answers another client's estimate with 404 and refuses the owner and the builder with 403", async () => {
    const { w, tomasz, owner, builder } = box.c;
    expect((await tomasz.post(`/api/estimates/${w.ids.priyaEstimate}/deposit-checkout`)).status).toBe(404);
    expect((await owner.post(`/api/estimates/${w.ids.priyaEstimate}/deposit-checkout`)).status).toBe(403);
    expect((await builder.post(`/api/estimates/${w.ids.priyaEstimate}/deposit-checkout`)).status).toBe(403);
  });
});

describe('POST /api/estimates/:id/deposit-checkout with the card processor down', () => {
  it('answers 503 with a plain message, not a 500', async () => {
    // issue 13, defect 13
    const t = await testApp({ STRIPE_API_BASE: `http://127.0.0.1:${await freePort()}` });
    const owner = await t.signIn(EMAILS.owner);
    const priya = await t.signIn(EMAILS.priya);
    const projectId = (await priya.get('/api/projects')).body.projects[0].id;
    const d = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    expect((await owner.post(`/api/estimates/${d.id}/send`)).status).toBe(200);
    expect((await priya.post(`/api/estimates/${d.id}/accept`).send({ acceptedName: 'Priya Natarajan' })).status).toBe(
      200,
    );
    const r = await priya.post(`/api/estimates/${d.id}/deposit-checkout`);
    expect(r.status).toBe(503);
    expect(r.body.error.message).toMatch(/payment/i);
  });
});

describe('POST /api/projects/:id/balance-checkout', () => {
  const box = world();
  it('before the piece is ready, refuses with 409', async () => {
    const { w, tomasz } = box.c;
    expect((await tomasz.post(`/api/projects/${w.ids.tomaszProject}/balance-checkout`)).status).toBe(409);
  });
  it('when the piece is ready, gives the client the address of a checkout for the balance', async () => {
    const { w, owner, tomasz } = box.c;
    expect((await owner.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ stageKey: 'ready' })).status).toBe(200);
    const r = await tomasz.post(`/api/projects/${w.ids.tomaszProject}/balance-checkout`);
    expect(r.status).toBe(200);
    expect(r.body.url.startsWith(w.stripeBase)).toBe(true);
  });
  it("answers another client's project with 404 and refuses the owner and the builder with 403", async () => {
    const { w, priya, owner, builder } = box.c;
    expect((await priya.post(`/api/projects/${w.ids.tomaszProject}/balance-checkout`)).status).toBe(404);
    expect((await owner.post(`/api/projects/${w.ids.tomaszProject}/balance-checkout`)).status).toBe(403);
    expect((await builder.post(`/api/projects/${w.ids.tomaszProject}/balance-checkout`)).status).toBe(403);
  });
});

describe('POST /api/webhooks/stripe', () => {
  const box = world();
  const event = (id: string) => JSON.stringify({ id, object: 'event', type: 'customer.created', data: { object: {} } });
  const post = (body: string, signature?: string) =>
    fetch(`${box.c.w.api}/api/webhooks/stripe`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', ...(signature ? { 'Stripe-Signature': signature } : {}) },
      body,
    });
  it('when the event is signed with the shop secret, acknowledges it once and then as a duplicate', async () => {
    const body = event('evt_routes_1');
    const first = await post(body, signPayload(body, box.c.w.env.STRIPE_WEBHOOK_SECRET));
    expect(first.status).toBe(200);
    expect(await first.json()).toEqual({ received: true, duplicate: false });
    const again = await post(body, signPayload(body, box.c.w.env.STRIPE_WEBHOOK_SECRET));
    expect(await again.json()).toEqual({ received: true, duplicate: true });
  });
  it('refuses an unsigned event, one signed with another secret and one signed long ago with 400', async () => {
    const body = event('evt_routes_2');
    for (const sig of [
      undefined,
      signPayload(body, 'whsec_someone_else'),
      signPayload(body, box.c.w.env.STRIPE_WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 3600),
    ]) {
      const r = await post(body, sig);
      expect(r.status).toBe(400);
      expect(((await r.json()) as { error: { code: string } }).error.code).toBe('invalid_input');
    }
  });
});
