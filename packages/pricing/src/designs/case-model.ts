import * as z from 'zod';
import { toMm } from '../units';

/**
 * The one case model every design is a preset of (DESIGN.md section 5): a
 * case of a width, height and depth, divided into bays side by side; each bay
 * a stack of compartments from the bottom up, each a drawer, a door opening
 * (one or two doors, shelves behind) or open shelving.
 */

/** Carcass thickness assumed by the schema's own fit checks (nominal 3/4 in); the cut list uses the actual thickness. */
export const NOMINAL_CARCASS_MM = 19.05;
/** Shortest drawer slide (10 in) plus the 1/2 in behind it: the least inside depth for a drawer (common practice). */
export const MIN_DRAWER_DEPTH_MM = toMm(10.5);

/** A number in millimetres between limits, with messages that give the value and the limit. */
export function mm(min: number, max: number) {
  return z
    .number({ error: 'enter a length in millimetres' })
    .refine((v) => Number.isFinite(v), 'enter a finite length')
    .refine((v) => v >= min, {
      error: (iss) => `${round(iss.input as number)} mm is below the ${round(min)} mm minimum`,
      abort: true,
    })
    .refine((v) => v <= max, {
      error: (iss) => `${round(iss.input as number)} mm is above the ${round(max)} mm maximum`,
    });
}

function count(min: number, max: number, what: string) {
  return z
    .number({ error: `enter a whole number of ${what}` })
    .int(`enter a whole number of ${what}`)
    .refine((v) => v >= min, { error: (iss) => `${iss.input} ${what} is below the minimum of ${min}`, abort: true })
    .refine((v) => v <= max, { error: (iss) => `${iss.input} ${what} is above the maximum of ${max}` });
}

function round(v: number): number {
  return Math.round(v * 10) / 10;
}

export const materialId = z.string().min(1, 'choose a material').max(64);

export const Compartment = z.object({
  kind: z.enum(['drawer', 'door', 'open']),
  /** opening height; null shares what the others leave */
  heightMm: mm(60, 2400).nullable().default(null),
  doors: z.union([z.literal(1), z.literal(2)]).default(1),
  adjustableShelves: count(0, 8, 'adjustable shelves').default(0),
  fixedShelves: count(0, 6, 'fixed shelves').default(0),
});
export type Compartment = z.infer<typeof Compartment>;

export const Bay = z.object({
  /** clear width between sides or partitions; null shares what the others leave */
  widthMm: mm(150, 1200).nullable().default(null),
  compartments: z
    .array(Compartment)
    .min(1, 'a bay needs at least one compartment')
    .max(8, 'a bay takes at most 8 compartments'),
});
export type Bay = z.infer<typeof Bay>;

export const Trim = z.object({
  lumberId: materialId,
  widthMm: mm(12, 100),
  thicknessMm: mm(6, 32),
});
export type Trim = z.infer<typeof Trim>;

export interface CaseLimits {
  widthMm: [number, number];
  heightMm: [number, number];
  depthMm: [number, number];
  bays: [number, number];
}

/** Fields every design shares. */
export function caseFields(limits: CaseLimits) {
  return {
    widthMm: mm(...limits.widthMm),
    heightMm: mm(...limits.heightMm),
    depthMm: mm(...limits.depthMm),
    carcassMaterialId: materialId,
    backMaterialId: materialId,
    frontMaterialId: materialId,
    drawerMaterialId: materialId,
    drawerBottomMaterialId: materialId,
    bandingId: materialId,
    pullId: materialId,
    backConstruction: z.enum(['grooved', 'applied']).default('grooved'),
    finishId: materialId.nullable().default(null),
    coats: count(1, 6, 'coats').nullable().default(null),
    bays: z
      .array(Bay)
      .min(limits.bays[0], `at least ${limits.bays[0]} bay${limits.bays[0] > 1 ? 's' : ''}`)
      .max(limits.bays[1], `at most ${limits.bays[1]} bays`),
    trim: Trim.nullable().default(null),
  };
}

export interface InteriorInput {
  widthMm: number;
  heightMm: number;
  depthMm: number;
  bays: Bay[];
}

/**
 * Checks that bays and compartments fit the case, with the nominal carcass
 * thickness; `insideHeightMm` is the height between bottom and top, and
 * `insideDepthMm` the clear depth for drawers. Adds issues to `ctx`.
 */
export function checkInterior(
  spec: InteriorInput,
  insideWidthMm: number,
  insideHeightMm: number,
  insideDepthMm: number,
  ctx: z.RefinementCtx,
): void {
  const t = NOMINAL_CARCASS_MM;
  const baysWidth = insideWidthMm - (spec.bays.length - 1) * t;
  const fixed = spec.bays.reduce((s, b) => s + (b.widthMm ?? 0), 0);
  const free = spec.bays.filter((b) => b.widthMm === null).length;
  if (fixed > baysWidth + 0.01 || (free > 0 && (baysWidth - fixed) / free < 150)) {
    ctx.addIssue({
      code: 'custom',
      path: ['bays'],
      message: `the bays need ${round(fixed + free * 150)} mm but the case has ${round(baysWidth)} mm between its sides and partitions`,
    });
  }
  spec.bays.forEach((bay, b) => {
    const dividers = dividerCount(bay.compartments);
    const room = insideHeightMm - dividers * t;
    const set = bay.compartments.reduce((s, c) => s + (c.heightMm ?? 0), 0);
    const open = bay.compartments.filter((c) => c.heightMm === null).length;
    if (set > room + 0.01 || (open > 0 && (room - set) / open < 60)) {
      ctx.addIssue({
        code: 'custom',
        path: ['bays', b, 'compartments'],
        message: `the compartments need ${round(set + open * 60)} mm but the case has ${round(room)} mm inside this bay: make them shorter or the case taller`,
      });
    }
    bay.compartments.forEach((c, k) => {
      if (c.kind === 'drawer' && insideDepthMm < MIN_DRAWER_DEPTH_MM) {
        ctx.addIssue({
          code: 'custom',
          path: ['bays', b, 'compartments', k, 'kind'],
          message: `a drawer needs at least ${round(MIN_DRAWER_DEPTH_MM)} mm of inside depth for the shortest slide; the case has ${round(insideDepthMm)} mm`,
        });
      }
      if (c.kind === 'drawer' && (c.adjustableShelves > 0 || c.fixedShelves > 0)) {
        ctx.addIssue({
          code: 'custom',
          path: ['bays', b, 'compartments', k],
          message: 'a drawer compartment has no shelves',
        });
      }
    });
  });
}

/** Fixed dividers between compartments: one wherever a drawer does not sit directly on another drawer. */
export function dividerCount(compartments: readonly Compartment[]): number {
  let n = 0;
  let below: Compartment | undefined;
  for (const c of compartments) {
    if (below && !(c.kind === 'drawer' && below.kind === 'drawer')) n++;
    below = c;
  }
  return n;
}
