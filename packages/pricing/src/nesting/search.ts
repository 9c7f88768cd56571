/**
 * The heuristic search: greedy fills over several part orderings and fill
 * rules; at `thorough`, rounds of sheet-after-sheet fills each taking the
 * fullest of several trial fills, and moves that try to empty the
 * least-filled sheet into the others; the exact search (exact.ts) when the
 * layout stands one sheet over the lower bound. Work is counted in part
 * visits (`Ctx.spent`), not timed, so that results are deterministic.
 */
import { seededRandom } from '../_lib/random';
import { ALL_CONFIGS, fillBin, poolBySize, QUICK_CONFIGS, SPACE_CONFIGS } from './bin';
import { packExact } from './exact';
import { at } from '../_lib/at';
import { NESTING_TUNING } from './tuning';
import { EPS, type Bin, type Config, type Ctx, type Item, type NestEffort, type Solution } from './types';

/** Tries to pack every item into one bin with several configs and orders. */
function packAllInOne(items: Item[], ctx: Ctx, configs: Config[], rand?: () => number, tries = 0): Bin | null {
  const orders = [
    sortItems(items, 'area'),
    sortItems(items, 'long'),
    sortItems(items, 'width'),
    sortItems(items, 'length'),
  ];
  for (const order of orders) {
    for (const cfg of configs) {
      const { bin, rest } = fillBin(order, cfg, ctx);
      if (rest.length === 0) return bin;
    }
  }
  for (const cfg of SPACE_CONFIGS) {
    const { bin, rest } = fillBin(items, cfg, ctx);
    if (rest.length === 0) return bin;
  }
  // random orders, for the moves that would empty the last sheet above the bound
  for (let t = 0; rand && t < tries && ctx.spent < ctx.limit; t++) {
    const cfg =
      t % 2 ? { ...at(SPACE_CONFIGS, t % SPACE_CONFIGS.length), noise: rand } : at(configs, t % configs.length);
    const { bin, rest } = fillBin(perturb(items, rand, NESTING_TUNING.retryOrderNoise), cfg, ctx);
    if (rest.length === 0) return bin;
  }
  return null;
}

export type SortKey = 'area' | 'long' | 'width' | 'length' | 'perimeter' | 'short';

export function sortItems(items: Item[], key: SortKey): Item[] {
  const k = (it: Item): number => {
    switch (key) {
      case 'area':
        return it.area;
      case 'long':
        return Math.max(it.l, it.w);
      case 'short':
        return Math.min(it.l, it.w);
      case 'width':
        return it.w;
      case 'length':
        return it.l;
      case 'perimeter':
        return it.l + it.w;
    }
  };
  return [...items].sort((a, b) => k(b) - k(a) || b.area - a.area || a.type - b.type);
}

/** Lexicographic quality: fewer bins, then a lighter least-filled bin (so the search can empty it). */
function better(a: Solution, b: Solution | null): boolean {
  if (!b) return true;
  if (a.bins.length !== b.bins.length) return a.bins.length < b.bins.length;
  return minUsed(a) < minUsed(b) - EPS;
}

function minUsed(s: Solution): number {
  let m = Infinity;
  for (const b of s.bins) m = Math.min(m, b.used);
  return m;
}

/** Bin after bin, each filled by one pass over the remaining items. */
function greedy(order: Item[], cfg: Config, ctx: Ctx): Solution {
  const bins: Bin[] = [];
  let rest = order;
  while (rest.length) {
    const r = fillBin(rest, cfg, ctx);
    bins.push(r.bin);
    rest = r.rest;
  }
  return { bins };
}

/**
 * Bin after bin, each chosen as the fullest of several trial fills (configs
 * and randomly perturbed orders) of the remaining items.
 */
function bestFillGreedy(items: Item[], configs: Config[], trials: number, rand: () => number, ctx: Ctx): Solution {
  const bins: Bin[] = [];
  let rest = sortItems(items, 'area');
  while (rest.length) {
    let best: { bin: Bin; rest: Item[] } | null = null;
    const candidates: Item[][] = [rest, sortItems(rest, 'long'), sortItems(rest, 'width')];
    // past the work limit, finish the solution with the plain orders only
    for (let t = 0; t < trials && ctx.spent < ctx.limit; t++)
      candidates.push(perturb(rest, rand, NESTING_TUNING.trialOrderNoise));
    for (const order of candidates) {
      for (const cfg of configs) {
        const r = fillBin(order, cfg, ctx);
        if (!best || r.bin.used > best.bin.used + EPS) best = r;
      }
    }
    bins.push(best!.bin);
    rest = sortItems(best!.rest, 'area');
  }
  return { bins };
}

function perturb(items: Item[], rand: () => number, noise: number): Item[] {
  return items
    .map((it) => ({ it, k: it.area * (1 + noise * (rand() * 2 - 1)) }))
    .sort((a, b) => b.k - a.k)
    .map((x) => x.it);
}

/**
 * Local search: move items of the least-filled bin into other bins (repacking
 * each receiving bin whole), until the bin empties or nothing moves.
 */
function eliminateBins(
  sol: Solution,
  ctx: Ctx,
  configs: Config[],
  lowerBound: number,
  budget: { n: number },
  rand?: () => number,
): Solution {
  let bins = sol.bins.slice();
  let progress = true;
  while (progress && bins.length > lowerBound && budget.n > 0 && ctx.spent < ctx.limit) {
    progress = false;
    const order = bins.map((b, i) => ({ b, i })).sort((a, b) => a.b.used - b.b.used);
    for (const { b: weak, i: weakIdx } of order) {
      if (budget.n <= 0 || ctx.spent >= ctx.limit) break;
      const remaining = sortItems(
        weak.placed.map((p) => p.item),
        'area',
      );
      const others = bins
        .map((b, i) => ({ b, i }))
        .filter((x) => x.i !== weakIdx)
        .sort((a, b) => a.b.used - b.b.used);
      const left: Item[] = [];
      const replaced = new Map<number, Bin>();
      for (const it of remaining) {
        let moved = false;
        for (const o of others) {
          budget.n--;
          const cur = replaced.get(o.i) ?? o.b;
          if (cur.used + it.area > ctx.L * ctx.W + EPS) continue;
          const packed = packAllInOne(
            [...cur.placed.map((p) => p.item), it],
            ctx,
            configs,
            rand,
            rand && bins.length === lowerBound + 1 ? NESTING_TUNING.oneOverRetries : 0,
          );
          if (packed) {
            replaced.set(o.i, packed);
            moved = true;
            break;
          }
        }
        if (!moved) left.push(it);
      }
      if (replaced.size === 0) continue;
      const next: Bin[] = [];
      bins.forEach((b, i) => {
        if (i === weakIdx) {
          if (left.length) {
            const rebuilt = packAllInOne(left, ctx, configs);
            next.push(rebuilt ?? b);
          }
        } else next.push(replaced.get(i) ?? b);
      });
      // keep the move only if every item is still placed exactly once
      const count = next.reduce((s, b) => s + b.placed.length, 0);
      if (count === bins.reduce((s, b) => s + b.placed.length, 0)) {
        bins = next;
        progress = true;
        break;
      }
    }
  }
  return { bins };
}

/**
 * The exact search (exact.ts) over `sheets` sheets for all `items`;
 * parts of one size are pooled so the search sees them as one kind.
 * Returns the bins, or null if it found none within `workLimit` steps,
 * and whether it proved that there is none.
 */
function exactBins(
  items: Item[],
  sheets: number,
  ctx: Ctx,
  workLimit: number,
  seed: number,
): { bins: Bin[] | null; impossible: boolean } {
  const kinds = poolBySize(items);
  const types = kinds.map((k) => {
    const first = at(k, 0);
    return { l: first.l, w: first.w, canRotate: first.canRotate, count: k.length };
  });
  const r = packExact(types, { x0: ctx.x0, y0: ctx.y0, L: ctx.L, W: ctx.W, sheets, kerf: ctx.kerf, workLimit, seed });
  ctx.spent += Math.ceil(r.work / NESTING_TUNING.stepsPerVisit);
  if (r.status !== 'found') return { bins: null, impossible: r.status === 'none' };
  const bins: Bin[] = Array.from({ length: sheets }, () => ({ free: [], placed: [], used: 0 }));
  const taken = kinds.map(() => 0);
  for (const p of r.placements) {
    // the units of a kind in order, so that parts of one size keep the order of the part list
    const next = at(taken, p.type);
    taken[p.type] = next + 1;
    const item = at(at(kinds, p.type), next);
    const bin = at(bins, p.sheet);
    bin.placed.push({ item, x: p.x, y: p.y, l: p.l, w: p.w, rotated: p.rotated });
    bin.used += item.area;
  }
  return { bins: bins.filter((b) => b.placed.length), impossible: false };
}

/**
 * Searches for the layout of `items` with the fewest sheets (then the lightest
 * least-filled sheet), stopping early when a layout meets `lowerBound`.
 * Returns null when there are no items.
 */
export function searchLayout(
  items: Item[],
  ctx: Ctx,
  lowerBound: number,
  effort: NestEffort,
  seed: number,
): Solution | null {
  let best: Solution | null = null;
  const consider = (s: Solution) => {
    if (better(s, best)) best = s;
  };
  // the bound's sheets proven too few (by the exact search): a layout one sheet over it is the best there is
  let boundUnreachable = false;
  const done = () =>
    best !== null && (best.bins.length <= lowerBound || (boundUnreachable && best.bins.length <= lowerBound + 1));
  if (!items.length) return best;

  const T = NESTING_TUNING;
  const thorough = effort === 'thorough';
  const area = items.reduce((a, it) => a + it.area, 0);
  // work allowed: at thorough, in proportion to the job's size in sheets (the parts' area over the usable sheet's)
  ctx.limit = thorough
    ? Math.round(
        Math.min(T.thoroughWork.max, Math.max(T.thoroughWork.min, (T.thoroughWork.perSheet * area) / (ctx.L * ctx.W))),
      )
    : T.workLimit.quick;
  const keys: SortKey[] = thorough
    ? ['area', 'long', 'width', 'length', 'perimeter', 'short']
    : ['area', 'long', 'width'];
  // the exact search (exact.ts), for when the greedy fills stop one sheet over the bound
  // nearly full sheets: the greedy fills rarely get there, the exact search is the hope
  const tight = lowerBound > 0 && 1 - area / (lowerBound * ctx.L * ctx.W) < T.tightLeftover;
  let exactRan = false;
  const tryExact = (visits: number) => {
    exactRan = true;
    const { bins, impossible } = exactBins(items, lowerBound, ctx, Math.max(0, visits) * T.stepsPerVisit, seed);
    if (bins) consider({ bins });
    if (impossible) boundUnreachable = true;
  };
  for (const key of keys) {
    const order = sortItems(items, key);
    for (const cfg of thorough ? ALL_CONFIGS : QUICK_CONFIGS) {
      consider(greedy(order, cfg, ctx));
      if (done()) break;
    }
    if (done()) break;
    // nearly full sheets: search exactly after the first round of greedy fills, with most of the work allowed
    if (thorough && tight && !exactRan && best!.bins.length === lowerBound + 1)
      tryExact(T.thoroughWork.max * T.exactEarlyShare);
    if (done()) break;
  }
  for (const cfg of thorough ? SPACE_CONFIGS : []) if (!done()) consider(greedy(items, cfg, ctx));
  const rand = seededRandom(seed);
  if (!done()) consider(eliminateBins(best!, ctx, QUICK_CONFIGS, lowerBound, { n: T.emptyingMoves[effort] }));
  // otherwise, one sheet over the bound after the greedy fills: the exact search with what is left of the first share
  if (thorough && !exactRan && !done() && best!.bins.length === lowerBound + 1)
    tryExact(ctx.limit * T.exactLateShare - ctx.spent);
  if (thorough) {
    const n = items.length;
    const trials = clampedShare(T.roundTrials, n);
    const rounds = clampedShare(T.rounds, n);
    // rounds until the bound is met, the work is spent, or `staleRounds` rounds in a row save no sheet
    let stale = 0;
    for (let r = 0; r < rounds && !done() && ctx.spent < ctx.limit && stale < T.staleRounds; r++) {
      const before = best!.bins.length;
      const s = bestFillGreedy(items, QUICK_CONFIGS, trials, rand, ctx);
      consider(s);
      if (!done())
        consider(eliminateBins(s, ctx, QUICK_CONFIGS, lowerBound, { n: Math.floor(T.roundEmptyingMoves / n) }));
      stale = best!.bins.length < before ? 0 : stale + 1;
    }
  }
  return best;
}

/** `work / n` rounded down, kept within [min, max] */
function clampedShare(c: { work: number; min: number; max: number }, n: number): number {
  return Math.max(c.min, Math.min(c.max, Math.floor(c.work / n)));
}
