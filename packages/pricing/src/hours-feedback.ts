import { STAGE_KEYS, type LabourOperation, type StageKey } from './price-book';

/** One delivered job's hours per stage: the budget it was priced with and the hours logged. */
export interface DeliveredJobHours {
  budget: Partial<Record<StageKey, number>>;
  logged: Partial<Record<StageKey, number>>;
}

export interface StageHours {
  stage: StageKey;
  /** the delivered jobs compared (those with both a budget and logged hours in the stage), newest first */
  jobs: number;
  /** actual over estimated hours, per job compared */
  ratios: number[];
  medianRatio: number | null;
  /**
   * The factor to apply to the time standards behind the stage: the median ratio held within
   * [1 - limit, 1 + limit]; null until `minJobs` jobs are compared.
   */
  suggestedFactor: number | null;
}

export const HOURS_FEEDBACK = {
  /** the delivered jobs looked at, newest first */
  window: 10,
  /** no suggestion from fewer jobs than this */
  minJobs: 3,
  /** a suggestion never moves a standard by more than this fraction at once */
  limit: 0.5,
} as const;

function median(xs: number[]): number | null {
  if (xs.length === 0) return null;
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * Hours that teach the price book: for each board stage, the ratio of the
 * hours logged to the hours budgeted over the last `window` delivered jobs,
 * and, once `minJobs` of them had both, a factor for the stage's time
 * standards (the median ratio, held within ±`limit`). The median rather than
 * the mean, so that one job that went badly does not move the standards. A
 * stage with no hours logged tells nothing (the builder may not have logged
 * it) and is left out of that job's comparison.
 *
 * @example
 * hoursFeedback([{ budget: { casework: 10 }, logged: { casework: 12 } }, ...])
 * // [{ stage: 'casework', jobs: 3, medianRatio: 1.2, suggestedFactor: 1.2, ... }, ...]
 */
export function hoursFeedback(
  jobsNewestFirst: readonly DeliveredJobHours[],
  opts: { window?: number; minJobs?: number; limit?: number } = {},
): StageHours[] {
  const { window, minJobs, limit } = { ...HOURS_FEEDBACK, ...opts };
  const recent = jobsNewestFirst.slice(0, window);
  return STAGE_KEYS.map((stage) => {
    const ratios = recent.flatMap((j) => {
      const b = j.budget[stage] ?? 0;
      const l = j.logged[stage] ?? 0;
      return b > 0 && l > 0 ? [l / b] : [];
    });
    const m = median(ratios);
    const suggestedFactor = m !== null && ratios.length >= minJobs ? Math.min(1 + limit, Math.max(1 - limit, m)) : null;
    return { stage, jobs: ratios.length, ratios, medianRatio: m, suggestedFactor };
  });
}

/** One time standard as an applied suggestion changes it: minutes per unit of its driver, before and after. */
export interface StandardChange {
  key: string;
  name: string;
  driver: LabourOperation['driver'];
  minutes: number;
  newMinutes: number;
}

/**
 * The time standards behind a stage scaled by a factor (an hours suggestion the owner applies): every labour
 * operation whose stage is `stage`, its minutes times `factor`, rounded to a hundredth of a minute (finer than any
 * standard is timed, coarse enough to read; a rounding to whole or tenth minutes would move the small standards,
 * such as a fraction of a minute per part, by far more than the factor). Operations of other stages are left out.
 *
 * @example
 * scaleStandards([{ key: 'case_assembly', minutes: 45, stage: 'casework', ... }], 'casework', 1.2)
 * // [{ key: 'case_assembly', minutes: 45, newMinutes: 54, ... }]
 */
export function scaleStandards(labour: readonly LabourOperation[], stage: StageKey, factor: number): StandardChange[] {
  if (!(factor > 0) || !Number.isFinite(factor)) throw new RangeError(`a factor must be positive, not ${factor}`);
  return labour
    .filter((op) => op.stage === stage)
    .map((op) => ({
      key: op.key,
      name: op.name,
      driver: op.driver,
      minutes: op.minutes,
      newMinutes: Math.round(op.minutes * factor * 100) / 100,
    }));
}
