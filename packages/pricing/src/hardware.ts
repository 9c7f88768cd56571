import type { CutList } from './cut-list';
import { byId, type HardwareItem, type PriceBook } from './price-book';
import { toMm } from './units';

/** Door weight one concealed hinge is counted to carry (common practice, from memory). */
export const KG_PER_HINGE = 5;

/**
 * Concealed hinges a door needs, by its height and its weight: 2 up to
 * 900 mm, 3 up to 1600 mm, 4 up to 2000 mm, 5 above; and never fewer than one
 * hinge per 5 kg of door (common practice, from memory).
 *
 * @example hingesPerDoor(762) // 2
 * @example hingesPerDoor(762, 12) // 3
 */
export function hingesPerDoor(heightMm: number, massKg = 0): number {
  if (!(heightMm > 0)) throw new RangeError(`a door height must be positive, got ${heightMm} mm`);
  if (!(massKg >= 0)) throw new RangeError(`a door's weight cannot be negative, got ${massKg} kg`);
  const byHeight = heightMm <= 900 ? 2 : heightMm <= 1600 ? 3 : heightMm <= 2000 ? 4 : 5;
  return Math.max(byHeight, Math.ceil(massKg / KG_PER_HINGE));
}

/** Drawers wider than this take two pulls (common practice). */
export const TWO_PULL_WIDTH_MM = toMm(24);
/** Pocket screws: one per hole. Hanging-rail screws: one per 16 in stud space, at least two. */
const STUD_SPACING_MM = toMm(16);

/**
 * Fasteners per fitting (all common practice): 6 screws a slide (3 into the
 * case, 3 into the drawer box), 4 a hinge (2 through the cup's flanges into
 * the door, 2 through the mounting plate into the case), 4 a drawer front
 * (driven from inside the box), 4 a caster plate and 4 a leveling foot's
 * plate, and top screws up through each stretcher one every 8 in, at least 2.
 */
export const FASTENERS_PER = { slide: 6, hinge: 4, drawer_front: 4, caster: 4, foot: 4 } as const;
export const TOP_SCREW_SPACING_MM = toMm(8);

/**
 * The pocket-screw length for stock of a thickness: 1 in into 1/2 in stock,
 * 1 1/4 in into 3/4 in, 1 1/2 in into thicker (common practice).
 *
 * @example pocketScrewLengthIn(11.9) // 1
 * @example pocketScrewLengthIn(18.26) // 1.25
 */
export function pocketScrewLengthIn(thicknessMm: number): number {
  if (!(thicknessMm > 0)) throw new RangeError(`a stock thickness must be positive, got ${thicknessMm} mm`);
  if (thicknessMm <= toMm(5 / 8)) return 1;
  if (thicknessMm <= toMm(7 / 8)) return 1.25;
  return 1.5;
}

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
 * drawer of the computed length; hinges by door height and weight, each of
 * the overlay its hinge edge calls for (full on an end panel, half on a shared
 * partition, inset); 4 shelf pins per adjustable shelf; a pull per door and
 * drawer (two on drawers wider than 24 in); casters and leveling feet; pocket
 * screws per hole, of the length for the stock drilled; hanging-rail screws;
 * the fasteners for slides, hinges, drawer fronts, the top, casters and feet
 * where the book lists them; connector bolts between joined cases; and an anti-tip kit when the checks ask for one.
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
  const fastener = (what: NonNullable<HardwareItem['fastens']>) =>
    book.hardware.find((h) => h.kind === 'bolt' && h.fastens === what) ??
    book.hardware.find((h) => h.kind === 'screw' && h.fastens === what);
  const fasten = (what: NonNullable<HardwareItem['fastens']>, n: number) => {
    const item = fastener(what);
    if (item) add(item.id, n);
  };
  for (const d of g.drawers) {
    const slide = book.hardware.find((h) => h.kind === 'slide' && h.lengthIn === d.slideLengthIn);
    if (!slide) throw new RangeError(`the price book has no ${d.slideLengthIn} in drawer slide`);
    add(slide.id, 2);
    add(g.pullId, d.frontWidthMm > TWO_PULL_WIDTH_MM ? 2 : 1);
    fasten('slide', 2 * FASTENERS_PER.slide);
    fasten('drawer_front', FASTENERS_PER.drawer_front);
  }
  const hinges = book.hardware.filter((h) => h.kind === 'hinge');
  for (const door of g.doors) {
    // the hinge made for the overlay; a book from before hinges carried one gives its unmarked or first hinge
    const hinge =
      hinges.find((h) => h.overlay === door.overlay) ?? hinges.find((h) => h.overlay === undefined) ?? hinges[0];
    if (!hinge) throw new RangeError('the price book has no hinge');
    const n = hingesPerDoor(door.heightMm, door.massKg);
    add(hinge.id, n);
    add(g.pullId, 1);
    fasten('hinge', n * FASTENERS_PER.hinge);
  }
  const pin = first('shelf_pin');
  if (g.adjustableShelves && pin) add(pin.id, 4 * g.adjustableShelves);
  if (g.casterId) add(g.casterId, g.casters);
  if (g.footId) add(g.footId, g.feet);
  fasten('caster', g.casters * FASTENERS_PER.caster);
  fasten('foot', g.feet * FASTENERS_PER.foot);
  if (g.top)
    fasten(
      'top',
      g.cases.reduce((s, c) => s + 2 * Math.max(2, Math.floor(c.widthMm / TOP_SCREW_SPACING_MM) + 1), 0),
    );
  const screws = book.hardware.filter((h) => h.kind === 'pocket_screw');
  for (const p of list.parts) {
    if (!p.pocketHoles) continue;
    const length = pocketScrewLengthIn(p.thicknessMm);
    const screw =
      screws.find((h) => h.lengthIn === length) ?? screws.find((h) => h.lengthIn === undefined) ?? screws[0];
    if (screw) add(screw.id, p.pocketHoles * p.quantity);
  }
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
