import { asc, desc, eq } from 'drizzle-orm';
import { hoursFeedback, STAGE_KEYS, type StageKey } from '@benchwright/pricing';
import type { User } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { hoursFeedbackMarks, jobs, stages } from '../../db/schema';
import { stmt } from '../../lib/statements';

/**
 * Hours that teach the price book: each stage's logged hours against its
 * budget over the last delivered jobs, and a suggested change to the time
 * standards behind the stage (engine: hoursFeedback). Once the owner applies
 * or dismisses a stage's suggestion, that stage counts only the jobs
 * delivered after it, so the next suggestion comes from jobs priced since.
 */
export function createHoursService(db: Db) {
  function marks() {
    return new Map(
      db
        .select()
        .from(hoursFeedbackMarks)
        .all()
        .map((m) => [m.stageKey, m]),
    );
  }
  return {
    get() {
      const delivered = db
        .select()
        .from(jobs)
        .where(eq(jobs.stageKey, 'delivered'))
        .orderBy(desc(jobs.updatedAt))
        .limit(200)
        .all();
      // the hours logged per job and stage, summed in the database for the delivered jobs above only
      const logged = new Map<string, number>();
      const sums = stmt(
        db.$client,
        `SELECT job_id AS jobId, stage_key AS stage, sum(hours) AS hours FROM time_entries
          WHERE job_id IN (SELECT value FROM json_each(?)) GROUP BY job_id, stage_key`,
      ).all(JSON.stringify(delivered.map((j) => j.id))) as { jobId: string; stage: string; hours: number }[];
      for (const r of sums) logged.set(`${r.jobId} ${r.stage}`, r.hours);
      const labels = new Map(
        db
          .select()
          .from(stages)
          .orderBy(asc(stages.position))
          .all()
          .map((s) => [s.key, s.label]),
      );
      const since = marks();
      return STAGE_KEYS.map((stage) => {
        const after = since.get(stage)?.at;
        const compared = delivered
          .filter((j) => !after || j.updatedAt > after)
          .map((j) => ({
            budget: j.hoursBudget,
            logged: {
              [stage]: logged.get(`${j.id} ${stage}`) ?? 0,
            } as Partial<Record<StageKey, number>>,
          }));
        const f = hoursFeedback(compared).find((x) => x.stage === stage)!;
        const mark = since.get(stage);
        return {
          ...f,
          label: labels.get(stage) ?? stage,
          lastAction: mark ? { action: mark.action, at: mark.at.toISOString() } : null,
        };
      });
    },
    /** The owner sets a stage's suggestion aside: it comes back from the jobs delivered after now. */
    dismiss(actor: User, stage: StageKey) {
      db.insert(hoursFeedbackMarks)
        .values({ stageKey: stage, action: 'dismissed', userId: actor.id, at: new Date() })
        .onConflictDoUpdate({
          target: hoursFeedbackMarks.stageKey,
          set: { action: 'dismissed', userId: actor.id, at: new Date() },
        })
        .run();
      return this.get();
    },
  };
}
export type HoursService = ReturnType<typeof createHoursService>;
