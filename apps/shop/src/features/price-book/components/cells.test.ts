import type { PriceColumn } from '@benchwright/contracts';
import { describe, expect, it } from 'vitest';
import { showValue } from './cells';

const column = (type: PriceColumn['type']): PriceColumn => ({ column: 'x', field: 'x', type, optional: false });

describe('showValue: a price-book cell as the owner reads it', () => {
  it('writes a number without the float noise arithmetic leaves (0.67, not 0.6699999999999999)', () => {
    expect(showValue(column('number'), 0.67 - 1e-16)).toBe('0.67');
    expect(showValue(column('number'), 0.1 + 0.2)).toBe('0.3');
    expect(showValue(column('number'), 18.26)).toBe('18.26');
    expect(showValue(column('number'), 2438.4)).toBe('2438.4');
  });
  it('writes a price in dollars with its cents', () => {
    expect(showValue(column('money'), 8950)).toBe('89.50');
  });
});
