import { createServer, type Server } from 'node:http';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import { MailDev } from 'maildev';
import { pino } from 'pino';
import request from 'supertest';
import Stripe from 'stripe';
import { createStripeFake, signPayload } from '@benchwright/stripe-fake';
import { afterAll, assert, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../src/app';
import { applyMigrations, openDb, type Db } from '../src/db/client';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { jobs, outbox, payments, projects } from '../src/db/schema';
import { loadEnv } from '../src/env';
import { createMailWorker, type MailWorker } from '../src/lib/mailer';
import { binary, freePort, pdfText } from './helpers';

const SMTP = await freePort();
const WEB = await freePort();
const SECRET = 'whsec_flow_test';
let maildev: MailDev;
let fake: ReturnType<typeof createStripeFake>;
let fakeServer: Server;
let apiServer: Server;
let api: string;
let db: Db;
let worker: MailWorker;
let stripeBase: string;

async function listen(s: Server): Promise<number> {
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', r));
  return (s.address() as AddressInfo).port;
}

beforeAll(async () => {
  maildev = new MailDev({
    smtp: SMTP,
    web: WEB,
    ip: '127.0.0.1',
    webIp: '127.0.0.1',
    mailDirectory: mkdtempSync(join(tmpdir(), 'bw-flow-mail-')),
    silent: true,
  });
  await maildev.start();
  apiServer = createServer();
  const apiPort = await listen(apiServer);
  api = `http://127.0.0.1:${apiPort}`;
  fakeServer = createServer();
  const fakePort = await listen(fakeServer);
  stripeBase = `http://127.0.0.1:${fakePort}`;
  fake = createStripeFake({
    baseUrl: stripeBase,
    webhookUrl: `${api}/api/webhooks/stripe`,
    webhookSecret: SECRET,
    retryBaseMs: 100,
  });
  fakeServer.on('request', fake.app);
  const dir = mkdtempSync(join(tmpdir(), 'bw-flow-'));
  const env = loadEnv({
    DATABASE_PATH: ':memory:',
    LOG_LEVEL: 'silent',
    RATE_LIMITS: 'false',
    STRIPE_API_BASE: stripeBase,
    STRIPE_WEBHOOK_SECRET: SECRET,
    PDF_DIR: join(dir, 'pdf'),
    SMTP_URL: `smtp://127.0.0.1:${SMTP}`,
  });
  db = openDb(':memory:');
  applyMigrations(db);
  await seedDemo(db);
  apiServer.on('request', createApp({ db, env, log: pino({ level: 'silent' }), ready: () => true }));
  worker = createMailWorker(db, env.SMTP_URL, env.MAIL_FROM, { warn: () => undefined }, env.PDF_DIR);
});
afterAll(async () => {
  await worker.stop();
  fake.stop();
  await new Promise((r) => fakeServer.close(r));
  apiServer.closeAllConnections();
  await new Promise((r) => apiServer.close(r));
  await maildev.stop();
});

const agent = async (email: string) => {
  const a = request.agent(api);
  expect((await a.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD })).status).toBe(200);
  return a;
};
interface Mail {
  id: string;
  subject: string;
  text: string;
  to: { address: string }[];
  attachments?: { contentType: string; generatedFileName: string }[];
}
async function inbox(): Promise<Mail[]> {
  await worker.tick();
  return (await (await fetch(`http://127.0.0.1:${WEB}/api/email`)).json()) as Mail[];
}
async function until<T>(f: () => T | Promise<T>, ok: (v: T) => boolean, what: string): Promise<T> {
  for (let i = 0; i < 100; i++) {
    const v = await f();
    if (ok(v)) return v;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`timed out waiting for ${what}`);
}
async function pay(url: string, card: string) {
  return fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card_number: card, exp: '12/34', cvc: '123', name: 'Priya Natarajan' }),
  });
}
/** a response body as bytes (supertest would otherwise try to parse the PDF) */

describe('an estimate travels: send, accept, pay the deposit, onto the board', () => {
  let projectId: string;
  let estimateId: string;
  let total: { totalCents: number; depositCents: number; balanceCents: number; taxCents: number };
  let owner: Awaited<ReturnType<typeof agent>>;
  let priya: Awaited<ReturnType<typeof agent>>;

  it('POST /api/projects/:id/estimates prices a draft from the engine; the client cannot see it yet', async () => {
    owner = await agent('maren@fernhill.example');
    priya = await agent('priya@example.com');
    projectId = (await priya.get('/api/projects')).body.projects[0].id;
    const r = await owner.post(`/api/projects/${projectId}/estimates`).send({});
    expect(r.status).toBe(201);
    const e = r.body.estimate;
    expect(e).toMatchObject({ revision: 1, status: 'draft', version: 1 });
    expect(e.lines.length).toBeGreaterThan(5);
    expect(e.lines.every((l: { source: string }) => l.source === 'computed')).toBe(true);
    // the labour lines name the stages as the board does
    const labour = e.lines
      .filter((l: { group: string }) => l.group === 'labour')
      .map((l: { description: string }) => l.description);
    expect(labour).toContain('Shop time: Cutting');
    expect(labour.join(' ')).not.toMatch(/final check|material and set-up/);
    expect(e.totals.depositCents + e.totals.balanceCents).toBe(e.totals.totalCents);
    estimateId = e.id;
    expect((await priya.get(`/api/estimates/${estimateId}`)).status).toBe(404);
    expect((await priya.get(`/api/projects/${projectId}`)).body.project.status).toBe('estimating');
    expect((await owner.get(`/api/projects/${projectId}`)).body.project.status).toBe('estimating');
  });

  it('PATCH /api/estimates/:id adds a manual line with a reason, and refuses a stale version (409)', async () => {
    const cur = (await owner.get(`/api/estimates/${estimateId}`)).body.estimate;
    const noReason = await owner.patch(`/api/estimates/${estimateId}`).send({
      version: cur.version,
      lines: [
        ...cur.lines,
        {
          group: 'delivery',
          description: 'Delivery to Alder Cross',
          quantity: 1,
          unit: 'trip',
          unitPriceCents: 9500,
        },
      ],
    });
    expect(noReason.status, JSON.stringify(noReason.body)).toBe(400);
    expect(noReason.body.error.issues[0].path).toMatch(/overrideReason/);
    const r = await owner.patch(`/api/estimates/${estimateId}`).send({
      version: cur.version,
      lines: [
        ...cur.lines,
        {
          group: 'delivery',
          description: 'Delivery to Alder Cross',
          quantity: 1,
          unit: 'trip',
          unitPriceCents: 9500,
          overrideReason: 'client asked for delivery',
        },
      ],
    });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.estimate.version).toBe(cur.version + 1);
    expect(r.body.estimate.totals.subtotalCents).toBe(cur.totals.subtotalCents + 9500);
    const stale = await owner.patch(`/api/estimates/${estimateId}`).send({ version: cur.version, discountCents: 100 });
    expect(stale.status).toBe(409);
    total = r.body.estimate.totals;
  });

  it('POST /api/estimates/:id/send freezes the revision and mails the PDF, whose figures match to the cent', async () => {
    const r = await owner.post(`/api/estimates/${estimateId}/send`);
    expect(r.status).toBe(200);
    expect(r.body.estimate.status).toBe('sent');
    const mail = await until(
      inbox,
      (m) => m.some((x) => /Your estimate from Fernhill Joinery/.test(x.subject)),
      'the estimate mail',
    );
    const em = mail.find((x) => /Your estimate/.test(x.subject))!;
    expect(em.to[0]?.address).toBe('priya@example.com');
    expect(em.text).toContain(`/projects/${projectId}`);
    expect(em.attachments?.[0]?.contentType).toBe('application/pdf');
    const pdf = await binary(priya.get(`/api/estimates/${estimateId}/pdf`));
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const text = pdfText(pdf.body as Buffer);
    const usd = (c: number) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(c / 100);
    for (const c of [total.totalCents, total.depositCents, total.balanceCents, total.taxCents])
      expect(text).toContain(usd(c));
    expect(text).toContain('Revision 1');
    // the safety block states this work's own checks and what is included, nothing it does not have
    expect(text).toMatch(/Safety[\s\S]*Each caster carries up to \d+ lb[\s\S]*Included for safety[\s\S]*caster/);
    expect(text).not.toMatch(/supplied anchor kit|load limits stated here/);
    // quantities as people write them, in the imperial demo shop's units
    expect(text).toMatch(/\b\d+ sheets?\b/);
    expect(text).toMatch(/banding.*[\d.]+ ft\s+\$[\d.]+\/ft/);
    expect(text).not.toMatch(/\d m\b|\bkg\b/);
    expect(text).toMatch(/Page 1 of \d/);
    expect((await owner.patch(`/api/estimates/${estimateId}`).send({ version: 3, discountCents: 5 })).status).toBe(409);
  });

  it('answers 404 to another client on every route of the flow', async () => {
    const tomasz = await agent('tomasz@example.com');
    expect((await tomasz.get(`/api/estimates/${estimateId}`)).status).toBe(404);
    expect((await tomasz.get(`/api/estimates/${estimateId}/pdf`)).status).toBe(404);
    expect((await tomasz.post(`/api/estimates/${estimateId}/accept`).send({ acceptedName: 'Tomasz W' })).status).toBe(
      404,
    );
    expect((await tomasz.post(`/api/estimates/${estimateId}/deposit-checkout`)).status).toBe(404);
    expect((await tomasz.post(`/api/projects/${projectId}/balance-checkout`)).status).toBe(404);
    expect((await tomasz.get(`/api/projects/${projectId}`)).status).toBe(404);
  });

  it('refuses a deposit before acceptance (409), then records the acceptance with name, time and IP', async () => {
    expect((await priya.post(`/api/estimates/${estimateId}/deposit-checkout`)).status).toBe(409);
    expect((await priya.post(`/api/estimates/${estimateId}/accept`).send({ acceptedName: 'P' })).status).toBe(400);
    const r = await priya
      .post(`/api/estimates/${estimateId}/accept`)
      .set('User-Agent', 'flow-test')
      .send({ acceptedName: 'Priya Natarajan' });
    expect(r.status).toBe(200);
    expect(r.body.estimate).toMatchObject({ status: 'accepted', acceptedName: 'Priya Natarajan' });
    const row = db.$client
      .prepare('select accepted_ip, accepted_user_agent, accepted_at from estimates where id = ?')
      .get(estimateId) as Record<string, unknown>;
    expect(row.accepted_ip).toBeTruthy();
    expect(row.accepted_user_agent).toBe('flow-test');
    expect((await priya.get(`/api/projects/${projectId}`)).body.project.status).toBe('accepted');
  });

  it('gives the same checkout while it is open; a declined card leaves the project unpaid', async () => {
    const a = await priya.post(`/api/estimates/${estimateId}/deposit-checkout`);
    const b = await priya.post(`/api/estimates/${estimateId}/deposit-checkout`);
    expect(a.status).toBe(200);
    expect(b.body.url).toBe(a.body.url);
    // once the session expires, asking again gives a new one
    const sdk = new Stripe('sk_test_flow', {
      host: '127.0.0.1',
      port: Number(new URL(stripeBase).port),
      protocol: 'http',
    });
    await sdk.checkout.sessions.expire(a.body.url.split('/pay/')[1]);
    const c = await priya.post(`/api/estimates/${estimateId}/deposit-checkout`);
    expect(c.status).toBe(200);
    expect(c.body.url).not.toBe(a.body.url);
    const declined = await pay(c.body.url, '4000 0000 0000 0002');
    expect(declined.status).toBe(402);
    await new Promise((r) => setTimeout(r, 200));
    expect((await priya.get(`/api/projects/${projectId}`)).body.project.status).toBe('accepted');
  });

  it('pays with 4242…: the signed webhook puts the job on the board with its hour budget and mails the receipt', async () => {
    const { url } = (await priya.post(`/api/estimates/${estimateId}/deposit-checkout`)).body;
    const paid = await pay(url, '4242 4242 4242 4242');
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toMatch(new RegExp(`/projects/${projectId}\\?session_id=cs_test_`));
    await until(
      () =>
        db
          .select()
          .from(projects)
          .all()
          .find((p) => p.id === projectId)!.status,
      (s) => s === 'deposit_paid',
      'deposit_paid',
    );
    const board = (await owner.get('/api/jobs')).body.jobs;
    expect(board).toHaveLength(1);
    expect(board[0]).toMatchObject({ stage: 'material', clientName: 'Priya Natarajan' });
    expect(board[0].hoursBudgeted.total).toBeGreaterThan(5);
    expect(board[0].hoursBudgeted.cutting).toBeGreaterThan(0);
    const mails = await until(inbox, (m) => m.some((x) => x.subject.startsWith('Deposit receipt')), 'the receipt');
    const receipts = mails.filter((m) => m.subject.startsWith('Deposit receipt'));
    expect(receipts).toHaveLength(1);
    expect(receipts[0]?.to[0]?.address).toBe('priya@example.com');
    expect(receipts[0]?.subject).toContain(
      new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(total.depositCents / 100),
    );
    expect(mails.some((m) => m.to[0]?.address === 'maren@fernhill.example' && /deposit/.test(m.subject))).toBe(true);
  });

  it('a resent event changes nothing: one payment, one job, one receipt', async () => {
    const events = (await (await fetch(`${stripeBase}/__fake/events`)).json()) as {
      data: { id: string; type: string }[];
    };
    for (const e of events.data) await fetch(`${stripeBase}/__fake/events/${e.id}/resend`, { method: 'POST' });
    await new Promise((r) => setTimeout(r, 400));
    expect(
      db
        .select()
        .from(payments)
        .all()
        .filter((p) => p.status === 'paid'),
    ).toHaveLength(1);
    expect(db.select().from(jobs).all()).toHaveLength(1);
    const mails = await inbox();
    expect(mails.filter((m) => m.subject.startsWith('Deposit receipt'))).toHaveLength(1);
  });

  it('a forged or stale signature answers 400 and changes nothing', async () => {
    const before = db.select().from(outbox).all().length;
    const payload = JSON.stringify({
      id: 'evt_forged',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { id: 'cs_x', payment_status: 'paid', metadata: { paymentId: 'x' } } },
    });
    const forged = await request(api)
      .post('/api/webhooks/stripe')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signPayload(payload, 'whsec_wrong'))
      .send(payload);
    expect(forged.status).toBe(400);
    expect(forged.body.error.code).toBe('invalid_input');
    const stale = await request(api)
      .post('/api/webhooks/stripe')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signPayload(payload, SECRET, Math.floor(Date.now() / 1000) - 3600))
      .send(payload);
    expect(stale.status).toBe(400);
    const none = await request(api).post('/api/webhooks/stripe').set('Content-Type', 'application/json').send(payload);
    expect(none.status).toBe(400);
    expect(db.$client.prepare("select count(*) as n from stripe_events where id = 'evt_forged'").get()).toEqual({
      n: 0,
    });
    expect(db.select().from(outbox).all().length).toBe(before);
  });

  it('acknowledges an unknown event type once', async () => {
    const payload = JSON.stringify({
      id: 'evt_unknown_1',
      object: 'event',
      type: 'customer.created',
      data: { object: {} },
    });
    const r = await request(api)
      .post('/api/webhooks/stripe')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signPayload(payload, SECRET))
      .send(payload);
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ received: true, duplicate: false });
  });

  it('shows the owner, on the overview, the accepted estimate, the deposit collected this month and the job’s hours', async () => {
    const o = (await owner.get('/api/overview')).body.overview;
    expect(o.acceptedThisMonth).toEqual({ count: 1, totalCents: total.totalCents });
    expect(o.collectedThisMonth).toEqual({ depositsCents: total.depositCents, balancesCents: 0 });
    expect(o.winRate).toEqual({ quoted: 1, won: 1 });
    expect(o.pipeline.deposit_paid).toBe(1);
    expect(o.hours).toEqual([expect.objectContaining({ clientName: 'Priya Natarajan', usedHours: 0 })]);
    expect(o.hours[0].budgetHours).toBeGreaterThan(0);
    expect((await priya.get('/api/overview')).status).toBe(403);
  });

  it('gives the builder the job’s traveller: cut list, every sheet drawn with its cuts, pick list, cautions, and no prices', async () => {
    const job = (await owner.get('/api/jobs')).body.jobs[0];
    const idris = await agent('idris@fernhill.example');
    const r = await idris.get(`/api/jobs/${job.id}/traveller`);
    expect(r.status).toBe(200);
    const t = r.body.traveller;
    expect(t.job.id).toBe(job.id);
    expect(t.pieces.length).toBeGreaterThan(0);
    expect(t.pieces[0].parts.length).toBeGreaterThan(3);
    const sheets = t.materials.reduce((s: number, m: { sheets: unknown[] }) => s + m.sheets.length, 0);
    expect(sheets).toBeGreaterThan(0);
    expect(t.materials[0].sheets[0].drawing.shapes.length).toBeGreaterThan(5);
    expect(t.materials[0].sheets[0].cuts[0]).toMatchObject({ order: 1 });
    expect(t.cautions.join(' ')).toMatch(/riving knife/);
    expect(JSON.stringify(t)).not.toMatch(/cents|price/i);
    // and as a PDF for the shop floor: the same cut list, the sheets one to a page, the cautions, no money
    const pdf = await binary(idris.get(`/api/jobs/${job.id}/traveller.pdf`));
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain(`Traveler: ${t.job.clientName}`);
    // in the imperial demo shop's words: pounds, banding by the foot, actual thicknesses to 1/32 in, the piece
    expect(text).toMatch(/About \d+ lb finished/);
    expect(text).toMatch(/[\d.]+ ft of edges to band/);
    expect(text).toMatch(/\b\d+\/32"/);
    expect(text).toMatch(/Piece[\s\S]*Overall[\s\S]*Finish[\s\S]*Fronts[\s\S]*Joinery/);
    expect(text).toMatch(/4 x 8 sheets/);
    expect(text).not.toMatch(/\bkg\b| m of edges/);
    expect(text).toContain(t.pieces[0].parts[0].name);
    expect(text).toMatch(new RegExp(`sheet 1 of ${t.materials[0].sheetCount}`));
    expect(text).toMatch(/riving knife/);
    expect(text).not.toContain('$');
    expect((await priya.get(`/api/jobs/${job.id}/traveller.pdf`)).status).toBe(403);
    expect((await priya.get(`/api/jobs/${job.id}/traveller`)).status).toBe(403);
    expect((await idris.get('/api/jobs/no-such-job/traveller')).status).toBe(404);
  });

  it('the board moves the project by its stage rules, asks for the balance at Ready, and a builder logs hours', async () => {
    const job = (await owner.get('/api/jobs')).body.jobs[0];
    const idris = await agent('idris@fernhill.example');
    expect((await idris.patch(`/api/jobs/${job.id}`).send({ stageKey: 'cutting' })).status).toBe(200);
    expect((await owner.get(`/api/projects/${projectId}`)).body.project.status).toBe('in_production');
    const t = await idris
      .post(`/api/jobs/${job.id}/time`)
      .send({ stageKey: 'cutting', hours: 2.5, note: 'broke down the sheets' });
    expect(t.status).toBe(201);
    expect(t.body.job.hoursLogged).toMatchObject({ cutting: 2.5, total: 2.5 });
    expect((await idris.post(`/api/jobs/${job.id}/time`).send({ stageKey: 'cutting', hours: 30 })).status).toBe(400);
    expect((await priya.get('/api/jobs')).status).toBe(403);
    expect((await idris.patch(`/api/jobs/${job.id}`).send({ stageKey: 'ready' })).status).toBe(200);
    expect((await owner.get(`/api/projects/${projectId}`)).body.project.status).toBe('ready');
    const mails = await until(inbox, (m) => m.some((x) => /balance of/.test(x.subject)), 'the balance request');
    expect(mails.find((m) => /balance of/.test(m.subject))!.subject).toContain(
      new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(total.balanceCents / 100),
    );
  });

  it('the client pays the balance once the piece is ready, and the owner refunds part of the deposit through Stripe', async () => {
    const { url } = (await priya.post(`/api/projects/${projectId}/balance-checkout`)).body;
    expect((await pay(url, '4242424242424242')).status).toBe(303);
    await until(
      () =>
        db
          .select()
          .from(payments)
          .all()
          .filter((p) => p.kind === 'balance' && p.status === 'paid').length,
      (n) => n === 1,
      'the balance',
    );
    const deposit = db
      .select()
      .from(payments)
      .all()
      .find((p) => p.kind === 'deposit' && p.status === 'paid')!;
    expect((await priya.post(`/api/payments/${deposit.id}/refund`).send({ amountCents: 100 })).status).toBe(403);
    const r = await owner.post(`/api/payments/${deposit.id}/refund`).send({ amountCents: 2500 });
    expect(r.status).toBe(202);
    await until(
      () =>
        db
          .select()
          .from(payments)
          .all()
          .find((p) => p.id === deposit.id)!.status,
      (s) => s === 'partially_refunded',
      'the refund',
    );
    const listed = (await owner.get('/api/payments')).body.payments.find((p: { id: string }) => p.id === deposit.id);
    expect(listed).toMatchObject({
      clientName: 'Priya Natarajan',
      kind: 'deposit',
      status: 'partially_refunded',
      refundedCents: 2500,
    });
    expect(listed).not.toHaveProperty('checkoutUrl');
    const mails = await until(inbox, (m) => m.some((x) => /Refund of \$25\.00/.test(x.subject)), 'the refund notice');
    expect(mails.filter((x) => /Refund of/.test(x.subject))).toHaveLength(1);
    const job = (await owner.get('/api/jobs')).body.jobs[0];
    expect((await owner.patch(`/api/jobs/${job.id}`).send({ stageKey: 'delivered' })).status).toBe(200);
    expect((await owner.get(`/api/projects/${projectId}`)).body.project.status).toBe('closed');
    const timeline = (await owner.get(`/api/projects/${projectId}`)).body.project.timeline.map(
      (e: { kind: string }) => e.kind,
    );
    expect(timeline).toEqual(
      expect.arrayContaining(['estimate_sent', 'estimate_accepted', 'deposit_paid', 'stage', 'balance_paid', 'refund']),
    );
  });
});

describe('revisions', () => {
  it('a superseded or expired revision cannot be accepted (409)', async () => {
    const owner = await agent('maren@fernhill.example');
    const tomasz = await agent('tomasz@example.com');
    const projectId = (await tomasz.get('/api/projects')).body.projects[0].id;
    const r1 = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    await owner.post(`/api/estimates/${r1.id}/send`);
    const r2 = (await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'copy' })).body.estimate;
    expect(r2).toMatchObject({ revision: 2, status: 'draft' });
    expect(r2.totals).toEqual(r1.totals);
    await owner.post(`/api/estimates/${r2.id}/send`);
    expect((await owner.get(`/api/estimates/${r1.id}`)).body.estimate.status).toBe('superseded');
    const old = await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    expect(old.status).toBe(409);
    expect(old.body.error.message).toMatch(/^Replaced by revision 2: accept the latest revision\.$/);
    db.$client.prepare('update estimates set valid_until = 0 where id = ?').run(r2.id);
    const late = await tomasz.post(`/api/estimates/${r2.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    expect(late.status).toBe(409);
    expect((await tomasz.get(`/api/estimates/${r2.id}`)).body.estimate.status).toBe('expired');
  });
});

describe('SMTP down while sending', () => {
  it('the estimate is still sent, and the mail arrives once maildev is back', async () => {
    await maildev.stop();
    const owner = await agent('maren@fernhill.example');
    const guild = await agent('guild@example.com');
    const projectId = (await guild.get('/api/projects')).body.projects[0].id;
    const e = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    const sent = await owner.post(`/api/estimates/${e.id}/send`);
    expect(sent.status).toBe(200);
    expect(sent.body.estimate.status).toBe('sent');
    await worker.tick();
    const pending = db
      .select()
      .from(outbox)
      .all()
      .filter((m) => m.to === 'guild@example.com' && m.status === 'pending');
    expect(
      pending,
      JSON.stringify(
        db
          .select()
          .from(outbox)
          .all()
          .map((m) => [m.to, m.status, m.attempts, m.lastError]),
      ),
    ).toHaveLength(1);
    // the worker tried, failed, and keeps every message for a later attempt
    expect(
      db
        .select()
        .from(outbox)
        .all()
        .some((m) => m.status === 'pending' && m.attempts >= 1 && m.lastError),
    ).toBe(true);
    // the owner sees it among the failed mail, with the relay's error; a client may not look
    const listed: { id: string; attempts: number; lastError: string | null }[] = (await owner.get('/api/mail/failed'))
      .body.mails;
    const tried = db
      .select()
      .from(outbox)
      .all()
      .filter((m) => m.status === 'pending' && m.attempts >= 1);
    expect(listed.map((m) => m.id).sort()).toEqual(tried.map((m) => m.id).sort());
    expect(listed.length).toBeGreaterThan(0);
    expect(listed.every((m) => m.attempts >= 1 && m.lastError)).toBe(true);
    const failed = listed[0];
    assert(failed);
    expect((await guild.get('/api/mail/failed')).status).toBe(403);
    maildev = new MailDev({
      smtp: SMTP,
      web: WEB,
      ip: '127.0.0.1',
      webIp: '127.0.0.1',
      mailDirectory: mkdtempSync(join(tmpdir(), 'bw-flow-mail-')),
      silent: true,
    });
    await maildev.start();
    // "try again now" instead of waiting out the backoff
    for (const m of (await owner.get('/api/mail/failed')).body.mails)
      expect((await owner.post(`/api/mail/${m.id}/retry`)).status).toBe(202);
    const mails = await until(
      inbox,
      (m) => m.some((x) => x.to[0]?.address === 'guild@example.com'),
      'the estimate mail after SMTP came back',
    );
    expect(mails.filter((x) => x.to[0]?.address === 'guild@example.com')).toHaveLength(1);
    await until(
      async () => (await owner.get('/api/mail/failed')).body.mails,
      (l) => l.length === 0,
      'no failed mail left',
    );
    expect((await owner.post(`/api/mail/${failed.id}/retry`)).status).toBe(409);
    expect((await owner.post('/api/mail/no-such/retry')).status).toBe(404);
  });
});

describe('POST /api/estimates/:id/withdraw with a deposit checkout open', () => {
  it('expires the checkout at the card processor first, so the withdrawn revision can no longer be paid', async () => {
    const owner = await agent('maren@fernhill.example');
    const guild = await agent('guild@example.com');
    const listed = (await guild.get('/api/projects')).body.projects[0];
    const project = (await guild.get(`/api/projects/${listed.id}`)).body.project;
    const sent = project.estimates.find((e: { status: string }) => e.status === 'sent');
    expect(
      (await guild.post(`/api/estimates/${sent.id}/accept`).send({ acceptedName: 'Alder Cross Guild' })).status,
    ).toBe(200);
    const { url } = (await guild.post(`/api/estimates/${sent.id}/deposit-checkout`)).body;
    const sessionId = url.split('/pay/')[1];
    const r = await owner
      .post(`/api/estimates/${sent.id}/withdraw`)
      .send({ reason: 'The cabinets need a deeper carcass.' });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.estimate.status).toBe('withdrawn');
    const sdk = new Stripe('sk_test_flow', {
      host: '127.0.0.1',
      port: Number(new URL(stripeBase).port),
      protocol: 'http',
    });
    expect((await sdk.checkout.sessions.retrieve(sessionId)).status).toBe('expired');
    expect(
      db
        .select()
        .from(payments)
        .all()
        .find((p) => p.stripeSessionId === sessionId)!.status,
    ).toBe('expired');
    expect((await pay(url, '4242 4242 4242 4242')).status).not.toBe(303);
    expect((await guild.get(`/api/projects/${project.id}`)).body.project.status).toBe('estimating');
    expect(
      db
        .select()
        .from(jobs)
        .all()
        .filter((j) => j.projectId === project.id),
    ).toHaveLength(0);
  });
});

// the SDK is what the API uses; make sure it is the one pinned
it('uses the stripe SDK pinned to API version 2026-10-28.endive', () => {
  expect(Stripe.API_VERSION ?? new Stripe('sk_test_x').getApiField('version')).toMatch(/2026-10-28/);
});
