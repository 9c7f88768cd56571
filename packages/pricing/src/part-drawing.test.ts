import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { cutList } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, DESIGN_SLUGS, type BuildSpec } from './designs';
import {
  boxesOverlap,
  drawingLength,
  partDrawing,
  partDrawings,
  textBox,
  type PartDrawing,
  type PartShape,
  type PartText,
} from './part-drawing';
import type { Traveller, TravellerPart } from './traveller';
import type { LengthUnit } from './units';
import { validateSpec } from './validate';

/** A piece's traveller parts as the traveller makes them (the cut list, with the piece's quantity). */
function pieceOf(spec: BuildSpec, quantity = 1): Traveller['pieces'][number] {
  const parts = cutList(spec, demoPriceBook, demoSettings).parts;
  const several = parts.some((p) => p.id.startsWith('c2-'));
  return {
    title: designs[spec.design].name,
    quantity,
    widthMm: spec.widthMm,
    heightMm: spec.heightMm,
    depthMm: spec.depthMm,
    finish: null,
    revealMm: demoSettings.revealMm,
    overlayMm: demoSettings.overlayMm,
    joinery: [],
    parts: parts.map(
      (p): TravellerPart => ({
        name: p.name,
        materialName: p.materialId,
        stock: p.stock,
        quantity: p.quantity * quantity,
        lengthMm: p.lengthMm,
        widthMm: p.widthMm,
        thicknessMm: p.thicknessMm,
        grain: p.grain,
        banding: '',
        machining: p.machining,
        ...(several && /^c(\d+)-/.test(p.id) ? { case: Number(/^c(\d+)-/.exec(p.id)![1]) } : {}),
      }),
    ),
  };
}

const texts = (d: { shapes: PartShape[] }) => d.shapes.filter((s): s is PartText => s.type === 'text');
const dimTexts = (d: { shapes: PartShape[] }) => texts(d).filter((t) => t.role === 'dimension');

/** The pairs of text boxes (dimension figures, edge names, tag numbers) of a drawing that meet. */
function overlaps(d: { shapes: PartShape[] }): [string, string][] {
  const boxes = [
    ...texts(d).map((t) => ({ text: t.text, box: textBox(t) })),
    ...d.shapes
      .filter((s) => s.type === 'tag')
      .map((s) => ({ text: `tag ${s.text}`, box: { x: s.cx - s.r, y: s.cy - s.r, width: 2 * s.r, height: 2 * s.r } })),
  ];
  const out: [string, string][] = [];
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++)
      if (boxesOverlap(boxes[i]!.box, boxes[j]!.box)) out.push([boxes[i]!.text, boxes[j]!.text]);
  return out;
}

/** A dimension line's end points along its axis, beside the figure it carries. */
function dimensionAt(d: { shapes: PartShape[] }, text: string) {
  const shapes = d.shapes;
  const i = shapes.findIndex((s) => s.type === 'text' && s.role === 'dimension' && s.text === text);
  const line = shapes[i - 1];
  if (i < 0 || line?.type !== 'line' || line.style !== 'dim') throw new Error(`no dimension reads ${text}`);
  return line.y1 === line.y2
    ? { axis: 'x', from: Math.min(line.x1, line.x2), to: Math.max(line.x1, line.x2) }
    : { axis: 'y', from: Math.min(line.y1, line.y2), to: Math.max(line.y1, line.y2) };
}

const base = designs['base-cabinet'].defaults;
const baseParts = pieceOf(base).parts;
const part = (name: string, parts = baseParts) => {
  const p = parts.find((x) => x.name === name);
  if (!p) throw new Error(`no part ${name}`);
  return p;
};

describe('a base cabinet side (34 1/2 x 24 in, 4 in toe kick)', () => {
  const side = part('side');
  const d = partDrawing(side, 'in');
  it('draws the bottom dado where the cut list puts it: 101.6 mm (4 in) from the bottom end, 18.3 mm wide', () => {
    const cuts = d.shapes.filter((s) => s.type === 'cut');
    // the bottom end is at x = 0; a dado runs across the whole width
    expect(cuts).toContainEqual({
      type: 'cut',
      x: 101.6,
      y: 0,
      width: expect.closeTo(18.3, 6),
      height: side.widthMm,
    });
    expect(dimensionAt(d, '4"')).toEqual({ axis: 'x', from: 0, to: 101.6 });
    // the fixed shelf's dado is stopped 591.3 mm from the front (lower) edge
    expect(cuts).toContainEqual({
      type: 'cut',
      x: 687.4,
      y: expect.closeTo(side.widthMm - 591.3, 6),
      width: expect.closeTo(18.3, 6),
      height: 591.3,
    });
    expect(dimensionAt(d, '27 1/16"')).toEqual({ axis: 'x', from: 0, to: 687.4 });
  });
  it('cuts the toe-kick notch from the front-bottom corner and draws both pin rows', () => {
    const outline = d.shapes.find((s) => s.type === 'outline');
    expect(outline?.type === 'outline' && outline.points).toContainEqual([101.6, side.widthMm - 76.2]);
    const holes = d.shapes.filter((s) => s.type === 'hole');
    // 14 holes a row, the first 183.9 mm from the bottom end, rows 37 mm from the front and 55.3 mm from the back
    expect(holes).toHaveLength(28);
    expect(holes).toContainEqual(expect.objectContaining({ cx: 183.9, cy: expect.closeTo(side.widthMm - 37, 6) }));
    expect(holes).toContainEqual(expect.objectContaining({ cx: 183.9 + 13 * 32, cy: 55.3 }));
  });
  it('writes each feature located from an edge or end, in inches', () => {
    expect(d.notes).toContain('Dado for the bottom, inside face: 23/32" wide, 1/4" deep, 4" from the bottom end.');
    expect(d.notes).toContain('Groove for the back, inside face: 7/32" wide, 1/4" deep, 1/2" from the back edge.');
    expect(d.notes).toContain('Band the front edge (thick line).');
    expect(dimTexts(d).every((t) => /"$/.test(t.text))).toBe(true);
  });
});

describe('a door', () => {
  const door = part('door');
  it('bores the hinge cups 100 mm from each end and 22.5 mm (7/8 in) from the hinge edge', () => {
    const d = partDrawing(door, 'in');
    const cups = d.shapes.filter((s) => s.type === 'hole');
    // the hinge edge is the lower one (y = width); the bottom end at x = 0
    expect(cups).toEqual([
      { type: 'hole', cx: 100, cy: door.widthMm - 22.5, r: 17.5 },
      { type: 'hole', cx: 491.7, cy: door.widthMm - 22.5, r: 17.5 },
    ]);
    expect(door.lengthMm - 491.7).toBeCloseTo(100, 0);
    // the first from the bottom end, the last from the top end, both 3 15/16 in; the edge distance 7/8 in
    expect(dimTexts(d).map((t) => t.text)).toEqual(expect.arrayContaining(['3 15/16"', '7/8"']));
    expect(dimTexts(d).filter((t) => t.text === '3 15/16"')).toHaveLength(2);
    expect(dimensionAt(d, '7/8"')).toEqual({ axis: 'y', from: door.widthMm - 22.5, to: door.widthMm });
    expect(d.notes).toContain(
      '2 hinge cups, 35 mm, 13 mm deep, inside face: centers 7/8" from the hinge edge; 3 15/16" from the bottom end and 3 15/16" from the top end.',
    );
  });
  it('reads in millimetres for a metric shop', () => {
    const d = partDrawing(door, 'mm');
    expect(dimTexts(d).map((t) => t.text)).toEqual(expect.arrayContaining(['100 mm', '22.5 mm', '591.7 mm']));
    expect(dimTexts(d).every((t) => / mm$/.test(t.text))).toBe(true);
    expect(d.notes.join(' ')).not.toMatch(/"/);
  });
});

describe('pocket holes', () => {
  const centreY = (s: PartShape) => (s.type === 'pocket' ? s.y + s.height / 2 : NaN);
  it('draws each hole at the position the machining gives, measured from the edge it names', () => {
    // the 4 in stretcher: holes 1 in from its front and back edges, at both ends
    const stretcher = part('stretcher');
    const d = partDrawing(stretcher, 'in');
    const slots = d.shapes.filter((s) => s.type === 'pocket');
    expect(slots).toHaveLength(4);
    // the front edge is the lower one (y = width)
    for (const y of [stretcher.widthMm - 25.4, stretcher.widthMm - 76.2])
      expect(slots.filter((s) => Math.abs(centreY(s) - y) < 1e-6)).toHaveLength(2);
    // a slot at each end, running out at it
    expect(new Set(slots.map((s) => (s.type === 'pocket' && s.x === 0 ? 'left' : 'right')))).toEqual(
      new Set(['left', 'right']),
    );
    expect(dimensionAt(d, '1"')).toEqual({ axis: 'y', from: stretcher.widthMm - 25.4, to: stretcher.widthMm });
    expect(dimensionAt(d, '2"')).toEqual({
      axis: 'y',
      from: stretcher.widthMm - 76.2,
      to: stretcher.widthMm - 25.4,
    });
    expect(d.notes).toContain(
      '4 pocket holes on the top face, 2 at the left end and right end each: centers 1" and 3" from the front edge.',
    );
  });
  it('places as many holes as the depth of a butt joint calls for, 2 in from its ends', () => {
    const parts = pieceOf({ ...base, joinery: 'butt' } as BuildSpec).parts;
    const bottom = part('bottom', parts);
    const d = partDrawing(bottom, 'in');
    const slots = d.shapes.filter((s) => s.type === 'pocket');
    expect(slots).toHaveLength(8);
    // measured from the front edge, the lower one (y = width)
    const ys = [...new Set(slots.map((s) => Math.round(centreY(s) * 10) / 10))].sort((a, b) => a - b);
    expect(ys).toEqual([558.8, 389.5, 220.1, 50.8].map((c) => Math.round((bottom.widthMm - c) * 10) / 10));
    expect(d.notes).toContain(
      '8 pocket holes on the underside, 4 at the left end and right end each: centers 2", 8 21/32", 15 11/32" and 22" from the front edge.',
    );
    expect(overlaps(d)).toEqual([]);
  });
  it('spreads the holes evenly, as before, for a traveller recorded before they had positions', () => {
    const stretcher = part('stretcher');
    const old = {
      ...stretcher,
      machining: [{ kind: 'pocket_holes' as const, face: 'top' as const, count: 4, at: ['left', 'right'] as const }],
    } as unknown as TravellerPart;
    const d = partDrawing(old, 'in');
    const ys = d.shapes.filter((s) => s.type === 'pocket').map(centreY);
    expect(ys.map((y) => Math.round(y * 100) / 100)).toEqual(
      [0.25, 0.75, 0.25, 0.75].map((f) => Math.round(stretcher.widthMm * f * 100) / 100),
    );
    expect(d.notes).toContain(
      '4 pocket holes on the top face, 2 at the left end and right end each, spaced evenly across it.',
    );
  });
});

describe('partDrawings', () => {
  it('draws identical parts once with their count and the pieces they belong to, and leaves plain parts out', () => {
    const ds = partDrawings({ pieces: [pieceOf(base, 2), pieceOf(base, 1)] }, 'in');
    const sides = ds.filter((d) => d.name === 'side');
    expect(sides).toHaveLength(1);
    expect(sides[0]).toMatchObject({
      quantity: 6,
      where: ['Base cabinet 1', 'Base cabinet 2'],
      size: '34 1/2" x 24" x 23/32"',
    });
    // the back and the toe kick have no machining and no banding
    expect(ds.map((d) => d.name)).not.toContain('back');
    expect(ds.map((d) => d.name)).not.toContain('toe kick');
    expect(ds.map((d) => d.name)).toContain('shelf'); // banded only
  });
  it('draws nothing, and does not fail, for a traveller recorded before parts carried their machining', () => {
    const piece = pieceOf(base, 1);
    const old = { ...piece, parts: piece.parts.map(({ machining: _m, ...p }) => p as TravellerPart) };
    expect(partDrawings({ pieces: [old] }, 'in')).toEqual([]);
  });
  it("names a bench's cases", () => {
    const ds = partDrawings({ pieces: [pieceOf(designs['assembly-bench'].defaults)] }, 'in');
    expect(ds.find((d) => d.name === 'partition' && d.where.join().includes('cases'))?.where).toEqual([
      'Rolling assembly bench, cases 2 and 3',
    ]);
  });
  it('writes lengths to 1/32 in, and millimetres to one decimal where not whole', () => {
    expect(drawingLength(18.26, 'in')).toBe('23/32"');
    expect(drawingLength(22.5, 'mm')).toBe('22.5 mm');
    expect(drawingLength(101.6, 'mm')).toBe('101.6 mm');
    expect(drawingLength(100, 'mm')).toBe('100 mm');
  });
});

describe('no two texts of a drawing overlap', () => {
  const check = (ds: PartDrawing[]) => {
    for (const d of ds) expect(overlaps(d), `${d.name} ${d.size}`).toEqual([]);
  };
  it.each(['in', 'mm'] as LengthUnit[])('on every demo design, in %s', (unit) => {
    check(partDrawings({ pieces: DESIGN_SLUGS.map((slug) => pieceOf(designs[slug].defaults)) }, unit));
  });
  it.each(['in', 'mm'] as LengthUnit[])(
    'on every demo design butt-jointed (pocket holes on its panels), in %s',
    (unit) => {
      const pieces = DESIGN_SLUGS.map((slug) => pieceOf({ ...designs[slug].defaults, joinery: 'butt' } as BuildSpec));
      const ds = partDrawings({ pieces }, unit);
      expect(ds.some((d) => d.name === 'partition' && d.notes.some((n) => /pocket holes/.test(n)))).toBe(true);
      check(ds);
    },
  );
  it('on random sizes of every demo design inside its limits (fixed seed)', () => {
    const spec = fc
      .record({
        slug: fc.constantFrom(...DESIGN_SLUGS),
        w: fc.double({ min: 0, max: 1, noNaN: true }),
        h: fc.double({ min: 0, max: 1, noNaN: true }),
        d: fc.double({ min: 0, max: 1, noNaN: true }),
        unit: fc.constantFrom<LengthUnit>('in', 'mm'),
      })
      .map(({ slug, w, h, d, unit }) => {
        const L = designs[slug].limits;
        const at = ([lo, hi]: readonly [number, number], f: number) => lo + (hi - lo) * f;
        const s = {
          ...structuredClone(designs[slug].defaults),
          widthMm: at(L.widthMm, w),
          heightMm: at(L.heightMm, h),
          depthMm: at(L.depthMm, d),
        };
        return { v: validateSpec(s, demoPriceBook, demoSettings), unit };
      });
    let drawn = 0;
    fc.assert(
      fc.property(spec, ({ v, unit }) => {
        if (!v.ok) return;
        const ds = partDrawings({ pieces: [pieceOf(v.spec)] }, unit);
        drawn += ds.length;
        for (const d of ds) expect(overlaps(d), `${d.name} ${d.size}`).toEqual([]);
      }),
      { seed: 20261202, numRuns: 150 },
    );
    expect(drawn).toBeGreaterThan(100);
  });
});
