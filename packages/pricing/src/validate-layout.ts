import { at } from './_lib/at';
import type { NestOptions, NestPart, NestResult, Placement, StockSheet } from './nesting';

export interface LayoutValidation {
  ok: boolean;
  errors: string[];
}

const EPS = 1e-6;

/**
 * Checks a layout without trusting the nester: every placement inside the
 * trimmed sheet, parts at least a kerf apart, each sheet separable by
 * recursive straight through-cuts (found here, not read from `cuts`),
 * grain-bound parts unrotated and sized as given, and every unit of every
 * part present exactly once (or reported unplaced).
 *
 * @example
 * validateLayout(nest(parts, sheet, opts), parts, sheet, opts).ok // true
 */
export function validateLayout(
  result: Pick<NestResult, 'sheets' | 'unplaced'>,
  parts: readonly NestPart[],
  sheet: StockSheet,
  options: Pick<NestOptions, 'kerfMm' | 'trimMm'>,
): LayoutValidation {
  const errors: string[] = [];
  const kerf = options.kerfMm;
  const t = options.trimMm;
  const byId = new Map(parts.map((p) => [p.id, p]));
  const count = new Map<string, number>();

  result.sheets.forEach((s, si) => {
    const label = `sheet ${si + 1}`;
    for (const p of s.placements) {
      const part = byId.get(p.partId);
      if (!part) {
        errors.push(`${label}: placement of unknown part "${p.partId}"`);
        continue;
      }
      count.set(p.partId, (count.get(p.partId) ?? 0) + 1);
      const expected: [number, number] = p.rotated ? [part.widthMm, part.lengthMm] : [part.lengthMm, part.widthMm];
      if (Math.abs(p.lengthMm - expected[0]) > EPS || Math.abs(p.widthMm - expected[1]) > EPS) {
        errors.push(
          `${label}: part "${p.partId}" is placed as ${p.lengthMm} x ${p.widthMm} mm, not ${expected[0]} x ${expected[1]} mm`,
        );
      }
      if (p.rotated && !part.canRotate) errors.push(`${label}: part "${p.partId}" is grain-bound but placed rotated`);
      if (
        p.xMm < t - EPS ||
        p.yMm < t - EPS ||
        p.xMm + p.lengthMm > sheet.lengthMm - t + EPS ||
        p.yMm + p.widthMm > sheet.widthMm - t + EPS
      ) {
        errors.push(
          `${label}: part "${p.partId}" at (${p.xMm}, ${p.yMm}) lies outside the sheet less its ${t} mm trim`,
        );
      }
    }
    const ps = s.placements;
    for (const [i, a] of ps.entries()) {
      for (const b of ps.slice(i + 1)) {
        const gapX = Math.max(b.xMm - (a.xMm + a.lengthMm), a.xMm - (b.xMm + b.lengthMm));
        const gapY = Math.max(b.yMm - (a.yMm + a.widthMm), a.yMm - (b.yMm + b.widthMm));
        const gap = Math.max(gapX, gapY);
        if (gap < -EPS) errors.push(`${label}: parts "${a.partId}" and "${b.partId}" overlap`);
        else if (gap < kerf - EPS)
          errors.push(
            `${label}: parts "${a.partId}" and "${b.partId}" are ${round(gap)} mm apart, less than the ${kerf} mm kerf`,
          );
      }
    }
    if (!errors.some((e) => e.startsWith(`${label}:`)) && !separable(ps, kerf)) {
      errors.push(`${label}: no sequence of straight through-cuts separates the parts (not guillotine)`);
    }
  });

  const unplaced = new Map<string, number>();
  for (const u of result.unplaced) unplaced.set(u.partId, (unplaced.get(u.partId) ?? 0) + u.quantity);
  for (const part of parts) {
    const placed = count.get(part.id) ?? 0;
    const missing = unplaced.get(part.id) ?? 0;
    if (placed + missing !== part.quantity) {
      errors.push(`part "${part.id}": ${placed} placed and ${missing} unplaced, but the quantity is ${part.quantity}`);
    }
  }
  return { ok: errors.length === 0, errors };
}

/** True when the rectangles can be parted by recursive edge-to-edge cuts a kerf wide. */
function separable(rects: readonly Placement[], kerf: number): boolean {
  if (rects.length <= 1) return true;
  for (const axis of ['x', 'y'] as const) {
    const sorted = [...rects].sort((a, b) => start(a, axis) - start(b, axis));
    let reach = -Infinity;
    for (let i = 0; i < sorted.length - 1; i++) {
      reach = Math.max(reach, end(at(sorted, i), axis));
      if (start(at(sorted, i + 1), axis) >= reach + kerf - EPS) {
        return separable(sorted.slice(0, i + 1), kerf) && separable(sorted.slice(i + 1), kerf);
      }
    }
  }
  return false;
}

function start(p: Placement, axis: 'x' | 'y'): number {
  return axis === 'x' ? p.xMm : p.yMm;
}
function end(p: Placement, axis: 'x' | 'y'): number {
  return axis === 'x' ? p.xMm + p.lengthMm : p.yMm + p.widthMm;
}
function round(mm: number): number {
  return Math.round(mm * 100) / 100;
}
