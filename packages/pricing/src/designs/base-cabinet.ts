import * as z from 'zod';
import { toMm } from '../units';
import { caseFields, checkInterior, NOMINAL_CARCASS_MM, toeKick, type CaseLimits } from './case-model';

export const baseCabinetLimits: CaseLimits = {
  widthMm: [229, 1219],
  heightMm: [457, 1067],
  depthMm: [305, 762],
  bays: [1, 4],
};

/** A frameless base cabinet on a toe kick: drawers and/or doors. */
export const baseCabinetSchema = z
  .object({
    design: z.literal('base-cabinet'),
    ...caseFields(baseCabinetLimits),
    toeKickMm: toeKick(),
    installation: z.enum(['built-in', 'free-standing']).default('built-in'),
    mobility: z.enum(['none', 'leveling-feet']).default('none'),
  })
  .superRefine((s, ctx) => {
    const t = NOMINAL_CARCASS_MM;
    checkInterior(s, s.widthMm - 2 * t, s.heightMm - s.toeKickMm - 2 * t, s.depthMm - toMm(0.5) - toMm(0.25), ctx);
  });
export type BaseCabinetSpec = z.infer<typeof baseCabinetSchema>;

export const baseCabinetDefaults: BaseCabinetSpec = {
  design: 'base-cabinet',
  widthMm: toMm(24),
  heightMm: toMm(34.5),
  depthMm: toMm(24),
  toeKickMm: toMm(4),
  carcassMaterialId: 'birch-ply-18',
  backMaterialId: 'birch-ply-6',
  frontMaterialId: 'birch-ply-18',
  drawerMaterialId: 'birch-ply-12',
  drawerBottomMaterialId: 'birch-ply-6',
  bandingId: 'birch-banding-22',
  pullId: 'pull-bar-128',
  backConstruction: 'grooved',
  finishId: 'waterborne-poly',
  coats: null,
  installation: 'built-in',
  mobility: 'none',
  trim: null,
  bays: [
    {
      widthMm: null,
      compartments: [
        { kind: 'door', heightMm: null, doors: 1, adjustableShelves: 1, fixedShelves: 0 },
        { kind: 'drawer', heightMm: toMm(6), doors: 1, adjustableShelves: 0, fixedShelves: 0 },
      ],
    },
  ],
};
