/**
 * The nester's types: the public ones (parts, sheets, options, layouts) and the
 * internal model the bin, the search and the cut plan share.
 */

/** A part to lay out. `lengthMm` runs along the grain (the sheet's length). */
export interface NestPart {
  id: string;
  lengthMm: number;
  widthMm: number;
  quantity: number;
  /** false for grain-bound parts: length stays along the sheet's length */
  canRotate: boolean;
  name?: string;
  materialId?: string;
}

/** One stock sheet size; the supply is unlimited. */
export interface StockSheet {
  lengthMm: number;
  widthMm: number;
}

export type NestEffort = 'quick' | 'thorough';

export interface NestOptions {
  kerfMm: number;
  trimMm: number;
  effort: NestEffort;
  seed?: number;
}

export interface Placement {
  partId: string;
  xMm: number;
  yMm: number;
  /** size as placed, along x */
  lengthMm: number;
  /** size as placed, along y */
  widthMm: number;
  rotated: boolean;
}

export type CutDirection = 'rip' | 'crosscut';

export interface Cut {
  order: number;
  /** 1 for cuts across the whole (trimmed) sheet, 2 for cuts across its strips, and so on; 0 for edge trims */
  stage: number;
  direction: CutDirection;
  x1Mm: number;
  y1Mm: number;
  x2Mm: number;
  y2Mm: number;
}

export interface Offcut {
  xMm: number;
  yMm: number;
  lengthMm: number;
  widthMm: number;
}

export interface SheetLayout {
  /** the stock sheet's size */
  lengthMm: number;
  widthMm: number;
  placements: Placement[];
  cuts: Cut[];
  offcuts: Offcut[];
  usedAreaMm2: number;
  yieldRatio: number;
}

export interface UnplacedPart {
  partId: string;
  quantity: number;
  reason: string;
}

export interface NestResult {
  sheets: SheetLayout[];
  sheetCount: number;
  lowerBound: number;
  yieldRatio: number;
  unplaced: UnplacedPart[];
}

/** tolerance for comparing lengths and areas */
export const EPS = 1e-6;

// ---------------------------------------------------------------------------
// Internal model: items are single units; a bin is a list of free rectangles
// produced by guillotine splits, so every layout is guillotine by construction.

export interface Item {
  /** index into the part list */
  type: number;
  l: number;
  w: number;
  canRotate: boolean;
  area: number;
}

export interface Free {
  x: number;
  y: number;
  l: number;
  w: number;
}

export interface Placed {
  item: Item;
  x: number;
  y: number;
  l: number;
  w: number;
  rotated: boolean;
}

export interface Bin {
  free: Free[];
  placed: Placed[];
  used: number;
}

export interface Solution {
  bins: Bin[];
}

export type FitRule = 'area' | 'short' | 'long' | 'bottom';
export type SplitRule = 'shorterLeftover' | 'longerLeftover' | 'shorterAxis' | 'longerAxis' | 'maxArea' | 'minArea';

export interface Config {
  /** 'item': parts in order, each to its best free rectangle; 'space': free rectangles in turn, each given its best part */
  mode?: 'item' | 'space';
  fit: FitRule;
  split: SplitRule;
  /** space mode only: a random source to choose among near-best parts (randomised restarts) */
  noise?: () => number;
}

/** The usable rectangle of a sheet, the kerf, and the work counter of one `nest` call. */
export interface Ctx {
  x0: number;
  y0: number;
  L: number;
  W: number;
  kerf: number;
  /** work done so far, in part visits; the search stops at `limit` (deterministic, unlike a clock) */
  spent: number;
  limit: number;
}
