import * as z from 'zod';
import { toMm } from '../units';
import { caseFields, checkInterior, materialId, mm, NOMINAL_CARCASS_MM, type CaseLimits } from './case-model';

export const assemblyBenchLimits: CaseLimits = {
  widthMm: [914, 2400],
  heightMm: [610, 1067],
  depthMm: [457, 1200],
  bays: [1, 3],
};

/** Height allowed under the cases by the schema's fit check (a 5 in caster); the cut list uses the chosen hardware's height. */
const MOBILITY_ALLOWANCE_MM = 127;

export const BenchTop = z.object({
  kind: z.enum(['torsion-box', 'laminated']),
  /** torsion box: overall thickness, skins included */
  thicknessMm: mm(38, 152),
  skinMaterialId: materialId,
  coreMaterialId: materialId,
  /** torsion box: centre-to-centre spacing of the grid ribs */
  gridSpacingMm: mm(100, 400),
});

/**
 * A rolling assembly bench: one or two cases (each with the same bays) under
 * a torsion-box top that overhangs the front and sides, on locking casters
 * and/or leveling feet. Width and depth are the top's; height is to the
 * working surface.
 */
export const assemblyBenchSchema = z
  .object({
    design: z.literal('assembly-bench'),
    ...caseFields(assemblyBenchLimits),
    caseCount: z.union([z.literal(1), z.literal(2)]),
    top: BenchTop,
    overhangFrontMm: mm(0, 305),
    overhangSidesMm: mm(0, 305),
    mobility: z.enum(['locking-casters', 'leveling-feet', 'casters-and-feet']),
    casterId: materialId,
    footId: materialId,
    /** what the bench is expected to carry in use, beyond its own weight */
    workingLoadKg: z.number().min(0).max(1000),
  })
  .superRefine((s, ctx) => {
    const t = NOMINAL_CARCASS_MM;
    const caseWidth = (s.widthMm - 2 * s.overhangSidesMm) / s.caseCount;
    const caseDepth = s.depthMm - s.overhangFrontMm;
    const caseHeight = s.heightMm - s.top.thicknessMm - MOBILITY_ALLOWANCE_MM;
    if (caseWidth < 300)
      ctx.addIssue({
        code: 'custom',
        path: ['overhangSidesMm'],
        message: `the overhangs leave ${Math.round(caseWidth)} mm for each case; at least 300 mm is needed`,
      });
    if (caseDepth < 305)
      ctx.addIssue({
        code: 'custom',
        path: ['overhangFrontMm'],
        message: `the overhang leaves ${Math.round(caseDepth)} mm of case depth; at least 305 mm is needed`,
      });
    if (s.top.kind === 'torsion-box' && s.top.thicknessMm < 3 * t) {
      ctx.addIssue({
        code: 'custom',
        path: ['top', 'thicknessMm'],
        message: `a torsion box needs at least ${Math.round(3 * t)} mm for two skins and a core`,
      });
    }
    checkInterior(s, caseWidth - 2 * t, caseHeight - 2 * t, caseDepth - toMm(0.5) - toMm(0.25), ctx);
  });
export type AssemblyBenchSpec = z.infer<typeof assemblyBenchSchema>;

export const assemblyBenchDefaults: AssemblyBenchSpec = {
  design: 'assembly-bench',
  widthMm: toMm(72),
  heightMm: toMm(34),
  depthMm: toMm(30),
  carcassMaterialId: 'birch-ply-18',
  backMaterialId: 'birch-ply-6',
  frontMaterialId: 'birch-ply-18',
  drawerMaterialId: 'birch-ply-12',
  drawerBottomMaterialId: 'birch-ply-6',
  bandingId: 'birch-banding-22',
  pullId: 'pull-bar-128',
  backConstruction: 'grooved',
  finishId: 'waterborne-poly',
  coats: 2,
  trim: null,
  caseCount: 2,
  bays: [
    {
      widthMm: null,
      compartments: [
        { kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 },
        { kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 },
        { kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 },
      ],
    },
  ],
  top: {
    kind: 'torsion-box',
    thicknessMm: toMm(3.5),
    skinMaterialId: 'mdf-12',
    coreMaterialId: 'birch-ply-18',
    gridSpacingMm: toMm(8),
  },
  overhangFrontMm: toMm(3),
  overhangSidesMm: toMm(3),
  mobility: 'locking-casters',
  casterId: 'caster-locking-5in',
  footId: 'leveling-foot',
  workingLoadKg: 200,
};
