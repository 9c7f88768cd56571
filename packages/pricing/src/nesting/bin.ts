/**
 * The guillotine bin: a sheet as a list of free rectangles. A part goes to the
 * corner of a free rectangle and what is left is split by one guillotine rule,
 * so every layout is guillotine by construction. A bin is filled part-first
 * (each part to its best rectangle) or space-first (each rectangle given its
 * best part).
 */
import { EPS, type Bin, type Config, type Ctx, type FitRule, type Free, type Item, type SplitRule } from './types';
import { at } from '../_lib/at';
import { NESTING_TUNING } from './tuning';

const FITS: FitRule[] = ['area', 'short', 'long', 'bottom'];
const SPLITS: SplitRule[] = ['shorterLeftover', 'longerLeftover', 'shorterAxis', 'longerAxis', 'maxArea', 'minArea'];
/** every fit rule with every split rule (thorough) */
export const ALL_CONFIGS: Config[] = FITS.flatMap((fit) => SPLITS.map((split) => ({ fit, split })));
export const SPACE_CONFIGS: Config[] = [
  { mode: 'space', fit: 'bottom', split: 'shorterLeftover' },
  { mode: 'space', fit: 'area', split: 'shorterLeftover' },
  { mode: 'space', fit: 'bottom', split: 'maxArea' },
  { mode: 'space', fit: 'area', split: 'longerLeftover' },
];
export const QUICK_CONFIGS: Config[] = [
  { fit: 'area', split: 'shorterLeftover' },
  { fit: 'short', split: 'shorterLeftover' },
  { fit: 'area', split: 'maxArea' },
  { fit: 'short', split: 'longerAxis' },
  { fit: 'bottom', split: 'shorterAxis' },
  { fit: 'long', split: 'maxArea' },
];

function newBin(ctx: Ctx): Bin {
  return { free: [{ x: ctx.x0, y: ctx.y0, l: ctx.L, w: ctx.W }], placed: [], used: 0 };
}

// the two keys of the last score() call (kept in module variables, not a new array per call: this is the hot loop)
let score0 = 0;
let score1 = 0;

function score(fit: FitRule, f: Free, l: number, w: number): void {
  const dl = f.l - l;
  const dw = f.w - w;
  switch (fit) {
    case 'area':
      score0 = f.l * f.w - l * w;
      score1 = Math.min(dl, dw);
      return;
    case 'short':
      score0 = Math.min(dl, dw);
      score1 = Math.max(dl, dw);
      return;
    case 'long':
      score0 = Math.max(dl, dw);
      score1 = Math.min(dl, dw);
      return;
    case 'bottom':
      score0 = f.y;
      score1 = f.x;
  }
}

/** Tries to put one item in the bin; returns false when no free rectangle takes it. */
function insert(bin: Bin, item: Item, cfg: Config, ctx: Ctx): boolean {
  let best = -1;
  let bestRot = false;
  let s0 = Infinity;
  let s1 = Infinity;
  const free = bin.free;
  for (let i = 0; i < free.length; i++) {
    const f = free[i]!; // i < free.length
    if (item.l <= f.l + EPS && item.w <= f.w + EPS) {
      score(cfg.fit, f, item.l, item.w);
      if (score0 < s0 - EPS || (score0 < s0 + EPS && score1 < s1)) {
        s0 = score0;
        s1 = score1;
        best = i;
        bestRot = false;
      }
    }
    if (item.canRotate && item.l !== item.w && item.w <= f.l + EPS && item.l <= f.w + EPS) {
      score(cfg.fit, f, item.w, item.l);
      if (score0 < s0 - EPS || (score0 < s0 + EPS && score1 < s1)) {
        s0 = score0;
        s1 = score1;
        best = i;
        bestRot = true;
      }
    }
  }
  if (best < 0) return false;
  place(bin, best, item, bestRot, cfg.split, ctx);
  return true;
}

/** Puts `item` at the corner of free rectangle `index` and splits what is left by one guillotine rule. */
function place(bin: Bin, index: number, item: Item, rotated: boolean, split: SplitRule, ctx: Ctx): void {
  const free = bin.free;
  const f = at(free, index);
  const l = rotated ? item.w : item.l;
  const w = rotated ? item.l : item.w;
  bin.placed.push({ item, x: f.x, y: f.y, l, w, rotated });
  bin.used += item.area;
  // guillotine split of f: the first cut runs across the whole of f
  const k = ctx.kerf;
  const dl = f.l - l;
  const dw = f.w - w;
  let horizontal: boolean;
  switch (split) {
    case 'shorterLeftover':
      horizontal = dl <= dw;
      break;
    case 'longerLeftover':
      horizontal = dl > dw;
      break;
    case 'shorterAxis':
      horizontal = f.l <= f.w;
      break;
    case 'longerAxis':
      horizontal = f.l > f.w;
      break;
    case 'maxArea':
      horizontal = l * dw <= dl * w;
      break;
    case 'minArea':
      horizontal = l * dw > dl * w;
      break;
  }
  free.splice(index, 1);
  const rl = f.l - l - k; // free length to the right of the part
  const tw = f.w - w - k; // free width above the part
  if (horizontal) {
    // cut along x at the part's far edge: the strip above spans all of f
    if (tw > EPS) free.push({ x: f.x, y: f.y + w + k, l: f.l, w: tw });
    if (rl > EPS) free.push({ x: f.x + l + k, y: f.y, l: rl, w });
  } else {
    if (rl > EPS) free.push({ x: f.x + l + k, y: f.y, l: rl, w: f.w });
    if (tw > EPS) free.push({ x: f.x, y: f.y + w + k, l, w: tw });
  }
}

/** Items grouped by size and turnability (one array per kind of part). */
export function poolBySize(items: readonly Item[]): Item[][] {
  const pools = new Map<string, Item[]>();
  for (const it of items) {
    const key = `${it.l}x${it.w}x${it.canRotate ? 1 : 0}`;
    const pool = pools.get(key);
    if (pool) pool.push(it);
    else pools.set(key, [it]);
  }
  return [...pools.values()];
}

/** Fills one bin from `items` in order; returns the bin and the items left over. */
export function fillBin(items: Item[], cfg: Config, ctx: Ctx): { bin: Bin; rest: Item[] } {
  ctx.spent += items.length;
  if (cfg.mode === 'space') return fillBinBySpace(items, cfg, ctx);
  const bin = newBin(ctx);
  const rest: Item[] = [];
  for (const it of items) {
    if (!insert(bin, it, cfg, ctx)) rest.push(it);
  }
  return { bin, rest };
}

/**
 * Fills one bin space first: takes free rectangles in turn (lowest first, or
 * smallest first) and gives each the largest remaining part that fits; a
 * rectangle no part fits is left as waste. Parts of one size are pooled, so
 * the cost grows with the number of sizes, not of units.
 */
function fillBinBySpace(items: Item[], cfg: Config, ctx: Ctx): { bin: Bin; rest: Item[] } {
  const bin = newBin(ctx);
  const kinds = poolBySize(items).sort((a, b) => at(b, 0).area - at(a, 0).area);
  while (bin.free.length) {
    let fi = 0;
    let f = at(bin.free, 0);
    for (let i = 1; i < bin.free.length; i++) {
      const a = bin.free[i]!; // i < bin.free.length
      const b = f;
      const before =
        cfg.fit === 'area'
          ? a.l * a.w < b.l * b.w - EPS || (Math.abs(a.l * a.w - b.l * b.w) < EPS && a.y < b.y)
          : a.y < b.y - EPS || (Math.abs(a.y - b.y) < EPS && a.x < b.x);
      if (before) {
        fi = i;
        f = a;
      }
    }
    let pick = -1;
    let rot = false;
    let bestArea = -1;
    let bestSide = Infinity;
    for (let k = 0; k < kinds.length; k++) {
      const it = kinds[k]![0]; // k < kinds.length
      if (!it) continue;
      if (it.area < bestArea - EPS) continue;
      if (it.l <= f.l + EPS && it.w <= f.w + EPS) {
        const side = Math.min(f.l - it.l, f.w - it.w);
        if (it.area > bestArea + EPS || side < bestSide) {
          bestArea = it.area;
          bestSide = side;
          pick = k;
          rot = false;
        }
      }
      if (it.canRotate && it.w <= f.l + EPS && it.l <= f.w + EPS) {
        const side = Math.min(f.l - it.w, f.w - it.l);
        if (it.area > bestArea + EPS || side < bestSide) {
          bestArea = it.area;
          bestSide = side;
          pick = k;
          rot = true;
        }
      }
    }
    if (pick < 0) {
      bin.free.splice(fi, 1);
      continue;
    }
    if (cfg.noise && cfg.noise() < NESTING_TUNING.spaceNoiseChance) {
      // now and then take a smaller part that also fits, to leave room differently
      const alt: [number, boolean][] = [];
      for (let k = 0; k < kinds.length; k++) {
        const it = kinds[k]![0]; // k < kinds.length
        if (!it || k === pick) continue;
        if (it.l <= f.l + EPS && it.w <= f.w + EPS) alt.push([k, false]);
        else if (it.canRotate && it.w <= f.l + EPS && it.l <= f.w + EPS) alt.push([k, true]);
      }
      if (alt.length)
        [pick, rot] = at(alt, Math.floor(cfg.noise() * Math.min(alt.length, NESTING_TUNING.spaceNoiseChoices)));
    }
    const it = at(kinds, pick).pop();
    if (!it) throw new Error('internal: the part picked has none left');
    place(bin, fi, it, rot, cfg.split, ctx);
  }
  const rest: Item[] = [];
  for (const pool of kinds) rest.push(...pool);
  return { bin, rest };
}
