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
 * design at 'quick' and 20 at 'thorough'.
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

/** Bays and sections with set sizes drawn as shares of the case (sometimes too much), the rest null. */
function sized(spec: Record<string, unknown>, bays: { width: number | null; compartments: Gen[] }[]) {
  const cases = spec.design === 'assembly-bench' ? (spec.caseCount as number) : 1;
  const over = spec.design === 'assembly-bench' ? 2 * (spec.overhangSidesMm as number) : 0;
  const inside = ((spec.widthMm as number) - over) / cases - 40;
  const tall = (spec.heightMm as number) - 200;
  return bays.map((b) => ({
    widthMm: b.width === null ? null : Math.max(150, Math.min(1200, (b.width * inside) / bays.length)),
    compartments: b.compartments.map(({ height, ...c }) => ({
      ...c,
      heightMm: height === null ? null : Math.max(60, Math.min(2400, (height * tall) / b.compartments.length)),
      ...(c.kind === 'drawer' ? { adjustableShelves: 0, fixedShelves: 0 } : {}),
    })),
  }));
}

function specFor(slug: DesignSlug) {
  const d = designs[slug];
  const L = d.limits;
  const bay = fc.record({
    width: fc.option(fc.double({ min: 0.3, max: 1.05, noNaN: true }), { freq: 5 }),
    compartments: fc.array(compartment, { minLength: 1, maxLength: 4 }),
  });
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
    // a bench case spans the bench, so one bay would mostly give drawers wider than slides carry
    bays: fc.array(bay, { minLength: slug === 'assembly-bench' ? 2 : L.bays[0], maxLength: L.bays[1] }),
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
          caseCount: fc.constantFrom(1, 2),
          top: fc.record({
            kind: fc.constantFrom('torsion-box', 'laminated'),
            thicknessMm: fc.oneof(
              { weight: 4, arbitrary: fc.double({ min: 57.2, max: 152, noNaN: true }) },
              { weight: 1, arbitrary: fc.double({ min: 38, max: 152, noNaN: true }) },
            ),
            skinMaterialId: fc.constantFrom(...thin),
            coreMaterialId: fc.constantFrom(...panel),
            gridSpacingMm: fc.double({ min: 100, max: 400, noNaN: true }),
          }),
          overhangFrontMm: fc.double({ min: 0, max: 305, noNaN: true }),
          overhangSidesMm: fc.double({ min: 0, max: 305, noNaN: true }),
          mobility: fc.constantFrom('locking-casters', 'leveling-feet', 'casters-and-feet'),
          workingLoadKg: fc.double({ min: 0, max: 1000, noNaN: true }),
        })
      : slug === 'wall-cabinet'
        ? fc.record({ hangingRail: fc.boolean() })
        : slug === 'base-cabinet'
          ? fc.record({
              installation: fc.constantFrom('built-in', 'free-standing'),
              mobility: fc.constantFrom('none', 'leveling-feet'),
            })
          : fc.record({ installation: fc.constantFrom('built-in', 'free-standing') });
  return fc.tuple(common, extra).map(([c, e]) => {
    const spec: Record<string, unknown> = { ...structuredClone(d.defaults), ...c, ...e, design: slug };
    return { ...spec, bays: sized(spec, c.bays) };
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
  return accepted;
}

describe('whenever validateSpec accepts a spec, estimate prices it and places every part (fast-check)', () => {
  it.each(DESIGN_SLUGS)(
    '%s: 200 random specs at quick',
    (slug) => {
      const accepted = property(slug, 'quick', 200, 20261202);
      // the generator must reach valid specs, or the property says nothing; the bench's generator still draws the
      // stored two-case shape (converted on parse), of which fewer pass: its arrangements are tested in
      // designs/assembly-bench.test.ts
      expect(accepted).toBeGreaterThanOrEqual(slug === 'assembly-bench' ? 6 : 12);
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
