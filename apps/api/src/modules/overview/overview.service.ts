import { eq } from 'drizzle-orm';
import { PROJECT_STATUSES } from '@benchwright/contracts';
import { STAGE_KEYS } from '@benchwright/pricing';
import type { Db } from '../../db/client';
import { estimates, jobs, payments, projects, timeEntries, users } from '../../db/schema';

/** The owner's overview: the pipeline, this month's money, the win rate, and hours estimated against hours used. */
export function createOverviewService(db: Db) {
  return {
    get(now = new Date()) {
      const monthStart = new Date(now.getFullYear(), now.getMonth(), 1);
      const all = db.select().from(projects).all();
      const pipeline = Object.fromEntries(PROJECT_STATUSES.map((s) => [s, all.filter((p) => p.status === s).length]));
      const ests = db.select().from(estimates).all();
      const acceptedThisMonth = ests.filter(
        (e) => e.status === 'accepted' && e.acceptedAt && e.acceptedAt >= monthStart,
      );
      const pays = db
        .select()
        .from(payments)
        .all()
        .filter((p) => ['paid', 'partially_refunded', 'refunded'].includes(p.status) && p.updatedAt >= monthStart);
      // of the projects that have had an estimate sent, the share that accepted one
      const quoted = new Set(ests.filter((e) => e.sentAt).map((e) => e.projectId));
      const won = new Set(ests.filter((e) => e.status === 'accepted').map((e) => e.projectId));
      const entries = db.select().from(timeEntries).all();
      const jobRows = db
        .select({ job: jobs, clientName: users.name })
        .from(jobs)
        .innerJoin(projects, eq(projects.id, jobs.projectId))
        .innerJoin(users, eq(users.id, projects.clientId))
        .all();
      const hours = jobRows.map(({ job, clientName }) => {
        const budget = STAGE_KEYS.reduce((s, k) => s + (job.hoursBudget[k] ?? 0), 0);
        const used = entries.filter((t) => t.jobId === job.id).reduce((s, t) => s + t.hours, 0);
        return {
          jobId: job.id,
          clientName,
          stage: job.stageKey,
          budgetHours: Math.round(budget * 10) / 10,
          usedHours: Math.round(used * 10) / 10,
        };
      });
      return {
        month: monthStart.toISOString().slice(0, 7),
        pipeline,
        acceptedThisMonth: {
          count: acceptedThisMonth.length,
          totalCents: acceptedThisMonth.reduce((s, e) => s + e.totalCents, 0),
        },
        collectedThisMonth: {
          depositsCents: pays
            .filter((p) => p.kind === 'deposit')
            .reduce((s, p) => s + p.amountCents - p.refundedCents, 0),
          balancesCents: pays
            .filter((p) => p.kind === 'balance')
            .reduce((s, p) => s + p.amountCents - p.refundedCents, 0),
        },
        winRate: { quoted: quoted.size, won: [...won].filter((id) => quoted.has(id)).length },
        hours,
      };
    },
  };
}
export type OverviewService = ReturnType<typeof createOverviewService>;
