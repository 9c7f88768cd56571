/**
 * Sheet-layout benchmark on the published 2D bin-packing instances in
 * bench/data/nesting-instances.txt (2DPackLib: Bengtsson 1982, Berkey & Wang 1987,
 * Martello & Vigo 1998, Macedo et al. 2010), against the best published
 * totals (Gonçalves & Resende 2013) and against a general-purpose rectangle
 * packer from the registry (maxrects-packer 2.7.4), run side by side.
 *
 *   pnpm bench:nesting                 # both variants, effort 'thorough'
 *   BENCH_FILTER=cl02 pnpm bench:nesting
 *   BENCH_NESTING_FILE=/path/instances.txt pnpm bench:nesting
 *   BENCH_VARIANT=fixed pnpm bench:nesting        # or rotating: one variant only
 *   BENCH_SEED=3 pnpm bench:nesting               # another seed for the nester's random choices (default: nest's own)
 *
 * Every layout of ours goes through validateLayout; a failure is printed and
 * makes the run exit non-zero.
 */
import { readFileSync, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, resolve } from 'node:path';
// the package's "main" is a UMD file under "type": "module", so take its ES build directly
import { MaxRectsPacker } from 'maxrects-packer/dist/maxrects-packer.mjs';
import { nest, type NestPart } from '../src/nesting';
import { validateLayout } from '../src/validate-layout';

const here = dirname(fileURLToPath(import.meta.url));
const file = process.env.BENCH_NESTING_FILE ?? resolve(here, 'data/nesting-instances.txt');
if (!existsSync(file)) {
  console.error(`instances not found at ${file}; set BENCH_NESTING_FILE`);
  process.exit(2);
}

interface Instance {
  name: string;
  group: string;
  binW: number;
  binH: number;
  items: { w: number; h: number; count: number }[];
}

const instances: Instance[] = readFileSync(file, 'utf8')
  .split('\n')
  .filter((l) => l.trim())
  .map((line) => {
    const [name, , bw, bh, ...rest] = line.trim().split(';');
    if (!name) throw new Error(`an instance line without a name: ${line}`);
    const items = rest.map((s) => {
      const [w, h, c] = s.split(',').map(Number);
      if (w === undefined || h === undefined) throw new Error(`instance ${name}: an item without a size: ${s}`);
      return { w, h, count: c ?? 1 };
    });
    return { name, group: groupOf(name), binW: Number(bw), binH: Number(bh), items };
  })
  .filter((i) => !process.env.BENCH_FILTER || i.name.startsWith(process.env.BENCH_FILTER));

function groupOf(name: string): string {
  if (name.startsWith('beng')) return Number(name.slice(4)) <= 8 ? 'beng01-08' : 'beng09-10';
  const m = /^cl(\d\d)_(\d{3})_/.exec(name);
  if (m) return `class ${Number(m[1])} n=${Number(m[2])}`;
  return 'a01-a20';
}

// Best published totals over the ten instances of each group (Gonçalves & Resende 2013), as listed in the bench README.
const FIXED: Record<string, number[]> = {
  1: [71, 134, 200],
  2: [10, 19, 25],
  3: [51, 94, 139],
  4: [10, 19, 25],
  5: [65, 119, 180],
  6: [10, 16, 21],
  7: [55, 111, 158],
  8: [58, 113, 161],
  9: [143, 278, 437],
  10: [42, 74, 100],
};
const ROTATING: Record<string, number[]> = {
  1: [66, 128, 195],
  2: [10, 19, 25],
  3: [47, 92, 134],
  4: [10, 19, 23],
  5: [59, 114, 172],
  6: [10, 16, 21],
  7: [52, 102, 146],
  8: [53, 103, 147],
  9: [143, 275, 435],
  10: [41, 72, 99],
};
function best(group: string, rotate: boolean): number | undefined {
  if (group === 'beng01-08') return 54;
  if (group === 'beng09-10') return 13;
  const m = /^class (\d+) n=(\d+)$/.exec(group);
  if (!m) return undefined;
  const [, cls = '', n] = m;
  return (rotate ? ROTATING : FIXED)[cls]?.[[20, 40, 60].indexOf(Number(n))];
}

interface Row {
  group: string;
  instances: number;
  ours: number;
  area: number;
  peer: number;
  best?: number;
  ms: number;
  maxMs: number;
  reachedBound: number;
}

let invalid = 0;
function run(rotate: boolean): Row[] {
  const rows = new Map<string, Row>();
  for (const inst of instances) {
    const parts: NestPart[] = inst.items.map((it, i) => ({
      id: `${i}`,
      lengthMm: it.w,
      widthMm: it.h,
      quantity: it.count,
      canRotate: rotate,
    }));
    const sheet = { lengthMm: inst.binW, widthMm: inst.binH };
    const opts = {
      kerfMm: 0,
      trimMm: 0,
      effort: 'thorough' as const,
      ...(process.env.BENCH_SEED ? { seed: Number(process.env.BENCH_SEED) } : {}),
    };
    const t0 = performance.now();
    const r = nest(parts, sheet, opts);
    const ms = performance.now() - t0;
    const v = validateLayout(r, parts, sheet, opts);
    if (!v.ok || r.unplaced.length) {
      invalid++;
      console.error(
        `INVALID ${inst.name} rotate=${rotate}: ${[...v.errors, ...r.unplaced.map((u) => u.reason)].slice(0, 3).join('; ')}`,
      );
    }
    const area = Math.ceil(
      inst.items.reduce((s, it) => s + it.w * it.h * it.count, 0) / (inst.binW * inst.binH) - 1e-9,
    );
    const packer = new MaxRectsPacker(inst.binW, inst.binH, 0, {
      smart: false,
      pot: false,
      square: false,
      allowRotation: rotate,
      border: 0,
    });
    packer.addArray(
      inst.items.flatMap((it) => Array.from({ length: it.count }, () => ({ width: it.w, height: it.h }))) as never,
    );
    const row = rows.get(inst.group) ?? {
      group: inst.group,
      instances: 0,
      ours: 0,
      area: 0,
      peer: 0,
      best: best(inst.group, rotate),
      ms: 0,
      maxMs: 0,
      reachedBound: 0,
    };
    row.instances++;
    row.ours += r.sheetCount;
    row.area += area;
    row.peer += packer.bins.length;
    row.ms += ms;
    row.maxMs = Math.max(row.maxMs, ms);
    if (r.sheetCount === area) row.reachedBound++;
    rows.set(inst.group, row);
  }
  return [...rows.values()];
}

function print(
  title: string,
  rows: Row[],
): { ours: number; peer: number; best: number; oursWithBest: number; maxMs: number } {
  console.log(`\n## ${title}\n`);
  console.log(
    '| group | instances | ours | area bound | best published | ours vs best | maxrects-packer | ms/instance (mean) | ms (max) |',
  );
  console.log('|---|---|---|---|---|---|---|---|---|');
  let ours = 0,
    peer = 0,
    bestSum = 0,
    oursWithBest = 0,
    maxMs = 0;
  for (const r of rows) {
    ours += r.ours;
    peer += r.peer;
    maxMs = Math.max(maxMs, r.maxMs);
    if (r.best !== undefined) {
      bestSum += r.best;
      oursWithBest += r.ours;
    }
    const gap = r.best !== undefined ? `${(((r.ours - r.best) / r.best) * 100).toFixed(1)} %` : '-';
    console.log(
      `| ${r.group} | ${r.instances} | ${r.ours} | ${r.area} | ${r.best ?? '-'} | ${gap} | ${r.peer} | ${(r.ms / r.instances).toFixed(1)} | ${r.maxMs.toFixed(0)} |`,
    );
  }
  const gap = bestSum ? (((oursWithBest - bestSum) / bestSum) * 100).toFixed(2) : '-';
  console.log(
    `| **all** | ${rows.reduce((s, r) => s + r.instances, 0)} | ${ours} | ${rows.reduce((s, r) => s + r.area, 0)} | ${bestSum} | ${gap} % | ${peer} | | ${maxMs.toFixed(0)} |`,
  );
  const c2 = rows.filter((r) => r.group.startsWith('class 2 '));
  if (c2.length)
    console.log(
      `\nclass II at the area bound: ${c2.reduce((s, r) => s + r.reachedBound, 0)} of ${c2.reduce((s, r) => s + r.instances, 0)} instances`,
    );
  console.log(
    `groups with a published total: ours ${oursWithBest} vs best ${bestSum} (${gap} % over); all instances: ours ${ours} vs maxrects-packer ${peer}`,
  );
  return { ours, peer, best: bestSum, oursWithBest, maxMs };
}

function quickTiming(): void {
  // the live budget: 100 parts at effort 'quick', on a 4 x 8 ft sheet with a 1/8 in kerf
  const parts: NestPart[] = Array.from({ length: 100 }, (_, i) => ({
    id: `p${i}`,
    lengthMm: 150 + ((i * 137) % 900),
    widthMm: 80 + ((i * 71) % 500),
    quantity: 1,
    canRotate: i % 3 !== 0,
  }));
  const sheet = { lengthMm: 2438.4, widthMm: 1219.2 };
  const opts = { kerfMm: 3.2, trimMm: 6, effort: 'quick' as const };
  for (let i = 0; i < 5; i++) nest(parts, sheet, opts);
  const times: number[] = [];
  for (let i = 0; i < 30; i++) {
    const t0 = performance.now();
    nest(parts, sheet, opts);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)] ?? NaN;
  const max = times.at(-1) ?? NaN;
  console.log(
    `\neffort 'quick', 100 parts on 4 x 8 ft: median ${median.toFixed(2)} ms, max ${max.toFixed(2)} ms (30 runs)`,
  );
}

console.log(`# Sheet-layout benchmark: ${instances.length} instances, kerf 0, trim 0, effort 'thorough'`);
const variant = process.env.BENCH_VARIANT; // 'fixed' or 'rotating' runs one variant only
const none = { ours: 0, peer: 0, best: 0, oursWithBest: 0, maxMs: 0 };
const fixed = variant === 'rotating' ? none : print('fixed orientation (grain-bound)', run(false));
const rot = variant === 'fixed' ? none : print('rotation allowed', run(true));
quickTiming();
console.log(`\nvalidation failures: ${invalid}`);
console.log(
  `summary: fixed ${fixed.oursWithBest}/${fixed.best} published, ${fixed.ours} vs peer ${fixed.peer}; rotating ${rot.oursWithBest}/${rot.best} published, ${rot.ours} vs peer ${rot.peer}; slowest instance ${Math.max(fixed.maxMs, rot.maxMs).toFixed(0)} ms`,
);
if (invalid) process.exit(1);
