/**
 * The job paper's machining drawings as plain data: each part that has
 * machining or banded edges drawn flat, to scale, in the part's own
 * millimetres, with every feature located from an edge or end a builder can
 * measure from. The shop app (SVG) and the traveller PDF (react-pdf) both
 * draw this model, so the screen and the paper cannot differ.
 *
 * The part lies with its length across the drawing (x, from 0 to the
 * length) and its width down it (y, from 0 to the width, growing
 * downwards). An upright part (side, partition, door) has its bottom end at
 * the left and its top end at the right; a part running left to right keeps
 * its left end at the left. The front (or hinge, or bottom) edge is the
 * lower edge; the back (or opening, or top) edge the upper one. Each named
 * edge and end is labelled on the drawing.
 *
 * Not in the browser geometry bundle: the shop app imports it on its own
 * (`@benchwright/pricing/part-drawing`).
 */
import type { DadoOp, HingeCupOp, Machining, PartEdge, PocketHoleOp, ShelfPinRowOp } from './machining';
import type { Traveller, TravellerPart } from './traveller';
import { formatLength, type LengthUnit } from './units';

export type PartShape =
  /** the part's outline (with its notches), closed */
  | { type: 'outline'; points: [number, number][] }
  /** a dado, rabbet or groove seen from its face: a hatched band */
  | { type: 'cut'; x: number; y: number; width: number; height: number }
  /** a banded edge: a thick line along it */
  | { type: 'band'; x1: number; y1: number; x2: number; y2: number }
  /** a bore (hinge cup, shelf pin) at its true diameter, or larger for a pin hole too small to see */
  | { type: 'hole'; cx: number; cy: number; r: number }
  /** a pocket hole seen from its face: a slot running out at the end it fastens through */
  | { type: 'pocket'; x: number; y: number; width: number; height: number }
  /** `dim`: a dimension line; `ext`: an extension line; `centre`: a centre line or a row of holes */
  | { type: 'line'; x1: number; y1: number; x2: number; y2: number; style: 'dim' | 'ext' | 'centre' }
  /** a callout: the number of a note, in a circle */
  | { type: 'tag'; cx: number; cy: number; r: number; text: string }
  /**
   * Text at its baseline; `vertical` reads upwards (turned -90 degrees about x, y). `role`: a dimension's figure,
   * an edge's name, or the number in a tag.
   */
  | {
      type: 'text';
      x: number;
      y: number;
      text: string;
      size: number;
      anchor: 'start' | 'middle' | 'end';
      vertical?: boolean;
      role: 'dimension' | 'edge' | 'tag';
    };

export type PartText = Extract<PartShape, { type: 'text' }>;

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** One drawing: a part (or several identical ones) with its notes. */
export interface PartDrawing {
  /** stable within a traveller */
  key: string;
  name: string;
  /** units to make for the whole job (identical parts of every piece drawn once) */
  quantity: number;
  /** the pieces (and cases) it is part of, as "Base cabinet 2" or "Rolling assembly bench, case 3" */
  where: string[];
  /** finished size: length x width x thickness, in the shop's units */
  size: string;
  materialName: string;
  viewBox: Box;
  /** the text size, in the drawing's millimetres; line widths follow it */
  textSize: number;
  shapes: PartShape[];
  /** what is done to the part, numbered as the tags on the drawing, each located in words */
  notes: string[];
}

/** About how wide a character of the drawing's sans-serif is, in ems (Source Sans 3 is narrower; common practice). */
const CHAR_EM = 0.56;

/** The box a text covers (for overlap checks). */
export function textBox(t: PartText): Box {
  const long = t.text.length * CHAR_EM * t.size;
  const start = t.anchor === 'start' ? 0 : t.anchor === 'middle' ? -long / 2 : -long;
  // from the baseline: 0.8 em above (cap height and accents), 0.25 em below (descenders)
  if (t.vertical) return { x: t.x - 0.8 * t.size, y: t.y - start - long, width: 1.05 * t.size, height: long };
  return { x: t.x + start, y: t.y - 0.8 * t.size, width: long, height: 1.05 * t.size };
}

export function boxesOverlap(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

const r1 = (v: number) => Math.round(v * 10) / 10;

/**
 * A length as the drawings write it: inches to 1/32 (as a dado is set), or
 * millimetres to one decimal where not whole (a hinge cup's 22.5 mm must not
 * read 23).
 * @example drawingLength(22.225, 'in') // '7/8"'
 * @example drawingLength(22.5, 'mm') // '22.5 mm'
 */
export function drawingLength(mm: number, unit: LengthUnit): string {
  if (unit === 'in') return formatLength(mm, { unit: 'in', denominator: 32 });
  const v = r1(mm);
  return `${Number.isInteger(v) ? v : v.toFixed(1)} mm`;
}

/**
 * Whether a part is drawn: it has machining beyond nothing, or banded edges. A traveller recorded before parts
 * carried their machining has none to draw (its record is kept as it was).
 */
export function isDrawn(part: Pick<TravellerPart, 'machining'>): boolean {
  return (part.machining ?? []).length > 0;
}

// ---- where a part's named edges and ends lie on the drawing ----

interface Side {
  axis: 'x' | 'y';
  /** the edge's coordinate */
  at: number;
  /** +1 or -1: into the part */
  into: 1 | -1;
  /** as the notes say it: "bottom end", "front edge" */
  words: string;
}

function edgesNamed(ops: readonly Machining[]): Set<PartEdge> {
  const s = new Set<PartEdge>();
  for (const o of ops) {
    if (o.kind === 'band') o.edges.forEach((e) => s.add(e));
    else if (o.kind === 'dado' || o.kind === 'rabbet' || o.kind === 'groove') s.add(o.fromEdge);
    else if (o.kind === 'pocket_holes') {
      o.at.forEach((e) => s.add(e));
      if (o.fromEdge && o.centresMm) s.add(o.fromEdge);
    } else if (o.kind === 'shelf_pin_row') s.add(o.fromEdge);
    else if (o.kind === 'hinge_cup') s.add('hinge');
  }
  return s;
}

/**
 * Whether `top` and `bottom` are the part's long edges (a drawer box side or a
 * drawer front, which run left to right or front to back) rather than its
 * ends (a side, a partition, a door). The machining says which: a groove
 * from the bottom runs along the part; a dado, shelf pins, hinge cups and a
 * toe kick are measured along it from the bottom end.
 */
function topBottomAreEdges(ops: readonly Machining[]): boolean {
  const named = edgesNamed(ops);
  if (named.has('left') || named.has('right')) return true;
  for (const o of ops) {
    if (o.kind === 'groove' && (o.fromEdge === 'top' || o.fromEdge === 'bottom')) return true;
    if ((o.kind === 'dado' || o.kind === 'rabbet') && (o.fromEdge === 'top' || o.fromEdge === 'bottom')) return false;
    if (o.kind === 'shelf_pin_row' || o.kind === 'hinge_cup' || o.kind === 'toe_kick_notch') return false;
    // pocket holes at the top and bottom: they are ends (a partition's)
    if (o.kind === 'pocket_holes' && (o.at.includes('top') || o.at.includes('bottom'))) return false;
  }
  return !(named.has('front') || named.has('back') || named.has('hinge') || named.has('opening'));
}

function sides(L: number, W: number, ops: readonly Machining[]): (e: PartEdge) => Side {
  const tbEdges = topBottomAreEdges(ops);
  return (e) => {
    switch (e) {
      case 'left':
        return { axis: 'x', at: 0, into: 1, words: 'left end' };
      case 'right':
        return { axis: 'x', at: L, into: -1, words: 'right end' };
      case 'bottom':
        return tbEdges
          ? { axis: 'y', at: W, into: -1, words: 'bottom edge' }
          : { axis: 'x', at: 0, into: 1, words: 'bottom end' };
      case 'top':
        return tbEdges
          ? { axis: 'y', at: 0, into: 1, words: 'top edge' }
          : { axis: 'x', at: L, into: -1, words: 'top end' };
      case 'front':
        return { axis: 'y', at: W, into: -1, words: 'front edge' };
      case 'back':
        return { axis: 'y', at: 0, into: 1, words: 'back edge' };
      case 'hinge':
        return { axis: 'y', at: W, into: -1, words: 'hinge edge' };
      case 'opening':
        return { axis: 'y', at: 0, into: 1, words: 'opening edge' };
    }
  };
}

// ---- dimensions, stacked in tiers so their figures never meet ----

interface Dim {
  /** along x (measured below the part) or along y (measured to its right) */
  axis: 'x' | 'y';
  from: number;
  to: number;
  /** where the extension lines start: the feature's other coordinate */
  foot: number;
  text: string;
}

/**
 * Places the dimensions: along-x ones in tiers under the part, along-y ones
 * in tiers to its right, the shortest nearest; a tier takes a dimension only
 * where neither its line nor its figure meets what the tier already holds.
 */
function placeDims(dims: Dim[], L: number, W: number, s: number, below0: number, right0: number): PartShape[] {
  const out: PartShape[] = [];
  const gap = s * 0.5;
  const step = s * 1.9;
  const seen = new Set<string>();
  const unique = dims.filter((d) => {
    const k = `${d.axis}:${r1(Math.min(d.from, d.to))}:${r1(Math.max(d.from, d.to))}`;
    if (seen.has(k) || Math.abs(d.to - d.from) < 0.05) return false;
    seen.add(k);
    return true;
  });
  for (const axis of ['x', 'y'] as const) {
    const tiers: [number, number][][] = [];
    const mine = unique
      .filter((d) => d.axis === axis)
      .sort((a, b) => Math.abs(a.to - a.from) - Math.abs(b.to - b.from) || a.from - b.from);
    for (const d of mine) {
      const lo = Math.min(d.from, d.to);
      const hi = Math.max(d.from, d.to);
      const long = d.text.length * CHAR_EM * s;
      const mid = (lo + hi) / 2;
      const span: [number, number] = [Math.min(lo, mid - long / 2) - gap, Math.max(hi, mid + long / 2) + gap];
      let k = tiers.findIndex((t) => t.every(([a, b]) => span[1] <= a || b <= span[0]));
      if (k < 0) k = tiers.push([]) - 1;
      tiers[k]!.push(span);
      if (axis === 'x') {
        const y = below0 + k * step + s * 0.9;
        out.push({ type: 'line', x1: lo, y1: d.foot, x2: lo, y2: y + s * 0.3, style: 'ext' });
        out.push({ type: 'line', x1: hi, y1: d.foot, x2: hi, y2: y + s * 0.3, style: 'ext' });
        out.push({ type: 'line', x1: lo, y1: y, x2: hi, y2: y, style: 'dim' });
        out.push({ type: 'text', x: mid, y: y - s * 0.25, text: d.text, size: s, anchor: 'middle', role: 'dimension' });
      } else {
        const x = right0 + k * step + s * 0.9;
        out.push({ type: 'line', x1: d.foot, y1: lo, x2: x + s * 0.3, y2: lo, style: 'ext' });
        out.push({ type: 'line', x1: d.foot, y1: hi, x2: x + s * 0.3, y2: hi, style: 'ext' });
        out.push({ type: 'line', x1: x, y1: lo, x2: x, y2: hi, style: 'dim' });
        out.push({
          type: 'text',
          x: x - s * 0.25,
          y: mid,
          text: d.text,
          size: s,
          anchor: 'middle',
          vertical: true,
          role: 'dimension',
        });
      }
    }
  }
  return out;
}

// ---- one part ----

const FACE_WORDS: Record<string, string> = {
  inside: 'inside face',
  outside: 'outside face',
  left: 'left face',
  right: 'right face',
  top: 'top face',
  underside: 'underside',
};

const only = (o: { only?: string }) => (o.only ? ` (on the ${o.only} one only)` : '');

/**
 * The drawing of one part: outline, cuts, bores, pocket holes, banded
 * edges, dimension lines in tiers and numbered notes.
 *
 * @example partDrawing(door, 'in').notes[0] // 'Band the top end, bottom end, hinge edge and opening edge.'
 */
export function partDrawing(
  part: Pick<TravellerPart, 'lengthMm' | 'widthMm' | 'machining'>,
  unit: LengthUnit,
): Pick<PartDrawing, 'viewBox' | 'textSize' | 'shapes' | 'notes'> {
  const L = part.lengthMm;
  const W = part.widthMm;
  const ops = part.machining ?? [];
  const side = sides(L, W, ops);
  const len = (mm: number) => drawingLength(mm, unit);
  // text about a 29th of the drawing's width: 12 px on a phone's 375 px screen, 9 pt in a PDF column
  // (a part wider than long is drawn taller than wide: its text follows its width, so a drawing fitted to a
  // page's height keeps it legible)
  const s = Math.max(L / 20, W / 24);
  const shapes: PartShape[] = [];
  const marks: PartShape[] = [];
  const dims: Dim[] = [];
  const notes: string[] = [];
  /** where the tags go: a feature's preferred spots, tried in turn */
  const tagSpots: { n: number; spots: [number, number][] }[] = [];
  const note = (text: string, spots: [number, number][] = []) => {
    notes.push(text);
    if (spots.length) tagSpots.push({ n: notes.length, spots });
  };

  // the outline, with the toe-kick notch cut from the front-bottom corner
  const notch = ops.find((o) => o.kind === 'toe_kick_notch');
  if (notch) {
    const h = notch.heightMm;
    const d = notch.depthMm;
    shapes.push({
      type: 'outline',
      points: [
        [0, 0],
        [L, 0],
        [L, W],
        [h, W],
        [h, W - d],
        [0, W - d],
      ],
    });
    dims.push({ axis: 'x', from: 0, to: h, foot: W - d, text: len(h) });
    dims.push({ axis: 'y', from: W - d, to: W, foot: h, text: len(d) });
    note(`Toe-kick notch: cut out ${len(h)} up from the bottom end and ${len(d)} in from the front edge.`, [
      [h / 2, W - d / 2],
    ]);
  } else {
    shapes.push({
      type: 'outline',
      points: [
        [0, 0],
        [L, 0],
        [L, W],
        [0, W],
      ],
    });
  }

  for (const o of ops) {
    if (o.kind === 'band') {
      for (const e of o.edges) {
        const sd = side(e);
        if (sd.axis === 'x')
          marks.push({ type: 'band', x1: sd.at, y1: 0, x2: sd.at, y2: notch && sd.at === 0 ? W - notch.depthMm : W });
        else
          marks.push({
            type: 'band',
            x1: notch && sd.at === W ? notch.heightMm : 0,
            y1: sd.at,
            x2: L,
            y2: sd.at,
          });
      }
      const words = o.edges.map((e) => side(e).words);
      notes.unshift(`Band the ${listWords(words)} (thick line).`);
      // the band's note comes first; the tags already planned move one number on
      tagSpots.forEach((t) => t.n++);
    }
  }
  for (const o of ops) {
    if (o.kind === 'dado' || o.kind === 'rabbet' || o.kind === 'groove') cutShapes(o);
    else if (o.kind === 'shelf_pin_row') continue;
    else if (o.kind === 'hinge_cup') cups(o);
    else if (o.kind === 'pocket_holes') pockets(o);
  }
  pinRows(ops.filter((o): o is ShelfPinRowOp => o.kind === 'shelf_pin_row'));

  function cutShapes(o: DadoOp) {
    const sd = side(o.fromEdge);
    const what = o.kind === 'groove' ? 'Groove' : o.kind === 'rabbet' ? 'Rabbet' : 'Dado';
    const near = sd.at + sd.into * o.distanceMm;
    const far = near + sd.into * o.widthMm;
    const where = o.distanceMm > 1e-6 ? `${len(o.distanceMm)} from the ${sd.words}` : `at the ${sd.words}`;
    if (sd.axis === 'x') {
      // across the part; a stopped one runs from the front (lower) edge
      const run = Math.min(o.lengthMm, W);
      const stopped = run < W - 0.5;
      shapes.push({ type: 'cut', x: Math.min(near, far), y: W - run, width: Math.abs(far - near), height: run });
      if (o.distanceMm > 1e-6) dims.push({ axis: 'x', from: sd.at, to: near, foot: W, text: len(o.distanceMm) });
      if (stopped) dims.push({ axis: 'y', from: W - run, to: W, foot: Math.max(near, far), text: len(run) });
      note(
        `${what} for the ${o.for}, ${FACE_WORDS[o.face]}: ${len(o.widthMm)} wide, ${len(o.depthMm)} deep, ${where}` +
          `${stopped ? `, stopped: running ${len(run)} in from the ${side('front').words}` : ''}${only(o)}.`,
        [0.5, 0.3, 0.7].map((f) => [(near + far) / 2, W - run * f]),
      );
    } else {
      // along the part; a stopped one runs from the end at the left of the drawing (the bottom or left end)
      const startEnd = side('bottom').axis === 'x' ? side('bottom') : side('left');
      const run = Math.min(o.lengthMm, L);
      const stopped = run < L - 0.5;
      shapes.push({ type: 'cut', x: 0, y: Math.min(near, far), width: run, height: Math.abs(far - near) });
      if (o.distanceMm > 1e-6) dims.push({ axis: 'y', from: sd.at, to: near, foot: L, text: len(o.distanceMm) });
      if (stopped) dims.push({ axis: 'x', from: 0, to: run, foot: Math.max(near, far), text: len(run) });
      note(
        `${what} for the ${o.for}, ${FACE_WORDS[o.face]}: ${len(o.widthMm)} wide, ${len(o.depthMm)} deep, ${where}` +
          `${stopped ? `, stopped: running ${len(run)} in from the ${startEnd.words}` : ''}${only(o)}.`,
        [0.5, 0.3, 0.7].map((f) => [run * f, (near + far) / 2]),
      );
    }
  }

  function cups(o: HingeCupOp) {
    const sd = side('hinge');
    const bottom = side('bottom');
    const y = sd.at + sd.into * o.edgeDistanceMm;
    const xs = o.centresMm.map((c) => bottom.at + bottom.into * c);
    for (const x of xs) {
      shapes.push({ type: 'hole', cx: x, cy: y, r: o.diameterMm / 2 });
      marks.push({
        type: 'line',
        x1: x - o.diameterMm * 0.7,
        y1: y,
        x2: x + o.diameterMm * 0.7,
        y2: y,
        style: 'centre',
      });
      marks.push({
        type: 'line',
        x1: x,
        y1: y - o.diameterMm * 0.7,
        x2: x,
        y2: y + o.diameterMm * 0.7,
        style: 'centre',
      });
    }
    // the end cups from their own ends, the ones between from the bottom end
    const top = side('top');
    o.centresMm.forEach((c, i) => {
      const last = i === o.centresMm.length - 1 && o.centresMm.length > 1;
      const x = xs[i]!;
      if (last) dims.push({ axis: 'x', from: x, to: top.at, foot: y, text: len(Math.abs(top.at - x)) });
      else dims.push({ axis: 'x', from: bottom.at, to: x, foot: y, text: len(c) });
    });
    dims.push({ axis: 'y', from: y, to: sd.at, foot: Math.max(...xs), text: len(o.edgeDistanceMm) });
    const ends = o.centresMm.length > 1;
    const lastFromTop = ends ? Math.abs(top.at - xs[xs.length - 1]!) : 0;
    note(
      `${o.centresMm.length} hinge cup${o.centresMm.length === 1 ? '' : 's'}, ${drawingLength(o.diameterMm, 'mm')}, ` +
        `${o.depthMm} mm deep, ${FACE_WORDS[o.face]}: centers ${len(o.edgeDistanceMm)} from the ${sd.words}; ` +
        (ends
          ? `${len(o.centresMm[0]!)} from the ${bottom.words} and ${len(lastFromTop)} from the ${top.words}` +
            (o.centresMm.length > 2
              ? `, between at ${o.centresMm
                  .slice(1, -1)
                  .map((c) => len(c))
                  .join(', ')} from the ${bottom.words}`
              : '')
          : `${len(o.centresMm[0]!)} from the ${bottom.words}`) +
        '.',
      xs.map((x) => [x, y + sd.into * (o.diameterMm / 2 + s * 0.9)] as [number, number]),
    );
  }

  function pockets(o: PocketHoleOp) {
    const ends = o.at.map(side);
    const from = o.fromEdge && o.centresMm ? side(o.fromEdge) : null;
    // the centres along each end from the edge they are measured from; a traveller recorded before the engine gave
    // positions has a count only, spread evenly across the end
    const per = o.centresMm && from ? o.centresMm.length : Math.ceil(o.count / Math.max(1, ends.length));
    const along = (e: Side, k: number): number => {
      const c = o.centresMm?.[k];
      if (from && c !== undefined && from.axis !== e.axis) return from.at + from.into * c;
      return ((e.axis === 'x' ? W : L) * (k + 0.5)) / per;
    };
    const slotL = Math.min(s * 1.1, L / 4);
    const across = (e: Side) => (e.axis === 'x' ? W : L);
    const spots: [number, number][] = [];
    for (const e of ends) {
      const gaps = Array.from({ length: per - 1 }, (_, k) => Math.abs(along(e, k + 1) - along(e, k)));
      const slotW = Math.min(s * 0.4, ...gaps.map((g) => g * 0.6), across(e) / 3);
      for (let k = 0; k < per; k++) {
        const p = along(e, k);
        if (e.axis === 'x') {
          const x = e.into > 0 ? e.at : e.at - slotL;
          marks.push({ type: 'pocket', x, y: p - slotW / 2, width: slotL, height: slotW });
          spots.push([e.at + e.into * (slotL + s * 0.9), p]);
        } else {
          const y = e.into > 0 ? e.at : e.at - slotL;
          marks.push({ type: 'pocket', x: p - slotW / 2, y, width: slotW, height: slotL });
          spots.push([p, e.at + e.into * (slotL + s * 0.9)]);
        }
      }
    }
    const each = ends.length > 1 ? ' each' : '';
    const at = `${per} at the ${listWords(ends.map((e) => e.words))}${each}`;
    if (!from || !o.centresMm) {
      note(`${o.count} pocket holes on the ${FACE_WORDS[o.face]}, ${at}, spaced evenly across it.`, spots);
      return;
    }
    // dimensioned at one end, the one nearest the tiers of dimensions (the right or top end, or the lower edge): from
    // the edge to the first centre, then centre to centre
    const shown = ends.reduce((a, e) => (e.at > a.at ? e : a));
    let prev = from.at;
    for (let k = 0; k < per; k++) {
      const p = along(shown, k);
      dims.push({ axis: from.axis, from: prev, to: p, foot: shown.at, text: len(Math.abs(p - prev)) });
      prev = p;
    }
    note(
      `${o.count} pocket hole${o.count === 1 ? '' : 's'} on the ${FACE_WORDS[o.face]}, ${at}: ` +
        `${per === 1 ? 'center' : 'centers'} ${listWords(o.centresMm.map((c) => len(c)))} from the ${from.words}.`,
      spots,
    );
  }

  function pinRows(rows: ShelfPinRowOp[]) {
    // rows at the same place on several faces (a partition's two faces) are drawn once
    const groups = new Map<string, ShelfPinRowOp[]>();
    for (const r of rows) {
      const k = [r.fromEdge, r.setbackMm, r.firstHoleMm, r.spacingMm, r.holes].join('|');
      groups.set(k, [...(groups.get(k) ?? []), r]);
    }
    const bottom = side('bottom');
    for (const g of groups.values()) {
      const r = g[0]!;
      const sd = side(r.fromEdge);
      const y = sd.at + sd.into * r.setbackMm;
      const x0 = bottom.at + bottom.into * r.firstHoleMm;
      const x1 = bottom.at + bottom.into * (r.firstHoleMm + (r.holes - 1) * r.spacingMm);
      // a hole too small to see is drawn larger; a row too tight to draw hole by hole is its end holes and a line
      const rr = Math.max(r.diameterMm / 2, s * 0.14);
      const each = r.spacingMm >= rr * 2.6;
      if (r.holes > 1) marks.push({ type: 'line', x1: x0, y1: y, x2: x1, y2: y, style: 'centre' });
      for (let i = 0; i < r.holes; i++) {
        if (!each && i > 0 && i < r.holes - 1) continue;
        shapes.push({ type: 'hole', cx: bottom.at + bottom.into * (r.firstHoleMm + i * r.spacingMm), cy: y, r: rr });
      }
      dims.push({ axis: 'x', from: bottom.at, to: x0, foot: y, text: len(r.firstHoleMm) });
      dims.push({ axis: 'y', from: sd.at, to: y, foot: Math.max(x0, x1), text: len(r.setbackMm) });
      const faces = listWords([...new Set(g.map((x) => FACE_WORDS[x.face] ?? x.face))]);
      // rows kept for some parts of the line only ("left", "right"): say which, unless one row is for all
      const ones = g.some((x) => !x.only) ? [] : [...new Set(g.map((x) => x.only!))];
      note(
        `Shelf-pin row, ${faces}: ${r.holes} holes ${drawingLength(r.diameterMm, 'mm')} on ${r.spacingMm} mm centers, ` +
          `${len(r.setbackMm)} from the ${sd.words}, the first ${len(r.firstHoleMm)} from the ${bottom.words}` +
          `${ones.length ? ` (on the ${listWords(ones)} one${ones.length > 1 ? 's' : ''}${ones.length > 1 ? '' : ' only'})` : ''}.`,
        [0.5, 0.3, 0.7, 0.15, 0.85].map((f) => [x0 + (x1 - x0) * f, y + sd.into * s * 0.9] as [number, number]),
      );
    }
  }

  // the overall sizes last (the outermost tiers)
  dims.push({ axis: 'x', from: 0, to: L, foot: W, text: len(L) });
  dims.push({ axis: 'y', from: 0, to: W, foot: L, text: len(W) });

  // the names of the edges and ends, outside the outline
  const labels: PartText[] = [];
  const named = new Map<string, Side>();
  for (const e of edgesNamed(ops)) named.set(side(e).words, side(e));
  if (ops.some((o) => o.kind === 'shelf_pin_row' || o.kind === 'hinge_cup' || o.kind === 'toe_kick_notch'))
    for (const e of ['bottom', 'top', 'front'] as const) {
      const sd = side(e);
      if (!(e === 'front' && !ops.some((o) => o.kind === 'toe_kick_notch'))) named.set(sd.words, sd);
    }
  const es = s * 0.8;
  let rightPad = 0;
  let belowPad = 0;
  for (const sd of named.values()) {
    const text = sd.words;
    // an end's name reads upwards beside it where the part is wide enough, else across, level with its middle
    const upright = text.length * CHAR_EM * es < W * 0.95;
    if (sd.axis === 'x' && sd.at === 0)
      labels.push(
        upright
          ? { type: 'text', x: -es * 0.5, y: W / 2, text, size: es, anchor: 'middle', vertical: true, role: 'edge' }
          : { type: 'text', x: -es * 0.4, y: W / 2 + es * 0.3, text, size: es, anchor: 'end', role: 'edge' },
      );
    else if (sd.axis === 'x') {
      labels.push(
        upright
          ? { type: 'text', x: L + es * 1.3, y: W / 2, text, size: es, anchor: 'middle', vertical: true, role: 'edge' }
          : { type: 'text', x: L + es * 0.4, y: W / 2 + es * 0.3, text, size: es, anchor: 'start', role: 'edge' },
      );
      rightPad = upright ? es * 1.4 : es * (0.6 + text.length * CHAR_EM);
    } else if (sd.at === 0)
      labels.push({ type: 'text', x: L / 2, y: -es * 0.5, text, size: es, anchor: 'middle', role: 'edge' });
    else {
      labels.push({ type: 'text', x: L / 2, y: W + es * 1.3, text, size: es, anchor: 'middle', role: 'edge' });
      belowPad = es * 1.4;
    }
  }
  const placed = placeDims(dims, L, W, s, W + belowPad + s * 0.3, L + rightPad + s * 0.3);

  // the tags: at the first of a feature's spots that meets no text and no other tag
  const taken: Box[] = [...labels, ...placed.filter((p): p is PartText => p.type === 'text')].map(textBox);
  const tags: PartShape[] = [];
  const tr = s * 0.55;
  for (const t of tagSpots) {
    const spot = t.spots.find(([cx, cy]) => {
      const b = { x: cx - tr, y: cy - tr, width: 2 * tr, height: 2 * tr };
      return !taken.some((x) => boxesOverlap(x, b));
    });
    if (!spot) continue;
    const [cx, cy] = spot;
    tags.push({ type: 'tag', cx, cy, r: tr, text: String(t.n) });
    taken.push({ x: cx - tr, y: cy - tr, width: 2 * tr, height: 2 * tr });
  }

  const all = [...shapes, ...marks, ...placed, ...labels, ...tags];
  return { viewBox: bounds(all, s), textSize: s, shapes: all, notes };
}

function listWords(words: string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

function bounds(shapes: readonly PartShape[], s: number): Box {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  const add = (x: number, y: number) => {
    x0 = Math.min(x0, x);
    y0 = Math.min(y0, y);
    x1 = Math.max(x1, x);
    y1 = Math.max(y1, y);
  };
  for (const sh of shapes) {
    if (sh.type === 'outline') sh.points.forEach(([x, y]) => add(x, y));
    else if (sh.type === 'cut' || sh.type === 'pocket') {
      add(sh.x, sh.y);
      add(sh.x + sh.width, sh.y + sh.height);
    } else if (sh.type === 'band' || sh.type === 'line') {
      add(sh.x1, sh.y1);
      add(sh.x2, sh.y2);
    } else if (sh.type === 'hole' || sh.type === 'tag') {
      add(sh.cx - sh.r, sh.cy - sh.r);
      add(sh.cx + sh.r, sh.cy + sh.r);
    } else {
      const b = textBox(sh);
      add(b.x, b.y);
      add(b.x + b.width, b.y + b.height);
    }
  }
  const m = s * 0.4;
  return { x: x0 - m, y: y0 - m, width: x1 - x0 + 2 * m, height: y1 - y0 + 2 * m };
}

// ---- the job's drawings ----

/**
 * Every part of a job that has machining or banded edges, drawn once for
 * all identical parts (same name, size and machining) with their total
 * quantity and the pieces they belong to, in the order of the cut list.
 * Parts with neither are left out.
 *
 * @example partDrawings(traveller, 'in')[0] // { name: 'side', quantity: 6, where: ['Base cabinet 1', ...], ... }
 */
export function partDrawings(t: Pick<Traveller, 'pieces'>, unit: LengthUnit): PartDrawing[] {
  const titles = new Map<string, number>();
  t.pieces.forEach((p) => titles.set(p.title, (titles.get(p.title) ?? 0) + 1));
  const seenTitle = new Map<string, number>();
  const byKey = new Map<string, PartDrawing & { whereSet: Set<string> }>();
  for (const p of t.pieces) {
    const k = (seenTitle.get(p.title) ?? 0) + 1;
    seenTitle.set(p.title, k);
    const piece = (titles.get(p.title) ?? 0) > 1 ? `${p.title} ${k}` : p.title;
    for (const part of p.parts) {
      if (!isDrawn(part)) continue;
      const key = JSON.stringify([
        part.name,
        r1(part.lengthMm),
        r1(part.widthMm),
        r1(part.thicknessMm),
        part.machining,
      ]);
      const where = part.case ? `${piece}, case ${part.case}` : piece;
      const cur = byKey.get(key);
      if (cur) {
        cur.quantity += part.quantity;
        cur.whereSet.add(where);
        continue;
      }
      byKey.set(key, {
        key: `d${byKey.size + 1}`,
        name: part.name,
        quantity: part.quantity,
        where: [],
        whereSet: new Set([where]),
        size: `${drawingLength(part.lengthMm, unit)} x ${drawingLength(part.widthMm, unit)} x ${drawingLength(part.thicknessMm, unit)}`,
        materialName: part.materialName,
        ...partDrawing(part, unit),
      });
    }
  }
  return [...byKey.values()].map(({ whereSet, ...d }) => ({ ...d, where: joinCases([...whereSet]) }));
}

/** "Bench, case 2" and "Bench, case 3" read as "Bench, cases 2 and 3". */
function joinCases(where: string[]): string[] {
  const out = new Map<string, string[]>();
  for (const w of where) {
    const m = /^(.*), case (\d+)$/.exec(w);
    const piece = m ? m[1]! : w;
    out.set(piece, [...(out.get(piece) ?? []), ...(m ? [m[2]!] : [])]);
  }
  return [...out].map(([piece, cases]) =>
    cases.length === 0 ? piece : `${piece}, case${cases.length > 1 ? 's' : ''} ${listWords(cases)}`,
  );
}
