import * as z from 'zod';
import { toMm } from '../units';
import { caseFields, checkInterior, NOMINAL_CARCASS_MM, toeKick, type CaseLimits } from './case-model';

export const bookcaseLimits: CaseLimits = {
  widthMm: [305, 1067],
  heightMm: [610, 2286],
  depthMm: [203, 457],
  bays: [1, 3],
};

/** A bookcase: one tall bay (or a few) of fixed and adjustable shelves on a plinth. */
export const bookcaseSchema = z
  .object({
    design: z.literal('bookcase'),
    ...caseFields(bookcaseLimits),
    toeKickMm: toeKick(),
    installation: z.enum(['free-standing', 'built-in']).default('free-standing'),
  })
  .superRefine((s, ctx) => {
    const t = NOMINAL_CARCASS_MM;
    checkInterior(s, s.widthMm - 2 * t, s.heightMm - s.toeKickMm - 2 * t, s.depthMm - toMm(0.5) - toMm(0.25), ctx);
  });
export type BookcaseSpec = z.infer<typeof bookcaseSchema>;

export const bookcaseDefaults: BookcaseSpec = {
  design: 'bookcase',
  widthMm: toMm(32),
  heightMm: toMm(72),
  depthMm: toMm(12),
  toeKickMm: toMm(3),
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
  installation: 'free-standing',
  trim: null,
  bays: [
    {
      widthMm: null,
      compartments: [{ kind: 'open', heightMm: null, doors: 1, adjustableShelves: 4, fixedShelves: 1 }],
    },
  ],
};
