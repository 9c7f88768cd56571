import { describe, expect, it } from 'vitest';
import { casterCheck } from '../checks';
import { estimate } from '../costing';
import { cutList, FOOT_MIN_CLEARANCE_MM } from '../cut-list';
import { demoPriceBook, demoSettings } from '../demo-data';
import { elevationDrawing } from '../drawings';
import { hardwareFor } from '../hardware';
import { PriceBook } from '../price-book';
import { toMm } from '../units';
import { validateSpec } from '../validate';
import { BuildSpec, designs, parseSpec, type AssemblyBenchSpec } from './index';

const bench = designs['assembly-bench'].defaults;
const copy = (): AssemblyBenchSpec => structuredClone(bench);

/** A bench as stored before arrangements: one or two equal cases side by side, one set of bays. */
const legacyBench = {
  design: 'assembly-bench',
  widthMm: toMm(72),
  heightMm: toMm(34),
  depthMm: toMm(30),
  carcassMaterialId: 'birch-ply-18',
  backMaterialId: 'birch-ply-6',
  frontMaterialId: 'birch-ply-18',
  drawerMaterialId: 'birch-ply-12',
  drawerBottomMaterialId: 'birch-ply-6',
  bandingId: 'birch-banding-22',
  pullId: 'pull-bar-128',
  backConstruction: 'grooved',
  finishId: 'waterborne-poly',
  coats: 2,
  trim: null,
  caseCount: 2,
  bays: [
    {
      widthMm: null,
      compartments: [1, 2, 3].map(() => ({
        kind: 'drawer',
        heightMm: null,
        doors: 1,
        adjustableShelves: 0,
        fixedShelves: 0,
      })),
    },
  ],
  top: {
    kind: 'torsion-box',
    thicknessMm: toMm(3.5),
    skinMaterialId: 'mdf-12',
    coreMaterialId: 'birch-ply-18',
    gridSpacingMm: toMm(8),
  },
  overhangFrontMm: toMm(3),
  overhangSidesMm: toMm(3),
  mobility: 'locking-casters',
  casterId: 'caster-locking-5in',
  footId: 'leveling-foot',
  workingLoadKg: 200,
};

describe('the standard bench', () => {
  it('validates and prices at quick and at thorough, every part placed', () => {
    expect(validateSpec(bench, demoPriceBook, demoSettings).ok).toBe(true);
    for (const effort of ['quick', 'thorough'] as const) {
      const e = estimate([{ spec: bench, quantity: 1 }], demoPriceBook, demoSettings, { effort });
      expect(e.totals.totalCents).toBeGreaterThan(0);
      expect(e.checks.filter((c) => c.level === 'error')).toEqual([]);
      const placed = e.layouts.reduce((s, l) => s + l.sheets.reduce((n, sh) => n + sh.placements.length, 0), 0);
      const sheetParts = e.pieces[0]!.parts.filter((p) => p.stock === 'sheet').reduce((s, p) => s + p.quantity, 0);
      expect(placed).toBe(sheetParts);
    }
  }, 60_000);

  it('is about 72 x 36 in at about 35 in, with seven drawers and three door cabinets on both long sides', () => {
    expect(bench.widthMm).toBeCloseTo(toMm(72), 6);
    expect(bench.depthMm).toBeCloseTo(toMm(36), 6);
    expect(bench.heightMm).toBeCloseTo(toMm(35), 6);
    const g = cutList(bench, demoPriceBook, demoSettings).geometry;
    expect(g.drawers).toHaveLength(7);
    // a door cabinet is a door compartment: one in the main case, one in each rear cabinet's... pair of bays
    const doorCabinets = bench.cases.map((c) => c.bays.some((b) => b.compartments.some((k) => k.kind === 'door')));
    expect(doorCabinets).toEqual([true, true, true]);
    expect(new Set(g.fronts.map((f) => f.face))).toEqual(new Set(['front', 'back']));
    expect(g.fronts.filter((f) => f.kind === 'drawer').every((f) => f.face === 'front')).toBe(true);
    // the rear cabinets are mirror images of each other and sit back to back with the main case
    expect(bench.cases[1]).toEqual(bench.cases[2]);
    expect(g.caseJoins?.map((j) => [j.a, j.b, j.kind])).toEqual([
      [0, 1, 'back'],
      [0, 2, 'back'],
      [1, 2, 'side'],
    ]);
  });

  it('builds drawer boxes of 1/2 in plywood with 1/4 in bottoms, and a torsion top of 1/2 in MDF skins', () => {
    const { parts } = cutList(bench, demoPriceBook, demoSettings);
    const nominal = (id: string) => demoPriceBook.sheetGoods.find((m) => m.id === id)!.nominalThicknessIn;
    expect(parts.filter((p) => p.name === 'drawer side').map((p) => nominal(p.materialId))).toEqual(Array(7).fill(0.5));
    expect(parts.filter((p) => p.name === 'drawer bottom').map((p) => nominal(p.materialId))).toEqual(
      Array(7).fill(0.25),
    );
    const skin = parts.find((p) => p.name === 'skin')!;
    expect([skin.quantity, nominal(skin.materialId)]).toEqual([2, 0.5]);
    expect(bench.overhangFrontMm).toBeCloseTo(toMm(3), 6);
  });

  it('fastens the joined cases with connector bolts and stands them on one set of casters', () => {
    const list = cutList(bench, demoPriceBook, demoSettings);
    const hw = hardwareFor(list, demoPriceBook, { antiTip: false });
    // back to back over 33 in twice (2 rows of 3), side to side over 12 in (2 rows of 2)
    expect(hw.find((h) => h.kind === 'connector')?.pieces).toBe(6 + 6 + 4);
    expect(hw.find((h) => h.kind === 'caster')?.pieces).toBe(6);
    expect(hw.find((h) => h.kind === 'leveling_foot')?.pieces).toBe(4);
    // not doubled up: the rear cabinets are closed by the main case's back
    expect(list.parts.filter((p) => p.name === 'back').map((p) => p.id)).toEqual(['c1-back']);
    expect(list.geometry.sharedBacks).toEqual(['c2', 'c3']);
  });

  it('checks the casters against the whole arrangement and its working load', () => {
    const e = estimate([{ spec: bench, quantity: 1 }], demoPriceBook, demoSettings, { effort: 'quick' });
    const expected = casterCheck({
      pieceKg: e.massKg,
      workingLoadKg: 200,
      casters: 6,
      ratedLoadKg: 100,
      unit: demoSettings.units,
    });
    expect(e.checks.find((c) => c.code === 'caster_load')?.message).toBe(expected.message);
    expect(e.massKg).toBeGreaterThan(150);
  });
});

describe('feet with casters', () => {
  it('reach the floor when lowered and clear it when raised, on mounting blocks that are cut', () => {
    const list = cutList(bench, demoPriceBook, demoSettings);
    const g = list.geometry;
    expect(g.feetLiftMm).toBeGreaterThan(0);
    expect(g.feetClearanceMm).toBeGreaterThanOrEqual(FOOT_MIN_CLEARANCE_MM);
    const caster = demoPriceBook.hardware.find((h) => h.id === bench.casterId)!.heightMm!;
    const foot = demoPriceBook.hardware.find((h) => h.id === bench.footId)!.heightMm!;
    const strip = list.parts.find((p) => p.id === 'foot-block-strip')!;
    const { count, layers, sideMm } = g.footBlocks!;
    expect(count).toBe(g.feet * layers);
    // the strips hold every block, with a saw kerf between blocks
    expect(strip.quantity * Math.floor(strip.lengthMm / (sideMm + demoSettings.kerfMm) + 1e-9)).toBeGreaterThanOrEqual(
      count,
    );
    // lowered (1 in of travel) the foot passes the caster's height; raised it stays above the floor
    expect(foot + layers * strip.thicknessMm + toMm(1)).toBeGreaterThan(caster);
    expect(foot + layers * strip.thicknessMm).toBeLessThan(caster);
  });

  it('refuses feet that would hold the casters off the floor, naming the feet', () => {
    const book = PriceBook.parse({
      ...demoPriceBook,
      hardware: demoPriceBook.hardware.map((h) => (h.id === 'leveling-foot' ? { ...h, heightMm: toMm(7) } : h)),
    });
    const v = validateSpec(bench, book, demoSettings);
    expect(v.ok).toBe(false);
    expect(!v.ok && v.issues.find((i) => i.path === 'footId')?.message).toMatch(/will not roll/);
  });
});

describe('the top edge', () => {
  it('keeps the trim inside the stated footprint and cuts it to its own width', () => {
    const s = copy();
    s.trim = { lumberId: 'hard-maple-4-4', widthMm: toMm(3.75), thicknessMm: toMm(1) };
    const { parts, geometry } = cutList(s, demoPriceBook, demoSettings);
    const long = parts.find((p) => p.id === 'trim-top-long')!;
    const end = parts.find((p) => p.id === 'trim-top-short')!;
    expect(long.lengthMm).toBeCloseTo(s.widthMm, 6);
    expect(end.lengthMm).toBeCloseTo(s.depthMm, 6);
    expect(long.widthMm).toBeCloseTo(toMm(3.75), 6);
    const skin = parts.find((p) => p.name === 'skin')!;
    expect(skin.lengthMm + 2 * toMm(1)).toBeCloseTo(s.widthMm, 6);
    expect(skin.widthMm + 2 * toMm(1)).toBeCloseTo(s.depthMm, 6);
    expect(geometry.widthMm).toBeCloseTo(s.widthMm, 6);
    expect(elevationDrawing(s).shapes.find((x) => x.type === 'dimension')).toMatchObject({ text: '72"' });
  });

  it('refuses trim narrower than the top is thick, and a trimmed edge with no trim', () => {
    const s = copy();
    s.trim = { lumberId: 'hard-maple-4-4', widthMm: toMm(2), thicknessMm: toMm(0.75) };
    expect(parseSpec(s)).toMatchObject({ ok: false, issues: [{ path: 'trim.widthMm' }] });
    expect(parseSpec({ ...copy(), trim: null })).toMatchObject({ ok: false, issues: [{ path: 'trim' }] });
  });

  it('bands every layer of a banded edge, and lays a laminated top up to the stated thickness', () => {
    const s = copy();
    s.top = { ...s.top, kind: 'laminated', thicknessMm: toMm(2.25), edge: 'banded' };
    const { parts, geometry } = cutList(s, demoPriceBook, demoSettings);
    const layer = parts.find((p) => p.name === 'top layer')!;
    expect(layer.quantity).toBe(3);
    expect(layer.bandedEdges).toEqual({ long: 2, short: 2 });
    expect(geometry.top?.heightMm).toBeCloseTo(3 * layer.thicknessMm, 6);
    expect(parts.some((p) => p.stock === 'lumber')).toBe(false);
    expect(validateSpec(s, demoPriceBook, demoSettings).ok).toBe(true);
  });
});

describe('drawings of the arrangement', () => {
  it('shows the front and back elevations and the plan, each with its cases', () => {
    const d = elevationDrawing(bench);
    expect(d.views?.map((v) => [v.key, v.cases])).toEqual([
      ['front', ['c1']],
      ['back', ['c2', 'c3']],
      ['plan', ['c1', 'c2', 'c3']],
    ]);
    const inside = (v: { x: number; width: number }, x: number) => x >= v.x - 1e-6 && x <= v.x + v.width + 1e-6;
    const [front, back] = d.views!;
    const fronts = d.shapes.filter((s) => s.type === 'rect' && s.style === 'front');
    // 7 drawer fronts and 2 doors on the front, 4 doors on the back, a face strip per case on the plan
    expect(fronts.filter((s) => s.type === 'rect' && s.y < front!.height && inside(front!, s.x))).toHaveLength(9);
    expect(fronts.filter((s) => s.type === 'rect' && s.y < back!.height && inside(back!, s.x))).toHaveLength(4);
    expect(fronts).toHaveLength(9 + 4 + 3);
  });
});

describe('benches stored before arrangements', () => {
  it('still parse, as two equal cases side by side with the old bays, and price', () => {
    for (const r of [parseSpec(legacyBench), BuildSpec.safeParse(legacyBench)]) {
      const spec = ('spec' in r ? r.spec : 'data' in r ? r.data : undefined) as AssemblyBenchSpec | undefined;
      expect(spec?.cases).toHaveLength(2);
      for (const c of spec!.cases) {
        expect(c.widthMm).toBeCloseTo(toMm(33), 6);
        expect(c.depthMm).toBeCloseTo(toMm(27), 6);
        expect([c.row, c.facing, c.xMm]).toEqual(['front', 'front', null]);
      }
      expect(spec!.cases[1]!.bays).toEqual(legacyBench.bays);
      expect([spec!.overhangLeftMm, spec!.overhangRightMm, spec!.overhangBackMm]).toEqual([toMm(3), toMm(3), 0]);
      expect(spec!.top.edge).toBe('banded');
    }
    const v = validateSpec(legacyBench, demoPriceBook, demoSettings);
    expect(v.ok).toBe(true);
    const e = estimate([{ spec: v.ok ? v.spec : bench, quantity: 1 }], demoPriceBook, demoSettings, {
      effort: 'quick',
    });
    expect(e.pieces[0]!.parts.filter((p) => p.name === 'side')).toHaveLength(2);
    expect(e.totals.totalCents).toBeGreaterThan(0);
  });

  it('convert a single case with trim to a trimmed edge', () => {
    const r = parseSpec({
      ...legacyBench,
      caseCount: 1,
      trim: { lumberId: 'walnut-4-4', widthMm: toMm(3.5), thicknessMm: toMm(0.75) },
    });
    expect(
      r.ok && [
        r.spec.design === 'assembly-bench' && r.spec.cases.length,
        r.spec.design === 'assembly-bench' && r.spec.top.edge,
      ],
    ).toEqual([1, 'trim']);
  });
});

describe('an arrangement that does not fit', () => {
  it('is an issue with its path, never a throw', () => {
    const wide = copy();
    wide.cases[0]!.widthMm = toMm(70);
    expect(() => validateSpec(wide, demoPriceBook, demoSettings)).not.toThrow();
    const v = validateSpec(wide, demoPriceBook, demoSettings);
    expect(v.ok).toBe(false);
    expect(!v.ok && v.issues.map((i) => i.path)).toContain('cases[0].widthMm');

    const deep = copy();
    deep.cases[1]!.depthMm = toMm(14);
    const d = parseSpec(deep);
    // deeper rear cabinet: it overlaps the main case
    expect(!d.ok && d.issues.map((i) => i.path)).toEqual(['cases[1]']);

    const overlap = copy();
    overlap.cases[2]!.xMm = toMm(30);
    const o = parseSpec(overlap);
    expect(!o.ok && o.issues.map((i) => i.path)).toEqual(['cases[2]']);

    const past = copy();
    past.cases[2]!.xMm = toMm(40);
    const p = parseSpec(past);
    expect(!p.ok && p.issues.map((i) => i.path)).toEqual(['cases[2].xMm']);

    const cramped = copy();
    cramped.overhangLeftMm = toMm(12);
    cramped.overhangRightMm = toMm(12);
    cramped.cases = [{ ...cramped.cases[0]!, widthMm: toMm(30) }];
    // the door bay keeps its 25 in, which leaves the drawer column too little room
    const c = parseSpec(cramped);
    expect(!c.ok && c.issues.map((i) => i.path)).toEqual(['cases[0].bays']);
    expect(!c.ok && c.issues[0]!.message).toMatch(/the bays need/i);
  });
});
