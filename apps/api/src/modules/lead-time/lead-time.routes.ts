import { Router } from 'express';
import { notInArray } from 'drizzle-orm';
import { LeadTimeQuery, type LeadTimeView, type StageKey } from '@benchwright/contracts';
import { bookedHours, leadTime, leadTimeDates } from '@benchwright/pricing';
import type { Db } from '../../db/client';
import { jobs, timeEntries } from '../../db/schema';
import { loadPricing } from '../../lib/engine';
import { parse } from '../../lib/errors';

/** Jobs on the board that still take shop time: not yet ready or delivered. */
const DONE_STAGES: StageKey[] = ['ready', 'delivered'];

/** When a job of `hours` could start and finish, from the board and the shop's weekly capacity. */
export function leadTimeFor(db: Db, hours: number, today = new Date()): LeadTimeView {
  const { settings } = loadPricing(db);
  const open = db.select().from(jobs).where(notInArray(jobs.stageKey, DONE_STAGES)).all();
  const logged = new Map<string, number>();
  for (const e of db.select({ jobId: timeEntries.jobId, hours: timeEntries.hours }).from(timeEntries).all())
    logged.set(e.jobId, (logged.get(e.jobId) ?? 0) + e.hours);
  const booked = bookedHours(
    open.map((j) => ({
      budgetHours: Object.values(j.hoursBudget).reduce((s: number, h) => s + (h ?? 0), 0),
      loggedHours: logged.get(j.id) ?? 0,
    })),
  );
  const lt = leadTime({ capacity: settings.weeklyCapacityHours, booked, jobHours: hours });
  return { ...lt, ...leadTimeDates(lt, today) };
}

/** `GET /api/lead-time?hours=N`: anyone (an hour count and a week are not prices; the board's load is summed). */
export function leadTimeRoutes(db: Db): Router {
  const r = Router();
  r.get('/', (req, res) => {
    const { hours } = parse(LeadTimeQuery, req.query);
    res.json({ leadTime: leadTimeFor(db, hours) });
  });
  return r;
}
