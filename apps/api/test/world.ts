import sharp from 'sharp';
import { createServer, type Server } from 'node:http';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import { pino } from 'pino';
import request from 'supertest';
import { createStripeFake } from '@benchwright/stripe-fake';
import { createApp } from '../src/app';
import { applyMigrations, openDb, type Db } from '../src/db/client';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { seedDemoFlow } from '../src/db/seed-flow';
import { loadEnv, type Env } from '../src/env';
import { freePort } from './helpers';

export const EMAILS = {
  owner: 'maren@fernhill.example',
  builder: 'idris@fernhill.example',
  priya: 'priya@example.com',
  tomasz: 'tomasz@example.com',
  guild: 'guild@example.com',
} as const;

export interface WorldIds {
  ownerId: string;
  builderId: string;
  priyaId: string;
  tomaszId: string;
  /** Priya's project: one estimate, sent */
  priyaProject: string;
  priyaEstimate: string;
  /** Tomasz's project: the estimate accepted, the deposit paid, the job in Casework with Idris */
  tomaszProject: string;
  tomaszEstimate: string;
  tomaszJob: string;
  tomaszDeposit: string;
  /** the Checkout Session of Tomasz's deposit */
  tomaszSession: string;
  /** a photo Tomasz attached to his project */
  tomaszUpload: string;
  /** a sketch the owner attached to Tomasz's project */
  ownerUpload: string;
  /** the guild's project: a request, no estimate */
  guildProject: string;
  /** a queued mail (SMTP is a closed port, so every mail stays pending) */
  mailId: string;
}

export interface World {
  db: Db;
  env: Env;
  app: ReturnType<typeof createApp>;
  /** the API's base URL (it listens, so the Stripe stand-in's webhooks reach it) */
  api: string;
  stripeBase: string;
  ids: WorldIds;
  /** a fresh session's Cookie header for a demo user */
  cookie: (email: string, password?: string) => Promise<string>;
  signIn: (email: string) => Promise<ReturnType<typeof request.agent>>;
  close: () => Promise<void>;
}

async function listen(s: Server): Promise<number> {
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', r));
  return (s.address() as AddressInfo).port;
}

/**
 * The demo as `pnpm start` seeds it (DESIGN.md section 8), through the real services: the API on a real port
 * with the Stripe stand-in in-process beside it, on an in-memory database; SMTP points at a closed port.
 */
export async function seededWorld(overrides: Record<string, string> = {}): Promise<World> {
  const secret = 'whsec_world_test';
  const apiServer = createServer();
  const apiPort = await listen(apiServer);
  const api = `http://127.0.0.1:${apiPort}`;
  const fakeServer = createServer();
  const stripeBase = `http://127.0.0.1:${await listen(fakeServer)}`;
  const fake = createStripeFake({
    baseUrl: stripeBase,
    webhookUrl: `${api}/api/webhooks/stripe`,
    webhookSecret: secret,
    retryBaseMs: 100,
  });
  fakeServer.on('request', fake.app);
  const dir = mkdtempSync(join(tmpdir(), 'bw-world-'));
  const env = loadEnv({
    DATABASE_PATH: ':memory:',
    LOG_LEVEL: 'silent',
    RATE_LIMITS: 'false',
    STRIPE_API_BASE: stripeBase,
    STRIPE_WEBHOOK_SECRET: secret,
    PDF_DIR: join(dir, 'pdf'),
    UPLOADS_DIR: join(dir, 'uploads'),
    SMTP_URL: `smtp://127.0.0.1:${await freePort()}`,
    ...overrides,
  });
  const db = openDb(':memory:');
  applyMigrations(db);
  await seedDemo(db);
  const log = pino({ level: 'silent' });
  const app = createApp({ db, env, log, ready: () => true });
  apiServer.on('request', app);
  await seedDemoFlow(db, app.services, log);

  const q = <T>(sql: string, ...args: unknown[]) => db.$client.prepare(sql).get(...args) as T;
  const userId = (email: string) => q<{ id: string }>('select id from users where email = ?', email).id;
  const projectOf = (clientId: string) => q<{ id: string }>('select id from projects where client_id = ?', clientId).id;
  const ownerId = userId(EMAILS.owner);
  const priyaId = userId(EMAILS.priya);
  const tomaszId = userId(EMAILS.tomasz);
  const priyaProject = projectOf(priyaId);
  const tomaszProject = projectOf(tomaszId);
  const ids: WorldIds = {
    ownerId,
    builderId: userId(EMAILS.builder),
    priyaId,
    tomaszId,
    priyaProject,
    priyaEstimate: q<{ id: string }>('select id from estimates where project_id = ?', priyaProject).id,
    tomaszProject,
    tomaszEstimate: q<{ id: string }>('select id from estimates where project_id = ?', tomaszProject).id,
    tomaszJob: q<{ id: string }>('select id from jobs where project_id = ?', tomaszProject).id,
    tomaszDeposit: q<{ id: string }>("select id from payments where project_id = ? and kind = 'deposit'", tomaszProject)
      .id,
    tomaszSession: q<{ s: string }>(
      "select stripe_session_id as s from payments where project_id = ? and kind = 'deposit'",
      tomaszProject,
    ).s,
    tomaszUpload: '',
    ownerUpload: '',
    guildProject: projectOf(userId(EMAILS.guild)),
    mailId: q<{ id: string }>('select id from outbox limit 1').id,
  };

  async function cookie(email: string, password = DEMO_PASSWORD): Promise<string> {
    const r = await request(app).post('/api/auth/sign-in').send({ email, password });
    if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
    const set = ([] as string[]).concat(r.headers['set-cookie'] ?? []);
    return set.map((c) => c.split(';')[0]).join('; ');
  }
  async function signIn(email: string) {
    const a = request.agent(app);
    const r = await a.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD });
    if (r.status !== 200) throw new Error(`sign-in of ${email} failed: ${r.status}`);
    return a;
  }
  async function close() {
    fake.stop();
    apiServer.closeAllConnections();
    await new Promise((r) => apiServer.close(r));
    fakeServer.closeAllConnections();
    await new Promise((r) => fakeServer.close(r));
    db.$client.close();
  }
  // a photo of the space attached by Tomasz, through the real route (sharp makes a small PNG)
  const photo = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#c8a27a' } })
    .png()
    .toBuffer();
  const up = await (await signIn(EMAILS.tomasz))
    .post(`/api/projects/${tomaszProject}/uploads`)
    .attach('file', photo, 'hall.png');
  if (up.status !== 201) throw new Error(`the demo upload failed: ${up.status} ${JSON.stringify(up.body)}`);
  ids.tomaszUpload = up.body.upload.id;
  const shopUp = await (await signIn(EMAILS.owner))
    .post(`/api/projects/${tomaszProject}/uploads`)
    .attach('file', photo, 'sketch.png');
  if (shopUp.status !== 201) throw new Error(`the owner's demo upload failed: ${shopUp.status}`);
  ids.ownerUpload = shopUp.body.upload.id;
  return { db, env, app, api, stripeBase, ids, cookie, signIn, close };
}
