import { asc, desc, eq } from 'drizzle-orm';
import { hoursFeedback, STAGE_KEYS, type StageKey } from '@benchwright/pricing';
import type { User } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { hoursFeedbackMarks, jobs, stages, timeEntries } from '../../db/schema';

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
      const entries = db.select().from(timeEntries).all();
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
              [stage]: entries.filter((e) => e.jobId === j.id && e.stageKey === stage).reduce((s, e) => s + e.hours, 0),
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
