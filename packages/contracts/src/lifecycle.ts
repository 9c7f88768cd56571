import { STAGE_KEYS, type StageKey } from '@benchwright/pricing/geometry';

/**
 * The project's life in one place (DESIGN.md section 3): its states, and the
 * actions that move it from one state to the next. The API asks this table
 * before every change of a project's status; the apps ask it what to offer.
 */

export const PROJECT_STATUSES = [
  'requested',
  'estimating',
  'estimate_sent',
  'accepted',
  'deposit_paid',
  'in_production',
  'ready',
  'delivered',
  'closed',
  'declined',
  'expired',
  'cancelled',
] as const;
export type ProjectStatus = (typeof PROJECT_STATUSES)[number];

/** A revision's own state; only a draft changes. `withdrawn`: the owner took back an accepted revision. */
export const ESTIMATE_STATUSES = ['draft', 'sent', 'accepted', 'superseded', 'expired', 'withdrawn'] as const;
export type EstimateStatus = (typeof ESTIMATE_STATUSES)[number];

/** The board's columns, the same keys the engine budgets hours by (declared once, in the engine). */
export { STAGE_KEYS };
export type { StageKey };

/**
 * Each action, and for each state it may start from, the state it leads to.
 * A state missing from an action's row means the action is refused there.
 * Example: `PROJECT_LIFECYCLE.accept_revision.estimate_sent === 'accepted'`.
 */
export const PROJECT_LIFECYCLE = {
  /** the owner starts a revision (priced or copied); a sent estimate stays sent while the next is drafted */
  start_revision: {
    requested: 'estimating',
    estimating: 'estimating',
    estimate_sent: 'estimate_sent',
    expired: 'estimating',
  },
  /** the owner sends a draft; never while a revision is accepted */
  send_revision: { estimating: 'estimate_sent', estimate_sent: 'estimate_sent', expired: 'estimate_sent' },
  /** the client accepts the sent revision */
  accept_revision: { estimate_sent: 'accepted' },
  /** the sent revision ran out of time unaccepted */
  expire_revision: { estimate_sent: 'expired' },
  /** the owner takes back an accepted revision, only while no deposit is paid; a revision can then be sent again */
  withdraw_acceptance: { accepted: 'estimating' },
  /** the deposit is paid: the job goes on the board */
  pay_deposit: { accepted: 'deposit_paid' },
  /** the job leaves Material */
  start_production: { deposit_paid: 'in_production' },
  /** the job enters Ready: the client is asked for the balance */
  mark_ready: { deposit_paid: 'ready', in_production: 'ready', delivered: 'ready' },
  /** the job goes back from Ready or Delivered to a work stage */
  resume_work: { ready: 'in_production', delivered: 'in_production' },
  /** the job enters Delivered */
  deliver: { deposit_paid: 'delivered', in_production: 'delivered', ready: 'delivered' },
  /** delivered and the balance settled */
  close: { delivered: 'closed' },
} as const satisfies Record<string, Partial<Record<ProjectStatus, ProjectStatus>>>;
export type ProjectAction = keyof typeof PROJECT_LIFECYCLE;
export const PROJECT_ACTIONS = Object.keys(PROJECT_LIFECYCLE) as ProjectAction[];

/** Where `action` takes a project that is `from`, or null when the table refuses it. Example: `nextStatus('accepted', 'send_revision') === null`. */
export function nextStatus(from: ProjectStatus, action: ProjectAction): ProjectStatus | null {
  const row: Partial<Record<ProjectStatus, ProjectStatus>> = PROJECT_LIFECYCLE[action];
  return row[from] ?? null;
}

/** Whether `action` may happen while the project is `from`. */
export const canDo = (from: ProjectStatus, action: ProjectAction): boolean => nextStatus(from, action) !== null;

/** Whether the owner may start a new revision (the shop app offers the buttons by this). */
export const canStartRevision = (status: ProjectStatus): boolean => canDo(status, 'start_revision');

/** Statuses with the job in the shop: what a builder may see. */
export const IN_SHOP_STATUSES = [
  'deposit_paid',
  'in_production',
  'ready',
  'delivered',
] as const satisfies readonly ProjectStatus[];
export const isInShop = (status: ProjectStatus): boolean => (IN_SHOP_STATUSES as readonly string[]).includes(status);

/** A status in plain words, for messages. */
const STATUS_WORDS: Record<ProjectStatus, string> = {
  requested: 'requested',
  estimating: 'being estimated',
  estimate_sent: 'waiting on a sent estimate',
  accepted: 'accepted',
  deposit_paid: 'paid for and waiting on material',
  in_production: 'in production',
  ready: 'ready',
  delivered: 'delivered',
  closed: 'closed',
  declined: 'declined',
  expired: 'expired',
  cancelled: 'cancelled',
};

const ACTION_WORDS: Record<ProjectAction, string> = {
  start_revision: 'A new revision cannot be started',
  send_revision: 'An estimate cannot be sent',
  accept_revision: 'An estimate cannot be accepted',
  expire_revision: 'The estimate cannot expire',
  withdraw_acceptance: 'An acceptance cannot be withdrawn',
  pay_deposit: 'A deposit cannot be recorded',
  start_production: 'Production cannot start',
  mark_ready: 'The job cannot be marked ready',
  resume_work: 'The job cannot go back to work',
  deliver: 'The job cannot be marked delivered',
  close: 'The project cannot be closed',
};

/** The plain sentence for a refused action. Example: "An estimate cannot be sent while the project is accepted." */
export function refusal(from: ProjectStatus, action: ProjectAction): string {
  return `${ACTION_WORDS[action]} while the project is ${STATUS_WORDS[from]}.`;
}
