import { describe, expect, it } from 'vitest';
import { at } from './at';

describe('at', () => {
  it('returns the element at an index in range', () => {
    expect(at([3, 5], 1)).toBe(5);
    expect(at(new Uint32Array([7]), 0)).toBe(7);
  });
  it('keeps falsy elements', () => {
    expect(at([0, '', false], 0)).toBe(0);
    expect(at([0, '', false], 2)).toBe(false);
  });
  describe('invalid input', () => {
    it('throws a clear error for an index out of range', () => {
      expect(() => at([3, 5], 2)).toThrow(new RangeError('internal: index 2 out of range (length 2)'));
      expect(() => at([], -1)).toThrow(RangeError);
    });
  });
});
