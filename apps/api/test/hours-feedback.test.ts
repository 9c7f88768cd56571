import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designs } from '@benchwright/pricing';
import { HoursAppliedResponse, HoursFeedbackResponse, type StageFeedback } from '@benchwright/contracts';
import { estimates, jobs, priceBookVersions, projects, timeEntries, users } from '../src/db/schema';
import { readRows } from '../src/lib/price-book';
import { contract, testApp, type TestApp } from './helpers';

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

describe('POST /api/hours-feedback/:stage/apply', () => {
  let a: TestApp;
  let boss: Awaited<ReturnType<TestApp['signIn']>>;
  let client: string;
  let builder: string;
  beforeAll(async () => {
    a = await testApp();
    await a.app.pool.warm();
    boss = await a.signIn('maren@fernhill.example');
    client = a.db.select().from(users).where(eq(users.role, 'client')).get()!.id;
    builder = a.db.select().from(users).where(eq(users.role, 'builder')).get()!.id;
  }, 120_000);
  afterAll(() => a.app.pool.close());

  /** A delivered job priced from price-book version `version` (its accepted revision's), casework budget and logged. */
  function pricedJob(version: number, budget: number, logged: number, at = new Date()) {
    const projectId = randomUUID();
    const jobId = randomUUID();
    a.db.insert(projects).values({ id: projectId, clientId: client, status: 'delivered' }).run();
    a.db
      .insert(estimates)
      .values({
        id: randomUUID(),
        projectId,
        revision: 1,
        status: 'accepted',
        hoursByStage: { casework: budget },
        priceBookVersion: version,
      })
      .run();
    a.db
      .insert(jobs)
      .values({ id: jobId, projectId, stageKey: 'delivered', hoursBudget: { casework: budget }, updatedAt: at })
      .run();
    a.db
      .insert(timeEntries)
      .values({ id: randomUUID(), jobId, userId: builder, stageKey: 'casework', hours: logged })
      .run();
  }
  const feedback = async () => contract(HoursFeedbackResponse, await boss.get('/api/hours-feedback'));
  const caseworkOf = (f: { stages: StageFeedback[] }) => f.stages.find((s) => s.stage === 'casework')!;
  const labour = () => readRows(a.db).labour.map((r) => r.item as { key: string; minutes: number; stage: string });
  const items = [{ spec: designs.bookcase.defaults, quantity: 1 }];
  const previewHours = async () =>
    (await boss.post('/api/quotes/preview').send({ items })).body.quote.hoursByStage as Record<string, number>;

  it(
    'scales the stage’s labour standards once, as one new version; previews move, a sent revision does not, and the same jobs suggest nothing again',
    { timeout: 120_000 },
    async () => {
      // a revision sent before the change
      const priya = await a.signIn('priya@example.com');
      const projectId = (await priya.get('/api/projects')).body.projects[0].id;
      const created = await boss.post(`/api/projects/${projectId}/estimates`).send({ source: 'engine' });
      expect(created.status).toBe(201);
      expect((await boss.post(`/api/estimates/${created.body.estimate.id}/send`)).status).toBe(200);
      const sent = (await boss.get(`/api/estimates/${created.body.estimate.id}`)).body.estimate;
      const v0 = (await feedback()).priceBookVersion;
      // ratios 1.2, 1.4 and 1.2: the median 1.2
      pricedJob(v0, 10, 12);
      pricedJob(v0, 10, 14);
      pricedJob(v0, 10, 12);
      const before = caseworkOf(await feedback());
      expect(before.suggestedFactor).toBeCloseTo(1.2);
      const ops = labour();
      const casework = ops.filter((o) => o.stage === 'casework');
      expect(before.standards.map((c) => [c.key, c.minutes, c.newMinutes])).toEqual(
        casework.map((o) => [o.key, o.minutes, Math.round(o.minutes * 1.2 * 100) / 100]),
      );

      const hours0 = await previewHours();

      // only the owner
      for (const who of ['idris@fernhill.example', 'priya@example.com']) {
        const other = await a.signIn(who);
        expect((await other.post('/api/hours-feedback/casework/apply').send({ version: v0 })).status).toBe(403);
      }
      expect((await a.agent().post('/api/hours-feedback/casework/apply').send({ version: v0 })).status).toBe(401);
      expect(a.db.select().from(priceBookVersions).all()).toHaveLength(v0);

      // a stale version, and a bad body
      const stale = await boss.post('/api/hours-feedback/casework/apply').send({ version: v0 - 1 || v0 + 1 });
      expect(stale.status).toBe(409);
      expect(stale.body.error.code).toBe('conflict');
      expect((await boss.post('/api/hours-feedback/casework/apply').send({})).status).toBe(400);
      expect(labour()).toEqual(ops);

      const r = await boss.post('/api/hours-feedback/casework/apply').send({ version: v0 });
      expect(r.status).toBe(200);
      expect(r.body.applied).toMatchObject({ stage: 'casework', version: v0 + 1 });
      expect(r.body.priceBookVersion).toBe(v0 + 1);
      const versions = a.db.select().from(priceBookVersions).all();
      expect(versions).toHaveLength(v0 + 1);
      expect(versions.at(-1)!.summary).toMatch(/^Labour standards for Casework × 1\.2 from hours/);
      expect(labour()).toEqual(
        ops.map((o) => (o.stage === 'casework' ? { ...o, minutes: Math.round(o.minutes * 1.2 * 100) / 100 } : o)),
      );

      // applies once: the same jobs no longer suggest it, so a second apply is refused
      const after = caseworkOf(contract(HoursAppliedResponse, r));
      expect(after).toMatchObject({ jobs: 0, suggestedFactor: null, standards: [] });
      expect(after.lastAction).toMatchObject({ action: 'applied', appliedVersion: v0 + 1 });
      const again = await boss.post('/api/hours-feedback/casework/apply').send({ version: v0 + 1 });
      expect(again.status).toBe(409);
      expect(again.body.error.code).toBe('conflict');
      expect(a.db.select().from(priceBookVersions).all()).toHaveLength(v0 + 1);

      // the next preview prices casework about 1.2 times; the other stages hold; the sent revision is as it was
      const hours1 = await previewHours();
      expect(hours1.casework! / hours0.casework!).toBeGreaterThan(1.15);
      expect(hours1.casework! / hours0.casework!).toBeLessThan(1.25);
      expect(hours1.cutting).toBe(hours0.cutting);
      expect((await boss.get(`/api/estimates/${sent.id}`)).body.estimate).toEqual(sent);

      // a job priced before the change and delivered after it still does not count; jobs priced since do
      pricedJob(v0, 10, 13, new Date(Date.now() + 1000));
      expect(caseworkOf(await feedback()).jobs).toBe(0);
      pricedJob(v0 + 1, 12, 12, new Date(Date.now() + 2000));
      expect(caseworkOf(await feedback()).jobs).toBe(1);
    },
  );
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
    for (const s of reads) expect(s).toMatch(/sum\([^)]*hours[^)]*\)[\s\S]*group by [^\n]*job_id[^\n]*stage_key/i);
    // 4 + 6 hours logged against 10 budgeted
    expect((stage as Stage & { ratios: number[] }).ratios).toContain(1);
  });
});
