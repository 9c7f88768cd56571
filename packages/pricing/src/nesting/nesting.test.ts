import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { nest, nestByMaterial, nestLowerBound, type NestPart, type NestResult } from './index';
import { validateLayout } from '../validate-layout';
import { toMm } from '../units';
import { at } from '../_lib/at';

// a 4 x 8 ft sheet is 2438.4 x 1219.2 mm
const SHEET = { lengthMm: toMm(96), widthMm: toMm(48) };
const OPTS = { kerfMm: 3.2, trimMm: 0, effort: 'quick' as const };

function single(
  parts: NestPart[],
  placements: { partId: string; xMm: number; yMm: number; lengthMm: number; widthMm: number; rotated?: boolean }[],
): Pick<NestResult, 'sheets' | 'unplaced'> {
  return {
    sheets: [
      {
        lengthMm: 100,
        widthMm: 100,
        placements: placements.map((p) => ({ rotated: false, ...p })),
        cuts: [],
        offcuts: [],
        usedAreaMm2: 0,
        yieldRatio: 0,
      },
    ],
    unplaced: [],
  };
}

describe('validateLayout', () => {
  const sq = (id: string, l = 40, w = 40, canRotate = true): NestPart => ({
    id,
    lengthMm: l,
    widthMm: w,
    quantity: 1,
    canRotate,
  });
  const sheet = { lengthMm: 100, widthMm: 100 };
  it('accepts a good hand-made layout', () => {
    const parts = [sq('a'), sq('b')];
    expect(
      validateLayout(
        single(parts, [
          { partId: 'a', xMm: 0, yMm: 0, lengthMm: 40, widthMm: 40 },
          { partId: 'b', xMm: 45, yMm: 0, lengthMm: 40, widthMm: 40 },
        ]),
        parts,
        sheet,
        { kerfMm: 3, trimMm: 0 },
      ),
    ).toEqual({ ok: true, errors: [] });
  });
  it('finds an overlap', () => {
    const parts = [sq('a'), sq('b')];
    const v = validateLayout(
      single(parts, [
        { partId: 'a', xMm: 0, yMm: 0, lengthMm: 40, widthMm: 40 },
        { partId: 'b', xMm: 30, yMm: 10, lengthMm: 40, widthMm: 40 },
      ]),
      parts,
      sheet,
      { kerfMm: 3, trimMm: 0 },
    );
    expect(v.ok).toBe(false);
    expect(v.errors.join()).toMatch(/overlap/);
  });
  it('finds parts closer than a kerf', () => {
    const parts = [sq('a'), sq('b')];
    const v = validateLayout(
      single(parts, [
        { partId: 'a', xMm: 0, yMm: 0, lengthMm: 40, widthMm: 40 },
        { partId: 'b', xMm: 42, yMm: 0, lengthMm: 40, widthMm: 40 },
      ]),
      parts,
      sheet,
      { kerfMm: 3, trimMm: 0 },
    );
    expect(v.errors.join()).toMatch(/less than the 3 mm kerf/);
  });
  it('finds a pinwheel that no through-cut separates', () => {
    const parts = [sq('a', 60, 30), sq('b', 30, 60), sq('c', 60, 30), sq('d', 30, 60), sq('e', 30, 30)];
    const v = validateLayout(
      single(parts, [
        { partId: 'a', xMm: 0, yMm: 0, lengthMm: 60, widthMm: 30 },
        { partId: 'b', xMm: 60, yMm: 0, lengthMm: 30, widthMm: 60 },
        { partId: 'c', xMm: 30, yMm: 60, lengthMm: 60, widthMm: 30 },
        { partId: 'd', xMm: 0, yMm: 30, lengthMm: 30, widthMm: 60 },
        { partId: 'e', xMm: 30, yMm: 30, lengthMm: 30, widthMm: 30 },
      ]),
      parts,
      sheet,
      { kerfMm: 0, trimMm: 0 },
    );
    expect(v.errors).toEqual(['sheet 1: no sequence of straight through-cuts separates the parts (not guillotine)']);
  });
  it('finds a rotated grain-bound part', () => {
    const parts = [sq('a', 60, 30, false)];
    const v = validateLayout(
      single(parts, [{ partId: 'a', xMm: 0, yMm: 0, lengthMm: 30, widthMm: 60, rotated: true }]),
      parts,
      sheet,
      { kerfMm: 0, trimMm: 0 },
    );
    expect(v.errors.join()).toMatch(/grain-bound but placed rotated/);
  });
  it('finds a part inside the trim and a missing unit', () => {
    const parts = [sq('a'), { ...sq('b'), quantity: 2 }];
    const v = validateLayout(
      single(parts, [
        { partId: 'a', xMm: 2, yMm: 10, lengthMm: 40, widthMm: 40 },
        { partId: 'b', xMm: 50, yMm: 10, lengthMm: 40, widthMm: 40 },
      ]),
      parts,
      sheet,
      { kerfMm: 3, trimMm: 5 },
    );
    expect(v.errors.join('\n')).toMatch(/outside the sheet less its 5 mm trim/);
    expect(v.errors.join('\n')).toMatch(/"b": 1 placed and 0 unplaced, but the quantity is 2/);
  });
});

describe('nest', () => {
  it('returns a valid guillotine layout with cuts, offcuts and yield', () => {
    const parts: NestPart[] = [
      { id: 'side', name: 'side', lengthMm: 876.3, widthMm: 609.6, quantity: 2, canRotate: false },
      { id: 'bottom', name: 'bottom', lengthMm: 585.8, widthMm: 609.6, quantity: 1, canRotate: false },
      { id: 'stretcher', name: 'stretcher', lengthMm: 573.1, widthMm: 101.6, quantity: 2, canRotate: true },
    ];
    const opts = { kerfMm: 3.2, trimMm: 6, effort: 'thorough' as const };
    const r = nest(parts, SHEET, opts);
    expect(validateLayout(r, parts, SHEET, opts)).toEqual({ ok: true, errors: [] });
    expect(r.sheetCount).toBe(1);
    expect(r.lowerBound).toBe(1);
    const s = at(r.sheets, 0);
    expect(s.placements).toHaveLength(5);
    expect(s.cuts[0]).toMatchObject({ order: 1, stage: 0 }); // edge trims first
    expect(
      s.cuts.filter((c) => c.stage === 1).every((c) => c.direction === s.cuts.find((x) => x.stage === 1)!.direction),
    ).toBe(true);
    expect(s.offcuts.length).toBeGreaterThan(0);
    const area = parts.reduce((a, p) => a + p.lengthMm * p.widthMm * p.quantity, 0);
    expect(s.yieldRatio).toBeCloseTo(area / (SHEET.lengthMm * SHEET.widthMm), 9);
  });

  it('does not fit two 1219.2 mm parts end to end on a 2438.4 mm sheet with a 3.2 mm kerf', () => {
    const part: NestPart = { id: 'p', lengthMm: 1219.2, widthMm: 1219.2, quantity: 2, canRotate: false };
    const parts = [part];
    const r = nest(parts, SHEET, OPTS);
    expect(r.sheetCount).toBe(2);
    expect(validateLayout(r, parts, SHEET, OPTS).ok).toBe(true);
    const fit = nest([{ ...part, lengthMm: 1217.6 }], SHEET, OPTS);
    expect(fit.sheetCount).toBe(1);
  });

  it('keeps parts inside the edge trim', () => {
    const part: NestPart = { id: 'p', lengthMm: 2438.4 - 12, widthMm: 1219.2 - 12, quantity: 1, canRotate: false };
    const r = nest([part], SHEET, { ...OPTS, trimMm: 6 });
    expect(r.sheets[0]?.placements[0]).toMatchObject({ xMm: 6, yMm: 6 });
    expect(nest([{ ...part, lengthMm: 2438.4 - 11 }], SHEET, { ...OPTS, trimMm: 6 }).unplaced).toHaveLength(1);
  });

  it('sends a grain-bound part that fits only rotated to unplaced, with a reason', () => {
    const tall: NestPart = { id: 'tall', lengthMm: 1000, widthMm: 1500, quantity: 2, canRotate: false };
    const parts: NestPart[] = [tall, { id: 'ok', lengthMm: 500, widthMm: 300, quantity: 1, canRotate: false }];
    const r = nest(parts, SHEET, OPTS);
    expect(r.unplaced).toEqual([
      { partId: 'tall', quantity: 2, reason: expect.stringMatching(/fits only turned across the grain/) },
    ]);
    expect(r.sheetCount).toBe(1);
    expect(validateLayout(r, parts, SHEET, OPTS).ok).toBe(true);
    expect(nest([{ ...tall, canRotate: true }], SHEET, OPTS).unplaced).toEqual([]);
  });

  it('gives the same layout for the same seed', () => {
    const parts: NestPart[] = Array.from({ length: 30 }, (_, i) => ({
      id: `p${i}`,
      lengthMm: 200 + ((i * 97) % 700),
      widthMm: 100 + ((i * 53) % 400),
      quantity: 1 + (i % 3),
      canRotate: i % 2 === 0,
    }));
    const a = nest(parts, SHEET, { ...OPTS, effort: 'thorough', seed: 5 });
    const b = nest(parts, SHEET, { ...OPTS, effort: 'thorough', seed: 5 });
    expect(b).toEqual(a);
  });

  it('fills a nearly full sheet that greedy fills miss: Berkey and Wang class II, instance cl02_040_01, grain-bound', () => {
    // 40 parts, 895 of 900 square units on one 30 x 30 sheet (2DPackLib, Berkey & Wang 1987 class II; see bench/data/README.md)
    const sizes =
      '1,1;1,2;1,3;1,5;1,9;1,9;2,2;2,2;2,2;2,8;3,1;3,4;3,8;3,9;3,10;4,1;4,1;4,2;4,3;4,4;4,7;4,7;6,3;6,5;6,8;6,9;7,1;7,1;7,2;8,3;8,4;9,2;9,5;9,5;9,5;9,7;9,8;10,2;10,4;10,6';
    const parts: NestPart[] = sizes.split(';').map((s, i) => {
      const size = s.split(',').map(Number);
      return { id: `p${i}`, lengthMm: at(size, 0), widthMm: at(size, 1), quantity: 1, canRotate: false };
    });
    const sheet = { lengthMm: 30, widthMm: 30 };
    const opts = { kerfMm: 0, trimMm: 0, effort: 'thorough' as const };
    const r = nest(parts, sheet, opts);
    expect(r.lowerBound).toBe(1);
    expect(r.sheetCount).toBe(1);
    expect(r.sheets[0]?.yieldRatio).toBeCloseTo(895 / 900, 6);
    expect(validateLayout(r, parts, sheet, opts)).toEqual({ ok: true, errors: [] });
    // the builder still gets a cut order for it
    expect(r.sheets[0]?.cuts.length).toBeGreaterThan(30);
  });
  it('does not mutate its inputs', () => {
    const parts: NestPart[] = [{ id: 'p', lengthMm: 500, widthMm: 400, quantity: 3, canRotate: true }];
    const copy = structuredClone(parts);
    nest(parts, SHEET, OPTS);
    expect(parts).toEqual(copy);
  });

  it('returns layouts that always validate, for random parts (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            l: fc.integer({ min: 20, max: 2500 }),
            w: fc.integer({ min: 20, max: 1300 }),
            q: fc.integer({ min: 1, max: 4 }),
            r: fc.boolean(),
          }),
          { minLength: 1, maxLength: 25 },
        ),
        fc.constantFrom(0, 3.2, 4.8),
        fc.constantFrom(0, 6, 12.5),
        (raw, kerfMm, trimMm) => {
          const parts: NestPart[] = raw.map((p, i) => ({
            id: `p${i}`,
            lengthMm: p.l,
            widthMm: p.w,
            quantity: p.q,
            canRotate: p.r,
          }));
          const opts = { kerfMm, trimMm, effort: 'quick' as const };
          const r = nest(parts, SHEET, opts);
          const v = validateLayout(r, parts, SHEET, opts);
          expect(v.errors).toEqual([]);
          expect(r.sheetCount).toBeGreaterThanOrEqual(r.lowerBound);
          expect(r.lowerBound).toBeGreaterThanOrEqual(nestLowerBound(parts, SHEET, trimMm));
        },
      ),
      { numRuns: 120, seed: 42 },
    );
  });

  describe('edge cases', () => {
    it('returns no sheets for no parts', () => {
      expect(nest([], SHEET, OPTS)).toEqual({ sheets: [], sheetCount: 0, lowerBound: 0, yieldRatio: 0, unplaced: [] });
    });
    it('counts parts too big to share a sheet in the lower bound', () => {
      expect(nestLowerBound([{ id: 'a', lengthMm: 1300, widthMm: 700, quantity: 3, canRotate: false }], SHEET, 0)).toBe(
        3,
      );
    });
  });

  describe('invalid input', () => {
    it('refuses duplicate ids, a negative kerf and a trim that leaves nothing', () => {
      const p: NestPart = { id: 'a', lengthMm: 10, widthMm: 10, quantity: 1, canRotate: true };
      expect(() => nest([p, p], SHEET, OPTS)).toThrow(/appears twice/);
      expect(() => nest([p], SHEET, { ...OPTS, kerfMm: -1 })).toThrow(/kerf/);
      expect(() => nest([p], SHEET, { ...OPTS, trimMm: 700 })).toThrow(/trim/);
      expect(() => nest([{ ...p, quantity: 1.5 }], SHEET, OPTS)).toThrow(/whole number/);
    });
  });
});

describe('nestByMaterial', () => {
  it('nests each material on its own stock and reports material without stock', () => {
    const parts: NestPart[] = [
      { id: 'a', lengthMm: 800, widthMm: 500, quantity: 2, canRotate: false, materialId: 'ply' },
      { id: 'b', lengthMm: 600, widthMm: 400, quantity: 1, canRotate: true, materialId: 'mdf' },
      { id: 'c', lengthMm: 100, widthMm: 100, quantity: 1, canRotate: true, materialId: 'unknown' },
    ];
    const r = nestByMaterial(parts, { ply: SHEET, mdf: SHEET }, OPTS);
    expect(r.ply?.sheets[0]?.placements.map((p) => p.partId)).toEqual(['a', 'a']);
    expect(r.mdf?.sheetCount).toBe(1);
    expect(r.unknown?.unplaced[0]?.reason).toMatch(/no stock sheet/);
  });
});

describe('nest regressions', () => {
  it('lays out parts whose sizes carry floating-point noise (found by the estimate properties)', () => {
    const w = 63.49999999999999;
    const parts: NestPart[] = [
      { id: 'frame-long', lengthMm: 1285.5, widthMm: w, quantity: 6, canRotate: true },
      { id: 'frame-end', lengthMm: 606.23, widthMm: w, quantity: 6, canRotate: true },
      { id: 'rib-cross', lengthMm: 606.23, widthMm: w, quantity: 18, canRotate: true },
      { id: 'rib-long', lengthMm: 162.77428571428572, widthMm: w, quantity: 42, canRotate: true },
      { id: 'side', lengthMm: 489.30000000000007, widthMm: 566.55, quantity: 12, canRotate: false },
      { id: 'bottom', lengthMm: 542.73, widthMm: 566.55, quantity: 6, canRotate: false },
      { id: 'stretcher', lengthMm: 530.03, widthMm: 101.6, quantity: 12, canRotate: true },
      { id: 'door', lengthMm: 485.7800000000001, widthMm: 563.03, quantity: 6, canRotate: false },
    ];
    const opts = { kerfMm: 3.2, trimMm: 6, effort: 'quick' as const };
    const r = nest(parts, SHEET, opts);
    expect(validateLayout(r, parts, SHEET, opts).errors).toEqual([]);
  });
});
