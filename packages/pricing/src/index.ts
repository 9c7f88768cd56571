export * from './geometry';
export { nest, nestByMaterial, nestLowerBound } from './nesting';
export type {
  Cut,
  NestOptions,
  NestPart,
  NestResult,
  Offcut,
  Placement,
  SheetLayout,
  StockSheet,
  UnplacedPart,
} from './nesting';
export { validateLayout } from './validate-layout';
export { finishCoverage, finishGallons, FT2_MIL_PER_GALLON } from './finish';
export { hardwareFor, TWO_PULL_WIDTH_MM } from './hardware';
export type { HardwareLine } from './hardware';
export { labourHours, labourCounts, bandingMetres, dadoMetres, shelfPinRows } from './labour';
export type { LabourCounts, LabourLine, LabourPiece } from './labour';
export type { Machining, PartEdge } from './machining';
export { estimate, budgetRange, rangeOf, totalsFor, splitDeposit, times } from './costing';
export type {
  Estimate,
  EstimateItem,
  EstimateLine,
  EstimateOptions,
  MaterialLayout,
  PieceResult,
  Totals,
} from './costing';
export { demoPriceBook, demoSettings } from './demo-data';
export { traveller, SHOP_CAUTIONS } from './traveller';
export type { Traveller, TravellerPart, TravellerSheet } from './traveller';
export { partDrawings, partDrawing, drawingLength, textBox, boxesOverlap } from './part-drawing';
export type { PartDrawing, PartShape, PartText, Box } from './part-drawing';
export { joineryOf, pieceSummary, type TravellerPiece } from './piece-summary';
export {
  LABOUR_OPERATION_KEYS,
  LABOUR_DRIVERS,
  LABOUR_DRIVER_UNITS,
  standardIn,
  LabourDriver,
  HardwareKind,
  SheetGood,
  Lumber,
  EdgeBanding,
  HardwareItem,
  Finish,
  LabourOperation,
  LabourOperationFields,
} from './price-book';
export { leadTime, bookedHours, leadTimeDates } from './lead-time';
export type { LeadTime, BookedJob } from './lead-time';
export { stageChecklist } from './checklist';
export type { ChecklistItem } from './checklist';
export { hoursFeedback, HOURS_FEEDBACK, scaleStandards } from './hours-feedback';
export type { DeliveredJobHours, StageHours, StandardChange } from './hours-feedback';
export { choicesOf } from './choices';
export type { Choice } from './choices';
