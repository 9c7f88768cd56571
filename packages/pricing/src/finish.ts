/** Square feet one US gallon (231 in3) covers at 1 mil (0.001 in) of film: 231 / 0.001 / 144 = 1604 (the coatings rule). */
export const FT2_MIL_PER_GALLON = 1604;
export const M2_PER_FT2 = 0.09290304;

/**
 * Coverage of a finish in ft2 per US gallon at a dry film thickness:
 * 1604 x volume solids x transfer efficiency / dry mils.
 *
 * @example finishCoverage({ volumeSolids: 0.65, dryFilmMils: 5 }) // 208.52
 */
export function finishCoverage({
  volumeSolids,
  dryFilmMils,
  transferEfficiency = 1,
}: {
  volumeSolids: number;
  dryFilmMils: number;
  transferEfficiency?: number;
}): number {
  if (!(volumeSolids > 0 && volumeSolids <= 1))
    throw new RangeError(`volume solids is a fraction from 0 to 1, got ${volumeSolids}`);
  if (!(transferEfficiency > 0 && transferEfficiency <= 1))
    throw new RangeError(`transfer efficiency is a fraction from 0 to 1, got ${transferEfficiency}`);
  if (!(dryFilmMils > 0)) throw new RangeError(`dry film thickness must be positive, got ${dryFilmMils} mils`);
  return (FT2_MIL_PER_GALLON * volumeSolids * transferEfficiency) / dryFilmMils;
}

/**
 * Gallons of finish for an area and a number of coats.
 * @example finishGallons({ areaM2: 10, coats: 3, coverageFt2PerGallon: 400 }) // 0.807
 */
export function finishGallons({
  areaM2,
  coats,
  coverageFt2PerGallon,
}: {
  areaM2: number;
  coats: number;
  coverageFt2PerGallon: number;
}): number {
  return ((areaM2 / M2_PER_FT2) * coats) / coverageFt2PerGallon;
}
