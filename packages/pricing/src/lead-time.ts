// The lead time: in which week a new job could start and finish, from the shop's weekly capacity and the hours
// already booked on the board. Jobs are taken in turn (first booked, first built), each week filled to capacity
// before the next; week 1 is this week.

export interface BookedJob {
  /** the job's budgeted hours, all stages */
  budgetHours: number;
  /** hours logged against it so far */
  loggedHours: number;
}

export interface LeadTime {
  /** the week the job's first hour falls in (1 = this week) */
  startWeek: number;
  /** the week its last hour falls in */
  finishWeek: number;
}

function check(name: string, v: number, positive = false): void {
  if (!Number.isFinite(v) || v < 0 || (positive && v === 0))
    throw new RangeError(`${name} must be a ${positive ? 'positive' : 'non-negative'} number, not ${v}`);
}

/**
 * Hours still booked on the board: each open job's budget less its logged hours, never below 0 (a job over its
 * budget frees no one else's time).
 *
 * @example bookedHours([{ budgetHours: 50, loggedHours: 10 }, { budgetHours: 20, loggedHours: 30 }]) // 40
 */
export function bookedHours(jobs: readonly BookedJob[]): number {
  return jobs.reduce((sum, j) => {
    check('budgetHours', j.budgetHours);
    check('loggedHours', j.loggedHours);
    return sum + Math.max(0, j.budgetHours - j.loggedHours);
  }, 0);
}

/**
 * The weeks a job of `jobHours` would start and finish in, after `booked` hours, at `capacity` hours a week.
 *
 * @example leadTime({ capacity: 40, booked: 130, jobHours: 35 }) // { startWeek: 4, finishWeek: 5 }
 */
export function leadTime({
  capacity,
  booked,
  jobHours,
}: {
  capacity: number;
  booked: number;
  jobHours: number;
}): LeadTime {
  check('capacity', capacity, true);
  check('booked', booked);
  check('jobHours', jobHours);
  // the first free hour is in the week after the whole weeks the booked hours fill
  const startWeek = Math.floor(booked / capacity) + 1;
  // the last hour ends at booked + jobHours; a week exactly filled finishes in that week
  const finishWeek = Math.max(startWeek, Math.ceil((booked + jobHours) / capacity));
  return { startWeek, finishWeek };
}

const DAY = 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/**
 * The Monday of the start week and the Friday of the finish week (a five-day shop week, common practice), as
 * YYYY-MM-DD dates in UTC, week 1 being the week of `today`.
 *
 * @example leadTimeDates({ startWeek: 4, finishWeek: 5 }, new Date('2026-12-02')) // { startDate: '2026-12-21', finishDate: '2027-01-01' }
 */
export function leadTimeDates(lt: LeadTime, today: Date): { startDate: string; finishDate: string } {
  const midnight = Date.UTC(today.getUTCFullYear(), today.getUTCMonth(), today.getUTCDate());
  const monday = midnight - ((today.getUTCDay() + 6) % 7) * DAY;
  return {
    startDate: iso(monday + (lt.startWeek - 1) * 7 * DAY),
    finishDate: iso(monday + (lt.finishWeek - 1) * 7 * DAY + 4 * DAY),
  };
}
