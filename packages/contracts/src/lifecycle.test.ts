import { describe, expect, it } from 'vitest';
import {
  canStartRevision,
  nextStatus,
  PROJECT_ACTIONS,
  PROJECT_LIFECYCLE,
  PROJECT_STATUSES,
  refusal,
  type ProjectAction,
  type ProjectStatus,
} from './lifecycle';

/** Every transition the lifecycle allows, written out by hand from DESIGN.md section 3 and the rules. */
const ALLOWED: [ProjectStatus, ProjectAction, ProjectStatus][] = [
  ['requested', 'start_revision', 'estimating'],
  ['estimating', 'start_revision', 'estimating'],
  ['estimate_sent', 'start_revision', 'estimate_sent'],
  ['expired', 'start_revision', 'estimating'],
  ['estimating', 'send_revision', 'estimate_sent'],
  ['estimate_sent', 'send_revision', 'estimate_sent'],
  ['expired', 'send_revision', 'estimate_sent'],
  ['estimate_sent', 'accept_revision', 'accepted'],
  ['estimate_sent', 'expire_revision', 'expired'],
  ['accepted', 'withdraw_acceptance', 'estimating'],
  ['accepted', 'pay_deposit', 'deposit_paid'],
  ['deposit_paid', 'start_production', 'in_production'],
  ['deposit_paid', 'mark_ready', 'ready'],
  ['in_production', 'mark_ready', 'ready'],
  ['delivered', 'mark_ready', 'ready'],
  ['ready', 'resume_work', 'in_production'],
  ['delivered', 'resume_work', 'in_production'],
  ['deposit_paid', 'deliver', 'delivered'],
  ['in_production', 'deliver', 'delivered'],
  ['ready', 'deliver', 'delivered'],
  ['delivered', 'close', 'closed'],
];

describe('nextStatus', () => {
  it.each(ALLOWED)('from %s, %s leads to %s', (from, action, to) => {
    expect(nextStatus(from, action)).toBe(to);
  });

  it('allows nothing beyond the list above', () => {
    const all = PROJECT_ACTIONS.flatMap((a) =>
      Object.entries(PROJECT_LIFECYCLE[a]).map(([from, to]) => [from, a, to] as const),
    );
    expect(all).toHaveLength(ALLOWED.length);
    expect(new Set(all.map((t) => t.join(' ')))).toEqual(new Set(ALLOWED.map((t) => t.join(' '))));
  });

  it.each([
    // the double acceptance: a revision cannot be sent or accepted while another is accepted
    ['accepted', 'send_revision'],
    ['accepted', 'accept_revision'],
    ['accepted', 'start_revision'],
    // a withdrawal once the deposit is paid, or before anything was accepted
    ['deposit_paid', 'withdraw_acceptance'],
    ['in_production', 'withdraw_acceptance'],
    ['estimate_sent', 'withdraw_acceptance'],
    // an accepted project has one deposit
    ['deposit_paid', 'pay_deposit'],
    ['estimate_sent', 'pay_deposit'],
    // a closed project stays closed
    ['closed', 'mark_ready'],
    ['closed', 'resume_work'],
    ['closed', 'deliver'],
    ['closed', 'start_revision'],
    ['ready', 'close'],
    ['requested', 'send_revision'],
    ['requested', 'accept_revision'],
    ['expired', 'accept_revision'],
    ['declined', 'start_revision'],
    ['cancelled', 'pay_deposit'],
  ] as [ProjectStatus, ProjectAction][])('refuses %s -> %s', (from, action) => {
    expect(nextStatus(from, action)).toBeNull();
  });

  it('leaves the side exits and closed with no way out', () => {
    for (const s of ['closed', 'declined', 'cancelled'] as const)
      for (const a of PROJECT_ACTIONS) expect(nextStatus(s, a), `${s} ${a}`).toBeNull();
  });

  it('reaches every working status from requested', () => {
    const seen = new Set<ProjectStatus>(['requested']);
    for (let grew = true; grew; ) {
      grew = false;
      for (const [from, , to] of ALLOWED)
        if (seen.has(from) && !seen.has(to)) {
          seen.add(to);
          grew = true;
        }
    }
    expect([...seen].sort()).toEqual(PROJECT_STATUSES.filter((s) => s !== 'declined' && s !== 'cancelled').sort());
  });
});

describe('canStartRevision', () => {
  it('offers a new revision before acceptance and after expiry, never once accepted', () => {
    expect(PROJECT_STATUSES.filter(canStartRevision)).toEqual(['requested', 'estimating', 'estimate_sent', 'expired']);
  });
});

describe('refusal', () => {
  it('says in plain words what cannot happen and why', () => {
    expect(refusal('accepted', 'send_revision')).toBe('An estimate cannot be sent while the project is accepted.');
    expect(refusal('deposit_paid', 'withdraw_acceptance')).toBe(
      'An acceptance cannot be withdrawn while the project is paid for and waiting on material.',
    );
  });
});
