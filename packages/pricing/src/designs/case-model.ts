import * as z from 'zod';
import { len, unitWord, where } from '../messages';
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
    .number({ error: () => `Enter a length in ${unitWord()}.` })
    .refine((v) => Number.isFinite(v), { error: () => `Enter a length in ${unitWord()}.`, abort: true })
    .refine((v) => v >= min, {
      error: (iss) => `${len(iss.input as number)} is below the ${len(min)} minimum.`,
      abort: true,
    })
    .refine((v) => v <= max, {
      error: (iss) => `${len(iss.input as number)} is above the ${len(max)} maximum.`,
    });
}

/** A toe kick or plinth: none (0), or from 2 in (common practice: lower leaves no room for a board) to 6 in. */
export function toeKick() {
  const least = toMm(2);
  return mm(0, 152).refine((v) => v === 0 || v >= least, {
    error: () => `A toe kick is either none (0) or at least ${len(least)} high.`,
  });
}

function count(min: number, max: number, what: string) {
  return z
    .number({ error: `Enter a whole number of ${what}.` })
    .int(`Enter a whole number of ${what}.`)
    .refine((v) => v >= min, {
      error: (iss) => `Choose at least ${min} ${what}; ${iss.input} is too few.`,
      abort: true,
    })
    .refine((v) => v <= max, { error: (iss) => `Choose at most ${max} ${what}; ${iss.input} is too many.` });
}

export const materialId = z
  .string({ error: 'Choose a material.' })
  .min(1, 'Choose a material.')
  .max(64, 'Choose a material from the list.');

export const Compartment = z.object({
  kind: z.enum(['drawer', 'door', 'open']),
  /** opening height; null shares what the others leave */
  heightMm: mm(60, 2400).nullable().default(null),
  doors: z.union([z.literal(1), z.literal(2)]).default(1),
  adjustableShelves: count(0, 8, 'adjustable shelves').default(0),
  fixedShelves: count(0, 6, 'fixed shelves').default(0),
  /** a single door: the side its hinges are on (left unless set); a pair hinges on both sides */
  hingeSide: z.enum(['left', 'right'], { error: 'Choose the left or the right side for the hinges.' }).optional(),
});
export type Compartment = z.infer<typeof Compartment>;

export const Bay = z.object({
  /** clear width between sides or partitions; null shares what the others leave */
  widthMm: mm(150, 1200).nullable().default(null),
  compartments: z
    .array(Compartment)
    .min(1, 'Each bay needs at least one section.')
    .max(8, 'A bay takes at most 8 sections.'),
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
      .min(limits.bays[0], `Choose at least ${limits.bays[0]} bay${limits.bays[0] > 1 ? 's' : ''}.`)
      .max(limits.bays[1], `This piece takes at most ${limits.bays[1]} bays.`),
    trim: Trim.nullable().default(null),
    /** overrides the shop's case joinery: panels dadoed into the sides, or butted and pocket-screwed */
    joinery: z.enum(['dado', 'butt'], { error: 'Choose dado or butt joints for the case.' }).optional(),
    /** overrides the shop's drawer fronts: equal heights, or each a fixed step taller than the one above */
    drawerFronts: z.enum(['equal', 'graduated'], { error: 'Choose equal or graduated drawer fronts.' }).optional(),
    /** overrides the shop's front style: fronts lapping the case edges, or set inside their openings */
    frontStyle: z.enum(['overlay', 'inset'], { error: 'Choose overlay or inset fronts.' }).optional(),
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
      message: `The bays need ${len(fixed + free * 150)} but the case has ${len(baysWidth)} between its sides and partitions: make the bays narrower or the case wider.`,
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
        message: `The sections of ${where(b)} need ${len(set + open * 60)} but the case has ${len(room)} inside that bay: ${fitAdvice(bay.compartments, b, room)}`,
      });
    }
    bay.compartments.forEach((c, k) => {
      if (c.kind === 'drawer' && insideDepthMm < MIN_DRAWER_DEPTH_MM) {
        ctx.addIssue({
          code: 'custom',
          path: ['bays', b, 'compartments', k, 'kind'],
          message: `${where(b, k)}: a drawer needs at least ${len(MIN_DRAWER_DEPTH_MM)} of inside depth for the shortest slide, and the case has ${len(insideDepthMm)}. Make the case deeper, or choose a door or open shelves.`,
        });
      }
      if (c.kind === 'drawer' && (c.adjustableShelves > 0 || c.fixedShelves > 0)) {
        ctx.addIssue({
          code: 'custom',
          path: ['bays', b, 'compartments', k],
          message: `${where(b, k)} is a drawer, which takes no shelves.`,
        });
      }
    });
  });
}

/**
 * What to change when a bay's sections do not fit: the tallest section of a set height, named, and the most it may
 * be with the others as they are (or that it may share what is left); else shorter sections or a taller case.
 */
function fitAdvice(compartments: readonly Compartment[], b: number, room: number): string {
  let k = -1;
  compartments.forEach((c, i) => {
    if (c.heightMm !== null && (k < 0 || c.heightMm > (compartments[k]!.heightMm ?? 0))) k = i;
  });
  if (k < 0) return 'take a section away or make the case taller.';
  const others = compartments.reduce((s, c, i) => s + (i === k ? 0 : (c.heightMm ?? 60)), 0);
  const most = room - others;
  const named = `${where(b, k)} is set at ${len(compartments[k]!.heightMm!)}`;
  return most >= 60
    ? `${named}; make it at most ${len(Math.floor(most))}, let it share what is left, or make the case taller.`
    : `${named}; let it share what is left, make the other sections shorter, or make the case taller.`;
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
