import { and, eq } from 'drizzle-orm';
import { nextStatus, refusal, type ProjectAction, type ProjectStatus } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { estimates, payments, projects } from '../../db/schema';
import { Conflict } from '../../lib/errors';

type Reader = Pick<Db, 'select'>;
type Writer = Pick<Db, 'select' | 'update'>;

/** The project's status, or a Conflict naming what cannot happen (the table is `PROJECT_LIFECYCLE` in contracts). */
export function assertCan(
  tx: Reader,
  projectId: string,
  action: ProjectAction,
): { from: ProjectStatus; to: ProjectStatus } {
  const p = tx.select({ status: projects.status }).from(projects).where(eq(projects.id, projectId)).get();
  if (!p) throw new Conflict('The project no longer exists.');
  const to = nextStatus(p.status, action);
  if (!to) throw new Conflict(refusal(p.status, action));
  return { from: p.status, to };
}

/**
 * The one way a project's status changes (in the caller's transaction): the
 * lifecycle table decides, a refused action is a 409, and a status changed by
 * someone else meanwhile is a 409 too.
 */
export function moveProject(tx: Writer, projectId: string, action: ProjectAction): ProjectStatus {
  const { from, to } = assertCan(tx, projectId, action);
  if (to === from) return to;
  const r = tx
    .update(projects)
    .set({ status: to, updatedAt: new Date() })
    .where(and(eq(projects.id, projectId), eq(projects.status, from)))
    .run();
  if (r.changes !== 1) throw new Conflict('The project changed meanwhile; reload it.');
  return to;
}

/** Whether the balance is settled: nothing was left to pay, or a balance payment came in. */
export function balanceSettled(tx: Reader, projectId: string): boolean {
  const est = tx
    .select({ balanceCents: estimates.balanceCents })
    .from(estimates)
    .where(and(eq(estimates.projectId, projectId), eq(estimates.status, 'accepted')))
    .get();
  if (est && est.balanceCents <= 0) return true;
  return tx
    .select({ status: payments.status })
    .from(payments)
    .where(and(eq(payments.projectId, projectId), eq(payments.kind, 'balance')))
    .all()
    .some((p) => p.status === 'paid' || p.status === 'partially_refunded' || p.status === 'refunded');
}

/**
 * Whether a project is closed is decided here alone: delivered with the
 * balance settled. Called after a delivery and after a balance payment, in
 * whichever order they come. Returns true when it closed the project.
 */
export function closeIfSettled(tx: Writer, projectId: string): boolean {
  const p = tx.select({ status: projects.status }).from(projects).where(eq(projects.id, projectId)).get();
  if (p?.status !== 'delivered' || !balanceSettled(tx, projectId)) return false;
  moveProject(tx, projectId, 'close');
  return true;
}
