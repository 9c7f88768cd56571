import { describe, expect, it } from 'vitest';
import { cutList } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs } from './designs';
import { hardwareFor, hingesPerDoor } from './hardware';
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
