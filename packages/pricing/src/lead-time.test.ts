import { describe, expect, it } from 'vitest';
import { bookedHours, leadTime, leadTimeDates } from './lead-time';

describe('leadTime', () => {
  it('returns week 4 to week 4 for a 35-hour job after 120 booked hours at 40 a week', () => {
    expect(leadTime({ capacity: 40, booked: 120, jobHours: 35 })).toEqual({ startWeek: 4, finishWeek: 4 });
  });
  it('returns week 4 to week 5 after 130 booked hours (30 free in week 4, 5 more in week 5)', () => {
    expect(leadTime({ capacity: 40, booked: 130, jobHours: 35 })).toEqual({ startWeek: 4, finishWeek: 5 });
  });
  it('returns this week with an empty board', () => {
    expect(leadTime({ capacity: 40, booked: 0, jobHours: 12 })).toEqual({ startWeek: 1, finishWeek: 1 });
  });
  describe('edge cases', () => {
    it('finishes in the week a job exactly fills', () => {
      expect(leadTime({ capacity: 40, booked: 0, jobHours: 40 })).toEqual({ startWeek: 1, finishWeek: 1 });
      expect(leadTime({ capacity: 40, booked: 20, jobHours: 60 })).toEqual({ startWeek: 1, finishWeek: 2 });
    });
    it('starts the week after booked hours that exactly fill whole weeks', () => {
      expect(leadTime({ capacity: 40, booked: 80, jobHours: 1 })).toEqual({ startWeek: 3, finishWeek: 3 });
    });
    it('gives a job of no hours the same start and finish week', () => {
      expect(leadTime({ capacity: 40, booked: 80, jobHours: 0 })).toEqual({ startWeek: 3, finishWeek: 3 });
    });
    it('spans many weeks for a long job', () => {
      expect(leadTime({ capacity: 30, booked: 10, jobHours: 200 })).toEqual({ startWeek: 1, finishWeek: 7 });
    });
  });
  describe('invalid input', () => {
    it.each([
      { capacity: 0, booked: 0, jobHours: 1 },
      { capacity: -40, booked: 0, jobHours: 1 },
      { capacity: 40, booked: -1, jobHours: 1 },
      { capacity: 40, booked: 0, jobHours: Number.NaN },
      { capacity: Number.POSITIVE_INFINITY, booked: 0, jobHours: 1 },
    ])('refuses %j', (input) => {
      expect(() => leadTime(input)).toThrow(RangeError);
    });
  });
});

describe('bookedHours', () => {
  it('returns each job’s budget less its logged hours, never below 0', () => {
    expect(
      bookedHours([
        { budgetHours: 50, loggedHours: 10 },
        { budgetHours: 20, loggedHours: 30 },
        { budgetHours: 90, loggedHours: 0 },
      ]),
    ).toBe(130);
  });
  it('does not change its input', () => {
    const jobs = Object.freeze([Object.freeze({ budgetHours: 5, loggedHours: 1 })]);
    expect(bookedHours(jobs)).toBe(4);
  });
  it('returns 0 for an empty board and refuses negative hours', () => {
    expect(bookedHours([])).toBe(0);
    expect(() => bookedHours([{ budgetHours: -1, loggedHours: 0 }])).toThrow(RangeError);
  });
});

describe('leadTimeDates', () => {
  it('returns the Monday of the start week and the Friday of the finish week, week 1 being this week', () => {
    // 2026-12-02 is a Wednesday
    expect(leadTimeDates({ startWeek: 4, finishWeek: 5 }, new Date('2026-12-02T10:00:00Z'))).toEqual({
      startDate: '2026-12-21',
      finishDate: '2027-01-01',
    });
  });
  it('counts a Sunday as the end of its week and a Monday as its start', () => {
    expect(leadTimeDates({ startWeek: 1, finishWeek: 1 }, new Date('2026-12-06T23:00:00Z'))).toEqual({
      startDate: '2026-11-30',
      finishDate: '2026-12-04',
    });
    expect(leadTimeDates({ startWeek: 1, finishWeek: 1 }, new Date('2026-12-07T00:00:00Z')).startDate).toBe(
      '2026-12-07',
    );
  });
});
