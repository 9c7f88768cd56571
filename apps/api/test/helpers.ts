import { pino } from 'pino';
import request from 'supertest';
import { createApp } from '../src/app';
import { applyMigrations, openDb, type Db } from '../src/db/client';
import { DEMO_PASSWORD, seedDemo } from '../src/db/seed';
import { outbox } from '../src/db/schema';
import { loadEnv, type Env } from '../src/env';

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
