import { pieceChecks } from './checks';
import { cutList } from './cut-list';
import { parseSpec, type BuildSpec, type SpecIssue } from './designs';
import type { PriceBook, ShopSettings } from './price-book';

/**
 * Validates a build spec fully: its design's schema (shape, limits, fit),
 * then against the price book and settings: materials that exist, a case
 * the cut list can be made from, and shelves the material can carry.
 *
 * @example validateSpec(designs.bookcase.defaults, demoPriceBook, demoSettings).ok // true
 */
export function validateSpec(
  input: unknown,
  book: PriceBook,
  settings: ShopSettings,
): { ok: true; spec: BuildSpec } | { ok: false; issues: SpecIssue[] } {
  const parsed = parseSpec(input);
  if (!parsed.ok) return parsed;
  try {
    const list = cutList(parsed.spec, book, settings);
    const errors = pieceChecks(list, book, settings).checks.filter((c) => c.level === 'error');
    if (errors.length) return { ok: false, issues: errors.map((c) => ({ path: c.path ?? '', message: c.message })) };
  } catch (err) {
    if (err instanceof RangeError) return { ok: false, issues: [{ path: '', message: err.message }] };
    throw err;
  }
  return parsed;
}
