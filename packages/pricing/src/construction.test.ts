import { describe, expect, it } from 'vitest';
import { cutList, DRAWER_BOTTOM_CLEARANCE_MM, MIN_GRADUATED_FRONT_MM } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, type BuildSpec } from './designs';
import { pieceChecks } from './checks';
import { hardwareFor } from './hardware';
import { ShopSettings } from './price-book';
import { toMm } from './units';
import { validateSpec } from './validate';

const standard = designs['assembly-bench'].defaults;
/** The standard bench with its main case as two bays of three drawers each. */
const threeDrawers = {
  widthMm: null,
  compartments: [0, 1, 2].map(() => ({
    kind: 'drawer' as const,
    heightMm: null,
    doors: 1 as const,
    adjustableShelves: 0,
    fixedShelves: 0,
  })),
};
const bench = {
  ...standard,
  cases: [{ ...standard.cases[0]!, bays: [threeDrawers, structuredClone(threeDrawers)] }, ...standard.cases.slice(1)],
} as BuildSpec;
const parts = (spec: BuildSpec, settings = demoSettings) => cutList(spec, demoPriceBook, settings).parts;
const fronts = (spec: BuildSpec, settings = demoSettings) =>
  parts(spec, settings)
    .filter((p) => p.name === 'drawer front' && p.id.startsWith('c1-b1-'))
    .map((p) => p.widthMm);

describe('construction choices', () => {
  it('gives a stack of drawers fronts of equal height (they came out 212 / 194 / 212 mm)', () => {
    const f = fronts(bench);
    expect(f).toHaveLength(3);
    for (const h of f) expect(h).toBeCloseTo(f[0]!, 6);
  });

  it('graduates the fronts a fixed step, each taller than the one above, from the shop default or the spec', () => {
    const graduated = ShopSettings.parse({ ...demoSettings, drawerFronts: 'graduated' });
    const [low, mid, top] = fronts(bench, graduated);
    expect(low! - mid!).toBeCloseTo(25.4, 6);
    expect(mid! - top!).toBeCloseTo(25.4, 6);
    const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);
    expect(sum([low!, mid!, top!])).toBeCloseTo(sum(fronts(bench)), 6);
    expect(fronts({ ...bench, drawerFronts: 'graduated' } as BuildSpec)).toEqual([low, mid, top]);
  });

  it('eases the step on a tall stack so its top front stays 4 in tall, and the standard bench takes graduated fronts', () => {
    const spec = { ...standard, drawerFronts: 'graduated' } as BuildSpec;
    expect(validateSpec(spec, demoPriceBook, demoSettings).ok).toBe(true);
    const column = fronts(spec);
    expect(column).toHaveLength(5);
    const steps = column.slice(1).map((h, i) => column[i]! - h);
    for (const s of steps) expect(s).toBeCloseTo(steps[0]!, 6);
    expect(steps[0]!).toBeGreaterThan(0);
    expect(steps[0]!).toBeLessThan(25.4);
    expect(Math.min(...column)).toBeCloseTo(MIN_GRADUATED_FRONT_MM, 6);
  });

  it('sets a wall cabinet back in by the hanging rail thickness, so the rail fits behind it', () => {
    const wall = designs['wall-cabinet'].defaults;
    const t = demoPriceBook.sheetGoods.find((s) => s.id === wall.carcassMaterialId)!.thicknessMm;
    const bt = demoPriceBook.sheetGoods.find((s) => s.id === wall.backMaterialId)!.thicknessMm;
    const shelf = parts(wall).find((p) => p.name === 'shelf')!;
    // shelf depth = case depth - rail thickness - back thickness - 1/4 in front setback
    expect(shelf.widthMm).toBeCloseTo(wall.depthMm - t - bt - toMm(0.25), 6);
    const noRail = parts({ ...wall, hangingRail: false } as BuildSpec).find((p) => p.name === 'shelf')!;
    expect(noRail.widthMm).toBeCloseTo(wall.depthMm - toMm(0.5) - bt - toMm(0.25), 6);
  });

  it('cuts drawer bottoms 1/16 in under the dado-to-dado size', () => {
    const list = parts(designs['base-cabinet'].defaults);
    const side = list.find((p) => p.name === 'drawer side')!;
    const bottom = list.find((p) => p.name === 'drawer bottom')!;
    expect(DRAWER_BOTTOM_CLEARANCE_MM).toBeCloseTo(toMm(1 / 16), 9);
    expect(bottom.widthMm).toBeCloseTo(side.lengthMm - 2 * side.thicknessMm + 2 * toMm(0.25) - toMm(1 / 16), 6);
  });

  it('butts and pocket-screws case panels when the spec or the shop says so; dado joints stay the default', () => {
    const base = designs['base-cabinet'].defaults;
    const dado = parts(base);
    const butt = parts({ ...base, joinery: 'butt' } as BuildSpec);
    const shopButt = parts(base, ShopSettings.parse({ ...demoSettings, caseJoinery: 'butt' }));
    const bottom = (l: typeof dado) => l.find((p) => p.name === 'bottom')!;
    expect(bottom(dado).lengthMm - bottom(butt).lengthMm).toBeCloseTo(2 * toMm(0.25), 6);
    expect(bottom(dado).pocketHoles).toBe(0);
    expect(bottom(butt).pocketHoles).toBeGreaterThanOrEqual(4);
    expect(shopButt).toEqual(butt);
    expect(butt.find((p) => p.name === 'side')!.dados).toBe(1); // the back groove only
  });

  it('hinges a single door on the side the spec asks; a pair on both sides', () => {
    const base = designs['base-cabinet'].defaults;
    const right = structuredClone(base);
    right.bays[0]!.compartments[0]!.hingeSide = 'right';
    const hinges = (s: BuildSpec) =>
      cutList(s, demoPriceBook, demoSettings)
        .geometry.fronts.filter((f) => f.kind === 'door')
        .map((f) => f.hinge);
    expect(hinges(base)).toEqual(['left']);
    expect(hinges(right)).toEqual(['right']);
    const pair = structuredClone(base);
    pair.bays[0]!.compartments[0]!.doors = 2;
    expect(hinges(pair)).toEqual(['left', 'right']);
  });

  it("parses settings stored before the construction settings, with today's construction", () => {
    const { maxDoorWidthMm, caseJoinery, drawerFronts, drawerFrontStepMm, frontStyle, ...old } = demoSettings;
    void [maxDoorWidthMm, caseJoinery, drawerFronts, drawerFrontStepMm, frontStyle];
    expect(ShopSettings.parse(old)).toMatchObject({
      maxDoorWidthMm: 610,
      caseJoinery: 'dado',
      drawerFronts: 'equal',
      frontStyle: 'overlay',
    });
  });
});

describe('front style', () => {
  const insetShop = ShopSettings.parse({ ...demoSettings, frontStyle: 'inset' });
  const reveal = demoSettings.revealMm;
  const t = demoPriceBook.sheetGoods.find((s) => s.id === 'birch-ply-18')!.thicknessMm;
  /** a 20 in wall cabinet with one door: its opening is the case less its two sides, top and bottom */
  const wallDefaults = structuredClone(designs['wall-cabinet'].defaults);
  wallDefaults.bays[0]!.compartments[0]!.doors = 1;
  const wall = { ...wallDefaults, widthMm: toMm(20) } as BuildSpec;
  const door = (spec: BuildSpec, settings = demoSettings) => parts(spec, settings).find((p) => p.name === 'door')!;

  it('sets an inset door inside its opening with the reveal on every side: opening less 2 x reveal each way', () => {
    const d = door(wall, insetShop);
    expect(d.quantity).toBe(1);
    expect(d.widthMm).toBeCloseTo(wall.widthMm - 2 * t - 2 * reveal, 6);
    expect(d.lengthMm).toBeCloseTo(wall.heightMm - 2 * t - 2 * reveal, 6);
    // the same door overlaid laps the case edges
    expect(door(wall).widthMm).toBeGreaterThan(wall.widthMm - 2 * t);
  });

  it('insets a drawer front in its own opening, and a pair of doors with a reveal between them', () => {
    const base = designs['base-cabinet'].defaults;
    const front = parts(base, insetShop).find((p) => p.name === 'drawer front')!;
    expect(front.widthMm).toBeCloseTo(base.bays[0]!.compartments[1]!.heightMm! - 2 * reveal, 6);
    expect(front.lengthMm).toBeCloseTo(base.widthMm - 2 * t - 2 * reveal, 6);
    const pair = door({ ...wall, widthMm: toMm(30) } as BuildSpec, insetShop);
    expect(pair.quantity).toBe(2);
    expect(2 * pair.widthMm + 3 * reveal).toBeCloseTo(toMm(30) - 2 * t, 6);
  });

  it('gives a stack of inset drawers fronts of equal height that, with their reveals, fill the opening', () => {
    const f = fronts(bench, insetShop);
    expect(f).toHaveLength(3);
    for (const h of f) expect(h).toBeCloseTo(f[0]!, 6);
    // one opening, three fronts and four reveals (top, bottom and two between)
    const caseHeight = cutList(bench, demoPriceBook, insetShop).parts.find((p) => p.id === 'c1-partition')!.lengthMm;
    expect(3 * f[0]! + 4 * reveal).toBeCloseTo(caseHeight - 2 * toMm(0.25), 6);
  });

  it("hangs inset doors on the book's inset hinges, and keeps overlay hinges for overlay fronts", () => {
    const hingeIds = (settings: ShopSettings) =>
      hardwareFor(cutList(designs['base-cabinet'].defaults, demoPriceBook, settings), demoPriceBook, {
        antiTip: false,
      })
        .filter((l) => l.kind === 'hinge')
        .map((l) => l.itemId);
    expect(hingeIds(insetShop)).toEqual(['hinge-inset']);
    expect(hingeIds(demoSettings)).not.toContain('hinge-inset');
  });

  it('keeps overlay fronts by default, and lets a spec override the shop either way', () => {
    expect(demoSettings.frontStyle).toBe('overlay');
    expect(door({ ...wall, frontStyle: 'overlay' } as BuildSpec, insetShop)).toEqual(door(wall));
    expect(door({ ...wall, frontStyle: 'inset' } as BuildSpec)).toEqual(door(wall, insetShop));
  });

  it('stands shelves, their front pin rows and drawer boxes back by the thickness of an inset front', () => {
    const base = designs['base-cabinet'].defaults;
    const over = parts(base);
    const ins = parts(base, insetShop);
    const ft = demoPriceBook.sheetGoods.find((s) => s.id === base.frontMaterialId)!.thicknessMm;
    const shelf = (l: typeof over) => l.find((p) => p.name === 'shelf')!;
    expect(shelf(over).widthMm - shelf(ins).widthMm).toBeCloseTo(ft, 6);
    const frontRow = (l: typeof over) =>
      l
        .find((p) => p.name === 'side')!
        .machining.find((op) => op.kind === 'shelf_pin_row' && op.fromEdge === 'front') as { setbackMm: number };
    expect(frontRow(ins).setbackMm - frontRow(over).setbackMm).toBeCloseTo(ft, 0);
    const boxDepth = (l: typeof over) => l.find((p) => p.name === 'drawer side')!.lengthMm;
    expect(boxDepth(ins)).toBeLessThanOrEqual(boxDepth(over));
  });

  it('warns when the book has no inset hinge, and when the reveal is too tight for inset fronts', () => {
    const book = { ...demoPriceBook, hardware: demoPriceBook.hardware.filter((h) => h.id !== 'hinge-inset') };
    const tight = ShopSettings.parse({ ...insetShop, revealMm: 1 });
    const codes = (b: typeof book, s: ShopSettings) =>
      pieceChecks(cutList(designs['base-cabinet'].defaults, b, s), b, s).checks.map((c) => c.code);
    expect(codes(book, insetShop)).toContain('inset_hinge');
    expect(codes(demoPriceBook, insetShop)).not.toContain('inset_hinge');
    expect(codes(demoPriceBook, tight)).toContain('inset_reveal');
    expect(codes(demoPriceBook, demoSettings)).not.toContain('inset_reveal');
  });
});
