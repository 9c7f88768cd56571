import { FOOT_MIN_CLEARANCE_MM, FOOT_TRAVEL_MM, type CutList, type CutPart } from './cut-list';
import type { PriceBook, ShopSettings } from './price-book';
import { len } from './messages';
import { formatAreaLoad, formatMeasure, formatWeight, LB_PER_KG, toInches, toMm, type LengthUnit } from './units';

export interface ShelfSagInput {
  spanMm: number;
  depthMm: number;
  thicknessMm: number;
  modulusMPa: number;
  /** uniform load over the shelf's area; 1.915 kPa is 40 lb/ft2 */
  loadKPa: number;
  /** long-term over initial sag (1 for none; 1.5 for seasoned wood under sustained load) */
  creepFactor?: number;
  /** allowable sag is span / limitRatio; 600 is 0.02 in per foot */
  limitRatio?: number;
  /** the units the message speaks in: inches and lb/ft² ('in'), or millimetres and kPa ('mm'; the default) */
  unit?: LengthUnit;
}

export interface ShelfSagResult {
  sagMm: number;
  allowableMm: number;
  ok: boolean;
  /** the shop's wording: the figures, the load assumed and the remedies of the trade */
  message: string;
  /** the client's wording when the shelf sags too much: what they can do about it */
  clientMessage?: string;
}

/**
 * Sag at mid-span of a simply supported shelf under a uniform load:
 * delta = 5 w L^4 / (384 E I) x creep, with w the load per length
 * (pressure x depth) and I = depth x thickness^3 / 12.
 *
 * @example
 * shelfSag({ spanMm: 762, depthMm: 280, thicknessMm: 18.3, modulusMPa: 12400, loadKPa: 1.915 })
 */
export function shelfSag(input: ShelfSagInput): ShelfSagResult {
  const { spanMm: L, depthMm: b, thicknessMm: t, modulusMPa: E, loadKPa } = input;
  const creep = input.creepFactor ?? 1;
  const ratio = input.limitRatio ?? 600;
  for (const [k, v] of Object.entries({
    spanMm: L,
    depthMm: b,
    thicknessMm: t,
    modulusMPa: E,
    limitRatio: ratio,
    creepFactor: creep,
  })) {
    if (!(v > 0) || !Number.isFinite(v)) throw new RangeError(`${k} must be a positive number, got ${v}`);
  }
  if (!(loadKPa >= 0)) throw new RangeError(`loadKPa must be zero or more, got ${loadKPa}`);
  const w = loadKPa * 1e-3 * b; // N/mm
  const I = (b * t ** 3) / 12; // mm^4
  const sagMm = ((5 * w * L ** 4) / (384 * E * I)) * creep;
  const allowableMm = L / ratio;
  const ok = sagMm <= allowableMm + 1e-9;
  // one unit system throughout, and the load it assumed stated
  const unit = input.unit ?? 'mm';
  const span = (mm: number, round: (x: number) => number = (x) => Math.round(x * 10) / 10) =>
    unit === 'in' ? `${round(toInches(mm))} in` : `${round(mm)} mm`;
  const load = formatAreaLoad(loadKPa, unit);
  if (ok)
    return {
      sagMm,
      allowableMm,
      ok,
      message: `A ${span(L)} shelf sags about ${formatMeasure(sagMm, unit)} under a load of ${load}, within the ${formatMeasure(allowableMm, unit)} allowed.`,
    };
  const maxSpan = maxShelfSpan({ thicknessMm: t, modulusMPa: E, loadKPa, limitRatio: ratio, creepFactor: creep });
  return {
    sagMm,
    allowableMm,
    ok,
    message: `A ${span(L)} shelf would sag about ${formatMeasure(sagMm, unit)} under a load of ${load}, more than the ${formatMeasure(allowableMm, unit)} allowed: use a thicker shelf, add a center support or partition to shorten the span (to ${span(maxSpan, Math.floor)} or less), or glue a solid-wood edge strip under the front edge.`,
    clientMessage: `A shelf ${span(L)} wide would bend under a full load (${load}, about what books weigh): add a bay, or ask us about a stiffer shelf.`,
  };
}

/**
 * The longest span whose sag equals span / limitRatio: from
 * 5 q L^3 / (384 E (t^3 / 12)) x creep = 1 / ratio (depth cancels out).
 *
 * @example maxShelfSpan({ thicknessMm: 19.05, modulusMPa: 6550, loadKPa: 1.915, limitRatio: 144 }) // about 1017 mm (40 in)
 */
export function maxShelfSpan({
  thicknessMm: t,
  modulusMPa: E,
  loadKPa,
  limitRatio,
  creepFactor = 1,
}: {
  thicknessMm: number;
  modulusMPa: number;
  loadKPa: number;
  limitRatio: number;
  creepFactor?: number;
}): number {
  if (!(t > 0 && E > 0 && loadKPa > 0 && limitRatio > 0 && creepFactor > 0))
    throw new RangeError('thickness, modulus, load, limit ratio and creep factor must all be positive');
  const q = loadKPa * 1e-3; // N/mm2
  return Math.cbrt((384 * E * t ** 3) / (12 * 5 * q * creepFactor * limitRatio));
}

export interface CasterCheckInput {
  pieceKg: number;
  workingLoadKg: number;
  casters: number;
  ratedLoadKg: number;
  /** the units the message speaks in: pounds ('in') or kilograms ('mm'; the default) */
  unit?: LengthUnit;
}

/**
 * Casters carry the piece and its working load with one caster assumed off
 * the floor (uneven floors, common practice).
 * @example casterCheck({ pieceKg: 120, workingLoadKg: 200, casters: 8, ratedLoadKg: 100 }).ok // true
 */
export function casterCheck({ pieceKg, workingLoadKg, casters, ratedLoadKg, unit = 'mm' }: CasterCheckInput): {
  perCasterKg: number;
  ok: boolean;
  message: string;
} {
  if (casters < 2) throw new RangeError('a caster check needs at least two casters');
  const perCasterKg = (pieceKg + workingLoadKg) / (casters - 1);
  const ok = perCasterKg <= ratedLoadKg;
  const w = (kg: number) => formatWeight(kg, unit);
  const atLeast = unit === 'in' ? `${Math.ceil(perCasterKg * LB_PER_KG)} lb` : `${Math.ceil(perCasterKg)} kg`;
  return {
    perCasterKg,
    ok,
    message: ok
      ? `Each caster carries up to ${w(perCasterKg)} (one assumed off the floor), within its ${w(ratedLoadKg)} rating.`
      : `Each caster would carry ${w(perCasterKg)} with one off the floor, more than its ${w(ratedLoadKg)} rating: fit casters rated ${atLeast} or more, add casters, or lower the working load.`,
  };
}

/**
 * Tip-over caution height: 27 in (686 mm). The figure comes from the US
 * safety standard for clothing storage units, 16 CFR part 1261, which adopts
 * ASTM F2057-23; the pieces here are not all clothing storage units, so it is
 * applied as a caution to every free-standing piece this tall, mobile ones
 * included.
 */
export const TIP_OVER_HEIGHT_MM = toMm(27);

export type CheckLevel = 'error' | 'warning' | 'caution';
export interface Check {
  code: string;
  level: CheckLevel;
  /** the shop's wording */
  message: string;
  /** the client's wording, when the shop's asks for a remedy only the shop can carry out */
  clientMessage?: string;
  /** field the check is about, when there is one */
  path?: string;
}

/** Mass of the parts from their volumes and the materials' densities, plus hardware. */
export function partsMassKg(parts: readonly CutPart[], book: PriceBook): number {
  let kg = 0;
  for (const p of parts) {
    const density =
      p.stock === 'lumber'
        ? book.lumber.find((l) => l.id === p.materialId)?.densityKgM3
        : book.sheetGoods.find((s) => s.id === p.materialId)?.densityKgM3;
    kg += p.quantity * p.lengthMm * p.widthMm * p.thicknessMm * 1e-9 * (density ?? 0);
  }
  return kg;
}

/**
 * The structural and safety checks of one piece: shelf sag under the design
 * load with creep (a warning past the shop's allowable sag; an error past
 * span/144, the limit of the Architectural Woodwork Standards' shelf table),
 * caster load, tip-over, and the usual cautions. Each message says what to do.
 */
export function pieceChecks(
  list: CutList,
  book: PriceBook,
  settings: ShopSettings,
  hardwareMassKg = 0,
): { checks: Check[]; massKg: number; needsAntiTip: boolean } {
  const g = list.geometry;
  const checks: Check[] = [];
  const massKg = partsMassKg(list.parts, book) + hardwareMassKg;
  const seen = new Set<string>();
  for (const s of g.shelfSpans) {
    const key = `${s.spanMm.toFixed(1)}-${s.materialId}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const mat = book.sheetGoods.find((m) => m.id === s.materialId);
    if (!mat) continue;
    const base = {
      spanMm: s.spanMm,
      depthMm: s.depthMm,
      thicknessMm: s.thicknessMm,
      modulusMPa: mat.modulusMPa,
      loadKPa: settings.shelfLoadKPa,
      creepFactor: settings.shelfCreepFactor,
      unit: settings.units,
    };
    const hard = shelfSag({ ...base, limitRatio: 144 });
    const soft = shelfSag({ ...base, limitRatio: settings.shelfSagRatio });
    if (!hard.ok)
      checks.push({
        code: 'shelf_span',
        level: 'error',
        path: 'bays',
        message: `${mat.name} cannot carry this span: ${hard.message}`,
        ...(hard.clientMessage ? { clientMessage: hard.clientMessage } : {}),
      });
    else if (!soft.ok)
      checks.push({
        code: 'shelf_sag',
        level: 'warning',
        path: 'bays',
        message: soft.message,
        ...(soft.clientMessage ? { clientMessage: soft.clientMessage } : {}),
      });
  }
  if (g.casters > 0 && g.casterId) {
    const caster = book.hardware.find((h) => h.id === g.casterId);
    if (caster?.ratedLoadKg) {
      const c = casterCheck({
        pieceKg: massKg,
        workingLoadKg: g.workingLoadKg,
        casters: g.casters,
        ratedLoadKg: caster.ratedLoadKg,
        unit: settings.units,
      });
      checks.push({ code: 'caster_load', level: c.ok ? 'caution' : 'error', path: 'casterId', message: c.message });
    }
    checks.push({
      code: 'casters_locked',
      level: 'caution',
      message: 'Lock the casters before working at the bench, and never stand on it.',
    });
  }
  if (g.feetLiftMm !== undefined && g.feetClearanceMm !== undefined) {
    if (g.feetLiftMm < 0)
      checks.push({
        code: 'feet_reach',
        level: 'error',
        path: 'footId',
        message: `Lowered, the leveling feet stop ${formatMeasure(Math.abs(g.feetLiftMm), settings.units)} above the floor, so the bench stays on its casters: choose taller feet or casters with less height.`,
      });
    else if (g.feetClearanceMm < FOOT_MIN_CLEARANCE_MM)
      checks.push({
        code: 'feet_reach',
        level: 'error',
        path: 'footId',
        message: `Raised, the leveling feet ${g.feetClearanceMm > 0 ? `clear the floor by only ${formatMeasure(g.feetClearanceMm, settings.units)}` : `still reach ${formatMeasure(-g.feetClearanceMm, settings.units)} below the casters`}, so the bench will not roll: choose shorter feet or taller casters (the feet adjust about ${formatMeasure(FOOT_TRAVEL_MM, settings.units)}).`,
      });
  }
  checks.push(...insetFrontChecks(list, book, settings));
  const hasFronts = g.doors.length > 0 || g.drawers.length > 0;
  let needsAntiTip = false;
  const rule =
    'The 27 in threshold is taken from the US rule for clothing storage units (16 CFR part 1261, adopting ASTM F2057-23) and applied here as a caution.';
  if (g.freeStanding && g.heightMm >= TIP_OVER_HEIGHT_MM) {
    const tall = len(g.heightMm, settings.units);
    if (g.mobile) {
      checks.push({
        code: 'tip_over_mobile',
        level: 'caution',
        message: `At ${tall} tall on casters this piece can tip, most of all with drawers open or while it is rolled: lock the casters, open one drawer at a time, keep heavy things low, push it low down and never climb it. ${rule}`,
      });
    } else if (hasFronts) {
      needsAntiTip = true;
      checks.push({
        code: 'tip_over',
        level: 'warning',
        message: `At ${tall} tall with drawers or doors, this piece must be anchored to the wall: an anti-tip kit is included. Anchor into a stud or with fasteners suited to the wall, as the kit's instructions and local codes require. Anchoring lowers the risk but does not by itself make the piece safe: open one drawer at a time, keep heavy things in the lowest drawers and do not let children climb it. ${rule}`,
      });
    } else {
      checks.push({
        code: 'anchor',
        level: 'caution',
        message: `Tall furniture can tip over: anchor this ${tall} piece to the wall, load the lowest shelves first, and do not let children climb it; an anchor helps but does not by itself make it safe. ${rule}`,
      });
    }
  }
  if (g.wallHung)
    checks.push({
      code: 'wall_hung',
      level: 'caution',
      message:
        'Hang wall cabinets from the rail with screws into studs or fasteners rated for the wall; have built-ins and anything electrical installed by licensed trades under local code.',
    });
  // a built-in stands on the floor fixed to the wall: a base cabinet under a counter, a bookcase in an alcove
  if (!g.freeStanding && !g.wallHung && !g.mobile)
    checks.push({
      code: 'built_in',
      level: 'caution',
      message:
        'Built in: level and shim it, then fasten it to the wall studs through the back rail; any plumbing and electrical work around it is for licensed trades under local code.',
    });
  return { checks, massKg, needsAntiTip };
}

/** Below this reveal an inset front binds in its opening as the case moves (1/16 in, common practice). */
export const MIN_INSET_REVEAL_MM = 1.5;

/**
 * Inset fronts: the book should hold a hinge made for inset doors (else the
 * first hinge is priced, which does not suit them), and the reveal should
 * leave the front room to open.
 */
function insetFrontChecks(list: CutList, book: PriceBook, settings: ShopSettings): Check[] {
  const out: Check[] = [];
  const insetDoors = list.geometry.doors.filter((d) => d.overlay === 'inset').length;
  if (insetDoors > 0 && !book.hardware.some((h) => h.kind === 'hinge' && h.overlay === 'inset'))
    out.push({
      code: 'inset_hinge',
      level: 'warning',
      path: 'frontStyle',
      message: `The price book has no hinge marked for inset doors, so the ${insetDoors === 1 ? 'inset door is' : `${insetDoors} inset doors are`} priced with another hinge: add an inset hinge to the book, or choose overlay fronts.`,
    });
  const g = list.geometry;
  if (g.frontStyle === 'inset' && g.fronts.length > 0 && settings.revealMm < MIN_INSET_REVEAL_MM)
    out.push({
      code: 'inset_reveal',
      level: 'warning',
      path: 'frontStyle',
      message: `Inset fronts with a ${formatMeasure(settings.revealMm, settings.units)} reveal will bind in their openings: set the reveal to ${formatMeasure(MIN_INSET_REVEAL_MM, settings.units)} or more (common practice).`,
    });
  return out;
}
