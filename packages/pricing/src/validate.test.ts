import { describe, expect, it } from 'vitest';
import { estimate } from './costing';
import { cutList } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, type BuildSpec } from './designs';
import { ShopSettings } from './price-book';
import { toMm } from './units';
import { validateSpec } from './validate';

const bench = designs['assembly-bench'].defaults;
const drawers = { ...bench.cases[0]!.bays[0]!, widthMm: null };
const priceAt = (spec: BuildSpec) =>
  (['quick', 'thorough'] as const).map((effort) =>
    estimate([{ spec, quantity: 1 }], demoPriceBook, demoSettings, { effort }),
  );

describe('validateSpec: a valid piece always prices', () => {
  it('prices a single-sided bench 72 x 36 x 35 in with three bays: its back, too wide for the sheet, is split over a partition', () => {
    const spec = {
      ...bench,
      widthMm: toMm(72),
      depthMm: toMm(36),
      heightMm: toMm(35),
      backMaterialId: 'birch-ply-6',
      overhangBackMm: 0,
      overhangLeftMm: toMm(3),
      overhangRightMm: toMm(3),
      cases: [
        {
          widthMm: toMm(66),
          depthMm: toMm(33),
          xMm: null,
          row: 'front',
          facing: 'front',
          bays: [drawers, drawers, drawers],
        },
      ],
      workingLoadKg: 100,
    } as BuildSpec;
    const v = validateSpec(spec, demoPriceBook, demoSettings);
    expect(v.ok).toBe(true);
    for (const e of priceAt(spec)) expect(e.layouts.every((l) => l.unplaced.length === 0)).toBe(true);
    const backs = cutList(spec, demoPriceBook, demoSettings).parts.filter((p) => p.name.startsWith('back'));
    expect(backs).toHaveLength(2);
    // grain up the case: each piece's length (its grain) is the back's height
    expect(backs[0]!.lengthMm).toBeCloseTo(backs[1]!.lengthMm, 6);
    expect(backs[0]!.lengthMm).toBeLessThan(spec.heightMm - toMm(6));
  });

  it('hangs a pair on a 1219 mm base cabinet with one door section (each under the 24 in maximum)', () => {
    const spec = {
      ...designs['base-cabinet'].defaults,
      widthMm: 1219,
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'door', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 }],
        },
      ],
    } as BuildSpec;
    expect(validateSpec(spec, demoPriceBook, demoSettings).ok).toBe(true);
    const doors = cutList(spec, demoPriceBook, demoSettings).parts.find((p) => p.name === 'door')!;
    expect(doors.quantity).toBe(2);
    expect(doors.widthMm).toBeLessThanOrEqual(toMm(24));
    priceAt(spec);
  });

  it('refuses a pair still wider than the shop hangs, naming the section, in the shop units', () => {
    const settings = ShopSettings.parse({ ...demoSettings, maxDoorWidthMm: toMm(12) });
    const spec = {
      ...designs['base-cabinet'].defaults,
      widthMm: toMm(36),
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'door', heightMm: null, doors: 2, adjustableShelves: 0, fixedShelves: 0 }],
        },
      ],
    } as BuildSpec;
    const v = validateSpec(spec, demoPriceBook, settings);
    expect(v.ok).toBe(false);
    if (!v.ok) {
      expect(v.issues[0]!.path).toBe('bays[0].compartments[0].doors');
      expect(v.issues[0]!.message).toMatch(
        /^Bay 1, Section 1: each door would be 17 7\/8 in wide, more than the 12 in/,
      );
    }
  });

  it('refuses a bookcase whose only section is a 1.6 m drawer, saying a drawer that tall is a door', () => {
    const spec = {
      ...designs.bookcase.defaults,
      widthMm: 1000,
      heightMm: 1800,
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 }],
        },
      ],
    } as BuildSpec;
    const v = validateSpec(spec, demoPriceBook, demoSettings, 'mm');
    expect(v.ok).toBe(false);
    if (!v.ok)
      expect(v.issues.map((i) => i.message).join(' ')).toMatch(
        /drawer front would be \d+ mm tall, more than the 457 mm/,
      );
  });

  it('names a part larger than any sheet and says what to change', () => {
    const book = {
      ...demoPriceBook,
      // 2 x 2 ft sheets: narrower than the one-bay bookcase's back, which has no partition to split it over
      sheetGoods: demoPriceBook.sheetGoods.map((s) =>
        s.id === 'birch-ply-6' ? { ...s, sheetLengthMm: 609.6, sheetWidthMm: 609.6 } : s,
      ),
    };
    const spec = { ...designs.bookcase.defaults, heightMm: toMm(72) } as BuildSpec;
    const v = validateSpec(spec, book, demoSettings);
    expect(v.ok).toBe(false);
    if (!v.ok) {
      expect(v.issues[0]!.path).toBe('backMaterialId');
      expect(v.issues[0]!.message).toMatch(/^The back \(.*\) is larger than a 24 in x 24 in sheet of .*: add a bay/);
    }
  });

  it('splits a grooved back over a partition when no sheet takes it whole', () => {
    const book = {
      ...demoPriceBook,
      sheetGoods: demoPriceBook.sheetGoods.map((s) => (s.id === 'birch-ply-6' ? { ...s, sheetWidthMm: 610 } : s)),
    };
    const open = {
      widthMm: null,
      compartments: [{ kind: 'open', heightMm: null, doors: 1, adjustableShelves: 2, fixedShelves: 0 }],
    };
    const spec = { ...designs.bookcase.defaults, widthMm: toMm(40), bays: [open, open] } as BuildSpec;
    expect(validateSpec(spec, book, demoSettings).ok).toBe(true);
    const parts = cutList(spec, book, demoSettings).parts;
    expect(parts.filter((p) => p.name.startsWith('back')).length).toBe(2);
    estimate([{ spec, quantity: 1 }], book, demoSettings);
  });

  it('names a bench’s case in the path and the words of a section it cannot build', () => {
    // a drawer too short for a box in the main case's drawer column
    const shallow = structuredClone(bench);
    shallow.cases[0]!.bays[0]!.compartments[4]!.heightMm = toMm(2.4);
    const graduated = validateSpec(shallow, demoPriceBook, demoSettings);
    expect(graduated.ok).toBe(false);
    if (!graduated.ok)
      expect(graduated.issues).toEqual([
        {
          path: 'cases[0].bays[0].compartments[4]',
          message: expect.stringMatching(/^Case 1, Bay 1, Section 5: a .* high opening .* takes no drawer box/),
        },
      ]);
    // a door too short for its hinges in the second rear cabinet
    const short = structuredClone(bench);
    short.cases[2]!.bays[1]!.compartments = [
      { kind: 'door', heightMm: 100, doors: 1, adjustableShelves: 0, fixedShelves: 0 },
      { kind: 'open', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 },
    ];
    const door = validateSpec(short, demoPriceBook, demoSettings);
    expect(door.ok).toBe(false);
    if (!door.ok)
      expect(door.issues).toEqual([
        {
          path: 'cases[2].bays[1].compartments[0].heightMm',
          message: expect.stringMatching(/^Case 3, Bay 2, Section 1: the door would be .* tall/),
        },
      ]);
  });

  it('refuses a material of the wrong kind and unknown hardware with the field path', () => {
    const v = validateSpec(
      { ...designs['base-cabinet'].defaults, carcassMaterialId: 'birch-ply-6', pullId: 'hinge-concealed' },
      demoPriceBook,
      demoSettings,
    );
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.issues.map((i) => i.path).sort()).toEqual(['backMaterialId', 'carcassMaterialId', 'pullId']);
  });
});

describe('messages in the units and words of the shop', () => {
  it('says a limit in inches for an imperial shop and in mm for a metric one, as a sentence', () => {
    const spec = { ...designs['base-cabinet'].defaults, heightMm: toMm(72) };
    const inch = validateSpec(spec, demoPriceBook, demoSettings);
    const metric = validateSpec(spec, demoPriceBook, demoSettings, 'mm');
    expect(!inch.ok && inch.issues[0]).toEqual({ path: 'heightMm', message: '72 in is above the 42 in maximum.' });
    expect(!metric.ok && metric.issues[0]).toEqual({
      path: 'heightMm',
      message: '1829 mm is above the 1067 mm maximum.',
    });
  });

  it('speaks of sections, as the screen does, never compartments', () => {
    const spec = {
      ...designs['base-cabinet'].defaults,
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 2, fixedShelves: 0 }],
        },
      ],
    };
    const v = validateSpec(spec, demoPriceBook, demoSettings);
    expect(v.ok).toBe(false);
    if (!v.ok) {
      expect(v.issues.map((i) => i.message)).toContain('Bay 1, Section 1 is a drawer, which takes no shelves.');
      for (const i of v.issues) {
        expect(i.message).not.toMatch(/compartment/i);
        expect(i.message).toMatch(/^[A-Z].*\.$/);
      }
    }
  });

  it("words zod's own messages for a client", () => {
    const v = validateSpec(
      { ...designs.bookcase.defaults, widthMm: 'wide', frontMaterialId: undefined },
      demoPriceBook,
      demoSettings,
    );
    expect(v.ok).toBe(false);
    if (!v.ok) {
      expect(v.issues.find((i) => i.path === 'widthMm')?.message).toBe('Enter a length in inches.');
      expect(v.issues.find((i) => i.path === 'frontMaterialId')?.message).toBe('Choose a material.');
    }
  });
});

describe('check messages in one unit system', () => {
  it('says a shelf span and its sag in inches with the load for an imperial shop, in mm and kPa for a metric one', () => {
    const spec = { ...designs.bookcase.defaults, widthMm: 1067, carcassMaterialId: 'mdf-18' };
    const inch = validateSpec(spec, demoPriceBook, demoSettings);
    const metric = validateSpec(spec, demoPriceBook, demoSettings, 'mm');
    expect(!inch.ok && inch.issues[0]!.message).toMatch(
      /A [\d ./]+ in shelf would sag about [\d.]+ in under a load of 40 lb\/ft², more than the [\d.]+ in allowed/,
    );
    expect(!metric.ok && metric.issues[0]!.message).toMatch(
      /A [\d.]+ mm shelf would sag about [\d.]+ mm under a load of 1.9\d* kPa/,
    );
  });
});

describe('the pieces the shop already prices', () => {
  it('validates every design default and every spec of the job fixtures', async () => {
    const { readFileSync } = await import('node:fs');
    const specs: unknown[] = Object.values(designs).map((d) => d.defaults);
    for (const f of ['kitchen-run.json', 'mixed-job.json']) {
      const items = JSON.parse(readFileSync(new URL(`../test/fixtures/${f}`, import.meta.url), 'utf8')) as unknown;
      const list = Array.isArray(items) ? items : ((items as { items: unknown[] }).items ?? []);
      for (const it of list) specs.push((it as { spec?: unknown }).spec ?? it);
    }
    expect(specs.length).toBeGreaterThan(4);
    for (const s of specs) expect(validateSpec(s, demoPriceBook, demoSettings)).toMatchObject({ ok: true });
  });
});
