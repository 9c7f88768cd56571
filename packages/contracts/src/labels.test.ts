import { describe, expect, it } from 'vitest';
import { ESTIMATE_STATUSES, PROJECT_STATUSES, STAGE_KEYS } from './lifecycle';
import {
  CLIENT_PROJECT_STATUS_LABELS,
  DEFAULT_STAGE_LABELS,
  ESTIMATE_STATUS_LABELS,
  replacedBy,
  SHOP_PROJECT_STATUS_LABELS,
} from './labels';
import { formatDate, formatDateTime } from './format';

describe('status label maps', () => {
  const maps = [
    ['shop project', SHOP_PROJECT_STATUS_LABELS, PROJECT_STATUSES],
    ['client project', CLIENT_PROJECT_STATUS_LABELS, PROJECT_STATUSES],
    ['estimate', ESTIMATE_STATUS_LABELS, ESTIMATE_STATUSES],
    ['stage', DEFAULT_STAGE_LABELS, STAGE_KEYS],
  ] as const;
  for (const [name, map, keys] of maps) {
    it(`returns one label per ${name} status, and nothing else`, () => {
      expect(Object.keys(map).sort()).toEqual([...keys].sort());
    });
    it(`gives each ${name} status its own words, written for people`, () => {
      const labels = Object.values(map) as string[];
      expect(new Set(labels).size).toBe(labels.length);
      for (const l of labels) {
        expect(l).toMatch(/^[A-Z]/);
        expect(l).not.toMatch(/_/);
      }
    });
  }
  it('tells the client what a sent estimate means for them, and the shop what it did', () => {
    expect(CLIENT_PROJECT_STATUS_LABELS.estimate_sent).toBe('Estimate ready to review');
    expect(SHOP_PROJECT_STATUS_LABELS.estimate_sent).toBe('Estimate sent');
  });
  it('names a superseded revision by what replaced it', () => {
    expect(replacedBy(3)).toBe('Replaced by revision 3');
  });
});

describe('formatDate', () => {
  it('returns a stored calendar date the way every other date reads', () => {
    expect(formatDate('2026-03-14')).toBe('Mar 14, 2026');
  });
  it('returns an instant in US English, medium style', () => {
    expect(formatDate(new Date(2026, 2, 14, 12))).toBe('Mar 14, 2026');
    expect(formatDate(new Date(2026, 2, 14, 12).getTime())).toBe('Mar 14, 2026');
  });
  it('returns the time too when asked', () => {
    expect(formatDateTime(new Date(2026, 2, 14, 15, 30))).toBe('Mar 14, 2026, 3:30 PM');
  });
  describe('invalid input', () => {
    it('refuses what is not a date', () => {
      expect(() => formatDate('not a date')).toThrow(RangeError);
    });
  });
});
