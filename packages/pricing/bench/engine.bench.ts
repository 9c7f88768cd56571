/**
 * Engine benchmark: `estimate` timings and the browser bundle of the geometry.
 *
 *   pnpm bench:engine
 *
 * - estimate of the assembly-bench defaults at effort 'quick' (median of 50 runs after warm-up)
 * - a 12-cabinet kitchen run (test/fixtures/kitchen-run.json) at 'quick' (median of 15 runs)
 * - a mixed job (test/fixtures/mixed-job.json: three base cabinets, two wall cabinets, a bookcase and the
 *   assembly-bench defaults) at 'thorough': sheets per material against the lower bound, and the time
 *   (median of 3 runs after one warm-up), wall clock and CPU (the CPU figure moves less on a busy machine)
 * - src/geometry.ts (designs, validation, cut list, checks, drawings, units) bundled by esbuild,
 *   minified, for the browser, then gzipped
 */
import { readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import { build } from 'esbuild';
import { at } from '../src/_lib/at';
import { designs, estimate, demoPriceBook, demoSettings, type EstimateItem } from '../src/index';

function median(f: () => void, runs: number, warm = 5): number {
  return timed(f, runs, warm).wallMs;
}

/** median wall-clock and CPU (user + system) milliseconds of `runs` calls after `warm` warm-up calls */
function timed(f: () => void, runs: number, warm: number): { wallMs: number; cpuMs: number } {
  for (let i = 0; i < warm; i++) f();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    f();
    const c = process.cpuUsage(c0);
    wall.push(performance.now() - t0);
    cpu.push((c.user + c.system) / 1000);
  }
  const mid = (xs: number[]) =>
    at(
      [...xs].sort((a, b) => a - b),
      Math.floor(runs / 2),
    );
  return { wallMs: mid(wall), cpuMs: mid(cpu) };
}

const bench: EstimateItem[] = [{ spec: designs['assembly-bench'].defaults, quantity: 1 }];
const kitchen: EstimateItem[] = JSON.parse(
  readFileSync(new URL('../test/fixtures/kitchen-run.json', import.meta.url), 'utf8'),
);
const benchMs = median(() => estimate(bench, demoPriceBook, demoSettings, { effort: 'quick' }), 50);
const kitchenMs = median(() => estimate(kitchen, demoPriceBook, demoSettings, { effort: 'quick' }), 15, 2);
const thoroughKitchenMs = median(() => estimate(kitchen, demoPriceBook, demoSettings, { effort: 'thorough' }), 3, 1);
const mixed: EstimateItem[] = JSON.parse(
  readFileSync(new URL('../test/fixtures/mixed-job.json', import.meta.url), 'utf8'),
);
const mixedLayouts = estimate(mixed, demoPriceBook, demoSettings, { effort: 'thorough' }).layouts;
const mixedThorough = timed(() => estimate(mixed, demoPriceBook, demoSettings, { effort: 'thorough' }), 3, 1);

const out = await build({
  entryPoints: [new URL('../src/geometry.ts', import.meta.url).pathname],
  bundle: true,
  minify: true,
  format: 'esm',
  platform: 'browser',
  write: false,
  treeShaking: true,
});
const [bundle] = out.outputFiles;
if (!bundle) throw new Error('esbuild wrote no bundle');
const js = bundle.contents;
const gz = gzipSync(js, { level: 9 }).length;

const pieces = kitchen.reduce((s, i) => s + i.quantity, 0);
console.log(`estimate, assembly-bench defaults, quick: median ${benchMs.toFixed(1)} ms (target <= 20 ms)`);
console.log(`estimate, kitchen run of ${pieces} cabinets, quick: median ${kitchenMs.toFixed(1)} ms (target <= 300 ms)`);
console.log(`estimate, kitchen run, thorough: median ${thoroughKitchenMs.toFixed(0)} ms`);
const mixedPieces = mixed.reduce((s, i) => s + i.quantity, 0);
console.log(
  `estimate, mixed job of ${mixedPieces} pieces, thorough: median ${mixedThorough.wallMs.toFixed(0)} ms, CPU ${mixedThorough.cpuMs.toFixed(0)} ms (target <= 1000 ms); sheets ${mixedLayouts.reduce((s, l) => s + l.sheetCount, 0)}: ${mixedLayouts.map((l) => `${l.materialId} ${l.sheetCount} (bound ${l.lowerBound})`).join(', ')}`,
);
console.log(
  `geometry bundle: ${(js.length / 1024).toFixed(1)} KB minified, ${(gz / 1024).toFixed(1)} KB gzipped (target <= 60 KB)`,
);
