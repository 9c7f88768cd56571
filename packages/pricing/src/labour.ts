import type { CutPart } from './cut-list';
import { STAGE_KEYS, type LabourOperationKey, type PriceBook, type StageKey } from './price-book';

/** What one job counts, for the time standards. */
export interface LabourCounts {
  jobs: number;
  sheets: number;
  parts: number;
  bandingMetres: number;
  pocketHoles: number;
  cases: number;
  drawers: number;
  slidePairs: number;
  doors: number;
  torsionTops: number;
  trimPieces: number;
  finishM2Coats: number;
  casters: number;
}

export interface LabourLine {
  key: LabourOperationKey;
  name: string;
  stage: StageKey;
  count: number;
  hours: number;
}

const COUNT_OF: Record<LabourOperationKey, keyof LabourCounts> = {
  job_setup: 'jobs',
  sheet_breakdown: 'sheets',
  part_cut: 'parts',
  edge_banding: 'bandingMetres',
  pocket_hole: 'pocketHoles',
  case_assembly: 'cases',
  drawer_box: 'drawers',
  slide_pair: 'slidePairs',
  door_hang: 'doors',
  torsion_top: 'torsionTops',
  trim_piece: 'trimPieces',
  finish_coat: 'finishM2Coats',
  caster: 'casters',
  final_check: 'jobs',
};

/**
 * Shop hours from the price book's time standards, per operation and per
 * stage of the board.
 *
 * @example labourHours({ ...counts, sheets: 3 }, demoPriceBook).byStage.cutting
 */
export function labourHours(
  counts: LabourCounts,
  book: PriceBook,
): { lines: LabourLine[]; byStage: Record<StageKey, number>; totalHours: number } {
  const byStage = Object.fromEntries(STAGE_KEYS.map((k) => [k, 0])) as Record<StageKey, number>;
  const lines: LabourLine[] = [];
  for (const op of book.labour) {
    const count = counts[COUNT_OF[op.key]];
    const hours = (count * op.minutes) / 60;
    if (hours <= 0) continue;
    lines.push({ key: op.key, name: op.name, stage: op.stage, count, hours });
    byStage[op.stage] += hours;
  }
  return { lines, byStage, totalHours: lines.reduce((s, l) => s + l.hours, 0) };
}

/** Metres of edge banding on the parts (before waste). */
export function bandingMetres(parts: readonly CutPart[]): number {
  return parts.reduce(
    (s, p) => s + (p.quantity * (p.bandedEdges.long * p.lengthMm + p.bandedEdges.short * p.widthMm)) / 1000,
    0,
  );
}
