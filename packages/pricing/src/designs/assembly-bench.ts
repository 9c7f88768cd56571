import * as z from 'zod';
import { toMm } from '../units';
import { Bay, caseFields, checkInterior, materialId, mm, NOMINAL_CARCASS_MM, type CaseLimits } from './case-model';

export const assemblyBenchLimits: CaseLimits = {
  widthMm: [914, 2400],
  heightMm: [610, 1067],
  depthMm: [457, 1200],
  bays: [1, 3],
};

/** Height allowed under the cases by the schema's fit check (a 5 in caster); the cut list uses the chosen hardware's height. */
const MOBILITY_ALLOWANCE_MM = 127;
/** The least case width or depth, and the least room between the overhangs (9 in). */
const MIN_CASE_MM = 229;
/** Cases and overlaps are measured to half a millimetre. */
const TOLERANCE_MM = 0.5;

export const BenchTop = z.object({
  kind: z.enum(['torsion-box', 'laminated']),
  /** torsion box: overall thickness, skins included; laminated: layers of the carcass material, to the nearest whole layer */
  thicknessMm: mm(38, 152),
  skinMaterialId: materialId,
  coreMaterialId: materialId,
  /** torsion box: centre-to-centre spacing of the grid ribs */
  gridSpacingMm: mm(100, 400),
  /** the top's edge: solid-wood trim (the spec's `trim`, inside the stated width and depth) or edge banding */
  edge: z.enum(['trim', 'banded']).default('banded'),
});

/**
 * One case of the arrangement. `row` puts it against the front or the back
 * of the space under the top; `facing` is the side its doors and drawers
 * face (a back-row case facing the back sits back to back with the case in
 * front of it). `xMm` is its left end in plan, from the left overhang line;
 * null places it against the case before it in the same row.
 */
export const BenchCase = z.object({
  widthMm: mm(MIN_CASE_MM, 2400),
  depthMm: mm(MIN_CASE_MM, 1200),
  xMm: mm(0, 2400).nullable().default(null),
  row: z.enum(['front', 'back']).default('front'),
  facing: z.enum(['front', 'back', 'left', 'right']).default('front'),
  bays: z
    .array(Bay)
    .min(assemblyBenchLimits.bays[0], 'a case needs at least one bay')
    .max(assemblyBenchLimits.bays[1], `a case takes at most ${assemblyBenchLimits.bays[1]} bays`),
});
export type BenchCase = z.infer<typeof BenchCase>;

const { bays: _bays, ...sharedFields } = caseFields(assemblyBenchLimits);

/**
 * A rolling assembly bench: an arrangement of cases under one top (torsion
 * box or laminated) that overhangs each side by its own amount, on locking
 * casters and/or leveling feet. Width and depth are the top's, its edge
 * included; height is to the working surface.
 */
export const assemblyBenchObject = z
  .object({
    design: z.literal('assembly-bench'),
    ...sharedFields,
    cases: z.array(BenchCase).min(1, 'a bench needs at least one case').max(6, 'a bench takes at most 6 cases'),
    top: BenchTop,
    overhangFrontMm: mm(0, 305),
    overhangBackMm: mm(0, 305),
    overhangLeftMm: mm(0, 305),
    overhangRightMm: mm(0, 305),
    mobility: z.enum(['locking-casters', 'leveling-feet', 'casters-and-feet']),
    casterId: materialId,
    footId: materialId,
    /** what the bench is expected to carry in use, beyond its own weight */
    workingLoadKg: z.number().min(0).max(1000),
  })
  .superRefine((s, ctx) => {
    const t = NOMINAL_CARCASS_MM;
    const roomW = s.widthMm - s.overhangLeftMm - s.overhangRightMm;
    const roomD = s.depthMm - s.overhangFrontMm - s.overhangBackMm;
    if (roomW < MIN_CASE_MM)
      ctx.addIssue({
        code: 'custom',
        path: ['overhangLeftMm'],
        message: `the side overhangs leave ${round(roomW)} mm under the top; at least ${MIN_CASE_MM} mm is needed`,
      });
    if (roomD < MIN_CASE_MM)
      ctx.addIssue({
        code: 'custom',
        path: ['overhangFrontMm'],
        message: `the front and back overhangs leave ${round(roomD)} mm under the top; at least ${MIN_CASE_MM} mm is needed`,
      });
    if (s.top.kind === 'torsion-box' && s.top.thicknessMm < 3 * t) {
      ctx.addIssue({
        code: 'custom',
        path: ['top', 'thicknessMm'],
        message: `a torsion box needs at least ${Math.round(3 * t)} mm for two skins and a core`,
      });
    }
    if (s.top.edge === 'trim' && !s.trim)
      ctx.addIssue({
        code: 'custom',
        path: ['trim'],
        message: 'a trimmed top edge needs its trim: choose the lumber, width and thickness',
      });
    if (s.top.edge === 'trim' && s.trim && s.trim.widthMm < s.top.thicknessMm - TOLERANCE_MM)
      ctx.addIssue({
        code: 'custom',
        path: ['trim', 'widthMm'],
        message: `the trim is ${round(s.trim.widthMm)} mm wide but the top's edge is ${round(s.top.thicknessMm)} mm thick: make the trim at least as wide as the top is thick`,
      });
    if (roomW < MIN_CASE_MM || roomD < MIN_CASE_MM) return;

    const places = benchLayout(s);
    const caseHeight = s.heightMm - s.top.thicknessMm - MOBILITY_ALLOWANCE_MM;
    places.forEach((p, i) => {
      const c = s.cases[i]!;
      const sideways = c.facing === 'left' || c.facing === 'right';
      const alongField = sideways ? 'depthMm' : 'widthMm';
      const acrossField = sideways ? 'widthMm' : 'depthMm';
      if (p.xMm + p.alongMm > s.widthMm - s.overhangRightMm + TOLERANCE_MM)
        ctx.addIssue({
          code: 'custom',
          path: ['cases', i, c.xMm === null ? alongField : 'xMm'],
          message: `case ${i + 1} reaches ${round(p.xMm + p.alongMm - s.overhangLeftMm)} mm along the bench but the top leaves ${round(roomW)} mm between the side overhangs: make it smaller, move it, or shorten the overhangs`,
        });
      if (p.acrossMm > roomD + TOLERANCE_MM)
        ctx.addIssue({
          code: 'custom',
          path: ['cases', i, acrossField],
          message: `case ${i + 1} is ${round(p.acrossMm)} mm from front to back but the top leaves ${round(roomD)} mm between the front and back overhangs`,
        });
      for (let j = 0; j < i; j++) {
        const q = places[j]!;
        const ox = Math.min(p.xMm + p.alongMm, q.xMm + q.alongMm) - Math.max(p.xMm, q.xMm);
        const oy = Math.min(p.yMm + p.acrossMm, q.yMm + q.acrossMm) - Math.max(p.yMm, q.yMm);
        if (ox > TOLERANCE_MM && oy > TOLERANCE_MM)
          ctx.addIssue({
            code: 'custom',
            path: ['cases', i],
            message: `case ${i + 1} overlaps case ${j + 1} by ${round(ox)} x ${round(oy)} mm in plan: make one of them smaller or move it`,
          });
      }
      // the bays and compartments of this case, with the issues' paths under cases[i]
      const caseCtx = {
        addIssue: (issue: z.core.$ZodRawIssue) =>
          ctx.addIssue({ ...issue, path: ['cases', i, ...(issue.path ?? [])] } as z.core.$ZodRawIssue),
      } as unknown as z.RefinementCtx;
      checkInterior(
        { ...c, heightMm: caseHeight },
        c.widthMm - 2 * t,
        caseHeight - 2 * t,
        c.depthMm - toMm(0.5) - toMm(0.25),
        caseCtx,
      );
    });
  });

/** A case's place in plan: millimetres from the top's left end (x) and front edge (y); along x and across y. */
export interface CasePlace {
  xMm: number;
  yMm: number;
  alongMm: number;
  acrossMm: number;
}

/**
 * Where each case stands under the top, in plan: front-row cases against
 * the front overhang line, back-row cases against the back one, each at its
 * `xMm` from the left overhang line or against the case before it in its row.
 */
export function benchLayout(
  s: Pick<AssemblyBenchSpec, 'cases' | 'depthMm' | 'overhangFrontMm' | 'overhangBackMm' | 'overhangLeftMm'>,
): CasePlace[] {
  const next = { front: s.overhangLeftMm, back: s.overhangLeftMm };
  return s.cases.map((c) => {
    const sideways = c.facing === 'left' || c.facing === 'right';
    const alongMm = sideways ? c.depthMm : c.widthMm;
    const acrossMm = sideways ? c.widthMm : c.depthMm;
    const xMm = c.xMm === null ? next[c.row] : s.overhangLeftMm + c.xMm;
    next[c.row] = xMm + alongMm;
    const yMm = c.row === 'front' ? s.overhangFrontMm : s.depthMm - s.overhangBackMm - acrossMm;
    return { xMm, yMm, alongMm, acrossMm };
  });
}

/** Two cases that touch in plan over `lengthMm`: side to side or back to back (`back`), fastened together. */
export interface CaseJoin {
  a: number;
  b: number;
  lengthMm: number;
  kind: 'side' | 'back';
}

/** The cases that touch each other over at least 100 mm, and how. */
export function caseJoins(s: AssemblyBenchSpec, places: readonly CasePlace[]): CaseJoin[] {
  const joins: CaseJoin[] = [];
  const edgeKind = (i: number, axis: 'x' | 'y'): 'side' | 'back' => {
    const f = s.cases[i]!.facing;
    return (axis === 'x') === (f === 'front' || f === 'back') ? 'side' : 'back';
  };
  for (let i = 0; i < places.length; i++)
    for (let j = i + 1; j < places.length; j++) {
      const p = places[i]!;
      const q = places[j]!;
      const ox = Math.min(p.xMm + p.alongMm, q.xMm + q.alongMm) - Math.max(p.xMm, q.xMm);
      const oy = Math.min(p.yMm + p.acrossMm, q.yMm + q.acrossMm) - Math.max(p.yMm, q.yMm);
      const touchX = Math.abs(p.xMm + p.alongMm - q.xMm) <= 1 || Math.abs(q.xMm + q.alongMm - p.xMm) <= 1;
      const touchY = Math.abs(p.yMm + p.acrossMm - q.yMm) <= 1 || Math.abs(q.yMm + q.acrossMm - p.yMm) <= 1;
      if (touchX && oy >= 100)
        joins.push({
          a: i,
          b: j,
          lengthMm: oy,
          kind: edgeKind(i, 'x') === 'back' || edgeKind(j, 'x') === 'back' ? 'back' : 'side',
        });
      else if (touchY && ox >= 100)
        joins.push({
          a: i,
          b: j,
          lengthMm: ox,
          kind: edgeKind(i, 'y') === 'back' || edgeKind(j, 'y') === 'back' ? 'back' : 'side',
        });
    }
  return joins;
}

/** The old shape of a bench: one or two equal cases side by side, all with the same bays. */
function fromLegacy(input: unknown): unknown {
  if (!input || typeof input !== 'object' || Array.isArray(input)) return input;
  const s = { ...(input as Record<string, unknown>) };
  if (s.top && typeof s.top === 'object' && !('edge' in s.top))
    s.top = { ...(s.top as object), edge: s.trim ? 'trim' : 'banded' };
  if (!('caseCount' in s) || 'cases' in s) return s;
  const { caseCount, bays, overhangSidesMm, ...rest } = s;
  const n = caseCount === 2 ? 2 : 1;
  const sides = typeof overhangSidesMm === 'number' ? overhangSidesMm : 0;
  const front = typeof rest.overhangFrontMm === 'number' ? rest.overhangFrontMm : 0;
  const width = typeof rest.widthMm === 'number' ? (rest.widthMm - 2 * sides) / n : NaN;
  const depth = typeof rest.depthMm === 'number' ? rest.depthMm - front : NaN;
  return {
    ...rest,
    overhangBackMm: 0,
    overhangLeftMm: overhangSidesMm,
    overhangRightMm: overhangSidesMm,
    cases: Array.from({ length: n }, () => ({
      widthMm: width,
      depthMm: depth,
      xMm: null,
      row: 'front',
      facing: 'front',
      bays: structuredClone(bays),
    })),
  };
}

/** A bench spec, converting specs stored before arrangements (`caseCount` and one set of `bays`). */
export const assemblyBenchSchema = z.preprocess(fromLegacy, assemblyBenchObject);
export type AssemblyBenchSpec = z.infer<typeof assemblyBenchObject>;
/** Converts a stored spec of any design to today's shape (a bench of the old shape to an arrangement). */
export function upgradeSpec(input: unknown): unknown {
  return (input as { design?: unknown } | null)?.design === 'assembly-bench' ? fromLegacy(input) : input;
}

function round(v: number): number {
  return Math.round(v * 10) / 10;
}

const drawer = { kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 } as const;
const rearCabinet: BenchCase = {
  widthMm: toMm(31),
  depthMm: toMm(12),
  xMm: null,
  row: 'back',
  facing: 'back',
  // a centre partition keeps the shelves' span short; a door to each side, hinged on the outer side
  bays: (['left', 'right'] as const).map((hingeSide) => ({
    widthMm: null,
    compartments: [
      { kind: 'door' as const, heightMm: null, doors: 1 as const, adjustableShelves: 1, fixedShelves: 0, hingeSide },
    ],
  })),
};

/**
 * The double-sided bench: a 72 x 36 in top at 35 in, overhanging 3 in front and back and 5 in at the ends,
 * its edge trimmed; a main case facing the front with a column of
 * five drawers and, beside it, two shallow drawers over a door cabinet;
 * two mirror-image door cabinets facing the back, bolted back to back to it
 * and closed by its back.
 */
export const assemblyBenchDefaults: AssemblyBenchSpec = {
  design: 'assembly-bench',
  widthMm: toMm(72),
  heightMm: toMm(35),
  depthMm: toMm(36),
  carcassMaterialId: 'birch-ply-18',
  // one back inside the bench, shared by the cases back to back: hardboard, which has no grain and so turns on
  // the sheet (the main case's back is longer than a sheet is wide)
  backMaterialId: 'hardboard-6',
  frontMaterialId: 'birch-ply-18',
  drawerMaterialId: 'birch-ply-12',
  drawerBottomMaterialId: 'birch-ply-6',
  bandingId: 'birch-banding-22',
  pullId: 'pull-bar-128',
  backConstruction: 'grooved',
  finishId: 'waterborne-poly',
  coats: 3,
  trim: { lumberId: 'hard-maple-4-4', widthMm: toMm(3.5), thicknessMm: toMm(0.75) },
  cases: [
    {
      widthMm: toMm(62),
      depthMm: toMm(18),
      xMm: null,
      row: 'front',
      facing: 'front',
      bays: [
        // the drawer column no wider than a pair of slides carries square (36 in, common practice)
        { widthMm: toMm(34.5), compartments: [drawer, drawer, drawer, drawer, drawer].map((c) => ({ ...c })) },
        {
          // the rest, so that its shelf spans no more than the stock can carry
          widthMm: null,
          compartments: [
            { kind: 'door', heightMm: null, doors: 2, adjustableShelves: 1, fixedShelves: 0 },
            { ...drawer, heightMm: toMm(4) },
            { ...drawer, heightMm: toMm(4) },
          ],
        },
      ],
    },
    structuredClone(rearCabinet),
    structuredClone(rearCabinet),
  ],
  top: {
    kind: 'torsion-box',
    thicknessMm: toMm(3.5),
    skinMaterialId: 'mdf-12',
    // the frame and grid from 3/4 in MDF: flat, stable and cheaper than the plywood (common practice)
    coreMaterialId: 'mdf-18',
    gridSpacingMm: toMm(8),
    edge: 'trim',
  },
  overhangFrontMm: toMm(3),
  overhangBackMm: toMm(3),
  // 5 in at the ends: the main case at 62 in keeps its drawers within what slides carry and its shelf span short
  overhangLeftMm: toMm(5),
  overhangRightMm: toMm(5),
  mobility: 'casters-and-feet',
  casterId: 'caster-locking-5in',
  footId: 'leveling-foot',
  workingLoadKg: 200,
};
