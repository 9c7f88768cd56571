import type { PriceColumn } from '@benchwright/contracts';
import {
  formatLength,
  LB_PER_KG,
  LengthParseError,
  M_PER_FOOT,
  PA_PER_PSF,
  parseLength,
  standardIn,
  toInches,
  toMm,
  unitPriceFactor,
  type LengthUnit,
} from '@benchwright/pricing/geometry';

/*
 * The one place where the price book's stored units (the engine's: millimetres, kilograms, prices per metre and
 * per gallon, labour standards per metre and square metre) meet the units the owner reads and types: the shop's
 * (`ShopSettings.units`). The API and the CSV keep the stored units; the table converts each cell on the way out
 * and on the way back in.
 */

/** What a cell is read in: the shop's units, and the shop's own names for its stages. */
export interface CellUnits {
  units: LengthUnit;
  stageLabels?: Partial<Record<string, string>>;
}

/** A number as a person writes it, without the float noise arithmetic leaves (0.67, not 0.6699999999999999). */
const plain = (n: number) => String(Number(n.toPrecision(12)));
/** A converted number to three significant figures (1.98 lb, 42.5 lb/ft³), grouped when large (1,800,000 psi). */
const figures = (n: number) => Number(n.toPrecision(3)).toLocaleString('en-US', { maximumFractionDigits: 6 });
/** Inches as a fraction (the shared formatter), without its inch mark: the column's heading names the unit. */
const inches = (mm: number, denominator: 16 | 32) => formatLength(mm, { unit: 'in', denominator }).replace(/"$/, '');

/** Reads a typed number, with or without the unit the column shows, and thousands separators. */
function number(text: string, unit: string): number {
  const t = text
    .replace(/[,\s]/g, '')
    .replace(new RegExp(`${unit.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&')}$`), '')
    .trim();
  const n = Number(t);
  if (t === '' || !Number.isFinite(n)) throw new CellError(`write a number${unit ? ` of ${unit}` : ''}`);
  return n;
}

export class CellError extends Error {}

/** A stored-unit field as the owner reads and types it. `row` is the item (or the draft) the cell belongs to. */
interface Quantity {
  /** the heading's words, before the unit */
  words: string;
  unit: (u: LengthUnit) => string;
  show: (stored: number, u: LengthUnit, row: Record<string, unknown>) => string;
  /** what was typed, back in the stored unit; throws `CellError` */
  read: (text: string, u: LengthUnit, row: Record<string, unknown>) => number;
  /** other fields the conversion depends on: a cell is changed when any of them is */
  dependsOn?: string[];
}

/** A length stored in millimetres: inches to 1/16 (1/32 for a thickness), or the millimetres as stored. */
const mmLength = (words: string, denominator: 16 | 32): Quantity => ({
  words,
  unit: (u) => u,
  show: (mm, u) => (u === 'in' ? inches(mm, denominator) : plain(mm)),
  read: (text, u) => length(text, u),
});
/** A length stored in inches (a nominal thickness, a slide's length): inches to 1/32, or millimetres to 0.1. */
const inLength = (words: string): Quantity => ({
  words,
  unit: (u) => u,
  show: (v, u) => (u === 'in' ? inches(toMm(v), 32) : plain(Math.round(toMm(v) * 10) / 10)),
  read: (text, u) => toInches(length(text, u)),
});
function length(text: string, u: LengthUnit): number {
  try {
    return parseLength(text, u);
  } catch (e) {
    if (e instanceof LengthParseError)
      throw new CellError(u === 'in' ? 'write inches, e.g. 23/32 or 1 1/4' : 'write millimetres, e.g. 18.3');
    throw e;
  }
}
/** A stored metric quantity shown times `perStored` in an imperial shop. */
const scaled = (words: string, metric: string, imperial: string, perStored: number): Quantity => ({
  words,
  unit: (u) => (u === 'in' ? imperial : metric),
  show: (v, u) => (u === 'in' ? figures(v * perStored) : plain(v)),
  read: (text, u) => (u === 'in' ? number(text, imperial) / perStored : number(text, metric)),
});
/** A price per stored unit (metre, gallon) shown per the unit the shop reads (foot, litre), as the estimate does. */
const unitPrice = (words: string, stored: string): Quantity => ({
  words,
  unit: () => '$',
  show: (cents, u) => dollars(cents, unitPriceFactor(stored, u)),
  read: (text, u) => Math.round((number(text.replace(/^\$/, ''), '') * 100) / unitPriceFactor(stored, u)),
});
/** Dollars with two decimals, or three where two would not read back as the stored cents (banding per foot). */
function dollars(cents: number, factor: number): string {
  const shown = (cents * factor) / 100;
  for (const digits of [2, 3, 4]) {
    const s = shown.toFixed(digits);
    if (Math.round((Number(s) * 100) / factor) === cents) return s;
  }
  return shown.toFixed(4);
}

const POUND_FT3_PER_KG_M3 = LB_PER_KG * M_PER_FOOT ** 3;
const PSI_PER_MPA = 1e6 / (PA_PER_PSF * 144);
const MICROMETRES_PER_MIL = 25.4;

/** Every stored-unit field of every kind, by its field name (a name means the same in every kind). */
const QUANTITIES: Record<string, Quantity> = {
  nominalThicknessIn: inLength('Nominal thickness'),
  thicknessMm: mmLength('Thickness', 32),
  sheetLengthMm: mmLength('Sheet length', 16),
  sheetWidthMm: mmLength('Sheet width', 16),
  widthMm: mmLength('Width', 16),
  heightMm: mmLength('Height', 16),
  lengthIn: inLength('Length'),
  roughThicknessIn: inLength('Rough thickness'),
  densityKgM3: scaled('Density', 'kg/m³', 'lb/ft³', POUND_FT3_PER_KG_M3),
  modulusMPa: scaled('Modulus', 'MPa', 'psi', PSI_PER_MPA),
  ratedLoadKg: scaled('Rated load', 'kg', 'lb', LB_PER_KG),
  massKg: scaled('Weight', 'kg', 'lb', LB_PER_KG),
  dryFilmMilsPerCoat: {
    words: 'Dry film per coat',
    unit: (u) => (u === 'in' ? 'mils' : 'µm'),
    show: (mils, u) => (u === 'in' ? plain(mils) : figures(mils * MICROMETRES_PER_MIL)),
    read: (text, u) => (u === 'in' ? number(text, 'mils') : number(text, 'µm') / MICROMETRES_PER_MIL),
  },
  pricePerMetreCents: unitPrice('Price per', 'm'),
  pricePerGallonCents: unitPrice('Price per', 'gal'),
  // a labour standard's minutes are per its driver, which reads per foot or square foot in an imperial shop
  minutes: {
    words: 'Minutes',
    unit: () => '',
    show: (m, u, row) => plain(Number(standardIn(m, String(row.driver), u).minutes.toFixed(3))),
    read: (text, u, row) => {
      const n = number(text, 'min');
      return n / (standardIn(1, String(row.driver), u).minutes || 1);
    },
    dependsOn: ['driver'],
  },
};
const PER_UNIT: Record<string, (u: LengthUnit) => string> = {
  pricePerMetreCents: (u) => (u === 'in' ? 'ft' : 'm'),
  pricePerGallonCents: (u) => (u === 'in' ? 'gallon' : 'L'),
};

/** The stored-unit fields the table converts (a test checks that every such column has its entry). */
export const CONVERTED_FIELDS = Object.keys(QUANTITIES);

/** A choice as the owner reads it: a driver by what it counts, a stage by the shop's name, other keys in words. */
export function choiceLabel(c: PriceColumn, value: string, cu: CellUnits): string {
  if (c.field === 'driver') return standardIn(0, value, cu.units).per;
  if (c.field === 'stage') return cu.stageLabels?.[value] ?? value;
  if (value === 'mdf') return 'MDF';
  return value.replace(/_/g, ' ');
}

/** A column's heading in the shop's units: "Thickness (in)", "Price per ft ($)". */
export function heading(c: PriceColumn, cu: CellUnits): string {
  if (c.field === 'driver') return 'Counted per';
  const q = QUANTITIES[c.field];
  if (q) {
    const per = PER_UNIT[c.field];
    const unit = q.unit(cu.units);
    return `${q.words}${per ? ` ${per(cu.units)}` : ''}${unit ? ` (${unit})` : ''}`;
  }
  return c.column
    .replace(/_usd$/, ' ($)')
    .replace(/_/g, ' ')
    .replace(/^./, (s) => s.toUpperCase());
}

/** A field's value as the table shows and edits it, in the shop's units; prices in dollars. */
export function showValue(c: PriceColumn, v: unknown, cu: CellUnits, row: Record<string, unknown> = {}): string {
  if (v === undefined || v === null) return '';
  const q = QUANTITIES[c.field];
  if (q && typeof v === 'number') return q.show(v, cu.units, row);
  if (c.type === 'money') return (Number(v) / 100).toFixed(2);
  if (c.type === 'json') return JSON.stringify(v);
  if (c.type === 'number' && typeof v === 'number') return plain(v);
  if (c.options && typeof v === 'string') return choiceLabel(c, v, cu);
  return String(v);
}

/**
 * What was typed into a field, in the stored unit as the API takes it; an empty field is left out. `row` is the
 * draft's other fields, already read (a labour standard's minutes depend on its driver). Throws `CellError` for a
 * quantity that cannot be read; other fields go to the API as typed, whose schema says what is wrong.
 */
export function readValue(c: PriceColumn, text: string, cu: CellUnits, row: Record<string, unknown> = {}): unknown {
  const t = text.trim();
  if (t === '') return undefined;
  const q = QUANTITIES[c.field];
  if (q) return q.read(t, cu.units, row);
  switch (c.type) {
    case 'money': {
      const n = Number(t.replace(/^\$/, ''));
      return Number.isFinite(n) ? Math.round(n * 100) : t;
    }
    case 'number':
      return Number.isFinite(Number(t)) ? Number(t) : t;
    case 'boolean':
      return t === 'true' || t === 'yes';
    case 'json':
      try {
        return JSON.parse(t) as unknown;
      } catch {
        return t;
      }
    default:
      return t;
  }
}

/**
 * The fields an edit sends: only those whose text the owner changed (or whose conversion changed with another
 * field), each read back into its stored unit, so a cell left alone is never rewritten by a round trip through
 * the shown units (18.26 mm shown as 23/32 in stays 18.26 mm). With no `shown`, every filled field (a new item).
 * Returns the fields, and the fields that could not be read with the reason.
 */
export function itemOf(
  cols: PriceColumn[],
  draft: Record<string, string>,
  cu: CellUnits,
  shown?: Record<string, string>,
): { item: Record<string, unknown>; errors: Record<string, string> } {
  const changed = (f: string) => !shown || (draft[f] ?? '') !== (shown[f] ?? '');
  const plainFields: Record<string, unknown> = {};
  for (const c of cols) if (!QUANTITIES[c.field]) plainFields[c.field] = readValue(c, draft[c.field] ?? '', cu);
  const item: Record<string, unknown> = {};
  const errors: Record<string, string> = {};
  for (const c of cols) {
    const q = QUANTITIES[c.field];
    if (!changed(c.field) && !(q?.dependsOn ?? []).some(changed)) continue;
    try {
      const v = q ? readValue(c, draft[c.field] ?? '', cu, plainFields) : plainFields[c.field];
      if (v !== undefined) item[c.field] = v;
    } catch (e) {
      if (!(e instanceof CellError)) throw e;
      errors[c.field] = e.message;
    }
  }
  return { item, errors };
}

/** The API's `item.<field>` issues, by field. */
export function fieldErrors(issues: { path: string; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) {
    const field = i.path.startsWith('item.') ? i.path.slice(5).split('.')[0]! : '';
    if (!(field in out)) out[field] = i.message;
  }
  return out;
}
