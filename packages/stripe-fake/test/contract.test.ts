import { createServer, type Server } from 'node:http';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterEach, assert, beforeEach, describe, expect, it } from 'vitest';
import { createStripeFake } from '../src/server';

const SECRET = 'whsec_test_contract';
let server: Server;
let hook: Server;
let received: { body: string; signature: string }[];
let fail = 0;
let fake: ReturnType<typeof createStripeFake>;
let stripe: Stripe;
let base: string;
let stateFile: string;

async function listen(s: Server): Promise<number> {
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', r));
  return (s.address() as AddressInfo).port;
}

async function start(file = stateFile) {
  hook = createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      if (fail > 0) {
        fail--;
        res.statusCode = 500;
        return res.end();
      }
      received.push({ body, signature: String(req.headers['stripe-signature']) });
      res.end('{}');
    });
  });
  const hookPort = await listen(hook);
  server = createServer();
  const port = await listen(server);
  base = `http://127.0.0.1:${port}`;
  fake = createStripeFake({
    stateFile: file,
    baseUrl: base,
    webhookUrl: `http://127.0.0.1:${hookPort}/hook`,
    webhookSecret: SECRET,
    retryBaseMs: 50,
    businessName: 'Fernhill Joinery',
  });
  server.on('request', fake.app);
  stripe = new Stripe('sk_test_contract', { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0 });
}

async function stop() {
  fake.stop();
  await new Promise((r) => server.close(r));
  await new Promise((r) => hook.close(r));
}

beforeEach(async () => {
  received = [];
  fail = 0;
  stateFile = join(mkdtempSync(join(tmpdir(), 'bw-stripe-')), 'stripe-fake.json');
  await start();
});
afterEach(stop);

const sessionParams = (
  over: Partial<Stripe.Checkout.SessionCreateParams> = {},
): Stripe.Checkout.SessionCreateParams => ({
  mode: 'payment',
  line_items: [
    {
      quantity: 1,
      price_data: {
        currency: 'usd',
        unit_amount: 163678,
        product_data: { name: 'Deposit: assembly bench, revision 1' },
      },
    },
  ],
  customer_email: 'priya@example.com',
  client_reference_id: 'project-1',
  metadata: { projectId: 'project-1', estimateId: 'est-1', kind: 'deposit' },
  payment_intent_data: { metadata: { projectId: 'project-1', estimateId: 'est-1', kind: 'deposit' } },
  success_url: 'http://127.0.0.1:5173/projects/project-1?session_id={CHECKOUT_SESSION_ID}',
  cancel_url: 'http://127.0.0.1:5173/projects/project-1',
  ...over,
});

async function payForm(url: string, card: string) {
  return fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card_number: card, exp: '12/34', cvc: '123', name: 'Priya Natarajan' }),
  });
}

async function eventsOf(type: string, n = 1) {
  for (let i = 0; i < 100 && received.filter((r) => JSON.parse(r.body).type === type).length < n; i++)
    await new Promise((r) => setTimeout(r, 20));
  return received.filter((r) => JSON.parse(r.body).type === type);
}

describe('secret-key auth', () => {
  it("answers 401 with Stripe's error object without a test key", async () => {
    const bad = new Stripe('sk_live_nope', {
      host: '127.0.0.1',
      port: Number(new URL(base).port),
      protocol: 'http',
      maxNetworkRetries: 0,
    });
    await expect(bad.checkout.sessions.create(sessionParams())).rejects.toMatchObject({
      type: 'StripeAuthenticationError',
      statusCode: 401,
    });
    const raw = await fetch(`${base}/v1/checkout/sessions/cs_test_x`);
    expect(raw.status).toBe(401);
    expect(((await raw.json()) as { error: unknown }).error).toMatchObject({
      type: 'invalid_request_error',
      code: 'api_key_invalid',
    });
  });
});

describe('POST /v1/checkout/sessions', () => {
  it("creates an open session with Stripe's shape, prefix and hosted page", async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect(s.id).toMatch(/^cs_test_[A-Za-z0-9]+$/);
    expect(s).toMatchObject({
      object: 'checkout.session',
      status: 'open',
      payment_status: 'unpaid',
      amount_total: 163678,
      currency: 'usd',
      mode: 'payment',
      metadata: { kind: 'deposit' },
      client_reference_id: 'project-1',
      customer_email: 'priya@example.com',
    });
    expect(s.url).toBe(`${base}/pay/${s.id}`);
    const page = await (await fetch(s.url!)).text();
    expect(page).toContain('$1,636.78');
    expect(page).toContain('Deposit: assembly bench, revision 1');
    expect(page).toContain('<h1>Pay Fernhill Joinery</h1>');
    expect(page).not.toContain('Pay as');
    expect((await stripe.checkout.sessions.retrieve(s.id)).id).toBe(s.id);
  });
  it('refuses missing line items with a parameter error', async () => {
    await expect(stripe.checkout.sessions.create({ ...sessionParams(), line_items: [] })).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      param: 'line_items',
    });
  });
  it('returns the first response for the same idempotency key and body, and refuses another body', async () => {
    const a = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'k-1' });
    const b = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'k-1' });
    expect(b.id).toBe(a.id);
    await expect(
      stripe.checkout.sessions.create(sessionParams({ customer_email: 'other@example.com' }), {
        idempotencyKey: 'k-1',
      }),
    ).rejects.toMatchObject({ type: 'StripeIdempotencyError' });
  });
});

describe('the hosted test checkout page', () => {
  it('with 4242 4242 4242 4242, completes the session, redirects to success_url and sends signed events', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    const r = await payForm(s.url!, '4242 4242 4242 4242');
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe(`http://127.0.0.1:5173/projects/project-1?session_id=${s.id}`);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    expect(done).toMatchObject({ status: 'complete', payment_status: 'paid' });
    const pi = await stripe.paymentIntents.retrieve(done.payment_intent as string);
    expect(pi).toMatchObject({ status: 'succeeded', amount: 163678, metadata: { kind: 'deposit' } });
    const [completed] = await eventsOf('checkout.session.completed');
    if (!completed) throw new Error('no checkout.session.completed event was delivered');
    assert(completed, 'no checkout.session.completed event');
    await eventsOf('payment_intent.succeeded');
    const event = stripe.webhooks.constructEvent(completed.body, completed.signature, SECRET);
    expect(event.id).toMatch(/^evt_[A-Za-z0-9]+$/);
    expect((event.data.object as Stripe.Checkout.Session).id).toBe(s.id);
    expect(() => stripe.webhooks.constructEvent(completed.body, completed.signature, 'whsec_wrong')).toThrow();
    const list = (await (await fetch(`${base}/__fake/events`)).json()) as { object: string; data: { type: string }[] };
    expect(list.object).toBe('list');
    expect(list.data[0]?.type).toBe('payment_intent.succeeded');
  });
  it('with 4000 0000 0000 0002, answers 402, sends no event, and the session can be paid again', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    const r = await payForm(s.url!, '4000 0000 0000 0002');
    expect(r.status).toBe(402);
    expect(await r.text()).toContain('Your card was declined');
    await new Promise((res) => setTimeout(res, 100));
    expect(received).toHaveLength(0);
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('open');
    expect((await payForm(s.url!, '4242424242424242')).status).toBe(303);
  });
  it('retries a webhook with backoff when the endpoint fails, and resends one on request', async () => {
    fail = 2;
    const s = await stripe.checkout.sessions.create(sessionParams());
    await payForm(s.url!, '4242424242424242');
    const got = await eventsOf('checkout.session.completed');
    expect(got).toHaveLength(1);
    assert(got[0]);
    const id = JSON.parse(got[0].body).id;
    await fetch(`${base}/__fake/events/${id}/resend`, { method: 'POST' });
    expect(await eventsOf('checkout.session.completed', 2)).toHaveLength(2);
  });
});

describe('expiry and refunds', () => {
  it('expires an open session and sends checkout.session.expired', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect((await stripe.checkout.sessions.expire(s.id)).status).toBe('expired');
    expect(await eventsOf('checkout.session.expired')).toHaveLength(1);
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({ type: 'StripeInvalidRequestError' });
    expect((await payForm(s.url!, '4242424242424242')).status).toBe(409);
  });
  it('refunds part then the rest of a payment, with charge.refunded and refund.created', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    await payForm(s.url!, '4242424242424242');
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    const part = await stripe.refunds.create({ payment_intent: pi, amount: 10000 });
    expect(part).toMatchObject({ object: 'refund', amount: 10000, status: 'succeeded' });
    expect(part.id).toMatch(/^re_test_/);
    await expect(stripe.refunds.create({ payment_intent: pi, amount: 999999 })).rejects.toMatchObject({
      param: 'amount',
    });
    const rest = await stripe.refunds.create({ payment_intent: pi });
    expect(rest.amount).toBe(153678);
    expect((await stripe.refunds.retrieve(rest.id)).id).toBe(rest.id);
    const [, charged] = await eventsOf('charge.refunded', 2);
    assert(charged, 'no second charge.refunded event');
    expect(JSON.parse(charged.body).data.object).toMatchObject({ refunded: true, amount_refunded: 163678 });
    expect(await eventsOf('refund.created', 2)).toHaveLength(2);
  });
});

describe('state on disk', () => {
  it('keeps sessions and payments across a restart', async () => {
    const s = await stripe.checkout.sessions.create(sessionParams());
    await payForm(s.url!, '4242424242424242');
    expect(JSON.parse(readFileSync(stateFile, 'utf8')).sessions[s.id].status).toBe('complete');
    await stop();
    await start(stateFile);
    const again = await stripe.checkout.sessions.retrieve(s.id);
    expect(again.payment_status).toBe('paid');
    expect((await stripe.paymentIntents.retrieve(again.payment_intent as string)).status).toBe('succeeded');
  });
  it('keeps a webhook delivery that was not acknowledged across a restart, and delivers it once started again', async () => {
    fail = 1_000_000; // the endpoint is down
    const s = await stripe.checkout.sessions.create(sessionParams());
    await payForm(s.url!, '4242424242424242');
    const onDisk = () => JSON.parse(readFileSync(stateFile, 'utf8')) as { pending?: { attempt: number }[] };
    for (let i = 0; i < 200 && !(onDisk().pending ?? []).some((p) => p.attempt >= 2); i++)
      await new Promise((r) => setTimeout(r, 20));
    expect(onDisk().pending?.length).toBeGreaterThan(0);
    expect(received).toHaveLength(0);
    await stop();
    fail = 0; // the endpoint is back; the stand-in starts again from its file
    await start(stateFile);
    const [completed] = await eventsOf('checkout.session.completed');
    if (!completed) throw new Error('no checkout.session.completed event was delivered');
    expect(
      (stripe.webhooks.constructEvent(completed.body, completed.signature, SECRET).data.object as { id: string }).id,
    ).toBe(s.id);
    expect(await eventsOf('payment_intent.succeeded')).toHaveLength(1);
    for (let i = 0; i < 100 && (onDisk().pending ?? []).length > 0; i++) await new Promise((r) => setTimeout(r, 20));
    expect(onDisk().pending).toEqual([]);
  });
});
