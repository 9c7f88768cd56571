/**
 * An exact, budgeted search: can these parts all go on this many sheets with
 * guillotine cuts? The nester calls it when its heuristics stop one sheet
 * above the lower bound, where the sheets must be nearly full and greedy
 * fills rarely find the one arrangement that works.
 *
 * The search takes a free rectangle and either leaves it as waste or puts a
 * part in its corner and cuts along one of that part's edges, first across
 * the whole rectangle (two ways), leaving two smaller free rectangles. That
 * reaches every guillotine layout: shrink each piece of a guillotine tree to
 * the parts it holds and order the pieces of each stage widest (or tallest)
 * first; the first part of a stage then sits in the corner and its edge is
 * the stage's first cut. The same ordering is used to break symmetry: a part
 * that continues a stage may be no bigger than the one that opened it.
 *
 * States already shown to fail are remembered by what they are (parts left,
 * free rectangle sizes; hashed), not by how they were reached. Three bounds
 * prune: every part left must fit some free rectangle, the free area must
 * hold the parts' area, and a rectangle holds no more than its width times
 * the longest row its parts can make (likewise for columns; whole-number
 * sizes only). The smallest free rectangle is filled first, parts that match
 * one of its sides exactly are tried first, and the search restarts now and
 * then with the parts' order shaken and a larger budget, keeping what it has
 * learnt, so that one bad early choice does not take the whole budget.
 *
 * Written here because no registry package does guillotine packing with
 * kerf, grain and an exact search. Tree search over guillotine patterns is
 * common practice in the cutting-stock literature (Christofides and Whitlock
 * 1977; Wang 1983); the rules above are ours.
 */
import { seededRandom } from '../_lib/random';
import { NESTING_TUNING } from './tuning';

const EPS = 1e-6;

export interface ExactType {
  l: number;
  w: number;
  canRotate: boolean;
  count: number;
}

export interface ExactPlacement {
  /** index into the types */
  type: number;
  /** which of the sheets, from 0 */
  sheet: number;
  x: number;
  y: number;
  l: number;
  w: number;
  rotated: boolean;
}

export interface ExactOptions {
  /** the usable rectangle of each sheet */
  x0: number;
  y0: number;
  L: number;
  W: number;
  sheets: number;
  kerf: number;
  /**
   * work allowed in all, in steps of the search (a part tried against a
   * rectangle, a word of a bound's bitset), so that the cost is the same on
   * every machine and for every run, unlike a clock
   */
  workLimit: number;
  seed?: number;
}

export interface ExactResult {
  /** 'found': every part placed; 'none': proven impossible; 'gave-up': work budget spent */
  status: 'found' | 'none' | 'gave-up';
  placements: ExactPlacement[];
  /** the steps of work spent */
  work: number;
}

interface Rect {
  sheet: number;
  x: number;
  y: number;
  l: number;
  w: number;
  /**
   * The rest of a stage: 'l' for the pieces beside a part whose end was cut
   * first, 'w' for those above a part whose side was cut first; a part that
   * continues the stage the same way may be no bigger than `bound`.
   */
  seq: 0 | 'l' | 'w';
  bound: number;
  /** hash of (l, w, seq, bound), two independent 32-bit halves */
  ha: number;
  hb: number;
}

/** One kind of part as the search tracks it. */
interface Kind {
  /** index into the types */
  t: number;
  l: number;
  w: number;
  canRotate: boolean;
  /** units not yet placed */
  count: number;
  area: number;
  /** hash keys for this kind's count in a state */
  ka: number;
  kb: number;
  /** place in the order parts are tried (falling area, shaken on restarts) */
  rank: number;
}

/** Searches for a guillotine layout of every unit of `types` on `sheets` identical sheets. */
export function packExact(types: readonly ExactType[], o: ExactOptions): ExactResult {
  const T = NESTING_TUNING.exact;
  const n = types.length;
  const kinds: Kind[] = types.map((t, i) => ({
    t: i,
    l: t.l,
    w: t.w,
    canRotate: t.canRotate,
    count: t.count,
    area: t.l * t.w,
    ka: 0,
    kb: 0,
    rank: i,
  }));
  let remaining = 0;
  for (const k of kinds) remaining += k.area * k.count;
  const placements: ExactPlacement[] = [];
  if (remaining > o.sheets * o.L * o.W + EPS) return { status: 'none', placements, work: 0 };
  const kerf = o.kerf;
  // row/column bounds work on whole numbers only (the benchmark's sizes, or mm cut lists in whole mm)
  const integral =
    [o.L, o.W, kerf, ...types.flatMap((t) => [t.l, t.w])].every((v) => Number.isInteger(v)) &&
    Math.max(o.L, o.W) + kerf <= T.maxBoundSize;
  const rand = seededRandom(o.seed ?? 1);
  // per-kind hash keys for the counts part of a state (all the first keys, then all the second)
  for (const k of kinds) k.ka = (rand() * 2 ** 32) | 1;
  for (const k of kinds) k.kb = (rand() * 2 ** 32) | 1;
  let hCountA = 0;
  let hCountB = 0;
  for (const k of kinds) {
    hCountA = (hCountA + Math.imul(k.ka, k.count)) | 0;
    hCountB = (hCountB + Math.imul(k.kb, k.count)) | 0;
  }

  // parts in order of falling area, shaken on restarts; `flip` swaps which cut is tried first
  const setOrder = (weight: (k: Kind) => number) => {
    kinds
      .map((k) => ({ k, weight: weight(k) }))
      .sort((a, b) => b.weight - a.weight || b.k.l - a.k.l)
      .forEach(({ k }, i) => (k.rank = i));
  };
  setOrder((k) => k.area);
  let flip = false;

  const stepsPerNode = T.stepsPerNode;
  const failed = new Set<number>();
  const memoCap = T.memoCap;
  let work = 0;
  let run = 0;
  let runLimit = 0;
  let gaveUp = false;

  const fitsAs = (k: Kind, r: Rect, rot: boolean) =>
    rot ? k.w <= r.l + EPS && k.l <= r.w + EPS : k.l <= r.l + EPS && k.w <= r.w + EPS;
  const fits = (k: Kind, r: Rect) => fitsAs(k, r, false) || (k.canRotate && fitsAs(k, r, true));

  const words = integral ? Math.ceil((Math.max(o.L, o.W) + kerf + 1) / 32) : 0;
  const bits = new Uint32Array(words);
  const tmp = new Uint32Array(words);
  /** the longest run of part sizes (plus a kerf each) within the rectangle's length or width */
  const longestRun = (r: Rect, along: 'l' | 'w'): number => {
    const cap = Math.round((along === 'l' ? r.l : r.w) + kerf);
    bits.fill(0);
    bits[0] = 1;
    for (const k of kinds) {
      if (!k.count || !fits(k, r)) continue;
      // a turnable part may lie either way: the shorter side is the looser bound
      const own = along === 'l' ? k.l : k.w;
      const other = along === 'l' ? k.w : k.l;
      const size = (k.canRotate && fitsAs(k, r, true) ? Math.min(own, other) : own) + kerf;
      const reps = Math.min(k.count, Math.floor(cap / size));
      for (let i = 0; i < reps; i++) shiftOr(bits, tmp, size, cap);
      work += n + reps * words;
    }
    for (let v = cap; v > 0; v--) if (bitAt(bits, v)) return v;
    return 0;
  };

  const rect = (sheet: number, x: number, y: number, l: number, w: number, seq: 0 | 'l' | 'w', bound: number): Rect => {
    const a = Math.round(l * 1000);
    const b = Math.round(w * 1000);
    const c = seq === 0 ? 0 : (seq === 'l' ? 1 : 2) + 3 * Math.round(bound * 1000);
    return { sheet, x, y, l, w, seq, bound, ha: mix(a, b, c, 0x9e3779b1), hb: mix(a, b, c, 0x85ebca77) };
  };

  const dfs = (free: Rect[]): boolean => {
    if (remaining <= EPS) return true;
    work += stepsPerNode + free.length * n;
    if (work > runLimit) {
      gaveUp = true;
      return false;
    }
    // rectangles no part fits are waste
    const live: Rect[] = [];
    let freeArea = 0;
    let ha = hCountA;
    let hb = hCountB;
    for (const r of free) {
      for (const k of kinds) {
        if (k.count && fits(k, r)) {
          live.push(r);
          freeArea += r.l * r.w;
          ha = (ha + r.ha) | 0;
          hb = (hb + r.hb) | 0;
          break;
        }
      }
    }
    if (freeArea < remaining - EPS) return false;
    // every part left must fit somewhere
    for (const k of kinds) {
      if (!k.count) continue;
      let ok = false;
      for (const r of live) {
        if (fits(k, r)) {
          ok = true;
          break;
        }
      }
      if (!ok) return false;
    }
    const key = (ha >>> 0) * 2097152 + (hb >>> 11);
    if (failed.has(key)) return false;
    // what each rectangle can hold at most; fill the smallest first
    let holdable = 0;
    let pick = -1;
    let r: Rect | undefined;
    let i = -1;
    for (const x of live) {
      i++;
      let sum = 0;
      for (const k of kinds) if (k.count && fits(k, x)) sum += k.area * k.count;
      let cap = Math.min(x.l * x.w, sum);
      if (integral) cap = Math.min(cap, longestRun(x, 'l') * x.w, longestRun(x, 'w') * x.l);
      holdable += cap;
      if (!r || x.l * x.w < r.l * r.w - EPS) {
        pick = i;
        r = x;
      }
    }
    // no live rectangle left with parts to place: the area check above has already failed
    if (!r) return false;
    if (holdable < remaining - EPS) {
      remember(key);
      return false;
    }
    const rest = live.filter((_, i) => i !== pick);
    // parts that match a side of the rectangle first, then by size
    const cands: { k: Kind; rot: boolean; exact: number; order: number }[] = [];
    for (const k of kinds) {
      if (!k.count) continue;
      for (const rot of k.canRotate && k.l !== k.w ? [false, true] : [false]) {
        if (!fitsAs(k, r, rot)) continue;
        const pl = rot ? k.w : k.l;
        const pw = rot ? k.l : k.w;
        const exact = (Math.abs(r.l - pl) < EPS ? 1 : 0) + (Math.abs(r.w - pw) < EPS ? 1 : 0);
        cands.push({ k, rot, exact, order: k.rank + (run > 0 ? 0.5 * n * rand() : 0) });
      }
    }
    cands.sort((a, b) => b.exact - a.exact || a.order - b.order);
    // a part the rectangle's exact size goes there: in any layout that puts it
    // elsewhere, swapping it with what fills this rectangle gives another layout
    const forced = cands[0]?.exact === 2;
    if (forced) cands.length = 1;
    for (const { k, rot } of cands) {
      const pl = rot ? k.w : k.l;
      const pw = rot ? k.l : k.w;
      const dl = r.l - pl - kerf;
      const dw = r.w - pw - kerf;
      const endOk = r.seq !== 'l' || pl <= r.bound + EPS;
      const sideOk = r.seq !== 'w' || pw <= r.bound + EPS;
      const splits: boolean[] = [];
      if (dl > EPS && dw > EPS) {
        if (endOk && !flip) splits.push(true);
        if (sideOk) splits.push(false);
        if (endOk && flip) splits.push(true);
      } else if (endOk || sideOk) {
        // one cut only: take the split whose leftover carries no bound
        splits.push(dw > EPS ? endOk : !sideOk);
      }
      if (!splits.length) continue;
      k.count--;
      remaining -= k.area;
      hCountA = (hCountA - k.ka) | 0;
      hCountB = (hCountB - k.kb) | 0;
      placements.push({ type: k.t, sheet: r.sheet, x: r.x, y: r.y, l: pl, w: pw, rotated: rot });
      for (const endFirst of splits) {
        if (dfs([...rest, ...pieces(r, pl, pw, dl, dw, endFirst)])) return true;
        if (gaveUp) break;
      }
      placements.pop();
      remaining += k.area;
      k.count++;
      hCountA = (hCountA + k.ka) | 0;
      hCountB = (hCountB + k.kb) | 0;
      if (gaveUp) return false;
    }
    // or leave the rectangle as waste, if the area left allows
    if (!forced && freeArea - r.l * r.w >= remaining - EPS) {
      if (dfs(rest)) return true;
      if (gaveUp) return false;
    }
    remember(key);
    return false;
  };

  const remember = (key: number) => {
    if (failed.size < memoCap) failed.add(key);
  };

  const pieces = (r: Rect, pl: number, pw: number, dl: number, dw: number, endFirst: boolean): Rect[] => {
    const out: Rect[] = [];
    if (endFirst) {
      // cut across at the part's end, then along its side
      if (dl > EPS) out.push(rect(r.sheet, r.x + pl + kerf, r.y, dl, r.w, 'l', pl));
      if (dw > EPS) out.push(rect(r.sheet, r.x, r.y + pw + kerf, pl, dw, 0, 0));
    } else {
      if (dw > EPS) out.push(rect(r.sheet, r.x, r.y + pw + kerf, r.l, dw, 'w', pw));
      if (dl > EPS) out.push(rect(r.sheet, r.x + pl + kerf, r.y, dl, pw, 0, 0));
    }
    return out;
  };

  const start = () => Array.from({ length: o.sheets }, (_, s) => rect(s, o.x0, o.y0, o.L, o.W, 0, 0));
  let found = false;
  // no run at all (no work allowed) proves nothing
  gaveUp = o.workLimit <= 0;
  let budget = T.firstRunStepsPerKind * Math.max(T.minKinds, n);
  for (run = 0; !found && work < o.workLimit; run++) {
    gaveUp = false;
    runLimit = Math.min(o.workLimit, work + budget);
    found = dfs(start());
    if (!gaveUp) break;
    budget = Math.ceil(budget * T.budgetGrowth);
    setOrder((k) => k.area * (1 + T.restartShake * (rand() * 2 - 1)));
    flip = rand() < 0.5;
  }
  return { status: found ? 'found' : gaveUp ? 'gave-up' : 'none', placements: found ? placements : [], work };
}

function mix(a: number, b: number, c: number, seed: number): number {
  let h = seed ^ Math.imul(a, 0xcc9e2d51);
  h = Math.imul(h ^ (h >>> 15), 0x1b873593) ^ Math.imul(b, 0x27d4eb2f);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35) ^ Math.imul(c, 0x165667b1);
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  return (h ^ (h >>> 13)) | 0;
}

// The bitsets below read 0 past their end (`?? 0`): every index is in range by the loop bounds, and 0 is
// what a bit past the end means.

/** whether bit v of the set is on */
function bitAt(bits: Uint32Array, v: number): boolean {
  return ((bits[v >>> 5] ?? 0) & (1 << (v & 31))) !== 0;
}

/** bits |= bits << s, keeping bits 0..cap */
function shiftOr(bits: Uint32Array, tmp: Uint32Array, s: number, cap: number): void {
  const words = bits.length;
  const ws = s >>> 5;
  const bs = s & 31;
  tmp.fill(0);
  for (let i = words - 1; i >= ws; i--) {
    let v = (bits[i - ws] ?? 0) << bs;
    if (bs && i - ws - 1 >= 0) v |= (bits[i - ws - 1] ?? 0) >>> (32 - bs);
    tmp[i] = v;
  }
  for (let i = 0; i < words; i++) bits[i] = (bits[i] ?? 0) | (tmp[i] ?? 0);
  const top = cap >>> 5;
  if (top < words) {
    bits[top] = (bits[top] ?? 0) & ((cap & 31) === 31 ? 0xffffffff : (1 << ((cap & 31) + 1)) - 1);
    for (let i = top + 1; i < words; i++) bits[i] = 0;
  }
}
