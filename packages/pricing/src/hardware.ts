import type { CutList } from './cut-list';
import { byId, type HardwareItem, type PriceBook } from './price-book';
import { toMm } from './units';

/**
 * Concealed hinges a door needs by its height: 2 up to 900 mm, 3 up to
 * 1600 mm, 4 up to 2000 mm, 5 above (common practice, from memory).
 *
 * @example hingesPerDoor(762) // 2
 */
export function hingesPerDoor(heightMm: number): number {
  if (!(heightMm > 0)) throw new RangeError(`a door height must be positive, got ${heightMm} mm`);
  if (heightMm <= 900) return 2;
  if (heightMm <= 1600) return 3;
  if (heightMm <= 2000) return 4;
  return 5;
}

/** Drawers wider than this take two pulls (common practice). */
export const TWO_PULL_WIDTH_MM = toMm(24);
/** Pocket screws: one per hole. Hanging-rail screws: one per 16 in stud space, at least two. */
const STUD_SPACING_MM = toMm(16);

export interface HardwareLine {
  itemId: string;
  name: string;
  kind: HardwareItem['kind'];
  /** pieces needed */
  pieces: number;
  /** priced units to buy (pairs, boxes...), rounded up */
  units: number;
  unit: HardwareItem['unit'];
  unitPriceCents: number;
  massKg: number;
}

/**
 * The hardware one piece needs, from its cut list: a pair of slides per
 * drawer of the computed length, hinges by door height, 4 shelf pins per
 * adjustable shelf, a pull per door and drawer (two on drawers wider than
 * 24 in), casters and leveling feet, pocket screws per hole, hanging-rail
 * screws, connector bolts between joined cases, and an anti-tip kit when
 * the checks ask for one.
 *
 * @example
 * hardwareFor(cutList(spec, book, settings), book, { antiTip: false })
 */
export function hardwareFor(list: CutList, book: PriceBook, opts: { antiTip: boolean }): HardwareLine[] {
  const g = list.geometry;
  const counts = new Map<string, number>();
  const add = (id: string, n: number) => {
    if (n > 0) counts.set(id, (counts.get(id) ?? 0) + n);
  };
  const first = (kind: HardwareItem['kind']) => book.hardware.find((h) => h.kind === kind);
  for (const d of g.drawers) {
    const slide = book.hardware.find((h) => h.kind === 'slide' && h.lengthIn === d.slideLengthIn);
    if (!slide) throw new RangeError(`the price book has no ${d.slideLengthIn} in drawer slide`);
    add(slide.id, slide.unit === 'pair' ? 2 : 2);
    add(g.pullId, d.frontWidthMm > TWO_PULL_WIDTH_MM ? 2 : 1);
  }
  const hinge = first('hinge');
  for (const door of g.doors) {
    if (!hinge) throw new RangeError('the price book has no hinge');
    add(hinge.id, hingesPerDoor(door.heightMm));
    add(g.pullId, 1);
  }
  const pin = first('shelf_pin');
  if (g.adjustableShelves && pin) add(pin.id, 4 * g.adjustableShelves);
  if (g.casterId) add(g.casterId, g.casters);
  if (g.footId) add(g.footId, g.feet);
  const pocketHoles = list.parts.reduce((s, p) => s + p.pocketHoles * p.quantity, 0);
  const screw = first('pocket_screw');
  if (pocketHoles && screw) add(screw.id, pocketHoles);
  const rail = first('rail_screw');
  if (g.hangingRailWidthMm && rail) add(rail.id, Math.max(2, Math.ceil(g.hangingRailWidthMm / STUD_SPACING_MM)));
  const connector = first('connector');
  if (g.caseConnectors) {
    if (!connector) throw new RangeError('the price book has no connector bolt to fasten the cases together');
    add(connector.id, g.caseConnectors);
  }
  const kit = first('anti_tip_kit');
  if (opts.antiTip && kit) add(kit.id, 1);

  return [...counts].map(([id, pieces]) => {
    const item = byId(book.hardware, id, 'hardware');
    const per = item.unit === 'pair' ? 2 : item.perUnit;
    return {
      itemId: id,
      name: item.name,
      kind: item.kind,
      pieces,
      units: Math.ceil(pieces / per),
      unit: item.unit,
      unitPriceCents: item.priceCents,
      massKg: item.massKg * pieces,
    };
  });
}
