/**
 * Tuning bench for the exact sheet search (src/nesting/exact.ts): sheets of
 * 30 x 30 cut at random into pieces of 1 to 10 a side (like Berkey and Wang's
 * class II), a few small pieces taken away to leave up to WASTE square units
 * free, then the search asked to put the rest back on one sheet within a work
 * budget. Every instance has a layout, so each miss is the search's fault.
 *
 *   pnpm bench:nesting-exact              # 80 sheets, 150 M steps each (about half a second)
 *   N=40 STEPS=50000000 WASTE=5 pnpm bench:nesting-exact
 */
import { packExact } from '../src/nesting/exact';
import { seededRandom } from '../src/_lib/random';
import { guillotinePieces, piecesByKind } from '../src/_lib/guillotine-pieces';

const N = Number(process.env.N ?? 80);
const STEPS = Number(process.env.STEPS ?? 150_000_000);
const WASTE = Number(process.env.WASTE ?? 5);
let solved = 0;
let steps = 0;
const t0 = performance.now();
const misses: string[] = [];
for (let s = 1; s <= N; s++) {
  const rand = seededRandom(s * 7919);
  const pieces = guillotinePieces(30, 30, 10, rand, 0.8);
  let waste = 0;
  const order = [...pieces.entries()].sort(() => rand() - 0.5);
  const kept = new Set(pieces.keys());
  for (const [i, [l, w]] of order) {
    const a = l * w;
    if (waste + a <= WASTE) {
      kept.delete(i);
      waste += a;
    }
  }
  const types = piecesByKind(
    pieces.filter((_, i) => kept.has(i)),
    false,
  );
  const r = packExact(types, { x0: 0, y0: 0, L: 30, W: 30, sheets: 1, kerf: 0, workLimit: STEPS });
  steps += r.work;
  if (r.status === 'found') solved++;
  else misses.push(`#${s} (${kept.size} parts, ${waste} free: ${r.status})`);
}
const ms = performance.now() - t0;
console.log(
  `exact search, ${N} random guillotine sheets of 30 x 30 with up to ${WASTE} free: ${solved} of ${N} put back within ${STEPS.toExponential(1)} steps each`,
);
console.log(
  `time ${(ms / 1000).toFixed(1)} s (${(ms / N).toFixed(0)} ms per sheet, ${((ms * 1e6) / steps).toFixed(1)} ns per step)`,
);
if (misses.length) console.log(`missed: ${misses.join(', ')}`);
