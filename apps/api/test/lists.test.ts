import { beforeAll, describe, expect, it } from 'vitest';
import { seedScale } from '../src/db/seed-scale';
import { testApp, type TestApp } from './helpers';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
let t: TestApp;
let owner: Agent;
beforeAll(async () => {
  t = await testApp();
  await seedScale(t.db, 300);
  owner = await t.signIn('maren@fernhill.example');
});

/** The statements a request runs, besides the session's own. */
async function statements(run: () => Promise<unknown>) {
  const seen: string[] = [];
  const client = t.db.$client;
  const prepare = client.prepare.bind(client);
  client.prepare = ((source: string) => {
    seen.push(source);
    return prepare(source);
  }) as typeof client.prepare;
  try {
    await run();
  } finally {
    client.prepare = prepare;
  }
  return seen.filter((s) => !/\bsessions\b/.test(s));
}

async function walk<T extends { id: string }>(agent: Agent, path: string, key: string) {
  const all: T[] = [];
  let cursor: string | null = null;
  do {
    const r = await agent.get(path).query({ limit: 40, ...(cursor ? { cursor } : {}) });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    all.push(...(r.body[key] as T[]));
    cursor = r.body.nextCursor;
  } while (cursor);
  return all;
}

describe('GET /api/jobs', () => {
  it('gives the board every job in the shop and the latest delivered page; the rest of the delivered follow by cursor', async () => {
    const count = (where: string) =>
      (t.db.$client.prepare(`SELECT count(*) AS n FROM jobs WHERE ${where}`).get() as { n: number }).n;
    const r = await owner.get('/api/jobs').query({ limit: 10 });
    expect(r.status).toBe(200);
    const open = r.body.jobs.filter((j: { stage: string }) => j.stage !== 'delivered');
    expect(open).toHaveLength(count(`stage_key <> 'delivered'`));
    expect(r.body.jobs.length - open.length).toBe(10);
    expect(r.body.nextCursor).toEqual(expect.any(String));
    const delivered = await walk<{ id: string; stage: string }>(owner, '/api/jobs?stage=delivered', 'jobs');
    expect(new Set(delivered.map((j) => j.id)).size).toBe(count(`stage_key = 'delivered'`));
    expect(delivered.every((j) => j.stage === 'delivered')).toBe(true);
    expect(r.body.jobs[0]).toMatchObject({
      project: { id: expect.any(String), status: expect.any(String) },
      clientName: expect.any(String),
      hoursBudgeted: { total: 22 },
      hoursLogged: { total: 0, material: 0 },
    });
  });

  it('reads the board in a fixed number of statements, however many jobs', async () => {
    const few = await statements(() => owner.get('/api/jobs').query({ limit: 1 }));
    const many = await statements(() => owner.get('/api/jobs').query({ limit: 200 }));
    expect(many.length, many.join('\n')).toBeLessThanOrEqual(4);
    expect(many.length).toBe(few.length);
  });

  it('answers 400 for a bad cursor, a bad limit or another stage', async () => {
    for (const q of [
      { stage: 'delivered', cursor: 'nonsense' },
      { limit: 0 },
      { limit: 201 },
      { stage: 'cutting' },
      { cursor: 'x' },
    ])
      expect((await owner.get('/api/jobs').query(q)).status).toBe(400);
  });
});

describe('GET /api/payments', () => {
  it('walks every payment once, the latest first, a page at a time', async () => {
    const all = await walk<{ id: string; createdAt: string }>(owner, '/api/payments', 'payments');
    const n = (t.db.$client.prepare('SELECT count(*) AS n FROM payments').get() as { n: number }).n;
    expect(new Set(all.map((p) => p.id)).size).toBe(n);
    expect(all).toHaveLength(n);
    const times = all.map((p) => Date.parse(p.createdAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));
  });

  it('answers 400 for a bad cursor or limit', async () => {
    for (const q of [{ cursor: 'nonsense' }, { limit: 0 }, { limit: 201 }])
      expect((await owner.get('/api/payments').query(q)).status).toBe(400);
  });
});
