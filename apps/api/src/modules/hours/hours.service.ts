import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import { hoursFeedback, scaleStandards, STAGE_KEYS, type StageKey } from '@benchwright/pricing';
import type { User } from '@benchwright/contracts';
import type { Db, Tx } from '../../db/client';
import { estimates, hoursFeedbackMarks, jobs, stages, timeEntries } from '../../db/schema';
import { loadPricing } from '../../lib/engine';
import { Conflict, Invalid } from '../../lib/errors';
import { checkBook, latestVersion, readRows, saveChange } from '../../lib/price-book';

/** A factor as people read it on the version's summary: "× 1.2", "× 0.85". */
const times = (f: number) => `× ${Number(f.toFixed(2))}`;

/**
 * Hours that teach the price book: each stage's logged hours against its
 * budget over the last delivered jobs, and a suggested change to the time
 * standards behind the stage (engine: hoursFeedback), which the owner applies
 * (a new price-book version) or dismisses.
 *
 * Which jobs a stage compares, after the owner answered:
 * - Applied: only jobs priced from the price-book version the change wrote, or
 *   a later one (their accepted revision's `price_book_version`). The jobs
 *   counted before were budgeted with the old standards; their ratios still say
 *   "too low" against those old budgets, so counting them again would suggest
 *   the same change a second time and compound it. A job priced before versions
 *   were kept (no version) counts as priced before any applied change. We key on
 *   the version rather than on the delivery date: a job priced with the old
 *   standards but delivered after the change would otherwise skew the next
 *   suggestion the same way.
 * - Dismissed: only jobs delivered after the dismissal (the owner said "not
 *   from these jobs"; the next suggestion comes from new deliveries). A
 *   dismissal after an applied change keeps the applied version's rule too.
 */
export function createHoursService(db: Db) {
  function marks(d: Pick<Db, 'select'>) {
    return new Map(
      d
        .select()
        .from(hoursFeedbackMarks)
        .all()
        .map((m) => [m.stageKey, m]),
    );
  }
  /** Every stage's comparison and suggestion, read through `d` (the database, or the apply's transaction). */
  function feedback(d: Pick<Db, 'select'>) {
    const delivered = d
      .select()
      .from(jobs)
      .where(eq(jobs.stageKey, 'delivered'))
      .orderBy(desc(jobs.updatedAt))
      .limit(200)
      .all();
    // the hours logged per job and stage, summed in the database for the delivered jobs above only
    const logged = new Map<string, number>();
    if (delivered.length)
      for (const r of d
        .select({
          jobId: timeEntries.jobId,
          stage: timeEntries.stageKey,
          hours: sql<number>`sum(${timeEntries.hours})`,
        })
        .from(timeEntries)
        .where(
          inArray(
            timeEntries.jobId,
            delivered.map((j) => j.id),
          ),
        )
        .groupBy(timeEntries.jobId, timeEntries.stageKey)
        .all())
        logged.set(`${r.jobId} ${r.stage}`, r.hours);
    // the price-book version each delivered job was priced from: its project's accepted revision's
    const pricedWith = new Map(
      delivered.length
        ? d
            .select({ projectId: estimates.projectId, version: estimates.priceBookVersion })
            .from(estimates)
            .where(
              and(
                eq(estimates.status, 'accepted'),
                inArray(
                  estimates.projectId,
                  delivered.map((j) => j.projectId),
                ),
              ),
            )
            .all()
            .map((e) => [e.projectId, e.version ?? 0])
        : [],
    );
    const labels = new Map(
      d
        .select()
        .from(stages)
        .orderBy(asc(stages.position))
        .all()
        .map((s) => [s.key, s.label]),
    );
    const since = marks(d);
    const pricing = loadPricing(d);
    return {
      bookVersion: pricing.bookVersion,
      units: pricing.settings.units,
      labour: pricing.activeBook.labour,
      stages: STAGE_KEYS.map((stage) => {
        const mark = since.get(stage);
        const compared = delivered
          .filter((j) => mark?.appliedVersion == null || (pricedWith.get(j.projectId) ?? 0) >= mark.appliedVersion)
          .filter((j) => mark?.action !== 'dismissed' || j.updatedAt > mark.at)
          .map((j) => ({
            budget: j.hoursBudget,
            logged: {
              [stage]: logged.get(`${j.id} ${stage}`) ?? 0,
            } as Partial<Record<StageKey, number>>,
          }));
        const f = hoursFeedback(compared).find((x) => x.stage === stage)!;
        return {
          ...f,
          label: labels.get(stage) ?? stage,
          /** what applying the suggestion would write: each of the stage's operations, old and new minutes */
          standards:
            f.suggestedFactor === null ? [] : scaleStandards(pricing.activeBook.labour, stage, f.suggestedFactor),
          lastAction: mark
            ? {
                action: mark.action,
                at: mark.at.toISOString(),
                appliedVersion: mark.appliedVersion ?? null,
              }
            : null,
        };
      }),
    };
  }
  const view = (d: Pick<Db, 'select'>) => {
    const f = feedback(d);
    return { stages: f.stages, priceBookVersion: f.bookVersion, units: f.units };
  };

  return {
    get: () => view(db),
    /** The owner sets a stage's suggestion aside: it comes back from the jobs delivered after now. */
    dismiss(actor: User, stage: StageKey) {
      db.insert(hoursFeedbackMarks)
        .values({ stageKey: stage, action: 'dismissed', userId: actor.id, at: new Date() })
        .onConflictDoUpdate({
          target: hoursFeedbackMarks.stageKey,
          set: { action: 'dismissed', userId: actor.id, at: new Date() },
        })
        .run();
      return view(db);
    },
    /**
     * The owner applies a stage's suggestion: the stage's labour operations (active ones: retired ones price no new
     * work) scaled by the suggested factor, saved as one new price-book version in one transaction, checked as any
     * edit of the book is, and the version kept on the stage's mark (see above). `seenVersion` is the book's version
     * the owner looked at: 409 if the book changed since, or if the suggestion no longer stands.
     */
    apply(actor: User, stage: StageKey, seenVersion: number) {
      return db.transaction((tx: Tx) => {
        const latest = latestVersion(tx);
        if (!latest) throw new Error('the price book is not seeded');
        if (latest.number !== seenVersion)
          throw new Conflict(
            `The price book changed since you looked (it is at version ${latest.number} now). Look at the suggestion again.`,
          );
        const f = feedback(tx);
        const s = f.stages.find((x) => x.stage === stage)!;
        if (s.suggestedFactor === null)
          throw new Conflict(
            `There is no suggestion for ${s.label} now; it needs at least 3 delivered jobs to compare.`,
          );
        if (!s.standards.length)
          throw new Conflict(`No labour standards in the price book belong to ${s.label}; there is nothing to change.`);
        const rows = readRows(tx);
        const newMinutes = new Map(s.standards.map((c) => [c.key, c.newMinutes]));
        const changed: { kind: 'labour'; id: string }[] = [];
        for (const r of rows.labour) {
          const m = newMinutes.get(String(r.item.key));
          if (r.retiredAt || m === undefined) continue;
          r.item = { ...r.item, minutes: m };
          changed.push({ kind: 'labour', id: r.id });
        }
        const meta = { currency: latest.currency, note: latest.note };
        const issues = checkBook(rows, meta, loadPricing(tx).settings, changed, readRows(tx));
        if (issues.length)
          throw new Invalid(
            'That change would leave the price book unusable.',
            issues.map((i) => ({ path: 'labour', message: i.message })),
          );
        const version = saveChange(tx, rows, changed, meta, {
          userId: actor.id,
          summary: `Labour standards for ${s.label} ${times(s.suggestedFactor)} from hours (${s.jobs} delivered job${s.jobs === 1 ? '' : 's'}).`,
        });
        const at = new Date();
        tx.insert(hoursFeedbackMarks)
          .values({ stageKey: stage, action: 'applied', userId: actor.id, at, appliedVersion: version })
          .onConflictDoUpdate({
            target: hoursFeedbackMarks.stageKey,
            set: { action: 'applied', userId: actor.id, at, appliedVersion: version },
          })
          .run();
        return { ...view(tx), applied: { stage, factor: s.suggestedFactor, version, changes: s.standards } };
      });
    },
  };
}
export type HoursService = ReturnType<typeof createHoursService>;
