/**
 * The nester's entry: `nest` lays parts out on identical stock sheets,
 * `nestByMaterial` does so per material. The concerns live beside it:
 * `types.ts`, `bin.ts` (the guillotine bin), `search.ts` (the heuristic search),
 * `exact.ts` (the exact search), `cut-plan.ts` (cut order and offcuts),
 * `lower-bound.ts`, and `tuning.ts` (every tuning constant).
 */
import { sheetLayouts } from './cut-plan';
import { fitsSheet, nestLowerBound } from './lower-bound';
import { searchLayout } from './search';
import { NESTING_TUNING } from './tuning';
import {
  EPS,
  type Ctx,
  type Item,
  type NestOptions,
  type NestPart,
  type NestResult,
  type StockSheet,
  type UnplacedPart,
} from './types';

export { nestLowerBound } from './lower-bound';
export { NESTING_TUNING } from './tuning';
export type {
  Cut,
  CutDirection,
  NestEffort,
  NestOptions,
  NestPart,
  NestResult,
  Offcut,
  Placement,
  SheetLayout,
  StockSheet,
  UnplacedPart,
} from './types';

function checkInputs(parts: readonly NestPart[], sheet: StockSheet, options: NestOptions): void {
  const bad = (what: string) => {
    throw new RangeError(what);
  };
  if (!(sheet.lengthMm > 0 && sheet.widthMm > 0))
    bad(`sheet size must be positive, got ${sheet.lengthMm} x ${sheet.widthMm} mm`);
  if (!(options.kerfMm >= 0)) bad(`kerf must be zero or more, got ${options.kerfMm} mm`);
  if (!(options.trimMm >= 0) || 2 * options.trimMm >= Math.min(sheet.lengthMm, sheet.widthMm))
    bad(`edge trim of ${options.trimMm} mm leaves nothing of the sheet`);
  const ids = new Set<string>();
  for (const p of parts) {
    if (ids.has(p.id)) bad(`part id "${p.id}" appears twice`);
    ids.add(p.id);
    if (!(p.lengthMm > 0 && p.widthMm > 0))
      bad(`part "${p.id}" must have a positive size, got ${p.lengthMm} x ${p.widthMm} mm`);
    if (!Number.isInteger(p.quantity) || p.quantity < 0)
      bad(`part "${p.id}" quantity must be a whole number, got ${p.quantity}`);
  }
}

/**
 * Lays parts out on identical stock sheets with guillotine cuts only, the saw
 * kerf between parts and the edge trim around the sheet; grain-bound parts
 * (`canRotate: false`) keep their length along the sheet's length.
 * `effort: 'quick'` tries a handful of orderings (for the live budget);
 * `'thorough'` searches further (for estimates of record). Deterministic for
 * a given seed.
 *
 * @example
 * nest([{ id: 'side', lengthMm: 762, widthMm: 584, quantity: 2, canRotate: false }],
 *      { lengthMm: 2438.4, widthMm: 1219.2 }, { kerfMm: 3.2, trimMm: 6, effort: 'quick' }).sheetCount // 1
 */
export function nest(parts: readonly NestPart[], sheet: StockSheet, options: NestOptions): NestResult {
  checkInputs(parts, sheet, options);
  const trim = options.trimMm;
  const ctx: Ctx = {
    x0: trim,
    y0: trim,
    L: sheet.lengthMm - 2 * trim,
    W: sheet.widthMm - 2 * trim,
    kerf: options.kerfMm,
    spent: 0,
    limit: 0,
  };
  const unplaced: UnplacedPart[] = [];
  const items: Item[] = [];
  parts.forEach((p, type) => {
    if (p.quantity === 0) return;
    if (!fitsSheet(p, ctx.L, ctx.W)) {
      const turned = p.widthMm <= ctx.L + EPS && p.lengthMm <= ctx.W + EPS;
      unplaced.push({
        partId: p.id,
        quantity: p.quantity,
        reason: turned
          ? `fits only turned across the grain, and its grain is fixed (${fmt(p.lengthMm)} x ${fmt(p.widthMm)} mm on ${fmt(ctx.L)} x ${fmt(ctx.W)} mm usable)`
          : `larger than the usable sheet (${fmt(p.lengthMm)} x ${fmt(p.widthMm)} mm on ${fmt(ctx.L)} x ${fmt(ctx.W)} mm usable)`,
      });
      return;
    }
    for (let q = 0; q < p.quantity; q++)
      items.push({ type, l: p.lengthMm, w: p.widthMm, canRotate: p.canRotate, area: p.lengthMm * p.widthMm });
  });

  const lowerBound = nestLowerBound(parts, sheet, trim);
  const solution = searchLayout(items, ctx, lowerBound, options.effort, options.seed ?? NESTING_TUNING.defaultSeed);
  const sheets = sheetLayouts(solution?.bins ?? [], parts, sheet, trim, ctx);
  const sheetArea = sheet.lengthMm * sheet.widthMm;
  const used = sheets.reduce((s, x) => s + x.usedAreaMm2, 0);
  return {
    sheets,
    sheetCount: sheets.length,
    lowerBound,
    yieldRatio: sheets.length ? used / (sheets.length * sheetArea) : 0,
    unplaced,
  };
}

function fmt(mm: number): string {
  return (Math.round(mm * 10) / 10).toString();
}

/**
 * Groups parts by `materialId` and nests each group on its own stock.
 * Parts whose material has no stock are reported as unplaced.
 *
 * @example
 * nestByMaterial(parts, { 'ply-18': { lengthMm: 2438.4, widthMm: 1219.2 } }, { kerfMm: 3.2, trimMm: 6, effort: 'quick' })['ply-18'].sheetCount
 */
export function nestByMaterial(
  parts: readonly NestPart[],
  stockByMaterialId: Readonly<Record<string, StockSheet>>,
  options: NestOptions,
): Record<string, NestResult> {
  const groups = new Map<string, NestPart[]>();
  for (const p of parts) {
    const key = p.materialId ?? '';
    if (!groups.has(key)) groups.set(key, []);
    groups.get(key)!.push(p);
  }
  const out: Record<string, NestResult> = {};
  for (const [materialId, group] of groups) {
    const stock = stockByMaterialId[materialId];
    if (!stock) {
      out[materialId] = {
        sheets: [],
        sheetCount: 0,
        lowerBound: 0,
        yieldRatio: 0,
        unplaced: group.map((p) => ({
          partId: p.id,
          quantity: p.quantity,
          reason: `no stock sheet is set for material "${materialId}"`,
        })),
      };
      continue;
    }
    out[materialId] = nest(group, stock, options);
  }
  return out;
}
