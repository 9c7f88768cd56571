import { STAGE_LABELS } from '@benchwright/pricing/geometry';
import type { EstimateStatus, ProjectStatus, StageKey } from './lifecycle';

/**
 * What people read for each state, in one place beside the enums (lifecycle.ts),
 * so the apps, the API's messages and the PDFs cannot drift apart. The shop and
 * its client see the same project from two sides, so a project's status has two
 * maps where the words must differ (the client reads what it means for them).
 */

/** A project's status as the shop reads it (request page, tables, overview). */
export const SHOP_PROJECT_STATUS_LABELS: Record<ProjectStatus, string> = {
  requested: 'Requested',
  estimating: 'Being estimated',
  estimate_sent: 'Estimate sent',
  accepted: 'Accepted, deposit due',
  deposit_paid: 'Deposit paid',
  in_production: 'In production',
  ready: 'Ready, balance due',
  delivered: 'Delivered',
  closed: 'Closed',
  declined: 'Declined',
  expired: 'Estimate expired',
  cancelled: 'Cancelled',
};

/** A project's status as its client reads it (the portal's list and project page). */
export const CLIENT_PROJECT_STATUS_LABELS: Record<ProjectStatus, string> = {
  requested: 'Estimate requested',
  estimating: 'Being estimated',
  estimate_sent: 'Estimate ready to review',
  accepted: 'Accepted, deposit due',
  deposit_paid: 'Deposit paid',
  in_production: 'In the shop',
  ready: 'Ready, balance due',
  delivered: 'Delivered',
  closed: 'Closed',
  declined: 'Declined',
  expired: 'Estimate expired',
  cancelled: 'Cancelled',
};

/** An estimate revision's status, the same for both sides. */
export const ESTIMATE_STATUS_LABELS: Record<EstimateStatus, string> = {
  draft: 'Draft',
  sent: 'Sent',
  accepted: 'Accepted',
  superseded: 'Replaced',
  expired: 'Expired',
  withdrawn: 'Acceptance withdrawn',
};

/**
 * The board's columns as first seeded, declared once in the engine beside the
 * stage keys. The shop may rename them: its own labels are stored with the
 * stages (the API's `stages` table), and whatever names a stage for people (the
 * board, the estimate's labour lines) reads them from there.
 */
export const DEFAULT_STAGE_LABELS: Record<StageKey, string> = STAGE_LABELS;

/** "Replaced by revision 3": the line a superseded revision reads. */
export const replacedBy = (revision: number): string => `Replaced by revision ${revision}`;
