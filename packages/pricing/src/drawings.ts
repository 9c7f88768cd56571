import type { BuildSpec } from './designs';
import { cutList, type CutList, type PieceGeometry } from './cut-list';
import { demoPriceBook, demoSettings } from './demo-data';
import type { PriceBook, ShopSettings } from './price-book';
import type { NestPart, SheetLayout } from './nesting';
import { formatLength, type LengthUnit } from './units';

/** How a shape is drawn; every style reads in black and white (hatching, not colour, carries meaning). */
export type ShapeStyle =
  | 'case'
  | 'front'
  | 'top'
  | 'kick'
  | 'hardware'
  | 'sheet'
  | 'part'
  | 'offcut'
  | 'trim'
  | 'cut'
  | 'guide'
  | 'shelf';

export type Shape =
  | { type: 'rect'; x: number; y: number; width: number; height: number; style: ShapeStyle }
  | { type: 'line'; x1: number; y1: number; x2: number; y2: number; style: ShapeStyle }
  | { type: 'arrow'; x1: number; y1: number; x2: number; y2: number; style: ShapeStyle }
  | { type: 'circle'; cx: number; cy: number; r: number; style: ShapeStyle }
  | {
      type: 'text';
      x: number;
      y: number;
      text: string;
      size: number;
      anchor: 'start' | 'middle' | 'end';
      weight?: 'normal' | 'bold';
    }
  | { type: 'dimension'; x1: number; y1: number; x2: number; y2: number; offset: number; text: string; size: number };

/** A drawing as plain data: millimetres, y growing downwards, within `viewBox`. */
export interface Drawing {
  title: string;
  viewBox: { x: number; y: number; width: number; height: number };
  shapes: Shape[];
  /** a drawing of several views (a bench's front, back and plan): where each is and the cases each shows */
  views?: DrawingView[];
}

/** One view of a drawing of several: its area in the drawing's coordinates and the cases it shows (by key). */
export interface DrawingView {
  key: 'front' | 'back' | 'plan';
  title: string;
  /** elevations: the cases whose fronts face the view; plan: every case */
  cases: string[];
  x: number;
  y: number;
  width: number;
  height: number;
}

function fmt(mm: number, unit: LengthUnit): string {
  return formatLength(mm, { unit });
}

/**
 * The front elevation of a build spec as drawing data: case outline,
 * partitions, doors (with hinge-side marks), drawer fronts, top, toe kick,
 * casters or feet, and overall dimensions.
 *
 * @example toSvg(elevationDrawing(designs.bookcase.defaults)) // to scale with the demo book's thicknesses
 * @example elevationDrawing(spec, { book, settings }) // with the shop's own materials
 */
export function elevationDrawing(
  spec: BuildSpec,
  options: { list?: CutList; book?: PriceBook; settings?: ShopSettings; unit?: LengthUnit } = {},
): Drawing {
  const unit = options.unit ?? options.settings?.units ?? 'in';
  // thicknesses come from the shop's price book; without one, from the demo book (the drawing is to scale, not priced)
  const list = options.list ?? cutList(spec, options.book ?? demoPriceBook, options.settings ?? demoSettings);
  const g: PieceGeometry = list.geometry;
  if (g.cases.some((c) => c.plan)) return arrangementDrawing(spec, g, unit);
  const H = g.heightMm;
  const W = g.widthMm;
  const Y = (yFromFloor: number) => H - yFromFloor;
  const size = Math.max(W, H) / 38;
  const shapes: Shape[] = [];
  for (const c of g.cases) {
    shapes.push({
      type: 'rect',
      x: c.xMm,
      y: Y(c.yMm + c.heightMm),
      width: c.widthMm,
      height: c.heightMm - c.toeKickMm,
      style: 'case',
    });
    if (c.toeKickMm > 0)
      shapes.push({
        type: 'rect',
        x: c.xMm + 20,
        y: Y(c.yMm + c.toeKickMm),
        width: c.widthMm - 40,
        height: c.toeKickMm,
        style: 'kick',
      });
    for (const px of c.partitionsXMm)
      shapes.push({
        type: 'line',
        x1: px,
        y1: Y(c.yMm + c.toeKickMm),
        x2: px,
        y2: Y(c.yMm + c.heightMm),
        style: 'guide',
      });
    for (const [sx, sy, sw] of c.shelvesMm)
      shapes.push({ type: 'line', x1: sx, y1: Y(sy), x2: sx + sw, y2: Y(sy), style: 'shelf' });
  }
  if (g.top)
    shapes.push({
      type: 'rect',
      x: g.top.xMm,
      y: Y(g.top.yMm + g.top.heightMm),
      width: g.top.widthMm,
      height: g.top.heightMm,
      style: 'top',
    });
  for (const f of g.fronts) {
    shapes.push({
      type: 'rect',
      x: f.xMm,
      y: Y(f.yMm + f.heightMm),
      width: f.widthMm,
      height: f.heightMm,
      style: 'front',
    });
    if (f.kind === 'door') {
      // the opening side meets at the hinge side: a thin chevron, as drawn on shop elevations
      const hx = f.hinge === 'right' ? f.xMm + f.widthMm : f.xMm;
      const ox = f.hinge === 'right' ? f.xMm : f.xMm + f.widthMm;
      shapes.push({
        type: 'line',
        x1: ox,
        y1: Y(f.yMm + f.heightMm),
        x2: hx,
        y2: Y(f.yMm + f.heightMm / 2),
        style: 'guide',
      });
      shapes.push({ type: 'line', x1: hx, y1: Y(f.yMm + f.heightMm / 2), x2: ox, y2: Y(f.yMm), style: 'guide' });
    } else {
      shapes.push({
        type: 'line',
        x1: f.xMm + f.widthMm / 2 - Math.min(64, f.widthMm / 4),
        y1: Y(f.yMm + f.heightMm / 2),
        x2: f.xMm + f.widthMm / 2 + Math.min(64, f.widthMm / 4),
        y2: Y(f.yMm + f.heightMm / 2),
        style: 'hardware',
      });
    }
  }
  for (const m of g.mobility) {
    if (m.kind === 'caster') {
      // a wheel under a short stem, drawn smaller than its height so neighbours never touch
      const r = Math.min(m.heightMm / 2.6, 45);
      shapes.push({ type: 'line', x1: m.xMm, y1: Y(m.heightMm), x2: m.xMm, y2: Y(2 * r), style: 'hardware' });
      shapes.push({ type: 'circle', cx: m.xMm, cy: Y(r), r, style: 'hardware' });
    } else
      shapes.push({ type: 'rect', x: m.xMm - 20, y: Y(m.heightMm), width: 40, height: m.heightMm, style: 'hardware' });
  }
  const gap = size * 1.6;
  shapes.push({ type: 'dimension', x1: 0, y1: H, x2: W, y2: H, offset: gap, text: fmt(W, unit), size });
  shapes.push({ type: 'dimension', x1: W, y1: 0, x2: W, y2: H, offset: gap, text: fmt(H, unit), size });
  shapes.push({
    type: 'text',
    x: 0,
    y: -size * 0.8,
    text: `${titleOf(spec)}: ${fmt(W, unit)} W x ${fmt(H, unit)} H x ${fmt(g.depthMm, unit)} D`,
    size,
    anchor: 'start',
    weight: 'bold',
  });
  const pad = size * 4;
  return {
    title: titleOf(spec),
    viewBox: { x: -pad / 2, y: -size * 2.5, width: W + pad * 1.5, height: H + size * 2.5 + pad },
    shapes,
  };
}

/**
 * A bench's arrangement in three views: the front and the back elevations
 * (each showing the fronts that face it, the cases behind in outline, the
 * top, and the casters and feet on that side) side by side, and below them
 * a plan of the cases under the top, each marked on the side it faces.
 */
function arrangementDrawing(spec: BuildSpec, g: PieceGeometry, unit: LengthUnit): Drawing {
  const W = g.widthMm;
  const H = g.heightMm;
  const D = g.depthMm;
  const size = Math.max(2 * W, H + D) / 60;
  const gap = size * 6;
  const shapes: Shape[] = [];
  const views: DrawingView[] = [];
  const title = (x: number, y: number, text: string) =>
    shapes.push({ type: 'text', x, y: y - size * 0.8, text, size, anchor: 'start', weight: 'bold' });

  const elevation = (view: 'front' | 'back', ox: number, oy: number) => {
    const Y = (yFromFloor: number) => oy + H - yFromFloor;
    const X = (planX: number, along: number) => (view === 'front' ? ox + planX : ox + W - planX - along);
    // the far cases first, so that the near ones are drawn over them
    const near = (yMm: number, across: number) => (view === 'front' ? -yMm : yMm + across);
    const cases = g.cases
      .filter((c) => c.plan)
      .sort((a, b) => near(a.plan!.yMm, a.plan!.acrossMm) - near(b.plan!.yMm, b.plan!.acrossMm));
    for (const c of cases) {
      const p = c.plan!;
      shapes.push({
        type: 'rect',
        x: X(p.xMm, p.alongMm),
        y: Y(c.yMm + c.heightMm),
        width: p.alongMm,
        height: c.heightMm,
        style: 'case',
      });
      if (c.facing !== view) continue;
      for (const px of c.partitionsXMm)
        shapes.push({
          type: 'line',
          x1: ox + px,
          y1: Y(c.yMm),
          x2: ox + px,
          y2: Y(c.yMm + c.heightMm),
          style: 'guide',
        });
      for (const [sx, sy, sw] of c.shelvesMm)
        shapes.push({ type: 'line', x1: ox + sx, y1: Y(sy), x2: ox + sx + sw, y2: Y(sy), style: 'shelf' });
    }
    if (g.top) {
      shapes.push({ type: 'rect', x: ox, y: Y(H), width: W, height: g.top.heightMm, style: 'top' });
      const tt = g.topTrimMm ?? 0;
      if (tt > 0)
        for (const x of [ox, ox + W - tt])
          shapes.push({ type: 'rect', x, y: Y(H), width: tt, height: g.top.heightMm, style: 'trim' });
    }
    for (const f of g.fronts.filter((f) => (f.face ?? 'front') === view)) {
      const fx = ox + f.xMm;
      shapes.push({
        type: 'rect',
        x: fx,
        y: Y(f.yMm + f.heightMm),
        width: f.widthMm,
        height: f.heightMm,
        style: 'front',
      });
      if (f.kind === 'door') {
        const hx = f.hinge === 'right' ? fx + f.widthMm : fx;
        const opening = f.hinge === 'right' ? fx : fx + f.widthMm;
        const mid = Y(f.yMm + f.heightMm / 2);
        shapes.push({ type: 'line', x1: opening, y1: Y(f.yMm + f.heightMm), x2: hx, y2: mid, style: 'guide' });
        shapes.push({ type: 'line', x1: hx, y1: mid, x2: opening, y2: Y(f.yMm), style: 'guide' });
      } else {
        const half = Math.min(64, f.widthMm / 4);
        const cx = fx + f.widthMm / 2;
        const cy = Y(f.yMm + f.heightMm / 2);
        shapes.push({ type: 'line', x1: cx - half, y1: cy, x2: cx + half, y2: cy, style: 'hardware' });
      }
    }
    // casters and feet on this view's half of the bench
    for (const m of g.mobility.filter((m) => (m.yMm ?? 0) < D / 2 === (view === 'front'))) {
      const x = view === 'front' ? ox + m.xMm : ox + W - m.xMm;
      if (m.kind === 'caster') {
        const r = Math.min(m.heightMm / 2.6, 45);
        shapes.push({ type: 'line', x1: x, y1: Y(m.heightMm), x2: x, y2: Y(2 * r), style: 'hardware' });
        shapes.push({ type: 'circle', cx: x, cy: Y(r), r, style: 'hardware' });
      } else {
        const block = m.blockMm ?? 0;
        const clear = Math.max(0, g.feetClearanceMm ?? 0);
        if (block > 0)
          shapes.push({ type: 'rect', x: x - 50, y: Y(m.heightMm), width: 100, height: block, style: 'part' });
        shapes.push({
          type: 'rect',
          x: x - 20,
          y: Y(m.heightMm - block),
          width: 40,
          height: Math.max(1, m.heightMm - block - clear),
          style: 'hardware',
        });
      }
    }
    const facing = g.cases.filter((c) => c.facing === view && c.key).map((c) => c.key!);
    const name = view === 'front' ? 'Front elevation' : 'Back elevation';
    title(ox, oy, name);
    views.push({ key: view, title: name, cases: facing, x: ox, y: oy, width: W, height: H });
  };
  elevation('front', 0, 0);
  elevation('back', W + gap, 0);
  shapes.push({ type: 'dimension', x1: 0, y1: H, x2: W, y2: H, offset: size * 1.6, text: fmt(W, unit), size });
  shapes.push({ type: 'dimension', x1: W, y1: 0, x2: W, y2: H, offset: size * 1.6, text: fmt(H, unit), size });

  // the plan: the top's outline, the cases under it, the front at the bottom
  const oy = H + gap + size * 2;
  const PY = (yMm: number) => oy + D - yMm;
  shapes.push({ type: 'rect', x: 0, y: oy, width: W, height: D, style: 'guide' });
  const tt = g.topTrimMm ?? 0;
  if (tt > 0) shapes.push({ type: 'rect', x: tt, y: oy + tt, width: W - 2 * tt, height: D - 2 * tt, style: 'guide' });
  const planCases: string[] = [];
  g.cases.forEach((c, i) => {
    const p = c.plan;
    if (!p) return;
    planCases.push(c.key ?? `c${i + 1}`);
    const x0 = p.xMm;
    const y0 = PY(p.yMm + p.acrossMm);
    shapes.push({ type: 'rect', x: x0, y: y0, width: p.alongMm, height: p.acrossMm, style: 'case' });
    // a strip along the face the doors and drawers are on
    const strip = Math.min(25, p.acrossMm / 8, p.alongMm / 8);
    const face = {
      front: { x: x0, y: y0 + p.acrossMm - strip, width: p.alongMm, height: strip },
      back: { x: x0, y: y0, width: p.alongMm, height: strip },
      left: { x: x0, y: y0, width: strip, height: p.acrossMm },
      right: { x: x0 + p.alongMm - strip, y: y0, width: strip, height: p.acrossMm },
    }[c.facing ?? 'front'];
    shapes.push({ type: 'rect', ...face, style: 'front' });
    shapes.push({
      type: 'text',
      x: x0 + p.alongMm / 2,
      y: y0 + p.acrossMm / 2 + size * 0.35,
      text: `Case ${i + 1}, facing ${c.facing ?? 'front'}`,
      size: Math.min(size, p.alongMm / 12),
      anchor: 'middle',
    });
  });
  for (const m of g.mobility) {
    const x = m.xMm;
    const y = PY(m.yMm ?? 0);
    if (m.kind === 'caster') shapes.push({ type: 'circle', cx: x, cy: y, r: 30, style: 'hardware' });
    else shapes.push({ type: 'rect', x: x - 25, y: y - 25, width: 50, height: 50, style: 'hardware' });
  }
  shapes.push({ type: 'dimension', x1: W, y1: oy, x2: W, y2: oy + D, offset: size * 1.6, text: fmt(D, unit), size });
  shapes.push({ type: 'text', x: W / 2, y: oy + D + size * 1.6, text: 'front', size, anchor: 'middle' });
  title(0, oy, 'Plan of the cases under the top');
  views.push({
    key: 'plan',
    title: 'Plan of the cases under the top',
    cases: planCases,
    x: 0,
    y: oy,
    width: W,
    height: D,
  });

  shapes.push({
    type: 'text',
    x: 0,
    y: -size * 2.4,
    text: `${titleOf(spec)}: ${fmt(W, unit)} W x ${fmt(H, unit)} H x ${fmt(D, unit)} D`,
    size,
    anchor: 'start',
    weight: 'bold',
  });
  const pad = size * 4;
  return {
    title: titleOf(spec),
    viewBox: { x: -pad / 2, y: -size * 4, width: 2 * W + gap + pad * 1.5, height: oy + D + size * 4 + pad },
    shapes,
    views,
  };
}

function titleOf(spec: BuildSpec): string {
  return {
    'assembly-bench': 'Assembly bench',
    'base-cabinet': 'Base cabinet',
    'wall-cabinet': 'Wall cabinet',
    bookcase: 'Bookcase',
  }[spec.design];
}

/**
 * One sheet of a layout to scale: each part outlined and labelled with its
 * name and size, a grain arrow on grain-bound parts, offcuts hatched, the
 * cuts numbered in order, and the sheet's size and yield.
 *
 * @example toSvg(sheetLayoutDrawing(result.sheets[0], parts, { title: '3/4 in birch plywood, sheet 1 of 3' }))
 */
export function sheetLayoutDrawing(
  sheet: SheetLayout,
  parts: readonly NestPart[],
  options: { title?: string; unit?: LengthUnit } = {},
): Drawing {
  const unit = options.unit ?? 'in';
  const L = sheet.lengthMm;
  const Wd = sheet.widthMm;
  const size = L / 70;
  const byId = new Map(parts.map((p) => [p.id, p]));
  const shapes: Shape[] = [{ type: 'rect', x: 0, y: 0, width: L, height: Wd, style: 'sheet' }];
  // what cut numbers must not cover: the parts' names and sizes, and the numbers already placed
  const textBoxes: Box[] = [];
  const smallParts: { n: number; text: string }[] = [];
  // an offcut's label is drawn last, and only where no cut number had to go
  const offcutLabels: { shape: Shape; box: Box }[] = [];
  for (const o of sheet.offcuts) {
    shapes.push({ type: 'rect', x: o.xMm, y: o.yMm, width: o.lengthMm, height: o.widthMm, style: 'offcut' });
    if (o.lengthMm > size * 8 && o.widthMm > size * 2.2) {
      const text = `offcut ${fmt(o.lengthMm, unit)} x ${fmt(o.widthMm, unit)}`;
      const cx = o.xMm + o.lengthMm / 2;
      const cy = o.yMm + o.widthMm / 2;
      const w = text.length * 0.55 * size * 0.8;
      offcutLabels.push({
        shape: { type: 'text', x: cx, y: cy + size * 0.35, text, size: size * 0.8, anchor: 'middle' },
        box: { x: cx - w / 2, y: cy - size * 0.5, width: w, height: size },
      });
    }
  }
  for (const p of sheet.placements) {
    const part = byId.get(p.partId);
    shapes.push({ type: 'rect', x: p.xMm, y: p.yMm, width: p.lengthMm, height: p.widthMm, style: 'part' });
    const cx = p.xMm + p.lengthMm / 2;
    const cy = p.yMm + p.widthMm / 2;
    const name = part?.name ?? p.partId;
    const sizeText = `${fmt(part?.lengthMm ?? p.lengthMm, unit)} x ${fmt(part?.widthMm ?? p.widthMm, unit)}`;
    // text shrinks to fit the part (about 0.55 em a character); a part too small for legible text gets a number
    // and a line in the key under the sheet
    const longest = Math.max(name.length, sizeText.length);
    const s = Math.min(size, p.lengthMm / (longest * 0.55 + 1), p.widthMm / 2.6);
    if (s >= size * 0.45) {
      shapes.push({ type: 'text', x: cx, y: cy - s * 0.15, text: name, size: s, anchor: 'middle', weight: 'bold' });
      shapes.push({ type: 'text', x: cx, y: cy + s * 1.05, text: sizeText, size: s * 0.85, anchor: 'middle' });
      const w = longest * 0.55 * s;
      textBoxes.push({ x: cx - w / 2, y: cy - s * 1.15, width: w, height: s * 2.45 });
    } else {
      const n = smallParts.length + 1;
      const ns = Math.min(size * 0.8, p.widthMm * 0.8, p.lengthMm / (String(n).length * 0.6 + 0.4));
      shapes.push({
        type: 'text',
        x: cx,
        y: cy + ns * 0.35,
        text: String(n),
        size: ns,
        anchor: 'middle',
        weight: 'bold',
      });
      textBoxes.push({ x: cx - ns * 0.4, y: cy - ns * 0.5, width: ns * 0.8, height: ns });
      smallParts.push({ n, text: `Part ${n}: ${name}, ${sizeText}` });
    }
    if (part && !part.canRotate) {
      // grain runs along the part's length, which is along the sheet's length when unrotated
      const len = Math.min(p.lengthMm * 0.5, size * 6);
      const ay = p.yMm + Math.min(p.widthMm * 0.2, size * 1.2) + size * 0.3;
      shapes.push({ type: 'arrow', x1: cx - len / 2, y1: ay, x2: cx + len / 2, y2: ay, style: 'guide' });
    }
  }
  const numberBoxes: Box[] = [];
  for (const c of sheet.cuts) {
    shapes.push({ type: 'line', x1: c.x1Mm, y1: c.y1Mm, x2: c.x2Mm, y2: c.y2Mm, style: 'cut' });
    // the cut's number sits near its start, where the saw enters, moved along the cut until it covers no other
    // number and no part's name or size
    const r = size * 0.55;
    const { cx, cy } = cutNumberSpot(c, r, textBoxes, numberBoxes);
    textBoxes.push({ x: cx - r, y: cy - r, width: 2 * r, height: 2 * r });
    numberBoxes.push({ x: cx - r, y: cy - r, width: 2 * r, height: 2 * r });
    shapes.push({ type: 'circle', cx, cy, r, style: 'cut' });
    shapes.push({
      type: 'text',
      x: cx,
      y: cy + r * 0.4,
      text: String(c.order),
      size: r * 1.1,
      anchor: 'middle',
      weight: 'bold',
    });
  }
  for (const l of offcutLabels) if (!numberBoxes.some((b) => boxesMeet(b, l.box))) shapes.push(l.shape);
  const title = options.title ?? 'Sheet layout';
  shapes.push({
    type: 'text',
    x: 0,
    y: -size * 0.8,
    text: `${title}: ${fmt(L, unit)} x ${fmt(Wd, unit)}, yield ${(sheet.yieldRatio * 100).toFixed(0)}%`,
    size: size * 1.1,
    anchor: 'start',
    weight: 'bold',
  });
  shapes.push({
    type: 'text',
    x: 0,
    y: Wd + size * 1.6,
    text: 'Numbers give the cut order; hatched areas are offcuts; arrows show the grain.',
    size: size * 0.8,
    anchor: 'start',
  });
  // the key to the numbered small parts, in columns under the legend
  const perColumn = Math.max(1, Math.ceil(smallParts.length / 3));
  smallParts.forEach((k, i) => {
    shapes.push({
      type: 'text',
      x: Math.floor(i / perColumn) * (L / 3),
      y: Wd + size * (2.8 + (i % perColumn) * 1.05),
      text: k.text,
      size: size * 0.75,
      anchor: 'start',
    });
  });
  const keyHeight = smallParts.length > 0 ? size * (1.2 + perColumn * 1.05) : 0;
  return {
    title,
    viewBox: { x: -size, y: -size * 2.5, width: L + 2 * size, height: Wd + size * 5 + keyHeight },
    shapes,
  };
}

interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

function boxesMeet(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

function circleHitsBox(cx: number, cy: number, r: number, b: Box): boolean {
  const nx = Math.max(b.x, Math.min(cx, b.x + b.width));
  const ny = Math.max(b.y, Math.min(cy, b.y + b.height));
  return (cx - nx) ** 2 + (cy - ny) ** 2 < r * r;
}

/** Where a cut's number goes: the first spot along the cut, from the saw's entry, that covers nothing already drawn. */
function cutNumberSpot(
  c: { direction: string; x1Mm: number; y1Mm: number; x2Mm: number; y2Mm: number },
  r: number,
  taken: readonly Box[],
  numbers: readonly Box[],
): { cx: number; cy: number } {
  const length = Math.hypot(c.x2Mm - c.x1Mm, c.y2Mm - c.y1Mm);
  const ux = length > 0 ? (c.x2Mm - c.x1Mm) / length : 1;
  const uy = length > 0 ? (c.y2Mm - c.y1Mm) / length : 0;
  const first = { cx: c.x1Mm + ux * r * 1.3, cy: c.y1Mm + uy * r * 1.3 };
  // on the cut first; then beside it, either side, for a short cut crowded by its neighbours
  // (a crowded spot may, at last, cover a part's text, never another number)
  for (const free of [taken, numbers]) {
    for (const aside of [0, 1.2, -1.2, 2.4, -2.4, 3.6, -3.6]) {
      for (let along = r * 1.3; along <= Math.max(r * 1.3, length - r); along += r * 0.75) {
        const cx = c.x1Mm + ux * along - uy * aside * r;
        const cy = c.y1Mm + uy * along + ux * aside * r;
        if (!free.some((b) => circleHitsBox(cx, cy, r * 1.05, b))) return { cx, cy };
      }
    }
  }
  return first;
}

const INK = '#231c15';
const STROKE: Record<ShapeStyle, { stroke: string; width: number; fill: string; dash?: string }> = {
  case: { stroke: INK, width: 1.6, fill: '#f1ebe0' },
  front: { stroke: INK, width: 1.2, fill: '#ffffff' },
  top: { stroke: INK, width: 1.6, fill: '#e3d6c1' },
  kick: { stroke: INK, width: 1, fill: '#d9d2c7' },
  hardware: { stroke: INK, width: 1.4, fill: '#ffffff' },
  sheet: { stroke: INK, width: 1.6, fill: '#ffffff' },
  part: { stroke: INK, width: 1.1, fill: '#f6f1e7' },
  offcut: { stroke: INK, width: 0.6, fill: 'url(#bw-hatch)' },
  trim: { stroke: INK, width: 1, fill: '#cdb79a' },
  cut: { stroke: INK, width: 0.7, fill: '#ffffff', dash: '6 4' },
  guide: { stroke: INK, width: 0.7, fill: 'none', dash: '10 6' },
  shelf: { stroke: INK, width: 1, fill: 'none' },
};

function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

function n(v: number): string {
  return (Math.round(v * 10) / 10).toString();
}

/**
 * A standalone SVG string for a drawing: strokes scale with the drawing,
 * hatching for offcuts, readable in print and in black and white.
 *
 * @example toSvg(elevationDrawing(spec, list)).startsWith('<svg') // true
 */
export function toSvg(drawing: Drawing, options: { widthPx?: number } = {}): string {
  const vb = drawing.viewBox;
  const scale = vb.width / 800; // stroke widths are given for an 800 px wide drawing
  const widthPx = options.widthPx ?? 800;
  const heightPx = Math.round((widthPx * vb.height) / vb.width);
  const attrs = (style: ShapeStyle, fill = true) => {
    const s = STROKE[style];
    return `stroke="${s.stroke}" stroke-width="${n(s.width * scale)}" fill="${fill ? s.fill : 'none'}"${
      s.dash
        ? ` stroke-dasharray="${s.dash
            .split(' ')
            .map((d) => n(Number(d) * scale))
            .join(' ')}"`
        : ''
    }`;
  };
  const out: string[] = [];
  for (const sh of drawing.shapes) {
    switch (sh.type) {
      case 'rect':
        out.push(
          `<rect x="${n(sh.x)}" y="${n(sh.y)}" width="${n(sh.width)}" height="${n(sh.height)}" ${attrs(sh.style)}/>`,
        );
        break;
      case 'line':
        out.push(
          `<line x1="${n(sh.x1)}" y1="${n(sh.y1)}" x2="${n(sh.x2)}" y2="${n(sh.y2)}" ${attrs(sh.style, false)}/>`,
        );
        break;
      case 'arrow':
        out.push(
          `<line x1="${n(sh.x1)}" y1="${n(sh.y1)}" x2="${n(sh.x2)}" y2="${n(sh.y2)}" ${attrs(sh.style, false)} marker-end="url(#bw-arrow)"/>`,
        );
        break;
      case 'circle':
        out.push(`<circle cx="${n(sh.cx)}" cy="${n(sh.cy)}" r="${n(sh.r)}" ${attrs(sh.style)}/>`);
        break;
      case 'text':
        out.push(
          `<text x="${n(sh.x)}" y="${n(sh.y)}" font-size="${n(sh.size)}" text-anchor="${sh.anchor}"${sh.weight === 'bold' ? ' font-weight="600"' : ''} fill="${INK}">${esc(sh.text)}</text>`,
        );
        break;
      case 'dimension': {
        const horizontal = Math.abs(sh.y1 - sh.y2) < 1e-6;
        const [ax, ay, bx, by] = horizontal
          ? [sh.x1, sh.y1 + sh.offset, sh.x2, sh.y2 + sh.offset]
          : [sh.x1 + sh.offset, sh.y1, sh.x2 + sh.offset, sh.y2];
        const tick = sh.size * 0.5;
        const w = n(0.8 * scale);
        out.push(`<line x1="${n(ax)}" y1="${n(ay)}" x2="${n(bx)}" y2="${n(by)}" stroke="${INK}" stroke-width="${w}"/>`);
        const ends: [number, number][] = [
          [ax, ay],
          [bx, by],
        ];
        for (const [x, y] of ends) {
          out.push(
            horizontal
              ? `<line x1="${n(x)}" y1="${n(y - tick)}" x2="${n(x)}" y2="${n(y + tick)}" stroke="${INK}" stroke-width="${w}"/>`
              : `<line x1="${n(x - tick)}" y1="${n(y)}" x2="${n(x + tick)}" y2="${n(y)}" stroke="${INK}" stroke-width="${w}"/>`,
          );
        }
        const mx = (ax + bx) / 2;
        const my = (ay + by) / 2;
        out.push(
          horizontal
            ? `<text x="${n(mx)}" y="${n(my + sh.size * 1.2)}" font-size="${n(sh.size)}" text-anchor="middle" fill="${INK}">${esc(sh.text)}</text>`
            : `<text x="${n(mx + sh.size * 0.6)}" y="${n(my)}" font-size="${n(sh.size)}" text-anchor="start" fill="${INK}">${esc(sh.text)}</text>`,
        );
        break;
      }
    }
  }
  const hatch = n(12 * scale);
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(vb.x)} ${n(vb.y)} ${n(vb.width)} ${n(vb.height)}" width="${widthPx}" height="${heightPx}" font-family="'Source Sans 3', 'Source Sans Pro', sans-serif" role="img" aria-label="${esc(drawing.title)}">`,
    `<title>${esc(drawing.title)}</title>`,
    `<defs><pattern id="bw-hatch" patternUnits="userSpaceOnUse" width="${hatch}" height="${hatch}" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="${hatch}" stroke="${INK}" stroke-width="${n(1.2 * scale)}"/></pattern>`,
    `<marker id="bw-arrow" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="6" markerHeight="6" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="${INK}"/></marker></defs>`,
    ...out,
    '</svg>',
  ].join('\n');
}
