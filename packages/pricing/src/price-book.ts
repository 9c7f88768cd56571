import * as z from 'zod';

const id = z
  .string()
  .min(1)
  .max(64)
  .regex(/^[a-z0-9][a-z0-9-]*$/, 'use lower-case letters, digits and hyphens');
const cents = z.number().int().nonnegative();
const positive = z.number().positive();
const fraction = z.number().min(0).max(1);

/** Stage keys of the production board (DESIGN.md section 3); labour hours are budgeted per key. */
export const STAGE_KEYS = ['material', 'cutting', 'casework', 'drawers_doors', 'finish', 'ready', 'delivered'] as const;
export const StageKey = z.enum(STAGE_KEYS);
export type StageKey = z.infer<typeof StageKey>;
/**
 * The board's columns as first named; the shop may rename them (the API keeps
 * its own labels with the stages), and whatever names a stage for people —
 * the board, the estimate's labour lines — reads the shop's labels.
 */
export const STAGE_LABELS: Record<StageKey, string> = {
  material: 'Material',
  cutting: 'Cutting',
  casework: 'Casework',
  drawers_doors: 'Drawers & doors',
  finish: 'Finish',
  ready: 'Ready',
  delivered: 'Delivered',
};

export const SheetGood = z.object({
  id,
  name: z.string().min(1),
  kind: z.enum(['plywood', 'mdf', 'particleboard', 'hardboard']),
  nominalThicknessIn: positive,
  /** actual thickness as measured; imported plywood is commonly under nominal */
  thicknessMm: positive,
  sheetLengthMm: positive,
  sheetWidthMm: positive,
  /** lengthwise: face grain runs along the sheet's length; none: no grain (MDF) */
  grain: z.enum(['lengthwise', 'none']),
  densityKgM3: positive,
  modulusMPa: positive,
  priceCents: cents,
});
export type SheetGood = z.infer<typeof SheetGood>;

export const Lumber = z.object({
  id,
  name: z.string().min(1),
  species: z.string().min(1),
  /** rough thickness bought, in quarters of an inch (4/4 = 1 in) */
  roughThicknessIn: positive,
  densityKgM3: positive,
  modulusMPa: positive,
  pricePerBoardFootCents: cents,
});
export type Lumber = z.infer<typeof Lumber>;

export const EdgeBanding = z.object({
  id,
  name: z.string().min(1),
  widthMm: positive,
  pricePerMetreCents: cents,
});
export type EdgeBanding = z.infer<typeof EdgeBanding>;

export const HardwareKind = z.enum([
  'slide',
  'hinge',
  'shelf_pin',
  'pull',
  'caster',
  'leveling_foot',
  'pocket_screw',
  'rail_screw',
  'anti_tip_kit',
  'hanging_rail',
  'screw',
  'bolt',
  'connector',
]);
export type HardwareKind = z.infer<typeof HardwareKind>;

export const HardwareItem = z.object({
  id,
  name: z.string().min(1),
  kind: HardwareKind,
  unit: z.enum(['each', 'pair', 'set', 'box']),
  priceCents: cents,
  /** pieces in one priced unit (a box of 100 screws) */
  perUnit: z.number().int().positive().default(1),
  /** slides: nominal length in inches; screws and bolts: length under the head */
  lengthIn: positive.optional(),
  /** hinges: the overlay the hinge is made for (full on an end panel, half on a shared partition, inset) */
  overlay: z.enum(['full', 'half', 'inset']).optional(),
  /** screws and bolts: what they fasten (the engine counts each) */
  fastens: z.enum(['slide', 'hinge', 'drawer_front', 'top', 'caster', 'foot']).optional(),
  /** casters: rated load per caster */
  ratedLoadKg: positive.optional(),
  /** casters and leveling feet: height added under the case */
  heightMm: z.number().nonnegative().optional(),
  massKg: z.number().nonnegative().default(0),
});
export type HardwareItem = z.infer<typeof HardwareItem>;

export const Finish = z.object({
  id,
  name: z.string().min(1),
  /** fraction of the wet volume that stays as dry film, 0..1 */
  volumeSolids: fraction,
  /** the dry film each coat leaves, in mils (thousandths of an inch) */
  dryFilmMilsPerCoat: positive,
  transferEfficiency: fraction.default(1),
  defaultCoats: z.number().int().min(1).max(6),
  pricePerGallonCents: cents,
});
export type Finish = z.infer<typeof Finish>;

/**
 * The operation keys of price books stored before operations were open. Kept
 * for reading those books (see `LabourOperation`); a book may now hold any
 * operations under any keys.
 */
export const LABOUR_OPERATION_KEYS = [
  'job_setup',
  'sheet_breakdown',
  'part_cut',
  'edge_banding',
  'pocket_hole',
  'case_assembly',
  'drawer_box',
  'slide_pair',
  'door_hang',
  'torsion_top',
  'trim_piece',
  'finish_coat',
  'caster',
  'final_check',
] as const;
export const LabourOperationKey = z.string().trim().min(1).max(64);
export type LabourOperationKey = z.infer<typeof LabourOperationKey>;

/**
 * What a time standard counts; the engine counts each from the cut list, the
 * hardware and the finish. `case`, `top` and `trim_piece` keep the meaning of
 * books stored before operations were open.
 */
export const LABOUR_DRIVERS = [
  'job',
  'sheet',
  'part',
  'case',
  'banding_metre',
  'pocket_hole',
  'dado_metre',
  'shelf_pin_row',
  'hinge_bored',
  'pull_fitted',
  'front_aligned',
  'drawer_box',
  'slide_pair',
  'door_hung',
  'sanded_m2',
  'finish_m2_coat',
  'torsion_top_m2',
  'top',
  'board_foot_milled',
  'trim_piece',
  'caster',
] as const;
export const LabourDriver = z.enum(LABOUR_DRIVERS);
export type LabourDriver = z.infer<typeof LabourDriver>;

/** The unit each driver counts, in words, for screens and the traveller. */
export const LABOUR_DRIVER_UNITS: Record<LabourDriver, string> = {
  job: 'job',
  sheet: 'sheet',
  part: 'part',
  case: 'case',
  banding_metre: 'meter banded',
  pocket_hole: 'pocket hole',
  dado_metre: 'meter of dado or groove',
  shelf_pin_row: 'shelf-pin row',
  hinge_bored: 'hinge bored',
  pull_fitted: 'pull fitted',
  front_aligned: 'front aligned',
  drawer_box: 'drawer box',
  slide_pair: 'slide pair',
  door_hung: 'door hung',
  sanded_m2: 'm² sanded',
  finish_m2_coat: 'm² per coat',
  torsion_top_m2: 'm² of torsion top',
  top: 'top',
  board_foot_milled: 'board foot milled',
  trim_piece: 'trim piece',
  caster: 'caster or foot',
};

/** The drivers counted per metre or per square metre, and what they read per foot or square foot. */
const IMPERIAL_DRIVER: Partial<Record<LabourDriver, { per: string; factor: number }>> = {
  banding_metre: { per: 'foot banded', factor: 0.3048 },
  dado_metre: { per: 'foot of dado or groove', factor: 0.3048 },
  sanded_m2: { per: 'ft² sanded', factor: 0.09290304 },
  finish_m2_coat: { per: 'ft² per coat', factor: 0.09290304 },
  torsion_top_m2: { per: 'ft² of torsion top', factor: 0.09290304 },
};

/**
 * A labour standard as the shop reads it: minutes per metre or square metre become minutes per foot or square foot
 * for an imperial shop (the book keeps the engine's metric drivers).
 * @example standardIn(10, 'banding_metre', 'in') // { minutes: 3.048, per: 'foot banded' }
 */
export function standardIn(minutes: number, driver: string, units: 'in' | 'mm'): { minutes: number; per: string } {
  const d = driver as LabourDriver;
  const imperial = units === 'in' ? IMPERIAL_DRIVER[d] : undefined;
  if (imperial) return { minutes: minutes * imperial.factor, per: imperial.per };
  return { minutes, per: LABOUR_DRIVER_UNITS[d] ?? driver };
}

/** The old `per` of a stored operation and the driver that counts the same thing. */
const DRIVER_OF_OLD_PER: Record<string, LabourDriver> = {
  job: 'job',
  sheet: 'sheet',
  part: 'part',
  metre: 'banding_metre',
  hole: 'pocket_hole',
  case: 'case',
  drawer: 'drawer_box',
  pair: 'slide_pair',
  door: 'door_hung',
  top: 'top',
  piece: 'trim_piece',
  m2_coat: 'finish_m2_coat',
  caster: 'caster',
};

/** Reads an operation stored in the old shape (`per` and no `driver`) as the new one. */
function fromOldOperation(raw: unknown): unknown {
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) return raw;
  const op = raw as Record<string, unknown>;
  if (op.driver !== undefined || typeof op.per !== 'string') return raw;
  const { per, ...rest } = op;
  const driver = DRIVER_OF_OLD_PER[per];
  return driver ? { ...rest, driver } : raw;
}

/** An operation's fields as stored today (the price book's tables and CSV columns are built from it). */
export const LabourOperationFields = z.object({
  /** the operation's id in the book, free text */
  key: LabourOperationKey,
  name: z.string().min(1),
  /** what the time standard counts */
  driver: LabourDriver,
  minutes: z.number().nonnegative(),
  stage: StageKey,
});
/** An operation, read from today's shape or the old one (see `fromOldOperation`). */
export const LabourOperation = z.preprocess(fromOldOperation, LabourOperationFields);
export type LabourOperation = z.infer<typeof LabourOperation>;

export const PriceBook = z
  .object({
    currency: z.literal('USD'),
    note: z.string().default(''),
    sheetGoods: z.array(SheetGood).min(1),
    lumber: z.array(Lumber),
    edgeBanding: z.array(EdgeBanding),
    hardware: z.array(HardwareItem),
    finishes: z.array(Finish).min(1),
    labour: z.array(LabourOperation),
  })
  .superRefine((book, ctx) => {
    const keys = new Set<string>();
    book.labour.forEach((op, i) => {
      if (keys.has(op.key))
        ctx.addIssue({
          code: 'custom',
          path: ['labour', i, 'key'],
          message: `operation "${op.key}" is in the price book twice`,
        });
      keys.add(op.key);
    });
    const seen = new Set<string>();
    for (const [list, items] of [
      ['sheetGoods', book.sheetGoods],
      ['lumber', book.lumber],
      ['edgeBanding', book.edgeBanding],
      ['hardware', book.hardware],
      ['finishes', book.finishes],
    ] as const) {
      items.forEach((it, i) => {
        if (seen.has(it.id))
          ctx.addIssue({
            code: 'custom',
            path: [list, i, 'id'],
            message: `id "${it.id}" is used twice in the price book`,
          });
        seen.add(it.id);
      });
    }
    if (!book.hardware.some((h) => h.kind === 'slide'))
      ctx.addIssue({ code: 'custom', path: ['hardware'], message: 'at least one drawer slide is needed' });
  });
export type PriceBook = z.infer<typeof PriceBook>;

export const ShopSettings = z.object({
  /** gap between neighbouring fronts */
  revealMm: z.number().min(0).max(10),
  /** how far a front laps the case edge; the full carcass thickness is full overlay */
  overlayMm: z.number().min(0).max(25),
  sheetCharging: z.enum(['whole', 'used_fraction']),
  /** with used-fraction charging, the least fraction of a sheet charged for each material */
  minSheetFraction: fraction,
  materialMarkup: z.number().min(0).max(5),
  consumablesRate: z.number().min(0).max(1),
  taxRate: z.number().min(0).max(0.5),
  taxApplies: z.enum(['all', 'materials']),
  depositRate: fraction,
  estimateValidityDays: z.number().int().min(1).max(365),
  /** the budget range shown to clients: total x (1 - spread) .. total x (1 + spread) */
  budgetSpread: z.number().min(0).max(0.5),
  /** allowed shelf sag as span / ratio; 600 is 0.02 in per foot */
  shelfSagRatio: z.number().min(100).max(2000),
  /** design shelf load; 1.915 kPa is 40 lb/ft2 */
  shelfLoadKPa: z.number().positive().max(20),
  /** long-term sag over initial sag */
  shelfCreepFactor: z.number().min(1).max(3),
  bandingWaste: z.number().min(0).max(1),
  lumberWaste: z.number().min(0).max(2),
  units: z.enum(['in', 'mm']),
  /** shop hours a week for the lead time; optional so that settings stored before it still parse */
  weeklyCapacityHours: z.number().positive().max(1000).default(40),
  // Construction defaults a spec may override; each optional with today's construction as its default, so
  // that settings stored before them still parse.
  /** the widest single door the shop hangs; a wider opening gets a pair (24 in, common practice) */
  maxDoorWidthMm: z.number().min(150).max(1200).default(610),
  /** how case panels join the sides: dadoed in, or butted and screwed (pocket screws) */
  caseJoinery: z.enum(['dado', 'butt']).default('dado'),
  /** a stack of drawers: fronts of equal height, or each a fixed step taller than the one above */
  drawerFronts: z.enum(['equal', 'graduated']).default('equal'),
  /** graduated fronts: how much taller each is than the one above (1 in, common practice) */
  drawerFrontStepMm: z.number().min(0).max(100).default(25.4),
  /**
   * fronts lapping the case edges (`overlay`, by `overlayMm`), or set inside their openings with the reveal on
   * every side (`inset`, hung on inset hinges; frameless casework needs no face frame for it)
   */
  frontStyle: z.enum(['overlay', 'inset']).default('overlay'),
  // The four below were price-book fields; their defaults (the demo shop's, invented) let settings stored before
  // the move still parse. The start-up move copies a shop's own values over from its old price book.
  /** the shop rate charged to clients, per hour */
  shopRateCents: cents.default(8500),
  /** what an hour costs the shop (wages and burden), for margins */
  labourCostPerHourCents: cents.default(3800),
  /** the saw's cut width */
  kerfMm: z.number().min(0).max(10).default(3.2),
  /** trimmed off each sheet edge before parts are laid out */
  sheetTrimMm: z.number().min(0).max(50).default(6),
});
export type ShopSettings = z.infer<typeof ShopSettings>;

/** Looks an id up in a price-book list, with an error that names the list. */
export function byId<T extends { id: string }>(list: readonly T[], id: string, what: string): T {
  const found = list.find((x) => x.id === id);
  if (!found) throw new RangeError(`${what} "${id}" is not in the price book`);
  return found;
}
