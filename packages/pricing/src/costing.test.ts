import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { budgetRange, estimate, splitDeposit, times, totalsFor, type EstimateItem } from './costing';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, DESIGN_SLUGS, parseSpec, type BuildSpec } from './designs';
import { halfUp } from 'dinero.js';
import { toMm } from './units';
import { at } from './_lib/at';

describe('totalsFor', () => {
  it('returns 8.25 % tax on $1,234.56 as $101.85', () => {
    expect(times(123456, 0.0825, halfUp)).toBe(10185);
    const t = totalsFor([{ group: 'hardware', amountCents: 123456 }], {
      taxRate: 0.0825,
      taxApplies: 'all',
      depositRate: 0.5,
    });
    expect(t).toMatchObject({ subtotalCents: 123456, taxCents: 10185, totalCents: 133641 });
  });
  it('taxes materials only when the shop says so', () => {
    const t = totalsFor(
      [
        { group: 'hardware', amountCents: 10000 },
        { group: 'labour', amountCents: 50000 },
      ],
      { taxRate: 0.1, taxApplies: 'materials', depositRate: 0.5 },
    );
    expect(t.taxCents).toBe(1000);
  });
  it('spreads a discount over the tax base', () => {
    const t = totalsFor(
      [
        { group: 'hardware', amountCents: 10000 },
        { group: 'labour', amountCents: 10000 },
      ],
      { taxRate: 0.1, taxApplies: 'materials', depositRate: 0.5 },
      2000,
    );
    expect(t).toMatchObject({ discountCents: 2000, taxCents: 900, totalCents: 18900 });
  });
  it('never discounts below zero', () => {
    expect(
      totalsFor([{ group: 'other', amountCents: 500 }], { taxRate: 0, taxApplies: 'all', depositRate: 0.5 }, 9999)
        .totalCents,
    ).toBe(0);
  });
});

describe('splitDeposit', () => {
  it('returns a 40/60 split that adds back to the total to the cent, for any total', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000_00 }), (total) => {
        const { depositCents, balanceCents } = splitDeposit(total, 0.4);
        expect(depositCents + balanceCents).toBe(total);
        expect(Math.abs(depositCents - total * 0.4)).toBeLessThanOrEqual(1);
      }),
      { numRuns: 500, seed: 7 },
    );
  });
  it('splits $1,000.01 at 40 % as $400.00 and $600.01', () => {
    expect(splitDeposit(100001, 0.4)).toEqual({ depositCents: 40000, balanceCents: 60001 });
  });
});

describe('estimate', () => {
  it.each(DESIGN_SLUGS)('prices the %s defaults with lines that add up', (slug) => {
    const e = estimate([{ spec: designs[slug].defaults, quantity: 1 }], demoPriceBook, demoSettings);
    const sum = e.lines.reduce((s, l) => s + l.amountCents, 0);
    expect(e.totals.subtotalCents).toBe(sum);
    expect(e.totals.totalCents).toBe(e.totals.subtotalCents - e.totals.discountCents + e.totals.taxCents);
    expect(e.totals.depositCents + e.totals.balanceCents).toBe(e.totals.totalCents);
    for (const l of e.lines) {
      expect(
        Number.isInteger(l.amountCents) && Number.isInteger(l.unitPriceCents) && Number.isInteger(l.costCents),
      ).toBe(true);
      expect(l.source).toBe('computed');
    }
    expect(e.lines.some((l) => l.group === 'sheet_goods')).toBe(true);
    expect(e.lines.some((l) => l.group === 'labour')).toBe(true);
    expect(e.layouts.every((l) => l.sheetCount >= l.lowerBound && l.unplaced.length === 0)).toBe(true);
    expect(e.totalHours).toBeGreaterThan(0);
    expect(e.massKg).toBeGreaterThan(0);
  });

  it('charges whole sheets as laid out, marked up, and labour at the shop rate', () => {
    const e = estimate([{ spec: designs['base-cabinet'].defaults, quantity: 1 }], demoPriceBook, demoSettings);
    const ply = e.lines.find((l) => l.ref === 'birch-ply-18')!;
    const layout = e.layouts.find((l) => l.materialId === 'birch-ply-18')!;
    expect(ply.quantity).toBe(layout.sheetCount);
    expect(ply.unitPriceCents).toBe(Math.round(8900 * 1.35));
    expect(ply.costCents).toBe(8900 * layout.sheetCount);
    for (const l of e.lines.filter((x) => x.group === 'labour'))
      expect(l.unitPriceCents).toBe(demoSettings.shopRateCents);
    const hours = e.lines.filter((x) => x.group === 'labour').reduce((s, l) => s + l.quantity, 0);
    expect(hours).toBeCloseTo(e.totalHours, 1);
  });

  it('charges the used fraction with its minimum when the shop says so', () => {
    const e = estimate([{ spec: designs['wall-cabinet'].defaults, quantity: 1 }], demoPriceBook, {
      ...demoSettings,
      sheetCharging: 'used_fraction',
      minSheetFraction: 0.25,
    });
    const back = e.lines.find((l) => l.ref === 'birch-ply-6')!;
    expect(back.quantity).toBeGreaterThanOrEqual(0.25);
    expect(back.quantity).toBeLessThan(1);
  });

  it('shares sheets between items: two wall cabinets need fewer sheets than twice one', () => {
    const one = estimate([{ spec: designs['wall-cabinet'].defaults, quantity: 1 }], demoPriceBook, demoSettings);
    const two = estimate([{ spec: designs['wall-cabinet'].defaults, quantity: 2 }], demoPriceBook, demoSettings);
    const sheets = (e: typeof one) => e.layouts.reduce((s, l) => s + l.sheetCount, 0);
    expect(sheets(two)).toBeLessThan(2 * sheets(one));
    expect(two.pieces[0]?.quantity).toBe(2);
  });

  it('prices walnut trim in board feet with waste', () => {
    const spec = {
      ...designs.bookcase.defaults,
      trim: { lumberId: 'walnut-4-4', widthMm: toMm(1.5), thicknessMm: toMm(0.75) },
    };
    const e = estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings);
    const wood = e.lines.find((l) => l.group === 'solid_wood')!;
    // 2 stiles of 69 in and 2 rails of 32 in, 1 1/2 in wide, 4/4 rough: (2 x 69 + 2 x 32) x 1.5 / 144 = 2.104 bd ft, plus 30 % waste
    expect(wood.quantity).toBeCloseTo((((2 * 69 + 2 * 32) * 1.5 * 1) / 144) * 1.3, 2);
    expect(wood.unit).toBe('bd ft');
  });

  it('adds an anti-tip kit and says why for a tall free-standing piece with doors', () => {
    const spec: BuildSpec = {
      ...designs.bookcase.defaults,
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'door', heightMm: null, doors: 2, adjustableShelves: 3, fixedShelves: 0 }],
        },
      ],
    };
    const e = estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings);
    expect(e.lines.some((l) => l.ref === 'anti-tip-kit')).toBe(true);
    expect(e.checks.find((c) => c.code === 'tip_over')?.message).toMatch(/anchored to the wall/);
  });

  it('gives the same result for the same input and does not mutate it', () => {
    const items: EstimateItem[] = [{ spec: structuredClone(designs['assembly-bench'].defaults), quantity: 1 }];
    const copy = structuredClone(items);
    const a = estimate(items, demoPriceBook, demoSettings);
    const b = estimate(items, demoPriceBook, demoSettings);
    expect(b).toEqual(a);
    expect(items).toEqual(copy);
  });

  describe('invalid input', () => {
    it('refuses no items and a fractional quantity', () => {
      expect(() => estimate([], demoPriceBook, demoSettings)).toThrow(/at least one item/);
      expect(() => estimate([{ spec: designs.bookcase.defaults, quantity: 1.5 }], demoPriceBook, demoSettings)).toThrow(
        /whole number/,
      );
    });
  });
});

describe('budgetRange', () => {
  it('returns a range around the estimate total from the spread setting', () => {
    const items = [{ spec: designs.bookcase.defaults, quantity: 1 }];
    const total = estimate(items, demoPriceBook, demoSettings).totals.totalCents;
    const r = budgetRange(items, demoPriceBook, demoSettings);
    expect(r.lowCents).toBeLessThanOrEqual(total);
    expect(r.highCents).toBeGreaterThanOrEqual(total);
    expect(r.lowCents).toBeGreaterThanOrEqual(Math.floor(total * 0.85) - 1000);
    expect(r.highCents).toBeLessThanOrEqual(Math.ceil(total * 1.15) + 1000);
    expect(r.lowCents % 1000).toBe(0);
  });
});

// Properties over random valid specs
const specArb = fc
  .record({
    slug: fc.constantFrom(...DESIGN_SLUGS),
    w: fc.double({ min: 0, max: 1, noNaN: true }),
    h: fc.double({ min: 0, max: 1, noNaN: true }),
    d: fc.double({ min: 0, max: 1, noNaN: true }),
    bays: fc.integer({ min: 1, max: 2 }),
    kinds: fc.array(fc.constantFrom('drawer', 'door', 'open'), { minLength: 1, maxLength: 3 }),
    shelves: fc.integer({ min: 0, max: 3 }),
  })
  .map(({ slug, w, h, d, bays, kinds, shelves }) => {
    const design = designs[slug];
    const L = design.limits;
    const lerp = ([a, b]: [number, number], f: number) => a + (b - a) * (0.25 + 0.5 * f);
    const base = structuredClone(design.defaults) as BuildSpec;
    const compartments = kinds.map((kind) => ({
      kind,
      heightMm: null,
      doors: 1 as const,
      adjustableShelves: kind === 'drawer' ? 0 : shelves,
      fixedShelves: 0,
    }));
    return {
      ...base,
      widthMm: lerp(L.widthMm, w),
      heightMm: lerp(L.heightMm, h),
      depthMm: lerp(L.depthMm, d),
      bays: Array.from({ length: Math.min(bays, L.bays[1]) }, () => ({ widthMm: null, compartments })),
    } as BuildSpec;
  })
  .filter((s) => parseSpec(s).ok);

describe('properties over random valid specs (fast-check)', () => {
  it('gives every sheet part a positive size that fits a sheet of its material, and totals that add up', () => {
    fc.assert(
      fc.property(specArb, fc.integer({ min: 1, max: 3 }), (spec, quantity) => {
        let e;
        try {
          e = estimate([{ spec, quantity }], demoPriceBook, demoSettings);
        } catch (err) {
          // a spec the schema lets through but the cut list cannot build must say why
          expect(err).toBeInstanceOf(RangeError);
          return;
        }
        for (const p of at(e.pieces, 0).parts.filter((x) => x.stock === 'sheet')) {
          const m = demoPriceBook.sheetGoods.find((s) => s.id === p.materialId)!;
          expect(p.lengthMm).toBeGreaterThan(0);
          expect(p.widthMm).toBeGreaterThan(0);
          const L = m.sheetLengthMm - 2 * demoSettings.sheetTrimMm;
          const W = m.sheetWidthMm - 2 * demoSettings.sheetTrimMm;
          expect((p.lengthMm <= L && p.widthMm <= W) || (p.grain === 'free' && p.widthMm <= L && p.lengthMm <= W)).toBe(
            true,
          );
        }
        expect(e.totals.subtotalCents).toBe(e.lines.reduce((s, l) => s + l.amountCents, 0));
        expect(e.totals.depositCents + e.totals.balanceCents).toBe(e.totals.totalCents);
      }),
      { numRuns: 40, seed: 11 },
    );
  }, 30_000);

  it('never lowers per-part operations or hardware when every dimension grows', () => {
    fc.assert(
      fc.property(specArb, fc.double({ min: 1.01, max: 1.15, noNaN: true }), (spec, grow) => {
        const bigger = {
          ...spec,
          widthMm: spec.widthMm * grow,
          heightMm: spec.heightMm * grow,
          depthMm: spec.depthMm * grow,
        } as BuildSpec;
        if (!parseSpec(bigger).ok) return;
        let a, b;
        try {
          a = estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings);
          b = estimate([{ spec: bigger, quantity: 1 }], demoPriceBook, demoSettings);
        } catch {
          return;
        }
        const parts = (e: typeof a) => at(e.pieces, 0).parts.reduce((s, p) => s + p.quantity, 0);
        const hw = (e: typeof a) =>
          at(e.pieces, 0)
            .hardware.filter((h) => h.kind !== 'slide' && h.kind !== 'anti_tip_kit' && h.kind !== 'rail_screw')
            .reduce((s, h) => s + h.pieces, 0);
        expect(parts(b)).toBeGreaterThanOrEqual(parts(a));
        expect(hw(b)).toBeGreaterThanOrEqual(hw(a));
        const cutting = (e: typeof a) => e.hoursByStage.casework + e.hoursByStage.drawers_doors;
        expect(cutting(b)).toBeGreaterThanOrEqual(cutting(a) - 1e-9);
      }),
      { numRuns: 30, seed: 13 },
    );
  });

  it('gives the same output for the same input', () => {
    fc.assert(
      fc.property(specArb, (spec) => {
        let a;
        try {
          a = estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings);
        } catch {
          return;
        }
        expect(estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings)).toEqual(a);
      }),
      { numRuns: 15, seed: 17 },
    );
  });
});
