import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { packExact, type ExactResult, type ExactType } from './exact';
import type { NestPart, NestResult } from './types';
import { validateLayout } from '../validate-layout';
import { seededRandom } from '../_lib/random';
import { guillotinePieces, piecesByKind } from '../_lib/guillotine-pieces';

/** the exact search's answer as a layout the independent validator reads */
function asLayout(
  types: ExactType[],
  r: ExactResult,
  sheets: number,
  L: number,
  W: number,
): { parts: NestPart[]; result: Pick<NestResult, 'sheets' | 'unplaced'> } {
  const parts = types.map((t, i) => ({
    id: `t${i}`,
    lengthMm: t.l,
    widthMm: t.w,
    quantity: t.count,
    canRotate: t.canRotate,
  }));
  return {
    parts,
    result: {
      unplaced: [],
      sheets: Array.from({ length: sheets }, (_, s) => ({
        lengthMm: L,
        widthMm: W,
        placements: r.placements
          .filter((p) => p.sheet === s)
          .map((p) => ({ partId: `t${p.type}`, xMm: p.x, yMm: p.y, lengthMm: p.l, widthMm: p.w, rotated: p.rotated })),
        cuts: [],
        offcuts: [],
        usedAreaMm2: 0,
        yieldRatio: 0,
      })),
    },
  };
}

describe('packExact', () => {
  it('puts back every piece of a sheet cut at random with guillotine cuts, no waste allowed', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2 ** 31 - 1 }), fc.boolean(), (seed, canRotate) => {
        const pieces = guillotinePieces(16, 12, 6, seededRandom(seed));
        const types = piecesByKind(pieces, canRotate);
        const r = packExact(types, { x0: 0, y0: 0, L: 16, W: 12, sheets: 1, kerf: 0, workLimit: 50_000_000 });
        expect(r.status).toBe('found');
        const { parts, result } = asLayout(types, r, 1, 16, 12);
        expect(validateLayout(result, parts, { lengthMm: 16, widthMm: 12 }, { kerfMm: 0, trimMm: 0 })).toEqual({
          ok: true,
          errors: [],
        });
      }),
      { numRuns: 40 },
    );
  });

  it('proves the pinwheel impossible with fixed grain, and finds a layout once parts may turn', () => {
    // four 60 x 30 boards round a 30 x 30 square fill a 90 x 90 sheet only as a pinwheel, which no saw can cut
    const fixed: ExactType[] = [
      { l: 60, w: 30, canRotate: false, count: 2 },
      { l: 30, w: 60, canRotate: false, count: 2 },
      { l: 30, w: 30, canRotate: false, count: 1 },
    ];
    const none = packExact(fixed, { x0: 0, y0: 0, L: 90, W: 90, sheets: 1, kerf: 0, workLimit: 10_000_000 });
    expect(none.status).toBe('none');
    const turning = fixed.map((t) => ({ ...t, canRotate: true }));
    const found = packExact(turning, { x0: 0, y0: 0, L: 90, W: 90, sheets: 1, kerf: 0, workLimit: 10_000_000 });
    expect(found.status).toBe('found');
    const { parts, result } = asLayout(turning, found, 1, 90, 90);
    expect(validateLayout(result, parts, { lengthMm: 90, widthMm: 90 }, { kerfMm: 0, trimMm: 0 }).ok).toBe(true);
  });

  it('leaves a kerf between parts on a 4 x 8 ft sheet, and says when the kerf makes it impossible', () => {
    // 2 x 1217.6 + 3.2 = 2438.4 and 2 x 607.8 + 3.2 = 1218.8 <= 1219.2: four fit exactly with a 3.2 mm kerf
    const fits: ExactType[] = [{ l: 1217.6, w: 607.8, canRotate: false, count: 4 }];
    const r = packExact(fits, { x0: 0, y0: 0, L: 2438.4, W: 1219.2, sheets: 1, kerf: 3.2, workLimit: 1_000_000 });
    expect(r.status).toBe('found');
    const { parts, result } = asLayout(fits, r, 1, 2438.4, 1219.2);
    expect(validateLayout(result, parts, { lengthMm: 2438.4, widthMm: 1219.2 }, { kerfMm: 3.2, trimMm: 0 })).toEqual({
      ok: true,
      errors: [],
    });
    // a tenth of a millimetre longer and the second part runs into the kerf
    const tooLong: ExactType[] = [{ l: 1217.7, w: 607.8, canRotate: false, count: 4 }];
    expect(
      packExact(tooLong, { x0: 0, y0: 0, L: 2438.4, W: 1219.2, sheets: 1, kerf: 3.2, workLimit: 1_000_000 }).status,
    ).toBe('none');
  });

  it('spreads parts over several sheets and stops at its work budget', () => {
    const types: ExactType[] = [{ l: 50, w: 50, canRotate: false, count: 7 }];
    const two = packExact(types, { x0: 5, y0: 5, L: 100, W: 100, sheets: 2, kerf: 0, workLimit: 1_000_000 });
    expect(two.status).toBe('found');
    expect(new Set(two.placements.map((p) => p.sheet))).toEqual(new Set([0, 1]));
    expect(two.placements.every((p) => p.x >= 5 && p.y >= 5 && p.x + p.l <= 105 && p.y + p.w <= 105)).toBe(true);
    // 40 mixed parts on a nearly full sheet cannot be settled in a few hundred steps
    const tight = piecesByKind(guillotinePieces(30, 30, 10, seededRandom(7)), false);
    const r = packExact(tight, { x0: 0, y0: 0, L: 30, W: 30, sheets: 1, kerf: 0, workLimit: 300 });
    expect(r.status).toBe('gave-up');
    expect(r.work).toBeLessThan(300 + 10_000);
  });

  it('gives up, rather than calling it impossible, when it is allowed no work at all', () => {
    // the nester reads 'none' as a proof that the lower bound cannot be met, so it must never mean "not tried"
    const types: ExactType[] = [{ l: 50, w: 50, canRotate: false, count: 4 }];
    const r = packExact(types, { x0: 0, y0: 0, L: 100, W: 100, sheets: 1, kerf: 0, workLimit: 0 });
    expect(r).toEqual({ status: 'gave-up', placements: [], work: 0 });
  });
});
