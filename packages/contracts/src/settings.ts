import * as z from 'zod';
import { ShopSettings, STAGE_KEYS, StageKey } from '@benchwright/pricing/geometry';

export { ShopSettings };
import { multiLine, singleLine } from './text';

/** The shop's profile: who the papers, the mail and the apps' headers say the shop is. */
export const ShopProfile = z.object({
  shopName: singleLine().min(1, 'enter the shop’s name').max(120, 'use at most 120 characters'),
  address: multiLine().max(300, 'use at most 300 characters'),
  phone: singleLine()
    .max(40, 'use at most 40 characters')
    .regex(/^[0-9+()./ -]*$/, 'use digits, spaces and + ( ) - . / only'),
  /** empty, or an address the clients may write to */
  email: z.union([
    z.literal(''),
    z
      .string()
      .trim()
      .toLowerCase()
      .pipe(z.email('enter a valid e-mail address').max(254, 'use at most 254 characters')),
  ]),
});
export type ShopProfile = z.infer<typeof ShopProfile>;

type Shape = typeof ShopSettings.shape;
/**
 * Each of the engine's settings, optional and without its default (a default would put a value back that the owner
 * did not send); the merged whole is checked again with the engine's ShopSettings.
 */
const settingsPatchShape = Object.fromEntries(
  Object.entries(ShopSettings.shape).map(([k, s]) => [k, (s instanceof z.ZodDefault ? s.unwrap() : s).optional()]),
) as { [K in keyof Shape]: z.ZodOptional<Shape[K] extends z.ZodDefault<infer I> ? I : Shape[K]> };

export const StageLabel = singleLine().trim().min(1, 'name the stage').max(40, 'use at most 40 characters');

/** `PATCH /api/settings`: what changes, and the version it was read at (409 when someone saved since). */
export const UpdateSettingsBody = z
  .object({
    version: z.number().int().positive(),
    profile: ShopProfile.partial().strict().optional(),
    values: z.object(settingsPatchShape).strict().optional(),
    /** new names for the board's stages; the keys stay as they are */
    stages: z.partialRecord(StageKey, StageLabel).optional(),
  })
  .strict();
export type UpdateSettingsBody = z.input<typeof UpdateSettingsBody>;

export interface StageView {
  key: (typeof STAGE_KEYS)[number];
  label: string;
  position: number;
}

/** `GET /api/settings` and `PATCH /api/settings` answer `{ settings: SettingsView }`. */
export interface SettingsView {
  version: number;
  profile: ShopProfile;
  values: ShopSettings;
  stages: StageView[];
  /** a logo is set: `GET /api/settings/logo` serves it as PNG */
  logo: boolean;
  updatedAt: string;
}

/** The logo upload: at most this many bytes before it is converted, and the PNG's largest width. */
export const LOGO_MAX_BYTES = 2 * 1024 * 1024;
export const LOGO_MAX_WIDTH_PX = 600;
export const LOGO_MAX_HEIGHT_PX = 300;
