import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { jobs, projects, timeEntries, users } from '../src/db/schema';
import { testApp, type TestApp } from './helpers';

/**
 * Hours that teach the price book (issue 12, item 5): delivered jobs' logged hours against their budgets, per
 * stage, and a suggestion once three jobs had the stage.
 */
let t: TestApp;
let owner: Awaited<ReturnType<TestApp['signIn']>>;
let clientId: string;
let builderId: string;
beforeAll(async () => {
  t = await testApp();
  owner = await t.signIn('maren@fernhill.example');
  clientId = t.db.select().from(users).where(eq(users.role, 'client')).get()!.id;
  builderId = t.db.select().from(users).where(eq(users.role, 'builder')).get()!.id;
}, 120_000);

/** A delivered job with `budget` hours of casework budgeted and `logged` logged, delivered at `at`. */
function delivered(budget: number, logged: number, at: Date) {
  const projectId = randomUUID();
  const jobId = randomUUID();
  t.db.insert(projects).values({ id: projectId, clientId, status: 'delivered' }).run();
  t.db
    .insert(jobs)
    .values({ id: jobId, projectId, stageKey: 'delivered', hoursBudget: { casework: budget }, updatedAt: at })
    .run();
  t.db
    .insert(timeEntries)
    .values({ id: randomUUID(), jobId, userId: builderId, stageKey: 'casework', hours: logged })
    .run();
}
type Stage = { stage: string; label: string; jobs: number; suggestedFactor: number | null };
const casework = async () =>
  ((await owner.get('/api/hours-feedback')).body.stages as Stage[]).find((s) => s.stage === 'casework')!;

describe('GET /api/hours-feedback', () => {
  it('suggests nothing until 3 delivered jobs, then the median of actual over estimated hours', async () => {
    delivered(10, 12, new Date(Date.now() - 3 * 86_400_000));
    delivered(10, 14, new Date(Date.now() - 2 * 86_400_000));
    expect(await casework()).toMatchObject({ jobs: 2, suggestedFactor: null });
    delivered(10, 9, new Date(Date.now() - 86_400_000));
    const s = await casework();
    expect(s.jobs).toBe(3);
    expect(s.suggestedFactor).toBeCloseTo(1.2);
    expect(s.label).toBe('Casework');
  });
  it('after a dismissal, counts only the jobs delivered since', async () => {
    const r = await owner.post('/api/hours-feedback/casework/dismiss');
    expect(r.status).toBe(200);
    expect((r.body.stages as Stage[]).find((s) => s.stage === 'casework')).toMatchObject({
      jobs: 0,
      suggestedFactor: null,
    });
    delivered(10, 11, new Date(Date.now() + 1000));
    expect((await casework()).jobs).toBe(1);
  });
  it('refuses a stage that is not on the board (400) and anyone but the owner', async () => {
    expect((await owner.post('/api/hours-feedback/sanding/dismiss')).status).toBe(400);
    const builder = await t.signIn('idris@fernhill.example');
    expect((await builder.get('/api/hours-feedback')).status).toBe(403);
  });
});

describe('GET /api/hours-feedback: the sums', () => {
  it('sums each job’s logged hours per stage in the database (GROUP BY), never reading the time entries one by one', async () => {
    // a delivered job whose casework was logged in two entries: the sum counts both
    delivered(10, 4, new Date(Date.now() + 2000));
    const last = t.db.select().from(timeEntries).all().at(-1)!;
    t.db
      .insert(timeEntries)
      .values({ ...last, id: randomUUID(), hours: 6 })
      .run();
    const seen: string[] = [];
    const proto = Object.getPrototypeOf(t.db.$client.prepare('SELECT 1')) as Record<
      'all' | 'get' | 'iterate',
      (this: { source: string }, ...args: unknown[]) => unknown
    >;
    const originals = { all: proto.all, get: proto.get, iterate: proto.iterate };
    for (const m of ['all', 'get', 'iterate'] as const) {
      const original = originals[m];
      proto[m] = function (this: { source: string }, ...args: unknown[]) {
        seen.push(this.source);
        return original.apply(this, args);
      };
    }
    let stage: Stage;
    try {
      stage = await casework();
    } finally {
      Object.assign(proto, originals);
    }
    const reads = seen.filter((s) => /time_entries/.test(s));
    expect(reads.length, seen.join('\n')).toBeGreaterThan(0);
    for (const s of reads) expect(s).toMatch(/sum\(hours\)[\s\S]*GROUP BY job_id, stage_key/i);
    // 4 + 6 hours logged against 10 budgeted
    expect((stage as Stage & { ratios: number[] }).ratios).toContain(1);
  });
});
