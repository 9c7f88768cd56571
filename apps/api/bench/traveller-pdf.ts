/**
 * Traveller PDF benchmark: how long the job paper takes to draw, in-process
 * (the PDF worker runs the same code on its own thread).
 *
 *   cd apps/api && pnpm exec tsx bench/traveller-pdf.ts [--mixed-only]
 *
 * - the mixed job (packages/pricing/test/fixtures/mixed-job.json) priced at 'thorough', as a revision keeps it:
 *   median of 3 renders after one warm-up, wall clock and CPU, pages and bytes
 * - the largest job the request caps let through with the most different parts: 20 assembly benches, each of
 *   another height (1,920 parts, at the MAX_PARTS cap of 2,000), priced at 'quick': one render, against
 *   the PDF worker's time limit (PDF_TIMEOUT_MS, 30 s by default)
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  demoPriceBook,
  demoSettings,
  designs,
  estimate,
  traveller,
  validateSpec,
  type EstimateItem,
} from '@benchwright/pricing';
import { MAX_PARTS, MAX_PIECES } from '@benchwright/contracts';
import { renderTravellerPdf, type TravellerPdfInput } from '../src/lib/pdf/traveller-pdf';

const input = (t: ReturnType<typeof traveller>): TravellerPdfInput => ({
  shopName: 'Fernhill Joinery',
  clientName: 'Benchmark',
  notes: '',
  stageLabel: 'Cutting',
  builderName: null,
  dueDate: null,
  units: 'in',
  stageLabels: {},
  hoursLogged: {},
  traveller: t,
});

function pages(pdf: Buffer): number {
  const dir = mkdtempSync(join(tmpdir(), 'bw-bench-'));
  try {
    writeFileSync(join(dir, 'a.pdf'), pdf);
    return Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [join(dir, 'a.pdf')]).toString())?.[1]);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

async function timed(d: TravellerPdfInput): Promise<{ wallMs: number; cpuMs: number; pdf: Buffer }> {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const pdf = await renderTravellerPdf(d);
  const c = process.cpuUsage(c0);
  return { wallMs: performance.now() - t0, cpuMs: (c.user + c.system) / 1000, pdf };
}

const mixed: EstimateItem[] = JSON.parse(
  readFileSync(new URL('../../../packages/pricing/test/fixtures/mixed-job.json', import.meta.url), 'utf8'),
);
const mixedInput = input(
  traveller(estimate(mixed, demoPriceBook, demoSettings, { effort: 'thorough' }), demoPriceBook, demoSettings),
);
await timed(mixedInput);
const runs = [];
for (let i = 0; i < 3; i++) runs.push(await timed(mixedInput));
runs.sort((a, b) => a.wallMs - b.wallMs);
const mid = runs[1]!;
console.log(
  `mixed job traveller PDF: ${Math.round(mid.wallMs)} ms wall, ${Math.round(mid.cpuMs)} ms CPU (median of 3), ` +
    `${pages(mid.pdf)} pages, ${(mid.pdf.length / 1024).toFixed(0)} KB`,
);

if (process.argv.includes('--mixed-only')) process.exit(0);
const d = designs['assembly-bench'];
const largest: EstimateItem[] = Array.from({ length: 20 }, (_, i) => {
  const spec = {
    ...structuredClone(d.defaults),
    heightMm: d.defaults.heightMm + 6.35 * (i - 10),
  };
  const v = validateSpec(spec, demoPriceBook, demoSettings);
  if (!v.ok) throw new Error(JSON.stringify(v.issues));
  return { spec: v.spec, quantity: 1 };
});
const { cutList } = await import('@benchwright/pricing/geometry');
const parts = largest.reduce(
  (s, it) => s + it.quantity * cutList(it.spec, demoPriceBook, demoSettings).parts.reduce((n, p) => n + p.quantity, 0),
  0,
);
const pieces = largest.reduce((s, it) => s + it.quantity, 0);
if (parts > MAX_PARTS || pieces > MAX_PIECES) throw new Error(`over the caps: ${pieces} pieces, ${parts} parts`);
const big = input(
  traveller(estimate(largest, demoPriceBook, demoSettings, { effort: 'quick' }), demoPriceBook, demoSettings),
);
const b = await timed(big);
console.log(
  `largest job (${largest.length} benches, ${pieces} pieces, ${parts} parts) traveller PDF: ` +
    `${Math.round(b.wallMs)} ms wall, ${Math.round(b.cpuMs)} ms CPU, ${pages(b.pdf)} pages, ` +
    `${(b.pdf.length / 1024).toFixed(0)} KB (time limit 30,000 ms)`,
);
