import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cutList, drawerBox } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, DESIGN_SLUGS, parseSpec } from './designs';
import { toMm } from './units';
import { at } from './_lib/at';

const UPDATE = process.env.UPDATE_GOLDEN === '1';

describe('drawerBox', () => {
  it('returns the longest slide that fits the depth less 1/2 in, the box 1/2 in narrower a side and 1 in lower (common practice)', () => {
    expect(drawerBox({ widthMm: 500, heightMm: 150, depthMm: 560 })).toEqual({
      boxWidthMm: 474.6,
      boxHeightMm: 124.6,
      boxDepthMm: 508,
      slideLengthMm: 508,
      slideLengthIn: 20,
    });
  });
  it('takes a 28 in slide at most', () => {
    expect(drawerBox({ widthMm: 500, heightMm: 150, depthMm: 900 }).slideLengthIn).toBe(28);
  });
  it('takes the height clearance from the rules', () => {
    expect(drawerBox({ widthMm: 500, heightMm: 150, depthMm: 560 }, { heightClearanceMm: 10 }).boxHeightMm).toBe(140);
  });
  describe('edge cases', () => {
    it('fits a 10 in slide at exactly 10 1/2 in of depth', () => {
      expect(drawerBox({ widthMm: 400, heightMm: 100, depthMm: toMm(10.5) }).slideLengthIn).toBe(10);
    });
  });
  describe('invalid input', () => {
    it('throws a RangeError naming the minimum depth when no slide fits', () => {
      expect(() => drawerBox({ widthMm: 400, heightMm: 100, depthMm: 250 })).toThrow(RangeError);
      expect(() => drawerBox({ widthMm: 400, heightMm: 100, depthMm: 250 })).toThrow(/at least 266.7 mm/);
    });
  });
});

describe('cutList', () => {
  it('returns the base cabinet defaults as worked by hand', () => {
    // Worked by hand: 24 x 34 1/2 x 24 in (609.6 x 876.3 x 609.6 mm) on a 4 in (101.6 mm) toe kick,
    // 3/4 in birch plywood measured at 18.26 mm, a 1/4 in back (5.56 mm) grooved 1/2 in from the back edge,
    // 1/4 in (6.35 mm) dados, reveal 3 mm, overlay 18 mm.
    //   inside width  = 609.6 - 2 x 18.26 = 573.08; bottom = 573.08 + 2 x 6.35 = 585.78 long
    //   inside height = 876.3 - 101.6 - 2 x 18.26 = 738.18; back = (738.18 + 12.7) x (573.08 + 12.7) = 750.88 x 585.78
    //   inside depth  = 609.6 - 12.7 - 5.56 = 591.34
    //   door over drawer: one fixed shelf between; door opening = 738.18 - 18.26 - 152.4 = 567.52
    //   fronts: edge inset = (18.26 - 18) + 1.5 = 1.76; width = 609.6 - 2 x 1.76 = 606.08
    //   door: from 101.6 + 1.76 = 103.36 to 119.86 + 567.52 + 9.13 - 1.5 = 695.01 -> 591.65 tall
    //   drawer front: from 705.64 - 9.13 + 1.5 = 698.01 to 876.3 - 1.76 = 874.54 -> 176.53 tall (3 mm reveal above the door)
    //   drawer box: slide <= 591.34 - 12.7 = 578.64 -> 22 in (558.8); box 573.08 - 25.4 = 547.68 wide, 152.4 - 25.4 = 127 high
    const { parts } = cutList(designs['base-cabinet'].defaults, demoPriceBook, demoSettings);
    const get = (name: string) => {
      const p = parts.filter((x) => x.name === name);
      expect(p.length, name).toBeGreaterThan(0);
      return at(p, 0);
    };
    const near = (a: number, b: number) => expect(a).toBeCloseTo(b, 2);
    const side = get('side');
    expect(side.quantity).toBe(2);
    near(side.lengthMm, 876.3);
    near(side.widthMm, 609.6);
    expect(side.thicknessMm).toBe(18.26);
    expect(side.grain).toBe('fixed');
    near(get('bottom').lengthMm, 585.78);
    const back = get('back');
    near(back.lengthMm, 750.88);
    near(back.widthMm, 585.78);
    expect(back.thicknessMm).toBe(5.56);
    const st = get('stretcher');
    expect(st.quantity).toBe(2);
    near(st.lengthMm, 573.08);
    expect(st.pocketHoles).toBe(4);
    near(get('toe kick').widthMm, 101.6);
    near(get('fixed shelf').widthMm, 591.34);
    const shelf = get('shelf');
    near(shelf.lengthMm, 573.08 - 3.175);
    near(shelf.widthMm, 591.34 - 6.35);
    expect(shelf.bandedEdges).toEqual({ long: 1, short: 0 });
    const door = get('door');
    near(door.widthMm, 606.08);
    near(door.lengthMm, 591.65);
    expect(door.bandedEdges).toEqual({ long: 2, short: 2 });
    const front = get('drawer front');
    near(front.lengthMm, 606.08);
    near(front.widthMm, 176.53);
    const dside = get('drawer side');
    near(dside.lengthMm, 558.8);
    near(dside.widthMm, 127);
    expect(dside.thicknessMm).toBe(11.9);
    const dbottom = get('drawer bottom');
    // the bottom 1/16 in (1.5875 mm) under its dado-to-dado size each way, to slide in (common practice)
    near(dbottom.lengthMm, 547.68 - 2 * 11.9 + 12.7 - 1.5875);
    near(dbottom.widthMm, 558.8 - 2 * 11.9 + 12.7 - 1.5875);
  });

  it('gives every part a stable, unique id', () => {
    for (const slug of DESIGN_SLUGS) {
      const a = cutList(designs[slug].defaults, demoPriceBook, demoSettings).parts.map((p) => p.id);
      const b = cutList(designs[slug].defaults, demoPriceBook, demoSettings).parts.map((p) => p.id);
      expect(new Set(a).size).toBe(a.length);
      expect(a).toEqual(b);
    }
  });

  it('builds the bench top as a torsion box: two skins, a frame and a grid of ribs', () => {
    const { parts } = cutList(designs['assembly-bench'].defaults, demoPriceBook, demoSettings);
    const names = parts.map((p) => p.name);
    expect(parts.find((p) => p.name === 'skin')?.quantity).toBe(2);
    expect(names).toEqual(
      expect.arrayContaining([
        'frame, long',
        'frame, end',
        'grid rib, cross',
        'grid rib, long, a strip to crosscut into 9',
      ]),
    );
    const cross = parts.find((p) => p.name === 'grid rib, cross')!;
    // 72 in top, 3/4 in frame, 8 in spacing: ceil((1828.8 - 36.52) / 203.2) - 1 = 8 cross ribs
    expect(cross.quantity).toBe(8);
    // core height = 3 1/2 in less two 1/2 in skins
    expect(cross.widthMm).toBeCloseTo(88.9 - 2 * 12.7, 6);
  });

  it('mitres solid trim and takes it off the banding', () => {
    const spec = {
      ...designs.bookcase.defaults,
      trim: { lumberId: 'walnut-4-4', widthMm: toMm(1.5), thicknessMm: toMm(0.75) },
    };
    const { parts } = cutList(spec, demoPriceBook, demoSettings);
    const trim = parts.filter((p) => p.stock === 'lumber');
    expect(trim.reduce((s, p) => s + p.quantity, 0)).toBe(4);
    expect(parts.find((p) => p.name === 'side')?.bandedEdges.long).toBe(0);
  });

  it('does not mutate its inputs', () => {
    const spec = structuredClone(designs['base-cabinet'].defaults);
    const book = structuredClone(demoPriceBook);
    const settings = structuredClone(demoSettings);
    cutList(spec, book, settings);
    expect(spec).toEqual(designs['base-cabinet'].defaults);
    expect(book).toEqual(demoPriceBook);
    expect(settings).toEqual(demoSettings);
  });

  describe('golden cut lists (regenerate on purpose with UPDATE_GOLDEN=1)', () => {
    it.each(DESIGN_SLUGS)('matches the fixture for the %s defaults', (slug) => {
      const file = new URL(`../test/fixtures/${slug}.cut-list.json`, import.meta.url);
      const parts = cutList(designs[slug].defaults, demoPriceBook, demoSettings).parts;
      const rounded = JSON.parse(
        JSON.stringify(parts, (_k, v) => (typeof v === 'number' ? Math.round(v * 100) / 100 : v)),
      );
      if (UPDATE) {
        mkdirSync(new URL('../test/fixtures/', import.meta.url), { recursive: true });
        writeFileSync(file, `${JSON.stringify(rounded, null, 2)}\n`);
      }
      expect(existsSync(file), `missing fixture ${file.pathname}: run with UPDATE_GOLDEN=1 on purpose`).toBe(true);
      expect(rounded).toEqual(JSON.parse(readFileSync(file, 'utf8')));
    });
  });

  describe('invalid input', () => {
    it('throws when a material is not in the price book', () => {
      expect(() =>
        cutList({ ...designs.bookcase.defaults, carcassMaterialId: 'unobtainium' }, demoPriceBook, demoSettings),
      ).toThrow(/not in the price book/);
    });
  });
});

describe('parseSpec', () => {
  it('accepts every design default', () => {
    for (const slug of DESIGN_SLUGS) expect(parseSpec(designs[slug].defaults).ok).toBe(true);
  });
  it('names the field path and the limit', () => {
    const spec = structuredClone(designs['base-cabinet'].defaults) as unknown as {
      bays: { compartments: { heightMm: number | null }[] }[];
    };
    const bay = at(spec.bays, 0);
    const compartment = at(bay.compartments, 0);
    spec.bays = [
      bay,
      {
        compartments: [{ ...compartment }, { ...compartment }, { ...compartment, heightMm: 38 }],
      } as never,
    ];
    const r = parseSpec({ ...designs['base-cabinet'].defaults, widthMm: toMm(30), bays: spec.bays });
    expect(r.ok).toBe(false);
    if (!r.ok)
      expect(r.issues).toContainEqual({
        path: 'bays[1].compartments[2].heightMm',
        message: '38 mm is below the 60 mm minimum.',
      });
  });
  it('catches compartments taller than the case', () => {
    const r = parseSpec({
      ...designs['wall-cabinet'].defaults,
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'door', heightMm: 900, doors: 2, adjustableShelves: 1, fixedShelves: 0 }],
        },
      ],
    });
    expect(r.ok).toBe(false);
    if (!r.ok)
      expect(r.issues[0]).toMatchObject({
        path: 'bays[0].compartments',
        message: expect.stringMatching(/^The sections of Bay 1 need 900 mm/),
      });
    // the message names the section to change and the most it may be
    if (!r.ok)
      expect(r.issues[0]!.message).toMatch(/Bay 1, Section 1 is set at 900 mm; make it at most \d+ mm, let it share/);
  });
  it('refuses an unknown design', () => {
    expect(parseSpec({ design: 'sofa' })).toEqual({
      ok: false,
      issues: [{ path: 'design', message: expect.stringMatching(/^Choose one of the designs/) }],
    });
  });
});
