import { describe, expect, it } from 'vitest';
import {
  boardFeet,
  displayUnit,
  formatArea,
  formatAreaLoad,
  formatLength,
  formatLineal,
  formatMeasure,
  formatQuantity,
  formatThickness,
  formatVolume,
  formatWeight,
  LengthParseError,
  WeightParseError,
  parseLength,
  parseWeight,
  toInches,
  toMm,
  unitPriceFactor,
} from './units';

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

describe('formatThickness', () => {
  it('returns actual plywood thickness to the nearest 1/32 in, not the nominal 3/4', () => {
    expect(formatThickness(18.26, 'in')).toBe('23/32"');
    expect(formatThickness(19.05, 'in')).toBe('3/4"');
  });
  it('returns millimetres to one decimal for a metric shop', () => {
    expect(formatThickness(18.26, 'mm')).toBe('18.3 mm');
    expect(formatThickness(18, 'mm')).toBe('18 mm');
  });
});

describe('formatLineal', () => {
  it('returns banding by the lineal foot for an imperial shop', () => {
    expect(formatLineal(37.08, 'in')).toBe('121.7 ft');
  });
  it('returns metres for a metric shop', () => {
    expect(formatLineal(37.08, 'mm')).toBe('37.1 m');
  });
});

describe('formatWeight', () => {
  it('returns pounds for an imperial shop and kilograms for a metric one', () => {
    expect(formatWeight(54.4311, 'in')).toBe('120 lb');
    expect(formatWeight(54.4311, 'mm')).toBe('54 kg');
  });
  it('returns one decimal under ten', () => {
    expect(formatWeight(2, 'in')).toBe('4.4 lb');
  });
});

describe('parseWeight', () => {
  it('returns kilograms from pounds for an imperial shop and from kilograms for a metric one', () => {
    // 1 lb is exactly 0.45359237 kg (the international pound, 1959)
    expect(parseWeight('500', 'in')).toBeCloseTo(226.796185, 6);
    expect(parseWeight('500 lb', 'in')).toBeCloseTo(226.796185, 6);
    expect(parseWeight('200', 'mm')).toBe(200);
  });
  it('takes the unit written over the default one', () => {
    expect(parseWeight('100 kg', 'in')).toBe(100);
    expect(parseWeight('10 lbs', 'mm')).toBeCloseTo(4.5359237, 9);
    expect(parseWeight('12.5 kilograms', 'in')).toBe(12.5);
  });
  it('reads back what formatWeight writes', () => {
    for (const kg of [2, 54.4311, 200, 680])
      for (const unit of ['in', 'mm'] as const)
        expect(formatWeight(parseWeight(formatWeight(kg, unit), unit), unit)).toBe(formatWeight(kg, unit));
    expect(parseWeight('1,102 lb', 'in')).toBeCloseTo(1102 * 0.45359237, 9);
  });
  describe('invalid input', () => {
    it.each(['', '  ', '-5', 'heavy', '5 stone', '1,10 lb', '3/4'])('throws for %j', (text) => {
      expect(() => parseWeight(text, 'in')).toThrow(WeightParseError);
      expect(() => parseWeight(text, 'in')).toThrow(/is not a weight/);
    });
  });
});

describe('formatArea, formatVolume, formatAreaLoad, formatMeasure', () => {
  it('returns square feet or square metres', () => {
    expect(formatArea(1, 'in')).toBe('10.8 ft²');
    expect(formatArea(1, 'mm')).toBe('1 m²');
  });
  it('returns gallons or litres', () => {
    expect(formatVolume(0.8, 'in')).toBe('0.8 gal');
    expect(formatVolume(1, 'mm')).toBe('3.8 L');
  });
  it('returns a shelf load of 1.915 kPa as 40 lb/ft²', () => {
    expect(formatAreaLoad(1.915, 'in')).toBe('40 lb/ft²');
    expect(formatAreaLoad(1.915, 'mm')).toBe('1.9 kPa');
  });
  it('returns a small measure in inches to the hundredth, or millimetres', () => {
    expect(formatMeasure(3.2, 'in')).toBe('0.13 in');
    expect(formatMeasure(3.2, 'mm')).toBe('3.2 mm');
  });
});

describe('formatQuantity', () => {
  it('returns quantities as a person writes them', () => {
    expect(formatQuantity(2, 'sheet', 'in')).toBe('2 sheets');
    expect(formatQuantity(1, 'sheet', 'in')).toBe('1 sheet');
    expect(formatQuantity(6, 'pair', 'in')).toBe('6 pairs');
    expect(formatQuantity(11.55, 'm', 'in')).toBe('37.9 ft');
    expect(formatQuantity(0.8, 'gal', 'in')).toBe('0.8 gal');
    expect(formatQuantity(12, 'each', 'in')).toBe('12');
    expect(formatQuantity(3.456, 'h', 'in')).toBe('3.46 h');
  });
  it('returns the metric figures for a metric shop', () => {
    expect(formatQuantity(37.08, 'm', 'mm')).toBe('37.1 m');
  });
  it('keeps the line amount: the unit price follows the shown unit', () => {
    expect(unitPriceFactor('m', 'in')).toBeCloseTo(0.3048);
    expect(displayUnit('m', 'in')).toBe('ft');
    expect(unitPriceFactor('sheet', 'in')).toBe(1);
  });
  describe('invalid input', () => {
    it('refuses a number that is not finite', () => {
      expect(() => formatQuantity(Number.NaN, 'sheet', 'in')).toThrow(RangeError);
      expect(() => formatLineal(Infinity, 'in')).toThrow(RangeError);
    });
  });
});
