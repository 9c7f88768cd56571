import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as z from 'zod';
import { pino } from 'pino';
import request from 'supertest';
import { createApp } from '../src/app';
import { applyMigrations, openDb, type Db } from '../src/db/client';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { outbox } from '../src/db/schema';
import { loadEnv, type Env } from '../src/env';
import * as contracts from '@benchwright/contracts';

export const PORTAL = 'http://127.0.0.1:5173';

export interface TestApp {
  db: Db;
  env: Env;
  app: ReturnType<typeof createApp>;
  agent: () => ReturnType<typeof request.agent>;
  signIn: (email: string, password?: string) => Promise<ReturnType<typeof request.agent>>;
  mails: () => (typeof outbox.$inferSelect)[];
}

/** The real app on a fresh in-memory database with the migrations applied and the demo seeded. */
export async function testApp(overrides: Record<string, string> = {}): Promise<TestApp> {
  const env = loadEnv({ DATABASE_PATH: ':memory:', LOG_LEVEL: 'silent', RATE_LIMITS: 'false', ...overrides });
  const db = openDb(':memory:');
  applyMigrations(db);
  await seedDemo(db);
  const app = createApp({ db, env, log: pino({ level: 'silent' }), ready: () => true });
  checkContracts(app);
  const agent = () => request.agent(app);
  return {
    db,
    env,
    app,
    agent,
    async signIn(email, password = DEMO_PASSWORD) {
      const a = agent();
      const r = await a.post('/api/auth/sign-in').send({ email, password });
      if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
      return a;
    },
    mails: () => db.select().from(outbox).all(),
  };
}

/** The token in the last link of a mail's text. */
export function tokenFrom(text: string | undefined): string {
  const m = /token=([A-Za-z0-9_-]+)/.exec(text ?? '');
  if (!m?.[1]) throw new Error(`no token in: ${text}`);
  return m[1];
}

/** A TCP port free on the loopback right now, so that test files running side by side never collide. */
export async function freePort(): Promise<number> {
  const { createServer } = await import('node:net');
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as import('node:net').AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/**
 * The body of a response, parsed with its contract schema from `@benchwright/contracts`: a response that drifts
 * from the contract fails the test that reads it, naming the field.
 */
export function contract<S extends z.ZodType>(schema: S, res: { status: number; body: unknown }): z.output<S> {
  const r = schema.safeParse(res.body);
  if (!r.success)
    throw new Error(
      `the ${res.status} answer drifts from its contract:\n${z.prettifyError(r.error)}\n${JSON.stringify(res.body).slice(0, 1500)}`,
    );
  return r.data;
}

/** Each route's answer (2xx JSON) and its contract schema, by method and route pattern. */
const CONTRACTS: Record<string, z.ZodType> = {
  'GET /api/auth/me': contracts.UserResponse,
  'POST /api/auth/sign-in': contracts.UserResponse,
  'POST /api/auth/sign-up': contracts.UserResponse,
  'GET /api/designs': contracts.DesignsResponse,
  'GET /api/designs/:slug': contracts.DesignResponse,
  'POST /api/quotes/preview': contracts.QuotePreviewResponse,
  'GET /api/projects': contracts.ProjectsResponse,
  'POST /api/projects': contracts.ProjectResponse,
  'GET /api/projects/:id': contracts.ProjectResponse,
  'POST /api/projects/:id/comments': contracts.ProjectResponse,
  'POST /api/projects/:id/estimates': contracts.EstimateResponse,
  'POST /api/projects/:id/balance-checkout': contracts.CheckoutResponse,
  'POST /api/projects/:id/uploads': contracts.UploadResponse,
  'GET /api/estimates/:id': contracts.EstimateResponse,
  'PATCH /api/estimates/:id': contracts.EstimateResponse,
  'POST /api/estimates/:id/send': contracts.EstimateResponse,
  'POST /api/estimates/:id/accept': contracts.EstimateResponse,
  'POST /api/estimates/:id/withdraw': contracts.EstimateResponse,
  'POST /api/estimates/:id/deposit-checkout': contracts.CheckoutResponse,
  'GET /api/jobs': contracts.JobsResponse,
  'GET /api/jobs/stages': contracts.StagesResponse,
  'GET /api/jobs/:id': contracts.JobResponse,
  'PATCH /api/jobs/:id': contracts.JobResponse,
  'POST /api/jobs/:id/time': contracts.JobResponse,
  'GET /api/payments': contracts.PaymentsResponse,
  'POST /api/payments/:id/refund': contracts.RefundResponse,
  'POST /api/payments/confirm': contracts.PaymentConfirmResponse,
  'GET /api/overview': contracts.OverviewResponse,
  'GET /api/lead-time': contracts.LeadTimeResponse,
  'GET /api/mail/failed': contracts.FailedMailsResponse,
  'GET /api/hours-feedback': contracts.HoursFeedbackResponse,
  'GET /api/clients': contracts.ClientsResponse,
  'GET /api/price-book/versions': contracts.PriceBookVersionsResponse,
  'POST /api/hours-feedback/:stage/dismiss': contracts.HoursFeedbackResponse,
  'POST /api/hours-feedback/:stage/apply': contracts.HoursAppliedResponse,
};

/**
 * Every 2xx JSON answer of the test app is parsed with its route's contract schema as it is sent: a response that
 * drifts from `@benchwright/contracts` becomes a 500 naming the field (and is printed), so the route's test fails.
 */
export function checkContracts(app: ReturnType<typeof createApp>): void {
  const json = app.response.json;
  app.response.json = function (this: typeof app.response, body: unknown) {
    const route = (this.req as { route?: { path?: string } }).route?.path;
    if (this.statusCode < 300 && route !== undefined) {
      const key = `${this.req.method} ${`${this.req.baseUrl}${route}`.replace(/\/$/, '')}`;
      const schema = CONTRACTS[key];
      const r = schema?.safeParse(body);
      if (r && !r.success) {
        const message = `${key} drifts from its contract:\n${z.prettifyError(r.error)}`;
        console.error(message);
        this.status(500);
        return json.call(this, { error: { code: 'internal', message } });
      }
    }
    return json.call(this, body);
  };
}

/** A supertest request whose body is read as raw bytes (a PDF, an image, a CSV). */
export function binary(req: request.Test) {
  return req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });
}

/** A PDF's text as pdftotext lays it out (poppler-utils, which the test command installs). */
export function pdfText(buf: Buffer): string {
  const f = join(mkdtempSync(join(tmpdir(), 'bw-pdf-')), 'doc.pdf');
  writeFileSync(f, buf);
  return execFileSync('pdftotext', ['-layout', f, '-']).toString();
}
