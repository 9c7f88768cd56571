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
  /** slides: nominal length in inches */
  lengthIn: positive.optional(),
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
export const LabourOperationKey = z.enum(LABOUR_OPERATION_KEYS);
export type LabourOperationKey = z.infer<typeof LabourOperationKey>;

export const LabourOperation = z.object({
  key: LabourOperationKey,
  name: z.string().min(1),
  /** what the time standard counts: per job, per sheet, per part, per metre banded, per m2 per coat... */
  per: z.enum([
    'job',
    'sheet',
    'part',
    'metre',
    'hole',
    'case',
    'drawer',
    'pair',
    'door',
    'top',
    'piece',
    'm2_coat',
    'caster',
  ]),
  minutes: z.number().nonnegative(),
  stage: StageKey,
});
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
    /** the shop rate charged to clients, per hour */
    shopRateCents: cents,
    /** what an hour costs the shop (wages and burden), for margins */
    labourCostPerHourCents: cents,
    kerfMm: z.number().min(0).max(10),
    sheetTrimMm: z.number().min(0).max(50),
  })
  .superRefine((book, ctx) => {
    const ops = new Set(book.labour.map((o) => o.key));
    for (const key of LABOUR_OPERATION_KEYS) {
      if (!ops.has(key))
        ctx.addIssue({ code: 'custom', path: ['labour'], message: `missing the time standard for "${key}"` });
    }
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
});
export type ShopSettings = z.infer<typeof ShopSettings>;

/** Looks an id up in a price-book list, with an error that names the list. */
export function byId<T extends { id: string }>(list: readonly T[], id: string, what: string): T {
  const found = list.find((x) => x.id === id);
  if (!found) throw new RangeError(`${what} "${id}" is not in the price book`);
  return found;
}
