import { describe, expect, it } from 'vitest';
import { estimate } from './costing';
import { cutList } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, type BuildSpec } from './designs';
import type { NestEffort } from './nesting';
import type { PriceBook } from './price-book';
import { toMm } from './units';
import { validateSpec } from './validate';

/** Every sheet part of a one-item estimate is placed on a sheet. */
function placesEverything(spec: BuildSpec, book: PriceBook, effort: NestEffort) {
  const e = estimate([{ spec, quantity: 1 }], book, demoSettings, { effort });
  for (const l of e.layouts) expect(l.unplaced).toEqual([]);
  const placed = e.layouts.flatMap((l) => l.sheets.flatMap((s) => s.placements)).length;
  const wanted = e.pieces[0]!.parts.filter((p) => p.stock === 'sheet').reduce((s, p) => s + p.quantity, 0);
  expect(placed).toBe(wanted);
}
const backs = (spec: BuildSpec, book = demoPriceBook) =>
  cutList(spec, book, demoSettings).parts.filter((p) => /^c\d+-back(-\d+)?$/.test(p.id));

describe('a back larger than its sheet, split as a shop splits it', () => {
  // the single-sided bench of the issue: one case 72 x 36 x 35 in with three bays and a 1/4 in birch plywood back,
  // whose grain runs up the case: about 630 mm tall and 1,550 mm wide, wider than a 4 ft sheet
  const standard = designs['assembly-bench'].defaults;
  const door = { kind: 'door' as const, heightMm: null, doors: 1 as const, adjustableShelves: 1, fixedShelves: 0 };
  const issueBench = {
    ...structuredClone(standard),
    backMaterialId: 'birch-ply-6',
    workingLoadKg: 100,
    overhangFrontMm: 0,
    overhangBackMm: 0,
    overhangLeftMm: 0,
    overhangRightMm: 0,
    cases: [
      {
        ...structuredClone(standard.cases[0]!),
        widthMm: toMm(72),
        depthMm: toMm(36),
        bays: [0, 1, 2].map(() => ({ widthMm: null, compartments: [{ ...door }] })),
      },
    ],
  } as BuildSpec;

  it('splits the three-bay bench case back over its nearest partition, each piece with its grain up, and prices it', () => {
    expect(validateSpec(issueBench, demoPriceBook, demoSettings)).toMatchObject({ ok: true });
    const pieces = backs(issueBench);
    expect(pieces.map((p) => p.name)).toEqual(['back, piece 1', 'back, piece 2']);
    const [a, b] = pieces;
    // grain up: each piece's length (its grain) is the back's height, and the two heights agree
    expect(a!.lengthMm).toBeCloseTo(b!.lengthMm, 6);
    expect(a!.lengthMm).toBeLessThan(a!.widthMm);
    expect(a!.widthMm).toBeLessThanOrEqual(1219.2 - 2 * demoSettings.sheetTrimMm);
    // a grooved back over a partition: the partition is grooved for it
    const partition = cutList(issueBench, demoPriceBook, demoSettings).parts.find((p) => p.name === 'partition')!;
    expect(partition.dados).toBeGreaterThanOrEqual(1);
    placesEverything(issueBench, demoPriceBook, 'quick');
    placesEverything(issueBench, demoPriceBook, 'thorough');
  });

  // a shop whose 1/4 in plywood comes in 5 x 5 ft sheets (as Baltic birch often does): a bookcase 90 in tall and
  // 42 in wide has a back larger than the sheet either way
  const fiveByFive: PriceBook = {
    ...demoPriceBook,
    sheetGoods: demoPriceBook.sheetGoods.map((m) =>
      m.id === 'birch-ply-6' ? { ...m, sheetLengthMm: toMm(60), sheetWidthMm: toMm(60) } : m,
    ),
  };
  const tallWide = {
    ...structuredClone(designs.bookcase.defaults),
    widthMm: toMm(42),
    heightMm: toMm(90),
    backMaterialId: 'birch-ply-6',
  } as BuildSpec;

  // the bookcase's one section, with no fixed shelf (or one low down, outside the range the split must fall in)
  const open = (fixedShelves: number, heightMm: number | null = null) => ({
    kind: 'open' as const,
    heightMm,
    doors: 1 as const,
    adjustableShelves: 2,
    fixedShelves,
  });
  const noShelf = { ...tallWide, bays: [{ widthMm: null, compartments: [open(0)] }] } as BuildSpec;
  const lowShelf = {
    ...tallWide,
    bays: [{ widthMm: null, compartments: [open(0, toMm(12)), open(0)] }],
  } as BuildSpec;
  const t = demoPriceBook.sheetGoods.find((m) => m.id === tallWide.carcassMaterialId)!.thicknessMm;
  const dado = toMm(0.25);
  const toe = designs.bookcase.defaults.toeKickMm;

  it.each([
    ['grooved', 'no fixed shelf', noShelf],
    ['applied', 'no fixed shelf', noShelf],
    ['grooved', 'a divider only 12 in up', lowShelf],
    ['applied', 'a divider only 12 in up', lowShelf],
  ] as const)(
    'splits a tall wide bookcase %s back with %s across over a back rail, and prices it',
    (construction, _, s) => {
      const spec = { ...s, backConstruction: construction } as BuildSpec;
      expect(validateSpec(spec, fiveByFive, demoSettings)).toMatchObject({ ok: true });
      const pieces = backs(spec, fiveByFive);
      expect(pieces).toHaveLength(2);
      const list = cutList(spec, fiveByFive, demoSettings).parts;
      const rails = list.filter((p) => p.name === 'back rail');
      expect(rails.reduce((sum, p) => sum + p.quantity, 0)).toBe(1);
      expect(list.some((p) => p.name === 'fixed shelf, grooved for the back')).toBe(false);
      // the pieces meet on the rail's centre line, halfway up: together they are the whole back's height
      const whole = cutList(spec, demoPriceBook, demoSettings).parts.find((p) => p.id === 'c1-back')!;
      expect(pieces[0]!.lengthMm).toBeCloseTo(whole.lengthMm / 2, 6);
      expect(pieces[0]!.lengthMm + pieces[1]!.lengthMm).toBeCloseTo(whole.lengthMm, 6);
      placesEverything(spec, fiveByFive, 'quick');
      placesEverything(spec, fiveByFive, 'thorough');
    },
  );

  // the bookcase's own fixed shelf, halfway up its section: where a shop splits the back, with no rail
  it.each(['grooved', 'applied'] as const)(
    'splits a tall wide bookcase %s back at its fixed shelf, with no back rail, and prices it',
    (backConstruction) => {
      const spec = { ...tallWide, backConstruction } as BuildSpec;
      expect(validateSpec(spec, fiveByFive, demoSettings)).toMatchObject({ ok: true });
      const list = cutList(spec, fiveByFive, demoSettings);
      const pieces = backs(spec, fiveByFive);
      expect(pieces).toHaveLength(2);
      expect(list.parts.some((p) => p.name === 'back rail')).toBe(false);
      // the shelf's lower face from the floor, and the case's inside floor
      const [, shelfY] = list.geometry.cases[0]!.shelvesMm[0]!;
      const floor = toe + t;
      const whole = cutList(spec, demoPriceBook, demoSettings).parts.find((p) => p.id === 'c1-back')!;
      const side = list.parts.find((p) => p.id === 'c1-side')!;
      const shelfDado = side.machining.find((o) => o.kind === 'dado' && o.for === 'fixed shelf');
      if (backConstruction === 'grooved') {
        // each piece stands 1/4 in into a groove at either end: the lower in the bottom's and the shelf's underside
        expect(pieces[0]!.lengthMm).toBeCloseTo(shelfY - floor + 2 * dado, 6);
        expect(pieces[0]!.lengthMm + pieces[1]!.lengthMm).toBeCloseTo(whole.lengthMm - t + 2 * dado, 6);
        // the shelf runs the case's full depth, as the bottom does, grooved on both faces where the sides are
        const shelf = list.parts.find((p) => p.name === 'fixed shelf, grooved for the back')!;
        expect(shelf).toMatchObject({ quantity: 1, widthMm: side.widthMm, dados: 2 });
        expect(list.parts.some((p) => p.name === 'fixed shelf')).toBe(false);
        const sideGroove = side.machining.find((o) => o.kind === 'groove' && o.for === 'back');
        const grooves = shelf.machining.filter((o) => o.kind === 'groove' && o.for === 'back');
        expect(grooves.map((g) => g.kind === 'groove' && g.face)).toEqual(['top', 'underside']);
        for (const g of grooves)
          expect(g).toMatchObject({
            fromEdge: 'back',
            distanceMm: sideGroove?.kind === 'groove' ? sideGroove.distanceMm : NaN,
            lengthMm: expect.closeTo(shelf.lengthMm, 1),
          });
        // its dado in each side runs through to the back edge
        expect(shelfDado).toMatchObject({ lengthMm: expect.closeTo(side.widthMm, 1) });
      } else {
        // the pieces meet on the shelf's centre line, nailed to its back edge; the shelf is as it was
        expect(pieces[0]!.lengthMm).toBeCloseTo(shelfY + t / 2 - toe, 6);
        expect(pieces[0]!.lengthMm + pieces[1]!.lengthMm).toBeCloseTo(whole.lengthMm, 6);
        expect(list.parts.find((p) => p.name === 'fixed shelf')).toMatchObject({ quantity: 1 });
        expect(shelfDado).toMatchObject({ lengthMm: expect.closeTo(side.widthMm, 1) });
      }
      placesEverything(spec, fiveByFive, 'quick');
      placesEverything(spec, fiveByFive, 'thorough');
    },
  );

  it('takes the split at the fixed shelf nearest halfway when several lie where it may fall', () => {
    // three shelves about a quarter, half and three quarters up: the pieces may be at most 59 in of an 86 in back,
    // so the lowest and the highest lie outside the range the split must fall in, and the middle one takes it
    const spec = { ...tallWide, bays: [{ widthMm: null, compartments: [open(3)] }] } as BuildSpec;
    const list = cutList(spec, fiveByFive, demoSettings);
    expect(list.parts.some((p) => p.name === 'back rail')).toBe(false);
    const shelves = list.geometry.cases[0]!.shelvesMm.map(([, y]) => y);
    expect(list.parts.find((p) => p.name === 'fixed shelf, grooved for the back')?.quantity).toBe(1);
    const pieces = backs(spec, fiveByFive);
    expect(pieces[0]!.lengthMm).toBeCloseTo(shelves[1]! - (toe + t) + 2 * dado, 6);
  });

  it('gives a drawer whose opening a back rail crosses a box short enough to clear the rail', () => {
    // 13 1/2 in deep: a 12 in slide without the rail; the 3/4 in rail leaves room for a 10 in one. Four drawers
    // 250 mm high from 600 mm up: the dividers under and over them lie outside the range the split must fall in,
    // so the back is split on a rail halfway up, across the second and third drawers
    const drawer = { kind: 'drawer', heightMm: 250, doors: 1, adjustableShelves: 0, fixedShelves: 0 };
    const drawerAtRail = {
      ...tallWide,
      widthMm: toMm(34),
      depthMm: toMm(13.5),
      bays: [
        {
          widthMm: null,
          compartments: [
            { kind: 'open', heightMm: 600, doors: 1, adjustableShelves: 2, fixedShelves: 0 },
            drawer,
            drawer,
            drawer,
            drawer,
            { kind: 'open', heightMm: null, doors: 1, adjustableShelves: 2, fixedShelves: 0 },
          ],
        },
      ],
    } as BuildSpec;
    const slide = (book: PriceBook) =>
      cutList(drawerAtRail, book, demoSettings).geometry.drawers.map((d) => d.slideLengthIn);
    expect(slide(demoPriceBook)).toEqual([12, 12, 12, 12]);
    expect(slide(fiveByFive)).toEqual([12, 10, 10, 12]);
    const rails = cutList(drawerAtRail, fiveByFive, demoSettings).parts.filter((p) => p.name === 'back rail');
    expect(rails.map((p) => p.quantity)).toEqual([1]);
    const v = validateSpec(drawerAtRail, fiveByFive, demoSettings);
    expect(v.ok ? [] : v.issues).toEqual([]);
    placesEverything(drawerAtRail, fiveByFive, 'quick');
  });

  it('keeps a back that fits whole in one piece, with no rail', () => {
    expect(backs(designs.bookcase.defaults).map((p) => p.id)).toEqual(['c1-back']);
    expect(
      cutList(designs.bookcase.defaults, demoPriceBook, demoSettings).parts.some((p) => p.name === 'back rail'),
    ).toBe(false);
  });

  it('leaves out every piece of a split back that a case back to back shares', () => {
    // the main case and one rear case 50 in wide, back to back: both backs are split over their partitions
    const rear = { ...structuredClone(standard.cases[1]!), widthMm: toMm(50) };
    const bench = {
      ...structuredClone(standard),
      backMaterialId: 'birch-ply-6',
      cases: [structuredClone(standard.cases[0]!), rear],
    } as BuildSpec;
    const ids = cutList(bench, demoPriceBook, demoSettings).parts.map((p) => p.id);
    const caseBacks = new Set(ids.filter((id) => /-back(-\d+)?$/.test(id)).map((id) => id.split('-')[0]));
    // one back inside the bench, shared: the main case's, in its pieces
    expect([...caseBacks]).toEqual(['c1']);
    expect(ids.filter((id) => id.startsWith('c1-back-'))).toHaveLength(2);
    expect(validateSpec(bench, demoPriceBook, demoSettings)).toMatchObject({ ok: true });
  });
});
