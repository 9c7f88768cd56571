import { allocate, dinero, halfEven, halfUp, multiply, toSnapshot, transformScale, USD, type Dinero } from 'dinero.js';
import { pieceChecks, type Check } from './checks';
import { cutList, type CutPart, type PieceGeometry } from './cut-list';
import type { BuildSpec } from './designs';
import { elevationDrawing, type Drawing } from './drawings';
import { finishCoverage, finishGallons } from './finish';
import { hardwareFor, type HardwareLine } from './hardware';
import { bandingMetres, labourCounts, labourHours } from './labour';
import { nestByMaterial, type NestEffort, type NestPart, type NestResult } from './nesting';
import { byId, STAGE_KEYS, STAGE_LABELS, type PriceBook, type ShopSettings, type StageKey } from './price-book';
import { boardFeet, toInches } from './units';

import { at } from './_lib/at';
import type { LineGroup } from './line-groups';
const MATERIAL_GROUPS: ReadonlySet<LineGroup> = new Set([
  'sheet_goods',
  'solid_wood',
  'edge_banding',
  'hardware',
  'finish',
  'consumables',
]);

export interface EstimateLine {
  group: LineGroup;
  description: string;
  quantity: number;
  unit: string;
  unitPriceCents: number;
  amountCents: number;
  costCents: number;
  source: 'computed';
  /** what the line is of: a material, hardware or labour key */
  ref: string;
}

export interface Totals {
  subtotalCents: number;
  discountCents: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  balanceCents: number;
}

export interface EstimateItem {
  spec: BuildSpec;
  quantity: number;
}

export interface PieceResult {
  index: number;
  spec: BuildSpec;
  quantity: number;
  parts: CutPart[];
  hardware: HardwareLine[];
  checks: Check[];
  massKg: number;
  elevation: Drawing;
}

export interface MaterialLayout extends NestResult {
  materialId: string;
  materialName: string;
  /** the parts as nested (ids prefixed by piece), for labels and cut lists */
  parts: NestPart[];
}

export interface Estimate {
  lines: EstimateLine[];
  totals: Totals;
  layouts: MaterialLayout[];
  pieces: PieceResult[];
  hoursByStage: Record<StageKey, number>;
  totalHours: number;
  massKg: number;
  checks: Check[];
  costCents: number;
  marginCents: number;
}

export interface EstimateOptions {
  effort?: NestEffort;
  discountCents?: number;
  seed?: number;
  /** the shop's names for its stages (the board's labels), for the labour lines; the first names by default */
  stageLabels?: Partial<Record<StageKey, string>>;
}

const usd = (cents: number): Dinero<number> => dinero({ amount: cents, currency: USD });
const cents = (d: Dinero<number>, round = halfEven): number => toSnapshot(transformScale(d, 2, round)).amount;

/**
 * Cents times a decimal factor, rounded to the cent (half to even unless
 * told), through dinero.js with a scaled factor rather than a float.
 * @example times(123456, 0.0825, halfUp) // 10185
 */
export function times(amountCents: number, factor: number, round = halfEven): number {
  const scale = 6;
  return cents(multiply(usd(amountCents), { amount: Math.round(factor * 10 ** scale), scale }), round);
}

/**
 * Splits a total into deposit and balance at a rate, to the cent: deposit + balance = total.
 * @example splitDeposit(100001, 0.4) // { depositCents: 40000, balanceCents: 60001 }
 */
export function splitDeposit(totalCents: number, rate: number): { depositCents: number; balanceCents: number } {
  const r = Math.round(rate * 10000);
  if (r <= 0) return { depositCents: 0, balanceCents: totalCents };
  if (r >= 10000) return { depositCents: totalCents, balanceCents: 0 };
  const [dep, bal] = allocate(usd(totalCents), [r, 10000 - r]);
  if (!dep || !bal) throw new Error('internal: a split in two gave fewer than two shares');
  return { depositCents: toSnapshot(dep).amount, balanceCents: toSnapshot(bal).amount };
}

/**
 * Totals from line amounts: subtotal, discount (spread over the lines by
 * their amounts for the tax base), tax (half up, to the cent) on everything
 * or on materials only, total, deposit and balance.
 * @example totalsFor([{ group: 'hardware', amountCents: 123456 }], { taxRate: 0.0825, taxApplies: 'all', depositRate: 0.5 }).taxCents // 10185
 */
export function totalsFor(
  lines: readonly Pick<EstimateLine, 'group' | 'amountCents'>[],
  rules: Pick<ShopSettings, 'taxRate' | 'taxApplies' | 'depositRate'>,
  discountCents = 0,
): Totals {
  const subtotalCents = lines.reduce((s, l) => s + l.amountCents, 0);
  const discount = Math.max(0, Math.min(Math.round(discountCents), subtotalCents));
  const taxable =
    rules.taxApplies === 'all'
      ? subtotalCents
      : lines.filter((l) => MATERIAL_GROUPS.has(l.group)).reduce((s, l) => s + l.amountCents, 0);
  const taxableDiscount = subtotalCents > 0 ? times(discount, taxable / subtotalCents) : 0;
  const taxCents = times(Math.max(0, taxable - taxableDiscount), rules.taxRate, halfUp);
  const totalCents = subtotalCents - discount + taxCents;
  return {
    subtotalCents,
    discountCents: discount,
    taxCents,
    totalCents,
    ...splitDeposit(totalCents, rules.depositRate),
  };
}

function line(
  group: LineGroup,
  ref: string,
  description: string,
  quantity: number,
  unit: string,
  unitCostCents: number,
  markup: number,
): EstimateLine {
  const unitPriceCents = times(unitCostCents, 1 + markup);
  return {
    group,
    ref,
    description,
    quantity,
    unit,
    unitPriceCents,
    amountCents: times(unitPriceCents, quantity),
    costCents: times(unitCostCents, quantity),
    source: 'computed',
  };
}

function r3(v: number): number {
  return Math.round(v * 1000) / 1000;
}

/** One unit kind of the whole job: a piece's part, its id prefixed by the piece and its quantity for the item. */
type JobPart = CutPart & { piece: number };

/**
 * Prices a project's items: cut lists, sheet layouts per material (all
 * pieces sharing sheets, as the shop cuts them), banding, board feet,
 * hardware, finish, consumables, markup, labour by stage at the shop rate,
 * tax, deposit and balance, with the checks, weight and drawings. Each group
 * of lines comes from its own builder below, in the order the estimate lists
 * them.
 *
 * @example
 * estimate([{ spec: designs.bookcase.defaults, quantity: 1 }], demoPriceBook, demoSettings).totals.totalCents
 */
export function estimate(
  items: readonly EstimateItem[],
  book: PriceBook,
  settings: ShopSettings,
  options: EstimateOptions = {},
): Estimate {
  if (!items.length) throw new RangeError('an estimate needs at least one item');
  const built = buildPieces(items, book, settings);
  const pieces = built.map((b) => b.piece);
  const all = jobParts(pieces);
  const layouts = nestJob(all, book, settings, options.effort ?? 'quick', options.seed);

  const finish = finishLines(pieces, book, settings);
  const lines: EstimateLine[] = [
    ...sheetGoodLines(layouts, book, settings),
    ...lumberLines(all, book, settings),
    ...bandingLines(all, book, settings),
    ...hardwareLines(pieces, book, settings),
    ...finish.lines,
  ];
  lines.push(...consumablesLines(lines, settings));
  const hours = jobHours(built, all, layouts, finish.m2Coats, book, settings);
  lines.push(...labourLines(hours.byStage, settings, options.stageLabels));

  const totals = totalsFor(lines, settings, options.discountCents ?? 0);
  const costCents = lines.reduce((s, l) => s + l.costCents, 0);
  return {
    lines,
    totals,
    layouts,
    pieces,
    hoursByStage: hours.byStage,
    totalHours: hours.totalHours,
    massKg: pieces.reduce((s, p) => s + p.massKg * p.quantity, 0),
    checks: pieces.flatMap((p) =>
      p.checks.map((c) => ({ ...c, message: pieces.length > 1 ? `Item ${p.index + 1}: ${c.message}` : c.message })),
    ),
    costCents,
    marginCents: totals.subtotalCents - totals.discountCents - costCents,
  };
}

/** Each item's cut list, hardware, checks, weight and drawing, with its geometry for the labour counts. */
function buildPieces(
  items: readonly EstimateItem[],
  book: PriceBook,
  settings: ShopSettings,
): { piece: PieceResult; geometry: PieceGeometry }[] {
  const lists = items.map((item, index) => {
    if (!Number.isInteger(item.quantity) || item.quantity < 1)
      throw new RangeError(`item ${index + 1}: quantity must be a whole number of 1 or more`);
    return cutList(item.spec, book, settings);
  });
  return items.map((item, index) => {
    const list = at(lists, index);
    const first = pieceChecks(list, book, settings);
    const hardware = hardwareFor(list, book, { antiTip: first.needsAntiTip });
    const { checks, massKg } = pieceChecks(
      list,
      book,
      settings,
      hardware.reduce((s, h) => s + h.massKg, 0),
    );
    const piece: PieceResult = {
      index,
      spec: item.spec,
      quantity: item.quantity,
      parts: list.parts,
      hardware,
      checks,
      massKg,
      elevation: elevationDrawing(item.spec, { list, unit: settings.units }),
    };
    return { piece, geometry: list.geometry };
  });
}

/** Every part of every piece, counted for the item's quantity, ids prefixed by the piece. */
function jobParts(pieces: readonly PieceResult[]): JobPart[] {
  return pieces.flatMap((p) =>
    p.parts.map((part) => ({
      ...part,
      id: `i${p.index + 1}-${part.id}`,
      quantity: part.quantity * p.quantity,
      piece: p.index,
    })),
  );
}

/** The sheet parts of the whole job nested together per material; throws if a part fits no sheet. */
function nestJob(
  all: readonly JobPart[],
  book: PriceBook,
  settings: ShopSettings,
  effort: NestEffort,
  seed: number | undefined,
): MaterialLayout[] {
  const nestParts: NestPart[] = all
    .filter((p) => p.stock === 'sheet')
    .map((p) => ({
      id: p.id,
      name: p.name,
      lengthMm: p.lengthMm,
      widthMm: p.widthMm,
      quantity: p.quantity,
      canRotate: p.grain === 'free',
      materialId: p.materialId,
    }));
  const stock = Object.fromEntries(
    book.sheetGoods.map((s) => [s.id, { lengthMm: s.sheetLengthMm, widthMm: s.sheetWidthMm }]),
  );
  const nested = nestByMaterial(nestParts, stock, {
    kerfMm: settings.kerfMm,
    trimMm: settings.sheetTrimMm,
    effort,
    seed,
  });
  const layouts: MaterialLayout[] = Object.entries(nested).map(([materialId, r]) => ({
    ...r,
    materialId,
    materialName: byId(book.sheetGoods, materialId, 'sheet good').name,
    parts: nestParts.filter((p) => p.materialId === materialId),
  }));
  const unplaced = layouts.flatMap((l) => l.unplaced);
  if (unplaced.length)
    throw new RangeError(`some parts fit no sheet: ${unplaced.map((u) => `${u.partId} (${u.reason})`).join('; ')}`);
  return layouts;
}

/** Sheet goods: whole sheets or the used fraction of each material's layouts. */
function sheetGoodLines(layouts: readonly MaterialLayout[], book: PriceBook, settings: ShopSettings): EstimateLine[] {
  return layouts.map((l) => {
    const m = byId(book.sheetGoods, l.materialId, 'sheet good');
    const sheetArea = m.sheetLengthMm * m.sheetWidthMm;
    const used = l.sheets.reduce((s, x) => s + x.usedAreaMm2, 0) / sheetArea;
    const qty =
      settings.sheetCharging === 'whole'
        ? l.sheetCount
        : Math.max(settings.minSheetFraction, Math.ceil(used * 100) / 100);
    return line(
      'sheet_goods',
      m.id,
      `${m.name}, ${toInches(m.sheetLengthMm / 12).toFixed(0)} x ${toInches(m.sheetWidthMm / 12).toFixed(0)} ft sheets${settings.sheetCharging === 'used_fraction' ? ' (used fraction)' : ''}`,
      qty,
      'sheet',
      m.priceCents,
      settings.materialMarkup,
    );
  });
}

/** Solid wood: board feet on the rough thickness, with waste, per lumber. */
function lumberLines(all: readonly JobPart[], book: PriceBook, settings: ShopSettings): EstimateLine[] {
  const lumberBf = new Map<string, number>();
  for (const p of all.filter((x) => x.stock === 'lumber')) {
    const lum = byId(book.lumber, p.materialId, 'lumber');
    lumberBf.set(
      lum.id,
      (lumberBf.get(lum.id) ?? 0) +
        p.quantity * boardFeet(lum.roughThicknessIn, toInches(p.widthMm), toInches(p.lengthMm)),
    );
  }
  return [...lumberBf].map(([id, bf]) => {
    const lum = byId(book.lumber, id, 'lumber');
    return line(
      'solid_wood',
      id,
      `${lum.name}, with ${Math.round(settings.lumberWaste * 100)}% waste`,
      r3(bf * (1 + settings.lumberWaste)),
      'bd ft',
      lum.pricePerBoardFootCents,
      settings.materialMarkup,
    );
  });
}

/** Edge banding: metres per banding, with waste. */
function bandingLines(all: readonly JobPart[], book: PriceBook, settings: ShopSettings): EstimateLine[] {
  const bandById = new Map<string, number>();
  for (const p of all)
    if (p.bandingId) bandById.set(p.bandingId, (bandById.get(p.bandingId) ?? 0) + bandingMetres([p]));
  return [...bandById].map(([id, metres]) => {
    const b = byId(book.edgeBanding, id, 'edge banding');
    return line(
      'edge_banding',
      id,
      `${b.name}, with ${Math.round(settings.bandingWaste * 100)}% waste`,
      r3(metres * (1 + settings.bandingWaste)),
      'm',
      b.pricePerMetreCents,
      settings.materialMarkup,
    );
  });
}

/** Hardware: the pieces' hardware summed over the job, in the price book's selling units. */
function hardwareLines(pieces: readonly PieceResult[], book: PriceBook, settings: ShopSettings): EstimateLine[] {
  const hw = new Map<string, HardwareLine>();
  for (const p of pieces) {
    for (const h of p.hardware) {
      const cur = hw.get(h.itemId);
      hw.set(
        h.itemId,
        cur ? { ...cur, pieces: cur.pieces + h.pieces * p.quantity } : { ...h, pieces: h.pieces * p.quantity },
      );
    }
  }
  return [...hw.values()].map((h) => {
    const item = byId(book.hardware, h.itemId, 'hardware');
    const per = item.unit === 'pair' ? 2 : item.perUnit;
    return line(
      'hardware',
      h.itemId,
      h.name,
      Math.ceil(h.pieces / per),
      item.unit,
      item.priceCents,
      settings.materialMarkup,
    );
  });
}

/** Finish: gallons per finish from the finished faces and coats; also the square metres times coats, for labour. */
function finishLines(
  pieces: readonly PieceResult[],
  book: PriceBook,
  settings: ShopSettings,
): { lines: EstimateLine[]; m2Coats: number } {
  let m2Coats = 0;
  const finishGal = new Map<string, number>();
  for (const p of pieces) {
    if (!p.spec.finishId) continue;
    const f = byId(book.finishes, p.spec.finishId, 'finish');
    const coats = p.spec.coats ?? f.defaultCoats;
    const areaM2 =
      p.parts.reduce((s, x) => s + (x.quantity * x.finishFaces * x.lengthMm * x.widthMm) / 1e6, 0) * p.quantity;
    m2Coats += areaM2 * coats;
    const coverage = finishCoverage({
      volumeSolids: f.volumeSolids,
      dryFilmMils: f.dryFilmMilsPerCoat,
      transferEfficiency: f.transferEfficiency,
    });
    finishGal.set(f.id, (finishGal.get(f.id) ?? 0) + finishGallons({ areaM2, coats, coverageFt2PerGallon: coverage }));
  }
  const lines = [...finishGal].map(([id, gal]) => {
    const f = byId(book.finishes, id, 'finish');
    return line('finish', id, f.name, r3(gal), 'gal', f.pricePerGallonCents, settings.materialMarkup);
  });
  return { lines, m2Coats };
}

/** Consumables: a share of the material cost of `materialLines`, as one lot (none when the rate or cost is 0). */
function consumablesLines(materialLines: readonly EstimateLine[], settings: ShopSettings): EstimateLine[] {
  const materialCost = materialLines.reduce((s, l) => s + l.costCents, 0);
  if (!(settings.consumablesRate > 0 && materialCost > 0)) return [];
  const c = times(materialCost, settings.consumablesRate);
  const markup = settings.materialMarkup;
  return [
    {
      group: 'consumables',
      ref: 'consumables',
      description: `Glue, abrasives, fasteners and sundries (${Math.round(settings.consumablesRate * 100)}% of materials)`,
      quantity: 1,
      unit: 'lot',
      unitPriceCents: times(c, 1 + markup),
      amountCents: times(c, 1 + markup),
      costCents: c,
      source: 'computed',
    },
  ];
}

/** Shop hours by stage from the job's counts (sheets, parts, banding, machining, fronts, finish...). */
function jobHours(
  built: readonly { piece: PieceResult; geometry: PieceGeometry }[],
  all: readonly JobPart[],
  layouts: readonly MaterialLayout[],
  finishM2Coats: number,
  book: PriceBook,
  settings: ShopSettings,
): ReturnType<typeof labourHours> {
  const roughBoardFeet = all
    .filter((p) => p.stock === 'lumber')
    .reduce((s, p) => {
      const lum = byId(book.lumber, p.materialId, 'lumber');
      return s + p.quantity * boardFeet(lum.roughThicknessIn, toInches(p.widthMm), toInches(p.lengthMm));
    }, 0);
  const counts = labourCounts({
    pieces: built.map((b) => ({
      parts: b.piece.parts,
      geometry: b.geometry,
      hardware: b.piece.hardware,
      quantity: b.piece.quantity,
    })),
    sheets: layouts.reduce((s, l) => s + l.sheetCount, 0),
    finishM2Coats,
    boardFeetMilled: roughBoardFeet * (1 + settings.lumberWaste),
  });
  return labourHours(counts, book);
}

/** Labour: one line per stage with hours, named as the board names the stage, at the shop rate, costed at the labour cost per hour. */
function labourLines(
  byStage: Record<StageKey, number>,
  settings: ShopSettings,
  labels: Partial<Record<StageKey, string>> = {},
): EstimateLine[] {
  const lines: EstimateLine[] = [];
  for (const stage of STAGE_KEYS) {
    const h = Math.round(byStage[stage] * 100) / 100;
    if (h <= 0) continue;
    const l = line(
      'labour',
      stage,
      `Shop time: ${labels[stage] ?? STAGE_LABELS[stage]}`,
      h,
      'h',
      settings.shopRateCents,
      0,
    );
    l.costCents = times(settings.labourCostPerHourCents, h);
    lines.push(l);
  }
  return lines;
}

/**
 * The client's budget range from the same numbers as the estimate: its total
 * less and plus the spread, rounded out to whole tens of dollars.
 * @example budgetRange(items, demoPriceBook, demoSettings) // { lowCents, highCents, totalCents }
 */
export function budgetRange(
  items: readonly EstimateItem[],
  book: PriceBook,
  settings: ShopSettings,
  options: EstimateOptions = {},
): { lowCents: number; highCents: number; totalCents: number } {
  const e = estimate(items, book, settings, options);
  return rangeOf(e.totals.totalCents, settings.budgetSpread);
}

/** The range around a total: low rounded down and high rounded up to $10. */
export function rangeOf(
  totalCents: number,
  spread: number,
): { lowCents: number; highCents: number; totalCents: number } {
  const low = Math.floor((totalCents * (1 - spread)) / 1000) * 1000;
  const high = Math.ceil((totalCents * (1 + spread)) / 1000) * 1000;
  return { lowCents: Math.min(low, totalCents), highCents: Math.max(high, totalCents), totalCents };
}
