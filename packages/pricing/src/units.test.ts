import { describe, expect, it } from 'vitest';
import { boardFeet, formatLength, LengthParseError, parseLength, toInches, toMm } from './units';

describe('toMm and toInches', () => {
  it('uses the international inch of exactly 25.4 mm', () => {
    expect(toMm(1)).toBe(25.4);
    expect(toInches(603.25)).toBeCloseTo(23.75, 12);
    expect(toInches(toMm(17.3))).toBeCloseTo(17.3, 12);
  });
});

describe('parseLength', () => {
  it.each([
    ['23 3/4', 603.25],
    ['23-3/4"', 603.25],
    ['1\' 11 3/4"', 603.25],
    ['603.25 mm', 603.25],
    ['60.3 cm', 603],
    ['23.75in', 603.25],
    ['3/4', 19.05],
    ['2 ft', 609.6],
    ['0.5 m', 500],
  ])('reads %s as %f mm', (text, mm) => {
    expect(parseLength(text, 'in')).toBeCloseTo(mm, 9);
  });
  it('takes bare numbers in the default unit', () => {
    expect(parseLength('600', 'mm')).toBe(600);
    expect(parseLength('600', 'in')).toBeCloseTo(15240, 9);
  });
  describe('invalid input', () => {
    it.each(['', 'abc', '3/0', '-5', '12 furlongs', '1/2/3'])('rejects %j with a reason', (text) => {
      expect(() => parseLength(text, 'in')).toThrow(LengthParseError);
      expect(() => parseLength(text, 'in')).toThrow(/is not a length/);
    });
  });
});

describe('formatLength', () => {
  it('returns whole inches and a reduced sixteenth by default', () => {
    expect(formatLength(603.25, { unit: 'in' })).toBe('23 3/4"');
    expect(formatLength(609.6, { unit: 'in' })).toBe('24"');
    expect(formatLength(1.5875, { unit: 'in' })).toBe('1/16"');
  });
  it('returns thirty-seconds for plywood thicknesses', () => {
    expect(formatLength(18.256, { unit: 'in', denominator: 32 })).toBe('23/32"');
  });
  it('returns whole millimetres', () => {
    expect(formatLength(603.25, { unit: 'mm' })).toBe('603 mm');
  });
  describe('edge cases', () => {
    it('rounds up into the next inch', () => {
      expect(formatLength(toMm(23.99), { unit: 'in' })).toBe('24"');
    });
    it('refuses a non-finite length', () => {
      expect(() => formatLength(Number.NaN, { unit: 'in' })).toThrow(RangeError);
    });
  });
});

describe('boardFeet', () => {
  // American Hardwood Export Council, summary of the NHLA grading rules: a 2 in x 6 1/4 in x 8 ft board is 8 1/3 board feet
  it('returns 8 1/3 for a 2 in x 6 1/4 in x 8 ft board (AHEC summary of the NHLA rules)', () => {
    expect(boardFeet(2, 6.25, 96)).toBeCloseTo(25 / 3, 12);
  });
  it('returns 1 for a board foot (1 x 12 x 12 in)', () => {
    expect(boardFeet(1, 12, 12)).toBe(1);
  });
});
