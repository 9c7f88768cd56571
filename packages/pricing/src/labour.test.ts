import { describe, expect, it } from 'vitest';
import { estimate } from './costing';
import { cutList } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, type BuildSpec } from './designs';
import { hardwareFor } from './hardware';
import { labourCounts, labourHours } from './labour';
import { LABOUR_OPERATION_KEYS, PriceBook } from './price-book';
import { toMm } from './units';

/** The standard bench: the double-sided assembly bench of the design's defaults. */
const benchLike: BuildSpec = designs['assembly-bench'].defaults;

describe('labourCounts', () => {
  it('counts every driver of the 24 in base cabinet as counted by hand', () => {
    const spec = designs['base-cabinet'].defaults;
    const list = cutList(spec, demoPriceBook, demoSettings);
    const hardware = hardwareFor(list, demoPriceBook, { antiTip: false });
    const c = labourCounts({
      pieces: [{ parts: list.parts, geometry: list.geometry, hardware, quantity: 2 }],
      sheets: 5,
      finishM2Coats: 7,
      boardFeetMilled: 3,
    });
    // per cabinet: sides 2, bottom, stretchers 2, toe kick, back, divider (door under the drawer), shelf, door,
    // drawer front, drawer sides 2, drawer box front and back, drawer bottom: 16 parts
    expect(c.part).toBe(32);
    expect(c.case).toBe(2);
    // 4 pocket holes in each stretcher and each drawer box end
    expect(c.pocket_hole).toBe(32);
    // two 5 mm rows a side under the divider
    expect(c.shelf_pin_row).toBe(8);
    // per cabinet, in mm: each side a bottom dado 609.6 + back groove 876.3 + divider dado 591.34; the bottom's
    // back groove 585.78; drawer-bottom grooves 2 x 558.8 (sides) + 2 x 523.88 (box ends)
    const dado = 2 * (609.6 + 876.3 + 591.34) + 585.78 + 2 * 558.8 + 2 * 523.88;
    expect(c.dado_metre).toBeCloseTo((2 * dado) / 1000, 2);
    // banding: side fronts 2 x 876.3, bottom, divider 585.78 each, shelf 569.9, door 2 x (591.65 + 606.08),
    // drawer front 2 x (606.08 + 176.53), drawer box tops 2 x 558.8 + 2 x 523.88
    const banding =
      2 * 876.3 + 2 * 585.78 + 569.9 + 2 * (591.65 + 606.08) + 2 * (606.08 + 176.53) + 2 * 558.8 + 2 * 523.88;
    expect(c.banding_metre).toBeCloseTo((2 * banding) / 1000, 2);
    expect(c).toMatchObject({
      job: 1,
      sheet: 5,
      hinge_bored: 4,
      pull_fitted: 4,
      front_aligned: 4,
      drawer_box: 2,
      slide_pair: 2,
      door_hung: 2,
      finish_m2_coat: 7,
      board_foot_milled: 3,
      torsion_top_m2: 0,
      caster: 0,
    });
  });

  it('counts the torsion top by its area and casters and feet under the bench', () => {
    const list = cutList(benchLike, demoPriceBook, demoSettings);
    const c = labourCounts({
      pieces: [{ parts: list.parts, geometry: list.geometry, hardware: [], quantity: 1 }],
      sheets: 0,
      finishM2Coats: 0,
      boardFeetMilled: 0,
    });
    expect(c.torsion_top_m2).toBeCloseTo((toMm(72) * toMm(36)) / 1e6, 6);
    expect(c.top).toBe(1);
    expect(c.caster).toBe(10); // six casters and four feet under the joined cases
  });
});

describe('labourHours', () => {
  it('adds every operation of a driver, so a book may hold several per driver under its own keys', () => {
    const book = PriceBook.parse({
      ...demoPriceBook,
      labour: [
        { key: 'Sand 120', name: 'Sand, 120 grit', driver: 'sanded_m2', minutes: 3, stage: 'finish' },
        { key: 'Sand 180', name: 'Sand, 180 grit', driver: 'sanded_m2', minutes: 2, stage: 'finish' },
      ],
    });
    const counts = labourCounts({ pieces: [], sheets: 0, finishM2Coats: 0, boardFeetMilled: 0 });
    const r = labourHours({ ...counts, sanded_m2: 12 }, book);
    expect(r.lines.map((l) => [l.key, l.hours])).toEqual([
      ['Sand 120', 0.6],
      ['Sand 180', 0.4],
    ]);
    expect(r.byStage.finish).toBeCloseTo(1, 9);
  });
});

describe('the demo standards', () => {
  // A skilled one-person shop takes roughly 30 to 60 hours over a mobile bench of this kind, and 4 to 10 hours
  // over a plain 24 in base cabinet with one drawer and one door (common practice).
  it('put a double-sided bench of two cases between 30 and 60 shop hours', () => {
    const e = estimate([{ spec: benchLike, quantity: 1 }], demoPriceBook, demoSettings);
    expect(e.totalHours).toBeGreaterThanOrEqual(30);
    expect(e.totalHours).toBeLessThanOrEqual(60);
  });
  it('put a plain 24 in base cabinet with one drawer and one door between 4 and 10 shop hours', () => {
    const spec = designs['base-cabinet'].defaults;
    expect(spec.widthMm).toBeCloseTo(toMm(24), 6);
    expect(spec.bays.flatMap((b) => b.compartments.map((c) => c.kind)).sort()).toEqual(['door', 'drawer']);
    const e = estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings);
    expect(e.totalHours).toBeGreaterThanOrEqual(4);
    expect(e.totalHours).toBeLessThanOrEqual(10);
  });
});

describe('price books stored before operations were open', () => {
  const oldLabour = [
    { key: 'job_setup', name: 'Job set-up', per: 'job', minutes: 45, stage: 'material' },
    { key: 'sheet_breakdown', name: 'Break down sheets', per: 'sheet', minutes: 12, stage: 'cutting' },
    { key: 'part_cut', name: 'Cut parts', per: 'part', minutes: 2, stage: 'cutting' },
    { key: 'edge_banding', name: 'Edge banding', per: 'metre', minutes: 1.5, stage: 'casework' },
    { key: 'pocket_hole', name: 'Pocket holes', per: 'hole', minutes: 0.5, stage: 'casework' },
    { key: 'case_assembly', name: 'Assemble cases', per: 'case', minutes: 60, stage: 'casework' },
    { key: 'drawer_box', name: 'Drawer boxes', per: 'drawer', minutes: 35, stage: 'drawers_doors' },
    { key: 'slide_pair', name: 'Fit slides', per: 'pair', minutes: 15, stage: 'drawers_doors' },
    { key: 'door_hang', name: 'Hang doors', per: 'door', minutes: 20, stage: 'drawers_doors' },
    { key: 'torsion_top', name: 'Torsion-box top', per: 'top', minutes: 180, stage: 'casework' },
    { key: 'trim_piece', name: 'Fit trim', per: 'piece', minutes: 12, stage: 'casework' },
    { key: 'finish_coat', name: 'Finish, per coat', per: 'm2_coat', minutes: 10, stage: 'finish' },
    { key: 'caster', name: 'Casters and feet', per: 'caster', minutes: 8, stage: 'casework' },
    { key: 'final_check', name: 'Final check', per: 'job', minutes: 30, stage: 'ready' },
  ];

  it('parse, each operation with the driver that counts what its `per` counted', () => {
    const stored = JSON.parse(JSON.stringify({ ...demoPriceBook, labour: oldLabour }));
    const book = PriceBook.parse(stored);
    expect(book.labour.map((o) => o.key)).toEqual([...LABOUR_OPERATION_KEYS]);
    expect(Object.fromEntries(book.labour.map((o) => [o.key, o.driver]))).toEqual({
      job_setup: 'job',
      sheet_breakdown: 'sheet',
      part_cut: 'part',
      edge_banding: 'banding_metre',
      pocket_hole: 'pocket_hole',
      case_assembly: 'case',
      drawer_box: 'drawer_box',
      slide_pair: 'slide_pair',
      door_hang: 'door_hung',
      torsion_top: 'top',
      trim_piece: 'trim_piece',
      finish_coat: 'finish_m2_coat',
      caster: 'caster',
      final_check: 'job',
    });
    expect(book.labour.every((o) => !('per' in o))).toBe(true);
    // and price as before: one top at 180 minutes
    const counts = labourCounts({ pieces: [], sheets: 0, finishM2Coats: 0, boardFeetMilled: 0 });
    expect(labourHours({ ...counts, top: 1, job: 0 }, book).totalHours).toBe(3);
  });

  it('refuse an old operation whose `per` is unknown, and a key used twice, with the path', () => {
    const bad = PriceBook.safeParse({ ...demoPriceBook, labour: [{ ...oldLabour[0], per: 'fortnight' }] });
    expect(bad.success).toBe(false);
    expect(bad.error?.issues[0]?.path.slice(0, 2)).toEqual(['labour', 0]);
    const twice = PriceBook.safeParse({ ...demoPriceBook, labour: [...demoPriceBook.labour, demoPriceBook.labour[0]] });
    expect(twice.success).toBe(false);
    expect(twice.error?.issues.map((i) => i.message).join()).toMatch(/twice/);
  });

  it('need no fixed set of operations any more', () => {
    expect(PriceBook.safeParse({ ...demoPriceBook, labour: [] }).success).toBe(true);
  });
});
