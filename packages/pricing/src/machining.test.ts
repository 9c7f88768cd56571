import { describe, expect, it } from 'vitest';
import { cutList, type CutPart } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs } from './designs';
import { hingeCups, pinRows, pocketHoleCentres, POCKET_MAX_SPACING_MM } from './machining';
import { labourCounts } from './labour';
import { toMm } from './units';

const ops = (parts: CutPart[], id: string) => {
  const p = parts.find((x) => x.id === id);
  if (!p) throw new Error(`no part ${id}`);
  return p.machining;
};

// Hand-worked for the 24 in base cabinet (34 1/2 x 24 x 24 in, 4 in toe kick, 18.26 mm carcass, 5.56 mm back
// grooved 1/2 in from the rear, a door with one adjustable shelf under a 6 in drawer):
// - the bottom sits on the toe kick: its dado starts 101.6 mm up each side; the inside floor is at 119.86 mm;
// - inside height 876.3 - 101.6 - 2 x 18.26 = 738.18; the drawer takes 152.4, the divider 18.26, the door's
//   compartment 567.52, so the divider's dado starts 119.86 + 567.52 = 687.38 mm up;
// - shelf pins: first hole 64 mm over the floor (183.86), 14 holes on 32 mm up to 599.86 (64 mm under the
//   divider is 623.38), rows 37 mm from the front and 12.7 + 5.56 + 37 = 55.26 mm from the back edge;
// - the door is 591.65 mm tall: cups 100 mm from each end, 22.5 mm from the hinge edge.
describe('machining positions on the base cabinet', () => {
  const parts = cutList(designs['base-cabinet'].defaults, demoPriceBook, demoSettings).parts;
  it('marks each side with its notch, dados, groove and shelf-pin rows', () => {
    const side = ops(parts, 'c1-side');
    expect(side).toContainEqual({ kind: 'band', edges: ['front'] });
    expect(side).toContainEqual({
      kind: 'toe_kick_notch',
      corner: 'front-bottom',
      heightMm: 101.6,
      depthMm: 76.2,
    });
    expect(side).toContainEqual(
      expect.objectContaining({ kind: 'dado', for: 'bottom', fromEdge: 'bottom', distanceMm: 101.6, widthMm: 18.3 }),
    );
    expect(side).toContainEqual(
      expect.objectContaining({ kind: 'dado', for: 'fixed shelf', distanceMm: 687.4, depthMm: 6.4, lengthMm: 591.3 }),
    );
    expect(side).toContainEqual(
      expect.objectContaining({ kind: 'groove', for: 'back', fromEdge: 'back', distanceMm: 12.7, widthMm: 5.6 }),
    );
    const rows = side.filter((o) => o.kind === 'shelf_pin_row');
    expect(rows).toEqual([
      expect.objectContaining({ fromEdge: 'front', setbackMm: 37, firstHoleMm: 183.9, spacingMm: 32, holes: 14 }),
      expect.objectContaining({ fromEdge: 'back', setbackMm: 55.3, firstHoleMm: 183.9, spacingMm: 32, holes: 14 }),
    ]);
  });
  it('bores the door for its two hinges and bands its four edges', () => {
    expect(ops(parts, 'c1-b1-k1-door')).toEqual([
      { kind: 'band', edges: ['top', 'bottom', 'hinge', 'opening'] },
      {
        kind: 'hinge_cup',
        face: 'inside',
        diameterMm: 35,
        depthMm: 13,
        fromEdge: 'hinge',
        edgeDistanceMm: 22.5,
        fromEnd: 'bottom',
        centresMm: [100, 491.7],
      },
    ]);
  });
  it('grooves the drawer box for its bottom and pocket-drills the box front and back', () => {
    expect(ops(parts, 'c1-b1-k2-drawer-side')).toContainEqual(
      expect.objectContaining({ kind: 'groove', for: 'drawer bottom', distanceMm: 12.7, widthMm: 5.6, depthMm: 6.4 }),
    );
    // the box is 5 in high (a 6 in opening less 1 in); the holes keep to the 108.7 mm above the bottom's groove
    // (1/2 in up, 5.56 mm wide): two an end, a quarter of that in from its ends, 18.26 + 27.2 and 18.26 + 81.6 mm up
    const end = parts.find((p) => p.id === 'c1-b1-k2-drawer-end')!;
    expect(end.widthMm).toBeCloseTo(127, 0);
    expect(end.machining).toContainEqual({
      kind: 'pocket_holes',
      face: 'outside',
      count: 4,
      at: ['left', 'right'],
      fromEdge: 'bottom',
      centresMm: [45.4, 99.8],
    });
    // the 4 in stretcher: holes 1 in from its front and back edges
    expect(ops(parts, 'c1-stretcher')).toEqual([
      {
        kind: 'pocket_holes',
        face: 'top',
        count: 4,
        at: ['left', 'right'],
        fromEdge: 'front',
        centresMm: [25.4, 76.2],
      },
    ]);
  });
  it('gives every part with banded edges a band entry, and none to parts without', () => {
    for (const p of parts) {
      const banded = p.bandedEdges.long + p.bandedEdges.short;
      const named = p.machining.filter((o) => o.kind === 'band').flatMap((o) => o.edges).length;
      expect(named, p.id).toBe(banded);
    }
  });
});

// A 36 in base cabinet of two bays, a door with a shelf in each: the bays are (877.88 - 18.26) / 2 = 429.81 mm;
// the partition stands in a dado 6.35 + 429.81 = 436.16 mm from the bottom's left end, and its own foot is in that
// dado, 113.51 mm up, so the compartments' floor is 6.35 mm above its foot: first pin 70.35 mm, 20 holes.
describe('machining positions on a two-bay base cabinet', () => {
  const spec = {
    ...designs['base-cabinet'].defaults,
    widthMm: toMm(36),
    bays: [0, 1].map(() => ({
      widthMm: null,
      compartments: [
        { kind: 'door' as const, heightMm: null, doors: 1 as const, adjustableShelves: 1, fixedShelves: 0 },
      ],
    })),
  };
  const parts = cutList(spec, demoPriceBook, demoSettings).parts;
  it('dados the bottom for the partition', () => {
    expect(ops(parts, 'c1-bottom')).toContainEqual(
      expect.objectContaining({ kind: 'dado', for: 'partition', fromEdge: 'left', distanceMm: 436.2, widthMm: 18.3 }),
    );
  });
  it('drills pin rows on both faces of the partition and on the inside of each side', () => {
    const rows = ops(parts, 'c1-partition').filter((o) => o.kind === 'shelf_pin_row');
    expect(rows.map((r) => [r.face, r.fromEdge, r.setbackMm, r.firstHoleMm, r.holes])).toEqual([
      ['left', 'front', 37, 70.4, 20],
      ['left', 'back', 37, 70.4, 20],
      ['right', 'front', 37, 70.4, 20],
      ['right', 'back', 37, 70.4, 20],
    ]);
    const side = ops(parts, 'c1-side').filter((o) => o.kind === 'shelf_pin_row');
    expect(side.map((r) => [r.only, r.fromEdge, r.firstHoleMm])).toEqual([
      ['left', 'front', 183.9],
      ['left', 'back', 183.9],
      ['right', 'front', 183.9],
      ['right', 'back', 183.9],
    ]);
  });
});

describe('pinRows and hingeCups', () => {
  it('leave a compartment too low for a hole without rows', () => {
    expect(pinRows({ face: 'inside', floorMm: 0, heightMm: 100, backSetbackMm: 37 })).toEqual([]);
  });
  it('space three cups evenly between the end cups', () => {
    expect(hingeCups(1000, 3).centresMm).toEqual([100, 500, 900]);
  });
});

describe('pocket holes', () => {
  it('puts a hole 2 in from each end of a joint and the rest evenly between, at most 8 in apart', () => {
    // a 24 in joint: 20 in between the end holes takes three spaces of 6 2/3 in
    expect(pocketHoleCentres(toMm(24))).toEqual([50.8, 220.1, 389.5, 558.8]);
    // 8 in between the end holes is one space; a hair more takes two
    expect(pocketHoleCentres(toMm(12))).toEqual([50.8, 254]);
    expect(pocketHoleCentres(toMm(12) + 1)).toHaveLength(3);
    for (const joint of [toMm(8), 300, 457.2, 600, 900, 1200]) {
      const c = pocketHoleCentres(joint);
      expect(c[0]).toBeCloseTo(50.8, 1);
      expect(joint - c.at(-1)!).toBeCloseTo(50.8, 1);
      for (let i = 1; i < c.length; i++) expect(c[i]! - c[i - 1]!).toBeLessThanOrEqual(POCKET_MAX_SPACING_MM + 0.1);
      // no fewer holes than the spacing needs
      expect(c.length).toBe(Math.ceil((joint - 2 * 50.8) / POCKET_MAX_SPACING_MM) + 1);
    }
  });
  it('brings the two holes in on a short joint, and takes one hole on a narrow one', () => {
    expect(pocketHoleCentres(150)).toEqual([37.5, 112.5]);
    expect(pocketHoleCentres(toMm(3))).toEqual([19, 57.1]);
    expect(pocketHoleCentres(toMm(1.25))).toEqual([15.9]);
  });
  it('gives a butt-jointed case its pocket holes with positions, and counts them as drilled', () => {
    const spec = { ...designs['base-cabinet'].defaults, joinery: 'butt' as const };
    const parts = cutList(spec, demoPriceBook, demoSettings).parts;
    const bottom = parts.find((p) => p.id === 'c1-bottom')!;
    // the 24 in deep bottom, screwed up into the sides from its underside: four holes an end
    expect(bottom.machining).toContainEqual({
      kind: 'pocket_holes',
      face: 'underside',
      count: 8,
      at: ['left', 'right'],
      fromEdge: 'front',
      centresMm: [50.8, 220.1, 389.5, 558.8],
    });
    // every part's count is the holes its machining places, and the labour prices those
    const placed = (p: CutPart) =>
      p.machining
        .filter((o) => o.kind === 'pocket_holes')
        .reduce((sum, o) => sum + (o.centresMm?.length ?? 0) * o.at.length, 0);
    for (const p of parts) expect(p.pocketHoles, p.id).toBe(placed(p));
    const list = cutList(spec, demoPriceBook, demoSettings);
    const counts = labourCounts({
      pieces: [{ parts: list.parts, geometry: list.geometry, hardware: [], quantity: 1 }],
      sheets: 0,
      finishM2Coats: 0,
      boardFeetMilled: 0,
    });
    expect(counts.pocket_hole).toBe(parts.reduce((sum, p) => sum + p.quantity * placed(p), 0));
    // by hand: the stretchers 2 x 4 and the drawer box ends 2 x 4, as with dadoes, and now the bottom's 8 and the
    // divider's 8 (23 1/4 in deep: four an end)
    expect(counts.pocket_hole).toBe(32);
    expect(parts.filter((p) => p.pocketHoles > 0).map((p) => p.name)).toEqual(
      expect.arrayContaining(['bottom', 'stretcher', 'fixed shelf', 'drawer box front and back']),
    );
  });
});
