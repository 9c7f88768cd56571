import { createServer, type Server } from 'node:http';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import { and, eq } from 'drizzle-orm';
import { pino } from 'pino';
import request from 'supertest';
import Stripe from 'stripe';
import { designs } from '@benchwright/pricing';
import { createStripeFake, signPayload } from '@benchwright/stripe-fake';
import { expect } from 'vitest';
import { createApp } from '../src/app';
import { applyMigrations, openDb, type Db } from '../src/db/client';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { jobs, outbox, payments, projectEvents, projects } from '../src/db/schema';
import { loadEnv } from '../src/env';
import { freePort } from './helpers';

/**
 * The API on a real free port with the Stripe stand-in in-process (as in flow.test.ts), for the payment
 * tests. `hooksDown` makes the API refuse the stand-in's webhook deliveries (503), as if it were down
 * while the client paid; the test can still deliver events itself, in the order it wants.
 */
export const SECRET = 'whsec_payments_test';

export interface Harness {
  api: string;
  db: Db;
  app: ReturnType<typeof createApp>;
  fake: ReturnType<typeof createStripeFake>;
  sdk: Stripe;
  stripeBase: string;
  hooksDown: boolean;
  stopStripe(): Promise<void>;
  startStripe(): Promise<void>;
  close(): Promise<void>;
}

async function listen(s: Server, port = 0): Promise<number> {
  await new Promise<void>((r) => s.listen(port, '127.0.0.1', r));
  return (s.address() as AddressInfo).port;
}

export async function startHarness(): Promise<Harness> {
  const apiServer = createServer();
  const apiPort = await listen(apiServer, await freePort());
  const api = `http://127.0.0.1:${apiPort}`;
  const fakePort = await freePort();
  const stripeBase = `http://127.0.0.1:${fakePort}`;
  const fake = createStripeFake({
    baseUrl: stripeBase,
    webhookUrl: `${api}/api/webhooks/stripe`,
    webhookSecret: SECRET,
    retryBaseMs: 50,
    maxAttempts: 3,
  });
  let fakeServer = createServer(fake.app);
  await listen(fakeServer, fakePort);
  const env = loadEnv({
    DATABASE_PATH: ':memory:',
    LOG_LEVEL: 'silent',
    RATE_LIMITS: 'false',
    STRIPE_API_BASE: stripeBase,
    STRIPE_WEBHOOK_SECRET: SECRET,
    PDF_DIR: join(mkdtempSync(join(tmpdir(), 'bw-pay-')), 'pdf'),
  });
  const db = openDb(':memory:');
  applyMigrations(db);
  await seedDemo(db);
  const app = createApp({ db, env, log: pino({ level: 'silent' }), ready: () => true });
  const h: Harness = {
    api,
    db,
    app,
    fake,
    stripeBase,
    hooksDown: false,
    sdk: new Stripe('sk_test_payments', { host: '127.0.0.1', port: fakePort, protocol: 'http' }),
    async stopStripe() {
      fakeServer.closeAllConnections();
      await new Promise((r) => fakeServer.close(r));
    },
    async startStripe() {
      fakeServer = createServer(fake.app);
      await listen(fakeServer, fakePort);
    },
    async close() {
      fake.stop();
      fakeServer.closeAllConnections();
      await new Promise((r) => fakeServer.close(r));
      apiServer.closeAllConnections();
      await new Promise((r) => apiServer.close(r));
      db.$client.close();
    },
  };
  apiServer.on('request', (req, res) => {
    if (h.hooksDown && String(req.headers['user-agent']).startsWith('Stripe/')) {
      res.statusCode = 503;
      return void res.end();
    }
    app(req, res);
  });
  return h;
}

export async function signIn(h: Harness, email: string) {
  const a = request.agent(h.api);
  expect((await a.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD })).status).toBe(200);
  return a;
}

/** A new request of the client's, estimated, sent and accepted: its deposit is due. */
export async function depositDue(h: Harness, clientEmail = 'guild@example.com', clientName = 'Alder Cross Guild') {
  const owner = await signIn(h, 'maren@fernhill.example');
  const client = await signIn(h, clientEmail);
  const made = await client
    .post('/api/projects')
    .send({ items: [{ spec: designs['wall-cabinet'].defaults, quantity: 1 }], notes: 'payments test' });
  expect(made.status, JSON.stringify(made.body)).toBe(201);
  const projectId: string = made.body.project.id;
  const est = await owner.post(`/api/projects/${projectId}/estimates`).send({});
  expect(est.status, JSON.stringify(est.body)).toBe(201);
  const estimateId: string = est.body.estimate.id;
  expect((await owner.post(`/api/estimates/${estimateId}/send`)).status).toBe(200);
  expect((await client.post(`/api/estimates/${estimateId}/accept`).send({ acceptedName: clientName })).status).toBe(
    200,
  );
  return { owner, client, projectId, estimateId, depositCents: est.body.estimate.totals.depositCents as number };
}

/** Asks for the deposit's checkout; its session id. */
export async function checkout(client: Awaited<ReturnType<typeof signIn>>, estimateId: string) {
  const r = await client.post(`/api/estimates/${estimateId}/deposit-checkout`);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return { url: r.body.url as string, sessionId: (r.body.url as string).split('/pay/')[1] };
}

export async function payAtStripe(url: string) {
  const r = await fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card_number: '4242424242424242', exp: '12/34', cvc: '123', name: 'A Client' }),
  });
  expect(r.status).toBe(303);
  return r.headers.get('location')!;
}

/** Waits for a condition with a deadline (no fixed sleeps). */
export async function until<T>(f: () => T | Promise<T>, ok: (v: T) => boolean, what: string, ms = 10_000): Promise<T> {
  const end = Date.now() + ms;
  for (;;) {
    const v = await f();
    if (ok(v)) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what} (last: ${JSON.stringify(v)})`);
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Until the stand-in has given up delivering (its retries are spent): the webhooks are lost. */
export async function deliveriesGivenUp(h: Harness) {
  await until(
    () => h.fake.state.pending?.length ?? 0,
    (n) => n === 0,
    'the stand-in to give up its deliveries',
  );
}

export type StripeEvent = { id: string; type: string; data: { object: Record<string, unknown> } };

/** The stand-in's events about one session: its own and those of its payment intent and charge. */
export async function eventsOf(h: Harness, sessionId: string): Promise<StripeEvent[]> {
  const s = await h.sdk.checkout.sessions.retrieve(sessionId);
  const pi = typeof s.payment_intent === 'string' ? s.payment_intent : null;
  const all = ((await (await fetch(`${h.stripeBase}/__fake/events`)).json()) as { data: StripeEvent[] }).data;
  return all
    .filter(
      (e) => e.data.object.id === sessionId || (pi && (e.data.object.id === pi || e.data.object.payment_intent === pi)),
    )
    .reverse();
}

/** Delivers an event as Stripe would, signed with the endpoint's secret. */
export async function deliver(h: Harness, event: object) {
  const payload = JSON.stringify(event);
  return fetch(`${h.api}/api/webhooks/stripe`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'Stripe-Signature': signPayload(payload, SECRET) },
    body: payload,
  });
}

/** What a project's payment left behind: its payments, jobs, receipts queued and owner-only notes. */
export function ledger(h: Harness, projectId: string) {
  const pays = h.db.select().from(payments).where(eq(payments.projectId, projectId)).all();
  return {
    status: h.db.select().from(projects).where(eq(projects.id, projectId)).get()!.status,
    paid: pays.filter((p) => p.status !== 'open' && p.status !== 'expired'),
    payments: pays,
    jobs: h.db.select().from(jobs).where(eq(jobs.projectId, projectId)).all().length,
    receipts: h.db
      .select()
      .from(outbox)
      .all()
      .filter((m) => m.subject.startsWith('Deposit receipt') && m.text.includes(projectId)).length,
    mismatches: h.db
      .select()
      .from(projectEvents)
      .where(and(eq(projectEvents.projectId, projectId), eq(projectEvents.kind, 'payment_mismatch')))
      .all(),
  };
}
