import type { CutPart, PieceGeometry } from './cut-list';
import type { HardwareLine } from './hardware';
import type { Machining } from './machining';
import { STAGE_KEYS, type LabourDriver, type PriceBook, type StageKey } from './price-book';

/** What one job counts, for the time standards: one number per driver. */
export type LabourCounts = Record<LabourDriver, number>;

export interface LabourLine {
  /** the operation's key in the price book */
  key: string;
  name: string;
  driver: LabourDriver;
  stage: StageKey;
  count: number;
  hours: number;
}

/**
 * Shop hours from the price book's time standards: each operation's minutes
 * times the count of its driver, per operation and per stage of the board.
 * Several operations may share a driver.
 *
 * @example labourHours({ ...counts, sheet: 3 }, demoPriceBook).byStage.cutting
 */
export function labourHours(
  counts: LabourCounts,
  book: PriceBook,
): { lines: LabourLine[]; byStage: Record<StageKey, number>; totalHours: number } {
  const byStage = Object.fromEntries(STAGE_KEYS.map((k) => [k, 0])) as Record<StageKey, number>;
  const lines: LabourLine[] = [];
  for (const op of book.labour) {
    const count = counts[op.driver] ?? 0;
    const hours = (count * op.minutes) / 60;
    if (hours <= 0) continue;
    lines.push({ key: op.key, name: op.name, driver: op.driver, stage: op.stage, count, hours });
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

/** One piece of a job as the labour counts see it. */
export interface LabourPiece {
  parts: readonly CutPart[];
  geometry: PieceGeometry;
  hardware: readonly HardwareLine[];
  quantity: number;
}

/** Metres of dados, rabbets and grooves machined in one piece's parts. */
export function dadoMetres(parts: readonly CutPart[]): number {
  return parts.reduce(
    (s, p) =>
      s +
      p.machining.reduce(
        (m, op) =>
          m +
          (op.kind === 'dado' || op.kind === 'rabbet' || op.kind === 'groove'
            ? (times(p, op) * op.lengthMm) / 1000
            : 0),
        0,
      ),
    0,
  );
}

/** Shelf-pin rows drilled in one piece's parts. */
export function shelfPinRows(parts: readonly CutPart[]): number {
  return parts.reduce(
    (s, p) => s + p.machining.reduce((n, op) => n + (op.kind === 'shelf_pin_row' ? times(p, op) : 0), 0),
    0,
  );
}

/** How many of a piece's part line an operation is done to: one where it names which part, else each. */
function times(part: CutPart, op: Machining): number {
  return 'only' in op && op.only ? 1 : part.quantity;
}

/**
 * Counts every driver for a job: sheets from the layouts, parts, banding,
 * pocket holes, dados and shelf-pin rows from the cut list, hinges and pulls
 * from the hardware, fronts, drawers and doors from the geometry, square
 * metres sanded (every finished face), finished (times coats) and of torsion
 * top, and the board feet of rough lumber milled.
 *
 * @example labourCounts({ pieces, sheets: 4, finishM2Coats: 12.5, boardFeetMilled: 0 }).hinge_bored
 */
export function labourCounts(job: {
  pieces: readonly LabourPiece[];
  sheets: number;
  finishM2Coats: number;
  boardFeetMilled: number;
}): LabourCounts {
  const per = (f: (p: LabourPiece) => number) => job.pieces.reduce((s, p) => s + f(p) * p.quantity, 0);
  const parts = (f: (parts: readonly CutPart[]) => number) => per((p) => f(p.parts));
  const hw = (kind: HardwareLine['kind']) =>
    per((p) => p.hardware.filter((h) => h.kind === kind).reduce((s, h) => s + h.pieces, 0));
  return {
    job: 1,
    sheet: job.sheets,
    part: parts((ps) => ps.reduce((s, x) => s + x.quantity, 0)),
    case: per((p) => p.geometry.caseCount),
    banding_metre: parts(bandingMetres),
    pocket_hole: parts((ps) => ps.reduce((s, x) => s + x.quantity * x.pocketHoles, 0)),
    dado_metre: parts(dadoMetres),
    shelf_pin_row: parts(shelfPinRows),
    hinge_bored: hw('hinge'),
    pull_fitted: hw('pull'),
    front_aligned: per((p) => p.geometry.fronts.length),
    drawer_box: per((p) => p.geometry.drawers.length),
    slide_pair: per((p) => p.geometry.drawers.length),
    door_hung: per((p) => p.geometry.doors.length),
    sanded_m2: parts((ps) => ps.reduce((s, x) => s + (x.quantity * x.finishFaces * x.lengthMm * x.widthMm) / 1e6, 0)),
    finish_m2_coat: job.finishM2Coats,
    torsion_top_m2: per((p) =>
      p.geometry.torsionTops && p.geometry.top ? (p.geometry.top.widthMm * p.geometry.depthMm) / 1e6 : 0,
    ),
    top: per((p) => p.geometry.torsionTops),
    board_foot_milled: job.boardFeetMilled,
    trim_piece: per((p) => p.geometry.trimPieces),
    caster: per((p) => p.geometry.casters + p.geometry.feet),
  };
}
