import { priceColumns, type PriceBookKind, type PriceColumn } from '@benchwright/contracts';
import { describe, expect, it } from 'vitest';
import { CONVERTED_FIELDS, heading, itemOf, readValue, showValue } from './cells';

const column = (type: PriceColumn['type']): PriceColumn => ({ column: 'x', field: 'x', type, optional: false });
const imperial = { units: 'in' as const };
const metric = { units: 'mm' as const };
const col = (kind: PriceBookKind, field: string) => {
  const c = priceColumns(kind).find((x) => x.field === field);
  if (!c) throw new Error(`no ${field} in ${kind}`);
  return c;
};

describe('showValue: a price-book cell as the owner reads it', () => {
  it('writes a number without the float noise arithmetic leaves (0.67, not 0.6699999999999999)', () => {
    expect(showValue(column('number'), 0.67 - 1e-16, imperial)).toBe('0.67');
    expect(showValue(column('number'), 0.1 + 0.2, imperial)).toBe('0.3');
    expect(showValue(col('sheet-goods', 'thicknessMm'), 18.26, metric)).toBe('18.26');
    expect(showValue(col('sheet-goods', 'sheetLengthMm'), 2438.4, metric)).toBe('2438.4');
  });
  it('writes a price in dollars with its cents', () => {
    expect(showValue(column('money'), 8950, imperial)).toBe('89.50');
  });
  it('writes a per-foot price to a tenth of a cent only where cents would not read back as the stored price', () => {
    const perMetre = col('banding', 'pricePerMetreCents');
    expect(showValue(perMetre, 46, imperial)).toBe('0.14'); // 0.46 x 0.3048 = 0.1402
    expect(showValue(perMetre, 35, imperial)).toBe('0.107'); // 0.11 would read back as 36 cents a metre
    expect(showValue(perMetre, 35, metric)).toBe('0.35');
  });
});

describe('every stored-unit column is shown in the shop’s units', () => {
  // a column whose name carries a stored unit (thickness_mm, mass_kg, price_per_metre_usd ...) must be converted
  const unitBearing = /_(mm|in|kg|kg_m3|mpa|mils_per_coat)$|_per_(metre|gallon)_usd$|^minutes$/;
  it.each(['sheet-goods', 'lumber', 'banding', 'hardware', 'finishes', 'labour'] as const)('%s', (kind) => {
    for (const c of priceColumns(kind))
      if (unitBearing.test(c.column)) expect(CONVERTED_FIELDS, `${kind}.${c.column}`).toContain(c.field);
  });
  it('names the unit in each heading, by the shop’s units', () => {
    expect(heading(col('sheet-goods', 'thicknessMm'), imperial)).toBe('Thickness (in)');
    expect(heading(col('sheet-goods', 'thicknessMm'), metric)).toBe('Thickness (mm)');
    expect(heading(col('banding', 'pricePerMetreCents'), imperial)).toBe('Price per ft ($)');
    expect(heading(col('banding', 'pricePerMetreCents'), metric)).toBe('Price per m ($)');
    expect(heading(col('finishes', 'pricePerGallonCents'), metric)).toBe('Price per L ($)');
    expect(heading(col('hardware', 'ratedLoadKg'), imperial)).toBe('Rated load (lb)');
    expect(heading(col('sheet-goods', 'densityKgM3'), imperial)).toBe('Density (lb/ft³)');
  });
});

describe('reading an edit back into the stored units', () => {
  it('takes what was typed in the shown units: 23/32 in is 18.256 mm, 0.14 a foot is 46 cents a metre', () => {
    expect(readValue(col('sheet-goods', 'thicknessMm'), '23/32', imperial)).toBeCloseTo(18.25625, 9);
    expect(readValue(col('sheet-goods', 'thicknessMm'), '18.26 mm', imperial)).toBeCloseTo(18.26, 9);
    expect(readValue(col('banding', 'pricePerMetreCents'), '0.14', imperial)).toBe(46);
    expect(readValue(col('hardware', 'ratedLoadKg'), '220.46', imperial)).toBeCloseTo(100, 2);
    expect(readValue(col('hardware', 'lengthIn'), '558.8', metric)).toBeCloseTo(22, 9);
    expect(readValue(col('labour', 'minutes'), '3.048', imperial, { driver: 'banding_metre' })).toBeCloseTo(10, 9);
  });

  it('round-trips every stored price per metre through its shown price per foot without drift', () => {
    const perMetre = col('banding', 'pricePerMetreCents');
    for (let cents = 0; cents <= 5000; cents++)
      expect(readValue(perMetre, showValue(perMetre, cents, imperial), imperial)).toBe(cents);
  });

  it('sends only the cells the owner changed, so an untouched one keeps its stored value exactly', () => {
    const cols = priceColumns('sheet-goods');
    const stored = {
      id: 'birch-ply-18',
      name: '3/4 in birch plywood',
      kind: 'plywood',
      nominalThicknessIn: 0.75,
      thicknessMm: 18.26,
      sheetLengthMm: 2438.4,
      sheetWidthMm: 1219.2,
      grain: 'lengthwise',
      densityKgM3: 680,
      modulusMPa: 12410,
      priceCents: 8900,
    };
    const shown = Object.fromEntries(cols.map((c) => [c.field, showValue(c, stored[c.field as 'id'], imperial)]));
    expect(shown).toMatchObject({ thicknessMm: '23/32', sheetLengthMm: '96', modulusMPa: '1,800,000' });
    expect(itemOf(cols, shown, imperial, shown)).toEqual({ item: {}, errors: {} });
    expect(itemOf(cols, { ...shown, priceCents: '92.00' }, imperial, shown)).toEqual({
      item: { priceCents: 9200 },
      errors: {},
    });
    expect(itemOf(cols, { ...shown, thicknessMm: 'thick' }, imperial, shown).errors).toEqual({
      thicknessMm: 'write inches, e.g. 23/32 or 1 1/4',
    });
  });

  it('reads a standard again when its driver changes, though its minutes were left as shown', () => {
    const cols = priceColumns('labour');
    const shown = {
      key: 'edge_banding',
      name: 'Edge banding',
      driver: 'banding_metre',
      minutes: '3.048',
      stage: 'casework',
    };
    expect(itemOf(cols, { ...shown, driver: 'part' }, imperial, shown).item).toEqual({
      driver: 'part',
      minutes: 3.048,
    });
  });
});
