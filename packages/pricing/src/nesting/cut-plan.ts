/**
 * The cut plan: the saw's plan recovered from the final placements by
 * recursive through-cuts, rips (along the length) first, then crosscuts of
 * each strip, and so on; the pieces no part uses are the offcuts.
 */
import { at } from '../_lib/at';
import {
  EPS,
  type Bin,
  type Ctx,
  type Cut,
  type NestPart,
  type Offcut,
  type Placed,
  type SheetLayout,
  type StockSheet,
} from './types';

interface Region {
  x: number;
  y: number;
  l: number;
  w: number;
  parts: Placed[];
  stage: number;
  dir: 'rip' | 'crosscut';
}

function planCuts(placed: Placed[], ctx: Ctx): { cuts: Omit<Cut, 'order'>[]; offcuts: Offcut[] } {
  const cuts: Omit<Cut, 'order'>[] = [];
  const offcuts: Offcut[] = [];
  const k = ctx.kerf;
  let queue: Region[] = [{ x: ctx.x0, y: ctx.y0, l: ctx.L, w: ctx.W, parts: placed, stage: 1, dir: 'rip' }];
  while (queue.length) {
    const next: Region[] = [];
    for (const r of queue) {
      if (r.parts.length === 0) {
        if (r.l > EPS && r.w > EPS) offcuts.push({ xMm: r.x, yMm: r.y, lengthMm: r.l, widthMm: r.w });
        continue;
      }
      // a region that is exactly its one part needs no more cuts
      const p = r.parts.length === 1 ? r.parts[0] : undefined;
      if (
        p &&
        Math.abs(p.x - r.x) < EPS &&
        Math.abs(p.y - r.y) < EPS &&
        Math.abs(p.l - r.l) < EPS &&
        Math.abs(p.w - r.w) < EPS
      )
        continue;
      let pieces = splitRegion(r, r.dir, k, cuts);
      let dir = r.dir;
      if (!pieces) {
        dir = r.dir === 'rip' ? 'crosscut' : 'rip';
        pieces = splitRegion(r, dir, k, cuts);
      }
      if (!pieces) throw new Error('internal: layout is not guillotine');
      const childDir = dir === 'rip' ? 'crosscut' : 'rip';
      for (const p of pieces) next.push({ ...p, stage: r.stage + 1, dir: childDir });
    }
    queue = next;
  }
  return { cuts, offcuts };
}

/** All through-cuts of one direction across region r, or null if there is none. */
function splitRegion(
  r: Region,
  dir: 'rip' | 'crosscut',
  k: number,
  cuts: Omit<Cut, 'order'>[],
): Omit<Region, 'stage' | 'dir'>[] | null {
  const rip = dir === 'rip';
  const lo = rip ? r.y : r.x;
  const hi = rip ? r.y + r.w : r.x + r.l;
  const spans = r.parts
    .map((p) => (rip ? [p.y, p.y + p.w] : [p.x, p.x + p.l]) as [number, number])
    .sort((a, b) => a[0] - b[0]);
  const positions: number[] = [];
  // a leading gap is cut off so that the kerf ends where the first part starts
  // (a gap narrower than the kerf is trimmed with the blade partly past the edge)
  const [firstStart] = at(spans, 0); // the region holds parts
  if (firstStart > lo + EPS) positions.push(firstStart - k);
  let reach = -Infinity;
  for (let i = 0; i < spans.length; i++) {
    const [, end] = spans[i]!; // i < spans.length
    reach = Math.max(reach, end);
    const nextStart = spans[i + 1]?.[0] ?? Infinity;
    // a cut starting at `reach` takes k; it must stop short of the next part and of the region's edge
    if (nextStart >= reach + k - EPS && reach < hi - EPS && reach > lo + EPS) positions.push(reach);
  }
  if (!positions.length) return null;
  const pieces: Omit<Region, 'stage' | 'dir'>[] = [];
  let start = lo;
  for (const pos of positions) {
    const c = Math.max(pos, lo);
    if (rip) cuts.push({ stage: r.stage, direction: 'rip', x1Mm: r.x, y1Mm: c, x2Mm: r.x + r.l, y2Mm: c });
    else cuts.push({ stage: r.stage, direction: 'crosscut', x1Mm: c, y1Mm: r.y, x2Mm: c, y2Mm: r.y + r.w });
    if (c - start > EPS) pieces.push(piece(r, rip, start, c));
    start = Math.min(pos + k, hi);
  }
  if (hi - start > EPS) pieces.push(piece(r, rip, start, hi));
  return pieces;
}

function piece(r: Region, rip: boolean, a: number, b: number): Omit<Region, 'stage' | 'dir'> {
  const inside = (p: Placed) => (rip ? p.y >= a - EPS && p.y + p.w <= b + EPS : p.x >= a - EPS && p.x + p.l <= b + EPS);
  return rip
    ? { x: r.x, y: a, l: r.l, w: b - a, parts: r.parts.filter(inside) }
    : { x: a, y: r.y, l: b - a, w: r.w, parts: r.parts.filter(inside) };
}

function trimCuts(sheet: StockSheet, trim: number): Omit<Cut, 'order'>[] {
  if (trim <= 0) return [];
  const { lengthMm: L, widthMm: W } = sheet;
  return [
    { stage: 0, direction: 'rip', x1Mm: 0, y1Mm: trim, x2Mm: L, y2Mm: trim },
    { stage: 0, direction: 'rip', x1Mm: 0, y1Mm: W - trim, x2Mm: L, y2Mm: W - trim },
    { stage: 0, direction: 'crosscut', x1Mm: trim, y1Mm: trim, x2Mm: trim, y2Mm: W - trim },
    { stage: 0, direction: 'crosscut', x1Mm: L - trim, y1Mm: trim, x2Mm: L - trim, y2Mm: W - trim },
  ];
}

/** The sheet layouts of the bins: placements sorted from the sheet's corner, edge trims then the cut plan, offcuts. */
export function sheetLayouts(
  bins: Bin[],
  parts: readonly NestPart[],
  sheet: StockSheet,
  trimMm: number,
  ctx: Ctx,
): SheetLayout[] {
  const sheetArea = sheet.lengthMm * sheet.widthMm;
  return bins.map((bin) => {
    const placed = [...bin.placed].sort((a, b) => a.y - b.y || a.x - b.x);
    const plan = planCuts(placed, ctx);
    const cuts = [...trimCuts(sheet, trimMm), ...plan.cuts].map((c, i) => ({ order: i + 1, ...c }));
    return {
      lengthMm: sheet.lengthMm,
      widthMm: sheet.widthMm,
      placements: placed.map((p) => ({
        partId: at(parts, p.item.type).id,
        xMm: p.x,
        yMm: p.y,
        lengthMm: p.l,
        widthMm: p.w,
        rotated: p.rotated,
      })),
      cuts,
      offcuts: plan.offcuts,
      usedAreaMm2: bin.used,
      yieldRatio: bin.used / sheetArea,
    };
  });
}
