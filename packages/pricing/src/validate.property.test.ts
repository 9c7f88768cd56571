import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { estimate } from './costing';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, DESIGN_SLUGS, type DesignSlug } from './designs';
import type { NestEffort } from './nesting';
import { validateSpec } from './validate';

/**
 * The safety net of validation: over random specs inside every design's
 * limits, whenever `validateSpec` accepts one, `estimate` prices it without
 * throwing and every part is placed on a sheet. Fixed seeds; 200 runs per
 * design at 'quick' and 20 at 'thorough'. The bench is drawn as an
 * arrangement of cases under its top (a main case, rear cases back to back,
 * side cases, a second front case), each with its own width, depth and bays;
 * at the fixed seed 53 of its 200 quick specs validate (measured 2026-12-02).
 */

const sheets = (kinds: string[]) => demoPriceBook.sheetGoods.filter((s) => kinds.includes(s.kind)).map((s) => s.id);
const panel = sheets(['plywood', 'mdf', 'particleboard']);
const thin = sheets(['plywood', 'mdf', 'hardboard']);

/** A length anywhere inside [min, max], sometimes exactly at a limit. */
const length = ([min, max]: readonly [number, number]) =>
  fc.oneof(
    { weight: 6, arbitrary: fc.double({ min, max, noNaN: true }) },
    { weight: 1, arbitrary: fc.constantFrom(min, max) },
  );

/** Materials a shop puts together, and (in the record below) any mix at all. */
const MATERIAL_SETS = [
  ['birch-ply-18', 'birch-ply-6', 'birch-ply-18', 'birch-ply-12', 'birch-ply-6'],
  ['mdf-18', 'birch-ply-6', 'mdf-18', 'birch-ply-12', 'birch-ply-6'],
  ['birch-ply-18', 'mdf-12', 'mdf-18', 'birch-ply-18', 'birch-ply-6'],
  ['birch-ply-12', 'birch-ply-6', 'mdf-12', 'birch-ply-12', 'birch-ply-6'],
].map(([carcassMaterialId, backMaterialId, frontMaterialId, drawerMaterialId, drawerBottomMaterialId]) => ({
  carcassMaterialId: carcassMaterialId!,
  backMaterialId: backMaterialId!,
  frontMaterialId: frontMaterialId!,
  drawerMaterialId: drawerMaterialId!,
  drawerBottomMaterialId: drawerBottomMaterialId!,
}));

const compartment = fc.record({
  kind: fc.constantFrom('drawer', 'door', 'open'),
  /** a set height (a share of the room in its bay) one time in five, else null */
  height: fc.option(fc.double({ min: 0.2, max: 1.2, noNaN: true }), { freq: 5 }),
  doors: fc.constantFrom(1, 2),
  adjustableShelves: fc.integer({ min: 0, max: 3 }),
  fixedShelves: fc.integer({ min: 0, max: 2 }),
  hingeSide: fc.constantFrom(undefined, 'left', 'right'),
});

type Gen = { kind: string; height: number | null } & Record<string, unknown>;
type GenBay = { width: number | null; compartments: Gen[] };

/** Bays and sections of a case with set sizes drawn as shares of it (sometimes too much), the rest null. */
function sized(caseWidthMm: number, caseHeightMm: number, bays: GenBay[]) {
  const inside = caseWidthMm - 40;
  const tall = caseHeightMm - 60;
  return bays.map((b) => ({
    widthMm: b.width === null ? null : Math.max(150, Math.min(1200, (b.width * inside) / bays.length)),
    compartments: b.compartments.map(({ height, ...c }) => ({
      ...c,
      heightMm: height === null ? null : Math.max(60, Math.min(2400, (height * tall) / b.compartments.length)),
      ...(c.kind === 'drawer' ? { adjustableShelves: 0, fixedShelves: 0 } : {}),
    })),
  }));
}

const bay = fc.record({
  width: fc.option(fc.double({ min: 0.3, max: 1.05, noNaN: true }), { freq: 5 }),
  compartments: fc.array(compartment, { minLength: 1, maxLength: 4 }),
});
/**
 * A bench case's bay: under 3 ft tall, so up to three sections, their heights and its width left to share one
 * time in two; a lone section is mostly a door or open (a drawer front the case's height is refused).
 */
const benchBay = fc
  .record({
    width: fc.option(fc.double({ min: 0.3, max: 1, noNaN: true }), { freq: 2 }),
    compartments: fc.array(
      fc.tuple(compartment, fc.boolean()).map(([c, share]) => (share ? { ...c, height: null } : c)),
      { minLength: 1, maxLength: 3 },
    ),
    loneDrawer: fc.integer({ min: 0, max: 4 }),
  })
  .map(({ loneDrawer, ...b }) =>
    b.compartments.length === 1 && b.compartments[0]!.kind === 'drawer' && loneDrawer > 0
      ? { ...b, compartments: [{ ...b.compartments[0]!, kind: 'door' }] }
      : b,
  );

/** A share in [min, max], sometimes exactly at an end (a case filling the room under the top, say). */
const share = (min: number, max: number) =>
  fc.oneof(
    { weight: 5, arbitrary: fc.double({ min, max, noNaN: true }) },
    { weight: 1, arbitrary: fc.constantFrom(min, max) },
  );

/** A case deep enough for the shortest drawer slide, and its back (13 in). */
const DRAWER_CASE_MM = 330;

interface BenchRoom {
  widthMm: number;
  depthMm: number;
  heightMm: number;
  overhangFrontMm: number;
  overhangBackMm: number;
  overhangLeftMm: number;
  overhangRightMm: number;
  topThicknessMm: number;
}

/**
 * A bench's arrangement of cases under its top, drawn as shares of the room the overhangs leave: a main case
 * facing the front; then most often rear cases facing the back, back to back with it; else side cases facing
 * the ends beside it, or a second front case beside it, or the main case alone. Random widths, depths and bays
 * inside the limits; sizes can overrun the room, which validation must refuse.
 */
function benchArrangement(room: BenchRoom) {
  const roomW = room.widthMm - room.overhangLeftMm - room.overhangRightMm;
  const roomD = room.depthMm - room.overhangFrontMm - room.overhangBackMm;
  const caseHeight = room.heightMm - room.topThicknessMm - 150;
  const mm = (v: number) => Math.max(229, Math.min(2400, v));
  return fc
    .record({
      kind: fc.constantFrom('single', 'back-to-back', 'back-to-back', 'sides', 'row'),
      mainWidth: share(0.5, 1),
      mainDepth: share(0.35, 1),
      rear: fc.array(share(0.3, 1), { minLength: 1, maxLength: 2 }),
      side: fc.array(share(0.15, 0.3), { minLength: 1, maxLength: 2 }),
      bays: fc.array(fc.array(benchBay, { minLength: 1, maxLength: 3 }), { minLength: 5, maxLength: 5 }),
    })
    .map(({ kind: drawn, mainWidth, mainDepth, rear, side, bays }) => {
      // back to back needs room for two cases front to back, each deep enough for a drawer (13 in)
      const kind = drawn === 'back-to-back' && roomD < 2 * DRAWER_CASE_MM ? 'single' : drawn;
      const cases: Record<string, unknown>[] = [];
      const add = (widthMm: number, depthMm: number, row: string, facing: string) =>
        cases.push({
          widthMm: mm(widthMm),
          depthMm: mm(depthMm),
          xMm: null,
          row,
          facing,
          // a bay for every 12 in of the case's width or so, at most three
          bays: sized(
            mm(widthMm),
            caseHeight,
            (bays[cases.length] ?? []).slice(0, Math.max(1, Math.floor(widthMm / 300))),
          ),
        });
      // side cases stand sideways at the ends of the front row: their depth runs along the bench
      const sides = kind === 'sides' ? side.map((f) => Math.max(DRAWER_CASE_MM, f * roomW)) : [];
      const mainW = (roomW - sides.reduce((a, b) => a + b, 0)) * mainWidth;
      const deep = (share: number) => Math.min(roomD, Math.max(DRAWER_CASE_MM, roomD * share));
      const mainD =
        kind === 'back-to-back'
          ? Math.max(DRAWER_CASE_MM, Math.min(roomD * mainDepth, roomD - DRAWER_CASE_MM))
          : deep(mainDepth);
      if (sides[0] !== undefined) add(deep(mainDepth), sides[0], 'front', 'left');
      add(mainW, mainD, 'front', 'front');
      if (sides[1] !== undefined) add(deep(mainDepth), sides[1], 'front', 'right');
      if (kind === 'back-to-back') {
        // the rear cases share the main case's length and fill the depth behind it, touching it
        const total = rear.reduce((a, b) => a + b, 0);
        rear.forEach((f) => add((mainW * f) / total, roomD - mainD, 'back', 'back'));
      }
      if (kind === 'row') add((roomW - mainW) * mainWidth, deep(mainDepth), 'front', 'front');
      return cases;
    });
}

function specFor(slug: DesignSlug) {
  const d = designs[slug];
  const L = d.limits;
  const common = fc.record({
    widthMm: length(L.widthMm),
    heightMm: length(L.heightMm),
    depthMm: length(L.depthMm),
    materials: fc.oneof(
      { weight: 4, arbitrary: fc.constantFrom(...MATERIAL_SETS) },
      {
        weight: 1,
        arbitrary: fc.record({
          carcassMaterialId: fc.constantFrom(...panel),
          backMaterialId: fc.constantFrom(...thin),
          frontMaterialId: fc.constantFrom(...panel),
          drawerMaterialId: fc.constantFrom(...panel),
          drawerBottomMaterialId: fc.constantFrom(...thin),
        }),
      },
    ),
    backConstruction: fc.constantFrom('grooved', 'applied'),
    joinery: fc.constantFrom(undefined, 'dado', 'butt'),
    drawerFronts: fc.constantFrom(undefined, 'equal', 'graduated'),
    frontStyle: fc.constantFrom(undefined, 'overlay', 'inset'),
    bays: fc.array(bay, { minLength: L.bays[0], maxLength: L.bays[1] }),
    toeKickMm: fc.oneof(
      { weight: 1, arbitrary: fc.constant(0) },
      { weight: 4, arbitrary: fc.double({ min: 50.8, max: 152, noNaN: true }) },
      { weight: 1, arbitrary: fc.double({ min: 0, max: 152, noNaN: true }) },
    ),
    trim: fc.option(
      fc.record({
        lumberId: fc.constantFrom(...demoPriceBook.lumber.map((l) => l.id)),
        widthMm: fc.double({ min: 12, max: 100, noNaN: true }),
        thicknessMm: fc.double({ min: 6, max: 32, noNaN: true }),
      }),
      { freq: 4 },
    ),
  });
  const extra =
    slug === 'assembly-bench'
      ? fc.record({
          top: fc.record({
            kind: fc.constantFrom('torsion-box', 'laminated'),
            thicknessMm: fc.oneof(
              { weight: 4, arbitrary: fc.double({ min: 57.2, max: 100, noNaN: true }) },
              { weight: 1, arbitrary: fc.double({ min: 38, max: 152, noNaN: true }) },
            ),
            skinMaterialId: fc.constantFrom(...thin),
            coreMaterialId: fc.constantFrom(...panel),
            gridSpacingMm: fc.double({ min: 100, max: 400, noNaN: true }),
            edge: fc.constantFrom('trim', 'banded'),
          }),
          // front, back, left and right overhangs as shares of the top, each capped at the 12 in limit
          overhangs: fc.tuple(share(0, 0.2), share(0, 0.2), share(0, 0.15), share(0, 0.15)),
          mobility: fc.constantFrom('locking-casters', 'leveling-feet', 'casters-and-feet'),
          workingLoadKg: fc.double({ min: 0, max: 1000, noNaN: true }),
          trimShare: fc.integer({ min: 0, max: 9 }),
        })
      : slug === 'wall-cabinet'
        ? fc.record({ hangingRail: fc.boolean() })
        : slug === 'base-cabinet'
          ? fc.record({
              installation: fc.constantFrom('built-in', 'free-standing'),
              mobility: fc.constantFrom('none', 'leveling-feet'),
            })
          : fc.record({ installation: fc.constantFrom('built-in', 'free-standing') });
  const flat = fc.tuple(common, extra).map(([c, e]) => {
    const spec: Record<string, unknown> = { ...structuredClone(d.defaults), ...c, ...e, design: slug };
    return { ...spec, bays: sized(c.widthMm, c.heightMm, c.bays) };
  });
  if (slug !== 'assembly-bench') return flat;
  // a bench: its overhangs from their shares, a trim at least as wide as the top is thick when the edge is trimmed
  // and none was drawn, then the arrangement of cases under the top
  return flat.chain((drawn) => {
    const { overhangs, bays, trimShare, ...s } = drawn as typeof drawn & {
      overhangs: [number, number, number, number];
      trimShare: number;
      top: { thicknessMm: number; edge: string };
      trim: unknown;
      widthMm: number;
      depthMm: number;
      heightMm: number;
    };
    void bays;
    const [front, back, left, right] = overhangs;
    const room: BenchRoom = {
      widthMm: s.widthMm,
      depthMm: s.depthMm,
      heightMm: s.heightMm,
      overhangFrontMm: Math.min(305, front * s.depthMm),
      overhangBackMm: Math.min(305, back * s.depthMm),
      overhangLeftMm: Math.min(305, left * s.widthMm),
      overhangRightMm: Math.min(305, right * s.widthMm),
      topThicknessMm: s.top.thicknessMm,
    };
    const { topThicknessMm, ...overhangFields } = room;
    void topThicknessMm;
    // a trimmed edge mostly with trim as wide as the top is thick or wider (else validation refuses it)
    const trim =
      s.top.edge !== 'trim'
        ? s.trim
        : {
            ...((s.trim as object | null) ?? { lumberId: 'hard-maple-4-4', thicknessMm: 19 }),
            widthMm: Math.min(100, trimShare < 1 ? s.top.thicknessMm * 0.8 : s.top.thicknessMm + trimShare * 2),
          };
    return benchArrangement(room).map((cases) => ({ ...s, ...overhangFields, trim, cases }));
  });
}

function property(slug: DesignSlug, effort: NestEffort, numRuns: number, seed: number) {
  let accepted = 0;
  fc.assert(
    fc.property(specFor(slug), (input) => {
      const v = validateSpec(input, demoPriceBook, demoSettings);
      if (!v.ok) return;
      accepted++;
      const e = estimate([{ spec: v.spec, quantity: 1 }], demoPriceBook, demoSettings, { effort });
      for (const l of e.layouts) expect(l.unplaced).toEqual([]);
      const placed = e.layouts.flatMap((l) => l.sheets.flatMap((s) => s.placements)).length;
      const wanted = e.pieces[0]!.parts.filter((p) => p.stock === 'sheet').reduce((s, p) => s + p.quantity, 0);
      expect(placed).toBe(wanted);
    }),
    { numRuns, seed },
  );
  console.info(`${slug} at ${effort}: ${accepted} of ${numRuns} random specs validate`);
  return accepted;
}

describe('whenever validateSpec accepts a spec, estimate prices it and places every part (fast-check)', () => {
  it.each(DESIGN_SLUGS)(
    '%s: 200 random specs at quick',
    (slug) => {
      const accepted = property(slug, 'quick', 200, 20261202);
      // the generator must reach valid specs, or the property says nothing
      expect(accepted).toBeGreaterThanOrEqual(slug === 'assembly-bench' ? 30 : 12);
    },
    60_000,
  );
  it.each(DESIGN_SLUGS)(
    '%s: 20 random specs at thorough',
    (slug) => {
      property(slug, 'thorough', 20, 20261203);
    },
    60_000,
  );
});
