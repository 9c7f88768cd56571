import * as z from 'zod';
import { toMm } from '../units';
import { caseFields, checkInterior, NOMINAL_CARCASS_MM, type CaseLimits } from './case-model';

export const wallCabinetLimits: CaseLimits = {
  widthMm: [229, 1219],
  heightMm: [305, 1067],
  depthMm: [229, 406],
  bays: [1, 3],
};

/** A frameless wall cabinet: doors over shelves, hung on a rail screwed to the studs. */
export const wallCabinetSchema = z
  .object({
    design: z.literal('wall-cabinet'),
    ...caseFields(wallCabinetLimits),
    hangingRail: z.boolean().default(true),
  })
  .superRefine((s, ctx) => {
    const t = NOMINAL_CARCASS_MM;
    checkInterior(s, s.widthMm - 2 * t, s.heightMm - 2 * t, s.depthMm - toMm(0.5) - toMm(0.25), ctx);
  });
export type WallCabinetSpec = z.infer<typeof wallCabinetSchema>;

export const wallCabinetDefaults: WallCabinetSpec = {
  design: 'wall-cabinet',
  widthMm: toMm(30),
  heightMm: toMm(30),
  depthMm: toMm(12),
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
  hangingRail: true,
  trim: null,
  bays: [
    {
      widthMm: null,
      compartments: [{ kind: 'door', heightMm: null, doors: 2, adjustableShelves: 2, fixedShelves: 0 }],
    },
  ],
};
