import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { designs } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { jobs, projects, shopSettings, timeEntries, users } from '../src/db/schema';
import { testApp } from './helpers';

describe('GET /api/lead-time', () => {
  it('answers anyone with the start and finish weeks from the open jobs’ remaining hours and the weekly capacity', async () => {
    const t = await testApp();
    const [a, b, done] = t.db.select().from(projects).all();
    const idris = t.db.select().from(users).where(eq(users.email, 'idris@fernhill.example')).get()!;
    const job = (projectId: string, stageKey: 'cutting' | 'ready', hoursBudget: Record<string, number>) => {
      const id = randomUUID();
      t.db.insert(jobs).values({ id, projectId, stageKey, hoursBudget }).run();
      return id;
    };
    // 100 budgeted, 10 logged: 90 left; 40 budgeted, 50 logged: none left (never below 0); a ready job counts nothing
    const first = job(a!.id, 'cutting', { cutting: 60, casework: 40 });
    t.db
      .insert(timeEntries)
      .values({ id: randomUUID(), jobId: first, userId: idris.id, stageKey: 'cutting', hours: 10 })
      .run();
    const second = job(b!.id, 'cutting', { cutting: 40 });
    t.db
      .insert(timeEntries)
      .values({ id: randomUUID(), jobId: second, userId: idris.id, stageKey: 'cutting', hours: 50 })
      .run();
    job(done!.id, 'ready', { finish: 500 });
    const anon = t.agent();
    t.db
      .update(jobs)
      .set({ hoursBudget: { cutting: 40, casework: 30 } })
      .where(eq(jobs.id, second))
      .run();
    // the second now 70 budgeted, 50 logged: 20 left; booked 110 -> week 3 to week 4
    let r = await anon.get('/api/lead-time?hours=35');
    expect(r.status).toBe(200);
    expect(r.body.leadTime).toMatchObject({ startWeek: 3, finishWeek: 4 });
    t.db
      .update(jobs)
      .set({ hoursBudget: { cutting: 40, casework: 40 } })
      .where(eq(jobs.id, second))
      .run();
    // booked 90 + 30 = 120: 40 a week (the default) -> week 4 to week 4
    r = await anon.get('/api/lead-time?hours=35');
    expect(r.body.leadTime).toMatchObject({ startWeek: 4, finishWeek: 4 });
    expect(r.body.leadTime.startDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(new Date(r.body.leadTime.startDate).getUTCDay()).toBe(1);
    expect(new Date(r.body.leadTime.finishDate).getUTCDay()).toBe(5);
    t.db
      .update(jobs)
      .set({ hoursBudget: { cutting: 50, casework: 40 } })
      .where(eq(jobs.id, second))
      .run();
    // booked 130 -> week 4 to week 5
    expect((await anon.get('/api/lead-time?hours=35')).body.leadTime).toMatchObject({ startWeek: 4, finishWeek: 5 });
    // the shop's capacity from its settings
    const row = t.db.select().from(shopSettings).get()!;
    t.db
      .update(shopSettings)
      .set({ settings: { ...row.settings, weeklyCapacityHours: 80 } })
      .run();
    expect((await anon.get('/api/lead-time?hours=35')).body.leadTime).toMatchObject({ startWeek: 2, finishWeek: 3 });
  });

  it('answers 400 without hours or with hours that are not a number', async () => {
    const t = await testApp();
    for (const q of ['', '?hours=abc', '?hours=-1', '?hours=1e9']) {
      const r = await t.agent().get(`/api/lead-time${q}`);
      expect(r.status).toBe(400);
      expect(r.body.error.issues[0].path).toBe('hours');
    }
  });
});

describe('POST /api/quotes/preview', () => {
  it('gives anyone the request’s shop hours (for the lead time), still without prices of cost', async () => {
    const t = await testApp();
    const r = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec: designs.bookcase.defaults, quantity: 2 }] });
    expect(r.status).toBe(200);
    expect(r.body.quote.hours).toBeGreaterThan(1);
    expect(r.body.quote.lines).toBeUndefined();
    const one = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(one.body.quote.hours).toBeLessThan(r.body.quote.hours);
  });
});
