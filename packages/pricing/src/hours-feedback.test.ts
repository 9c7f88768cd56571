import { describe, expect, it } from 'vitest';
import { hoursFeedback, scaleStandards } from './hours-feedback';
import { standardIn, type LabourOperation } from './price-book';

const job = (budget: number, logged: number) => ({ budget: { casework: budget }, logged: { casework: logged } });
const casework = (jobs: Parameters<typeof hoursFeedback>[0]) =>
  hoursFeedback(jobs).find((s) => s.stage === 'casework')!;

describe('hoursFeedback', () => {
  it('suggests nothing from fewer than 3 delivered jobs', () => {
    expect(casework([job(10, 12), job(10, 14)])).toMatchObject({ jobs: 2, suggestedFactor: null });
  });
  it('suggests the median ratio of actual to estimated hours once 3 jobs had the stage', () => {
    // ratios 1.2, 1.4 and 0.9: the median 1.2, so one slow job does not set the standard
    const s = casework([job(10, 12), job(10, 14), job(10, 9)]);
    expect(s.medianRatio).toBeCloseTo(1.2);
    expect(s.suggestedFactor).toBeCloseTo(1.2);
  });
  it('holds a suggestion within plus or minus 50 %', () => {
    expect(casework([job(10, 30), job(10, 25), job(10, 40)]).suggestedFactor).toBe(1.5);
    expect(casework([job(10, 1), job(10, 2), job(10, 3)]).suggestedFactor).toBe(0.5);
  });
  it('looks at the last 10 delivered jobs only, newest first', () => {
    const newer = Array.from({ length: 10 }, () => job(10, 11));
    const older = Array.from({ length: 5 }, () => job(10, 30));
    expect(casework([...newer, ...older])).toMatchObject({ jobs: 10, suggestedFactor: 1.1 });
  });
  it('leaves out a job with no hours logged (or none budgeted) in the stage', () => {
    const s = casework([job(10, 12), job(10, 0), job(0, 5), job(10, 12), job(10, 12)]);
    expect(s.jobs).toBe(3);
    expect(s.ratios).toEqual([1.2, 1.2, 1.2]);
  });
  it('averages the two middle ratios of an even count', () => {
    expect(casework([job(10, 10), job(10, 12), job(10, 14), job(10, 16)]).medianRatio).toBeCloseTo(1.3);
  });
});

describe('scaleStandards', () => {
  const ops: LabourOperation[] = [
    { key: 'case_assembly', name: 'Case assembly', driver: 'case', minutes: 45, stage: 'casework' },
    { key: 'part_cut', name: 'Part cut', driver: 'part', minutes: 0.35, stage: 'casework' },
    { key: 'finish_coat', name: 'Finish coat', driver: 'finish_m2_coat', minutes: 6, stage: 'finish' },
  ];
  it("scales the minutes of the stage's operations only, to a hundredth of a minute", () => {
    expect(scaleStandards(ops, 'casework', 1.2)).toEqual([
      { key: 'case_assembly', name: 'Case assembly', driver: 'case', minutes: 45, newMinutes: 54 },
      { key: 'part_cut', name: 'Part cut', driver: 'part', minutes: 0.35, newMinutes: 0.42 },
    ]);
  });
  it('leaves nothing to change for a stage with no operations', () => {
    expect(scaleStandards(ops, 'delivered', 1.3)).toEqual([]);
  });
  it('refuses a factor that is not a positive number', () => {
    expect(() => scaleStandards(ops, 'casework', 0)).toThrow(RangeError);
    expect(() => scaleStandards(ops, 'casework', Number.NaN)).toThrow(RangeError);
  });
});

describe('standardIn: a labour standard in the shop’s units', () => {
  it('reads minutes per metre as minutes per foot, and per square metre as per square foot, for an imperial shop', () => {
    // 1 ft = 0.3048 m and 1 ft² = 0.09290304 m² exactly (NIST Handbook 44, Appendix C)
    expect(standardIn(10, 'banding_metre', 'in')).toEqual({ minutes: 3.048, per: 'foot banded' });
    expect(standardIn(10, 'finish_m2_coat', 'in').minutes).toBeCloseTo(0.9290304, 9);
    expect(standardIn(10, 'banding_metre', 'mm')).toEqual({ minutes: 10, per: 'meter banded' });
    expect(standardIn(60, 'case', 'in')).toEqual({ minutes: 60, per: 'case' });
  });
});
