/**
 * The engine's geometry, for the browser: designs, validation, cut list,
 * checks, drawings and units, without money. Prices come from the server.
 */
export * from './units';
export { withUnits } from './messages';
export * from './designs';
export { cutList, drawerBox, SLIDE_LENGTHS_IN } from './cut-list';
export type { CutList, CutPart, DrawerBox, FrontRect, PieceGeometry } from './cut-list';
export { shelfSag, maxShelfSpan, casterCheck, pieceChecks, TIP_OVER_HEIGHT_MM } from './checks';
export type { Check, CheckLevel } from './checks';
export { hingesPerDoor } from './hardware';
export { elevationDrawing, sheetLayoutDrawing, toSvg } from './drawings';
export type { Drawing, DrawingView, Shape, ShapeStyle } from './drawings';
export { validateSpec } from './validate';
export {
  PriceBook,
  ShopSettings,
  STAGE_KEYS,
  STAGE_LABELS,
  StageKey,
  SheetGood,
  Lumber,
  EdgeBanding,
  HardwareItem,
  Finish,
  LabourOperation,
  LabourOperationFields,
  LABOUR_DRIVER_UNITS,
  standardIn,
} from './price-book';
export { LINE_GROUPS, LINE_GROUP_LABELS } from './line-groups';
export type { LineGroup } from './line-groups';
export type { Traveller, TravellerPart, TravellerSheet } from './traveller';
export type { ChecklistItem } from './checklist';
export { joineryOf, pieceSummary, type TravellerPiece } from './piece-summary';
