import { describe, expect, it } from 'vitest';
import { cutList } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs } from './designs';
import { FASTENERS_PER, hardwareFor, hingesPerDoor, pocketScrewLengthIn } from './hardware';
import { PriceBook } from './price-book';
import { toMm } from './units';

describe('hingesPerDoor', () => {
  // common practice, from memory
  it.each([
    [300, 2],
    [900, 2],
    [901, 3],
    [1600, 3],
    [2000, 4],
    [2001, 5],
  ])('returns hinges for a %i mm door', (h, n) => {
    expect(hingesPerDoor(h)).toBe(n);
  });
  describe('invalid input', () => {
    it('refuses a zero height', () => expect(() => hingesPerDoor(0)).toThrow(RangeError));
  });
});

describe('hardwareFor', () => {
  it('gives the wall cabinet defaults two hinges a door, a pull a door and four pins a shelf', () => {
    const list = cutList(designs['wall-cabinet'].defaults, demoPriceBook, demoSettings);
    const hw = Object.fromEntries(
      hardwareFor(list, demoPriceBook, { antiTip: false }).map((h) => [h.itemId, h.pieces]),
    );
    expect(hw['hinge-concealed']).toBe(4);
    expect(hw['pull-bar-128']).toBe(2);
    expect(hw['shelf-pin']).toBe(8);
    expect(hw['rail-screw']).toBe(2);
  });
  it('gives a drawer wider than 24 in two pulls and one pair of slides', () => {
    const spec = {
      ...designs['base-cabinet'].defaults,
      widthMm: toMm(30),
      bays: [
        {
          widthMm: null,
          compartments: [
            { kind: 'drawer' as const, heightMm: null, doors: 1 as const, adjustableShelves: 0, fixedShelves: 0 },
          ],
        },
      ],
    };
    const hw = hardwareFor(cutList(spec, demoPriceBook, demoSettings), demoPriceBook, { antiTip: true });
    expect(hw.find((h) => h.kind === 'pull')?.pieces).toBe(2);
    const slide = hw.find((h) => h.kind === 'slide')!;
    expect(slide.pieces).toBe(2);
    expect(slide.units).toBe(1);
    expect(hw.find((h) => h.kind === 'anti_tip_kit')?.pieces).toBe(1);
  });
  it('puts one set of casters under the joined cases of the bench: two rows of three, at most 48 in apart', () => {
    const list = cutList(designs['assembly-bench'].defaults, demoPriceBook, demoSettings);
    expect(hardwareFor(list, demoPriceBook, { antiTip: false }).find((h) => h.kind === 'caster')?.pieces).toBe(6);
  });
});

const door = (adjustableShelves = 1) => ({
  kind: 'door' as const,
  heightMm: null,
  doors: 1 as const,
  adjustableShelves,
  fixedShelves: 0,
});
const pieces = (spec: Parameters<typeof cutList>[0], book = demoPriceBook) =>
  Object.fromEntries(
    hardwareFor(cutList(spec, book, demoSettings), book, { antiTip: false }).map((h) => [h.itemId, h.pieces]),
  );

describe('hinges by overlay, count and weight', () => {
  // a 36 in base cabinet of two bays, a single door each, both hinged on the left: the left door on the end
  // panel laps it fully; the right door hangs on the partition it shares with the left door and laps about half
  const twoBay = {
    ...designs['base-cabinet'].defaults,
    widthMm: toMm(36),
    bays: [
      { widthMm: null, compartments: [door()] },
      { widthMm: null, compartments: [door()] },
    ],
  };
  it('gives the door on the end panel full-overlay hinges and the door on the partition half-overlay ones', () => {
    const list = cutList(twoBay, demoPriceBook, demoSettings);
    expect(list.geometry.doors.map((d) => d.overlay)).toEqual(['full', 'half']);
    const hw = pieces(twoBay);
    expect(hw['hinge-concealed']).toBe(2);
    expect(hw['hinge-half-overlay']).toBe(2);
    expect(hw['hinge-inset']).toBeUndefined();
    expect(hw['screw-hinge']).toBe(4 * FASTENERS_PER.hinge);
  });
  it('gives inset hinges where the fronts sit inside the case', () => {
    const list = cutList(twoBay, demoPriceBook, { ...demoSettings, overlayMm: 0 });
    expect(list.geometry.doors[0]?.overlay).toBe('inset');
  });
  it('adds a hinge for every 5 kg beyond what the height gives', () => {
    expect(hingesPerDoor(800, 9.9)).toBe(2);
    expect(hingesPerDoor(800, 10.1)).toBe(3);
    expect(hingesPerDoor(1800, 26)).toBe(6);
    expect(() => hingesPerDoor(800, -1)).toThrow(RangeError);
  });
  it('still prices a book stored before hinges carried an overlay, with its one hinge', () => {
    const old = PriceBook.parse({
      ...demoPriceBook,
      hardware: demoPriceBook.hardware
        .filter((h) => h.kind !== 'hinge' && h.kind !== 'screw' && h.kind !== 'bolt')
        .concat([{ id: 'hinge-old', name: 'Concealed hinge', kind: 'hinge', unit: 'each', priceCents: 400 }] as never),
    });
    expect(pieces(twoBay, old)['hinge-old']).toBe(4);
  });
});

describe('screws and fasteners', () => {
  it.each([
    [11.9, 1], // 1/2 in drawer stock
    [12.7, 1],
    [18.26, 1.25], // 3/4 in plywood
    [19.05, 1.25],
    [25.4, 1.5],
  ])('takes %f mm stock with %f in pocket screws', (t, l) => expect(pocketScrewLengthIn(t)).toBe(l));

  it('puts 1 in pocket screws in the drawer box and 1 1/4 in ones in the stretchers of the base cabinet', () => {
    const hw = pieces(designs['base-cabinet'].defaults);
    // two stretchers of 3/4 in plywood, 4 holes each; the drawer box's front and back of 1/2 in, 4 holes each
    expect(hw['pocket-screw']).toBe(8);
    expect(hw['pocket-screw-1in']).toBe(8);
    // one drawer: a pair of slides at 6 screws each, 4 screws for its front; one door on 2 hinges at 4 screws each
    expect(hw['screw-slide']).toBe(12);
    expect(hw['screw-drawer-front']).toBe(4);
    expect(hw['screw-hinge']).toBe(8);
    expect(hw['screw-top']).toBeUndefined();
  });

  it('bolts the casters, screws the feet and screws the top down through the stretchers of a bench', () => {
    const spec = {
      ...designs['assembly-bench'].defaults,
      mobility: 'casters-and-feet' as const,
    };
    const hw = pieces(spec);
    // one set under the joined cases: six casters and four feet, 4 fasteners a plate
    expect(hw['bolt-caster']).toBe(24);
    expect(hw['screw-foot']).toBe(16);
    // two stretchers a case, a screw every 8 in: the 62 in main case floor(1574.8 / 203.2) + 1 = 8 a stretcher,
    // each 31 in rear cabinet floor(787.4 / 203.2) + 1 = 4 a stretcher
    expect(hw['screw-top']).toBe(2 * 8 + 2 * (2 * 4));
    // seven drawers, 12 slide screws and 4 front screws each
    expect(hw['screw-slide']).toBe(84);
    expect(hw['screw-drawer-front']).toBe(28);
  });

  it('buys screws and bolts by the box', () => {
    const list = cutList(designs['base-cabinet'].defaults, demoPriceBook, demoSettings);
    const slide = hardwareFor(list, demoPriceBook, { antiTip: false }).find((h) => h.itemId === 'screw-slide');
    expect(slide).toMatchObject({ kind: 'screw', pieces: 12, units: 1, unit: 'box' });
  });
});
