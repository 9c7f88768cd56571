/** The lower bound on sheets, and whether a part fits the usable sheet at all. */
import { EPS, type NestPart, type StockSheet } from './types';

/**
 * The lower bound on sheets: the larger of the area bound (kerf ignored) and
 * the number of parts so big that no two can share a sheet.
 *
 * @example
 * nestLowerBound([{ id: 'a', lengthMm: 1000, widthMm: 1000, quantity: 3, canRotate: true }], { lengthMm: 2440, widthMm: 1220 }, 0) // 2
 */
export function nestLowerBound(parts: readonly NestPart[], sheet: StockSheet, trimMm: number): number {
  const L = sheet.lengthMm - 2 * trimMm;
  const W = sheet.widthMm - 2 * trimMm;
  let area = 0;
  let big = 0;
  for (const p of parts) {
    if (!fitsSheet(p, L, W)) continue;
    area += p.lengthMm * p.widthMm * p.quantity;
    const bigAsIs = p.lengthMm > L / 2 && p.widthMm > W / 2;
    const bigTurned = !p.canRotate || (p.widthMm > L / 2 && p.lengthMm > W / 2) || p.widthMm > L || p.lengthMm > W;
    if (bigAsIs && bigTurned) big += p.quantity;
  }
  const areaBound = area > 0 ? Math.ceil(area / (L * W) - 1e-9) : 0;
  return Math.max(areaBound, big);
}

export function fitsSheet(p: NestPart, L: number, W: number): boolean {
  return (
    (p.lengthMm <= L + EPS && p.widthMm <= W + EPS) || (p.canRotate && p.widthMm <= L + EPS && p.lengthMm <= W + EPS)
  );
}
