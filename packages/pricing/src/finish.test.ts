import { describe, expect, it } from 'vitest';
import { finishCoverage, finishGallons } from './finish';

describe('finishCoverage', () => {
  // The coatings rule: one US gallon (231 in3) spread 1 mil dry covers 1604 ft2; 65 % solids at 5 mils -> about 208.5 ft2/gal
  it('returns about 208.5 ft2 per gallon for 65 % volume solids at 5 mils dry (the 1604 rule)', () => {
    expect(finishCoverage({ volumeSolids: 0.65, dryFilmMils: 5 })).toBeCloseTo(208.52, 2);
  });
  it('derives 1604 from the gallon: 231 in3 / 0.001 in / 144 in2 per ft2', () => {
    expect(231 / 0.001 / 144).toBeCloseTo(1604.17, 2);
    expect(finishCoverage({ volumeSolids: 1, dryFilmMils: 1 })).toBe(1604);
  });
  it('loses coverage with transfer efficiency', () => {
    expect(finishCoverage({ volumeSolids: 0.5, dryFilmMils: 2, transferEfficiency: 0.5 })).toBeCloseTo(200.5, 9);
  });
  describe('invalid input', () => {
    it.each([
      { volumeSolids: 0, dryFilmMils: 1 },
      { volumeSolids: 1.2, dryFilmMils: 1 },
      { volumeSolids: 0.5, dryFilmMils: 0 },
      { volumeSolids: 0.5, dryFilmMils: 1, transferEfficiency: 2 },
    ])('refuses %j', (input) => {
      expect(() => finishCoverage(input)).toThrow(RangeError);
    });
  });
});

describe('finishGallons', () => {
  it('returns area in ft2 times coats over coverage', () => {
    expect(finishGallons({ areaM2: 9.290304, coats: 2, coverageFt2PerGallon: 400 })).toBeCloseTo(0.5, 9);
  });
});
