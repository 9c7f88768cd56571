import { at } from './_lib/at';

/** Millimetres in one inch: the international inch (1959) is exactly 25.4 mm. */
export const MM_PER_INCH = 25.4;

/**
 * Inches to millimetres.
 * @example toMm(23.75) // 603.25
 */
export function toMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/**
 * Millimetres to inches.
 * @example toInches(19.05) // 0.75
 */
export function toInches(mm: number): number {
  return mm / MM_PER_INCH;
}

export type LengthUnit = 'in' | 'mm';

export class LengthParseError extends Error {
  constructor(
    readonly input: string,
    reason: string,
  ) {
    super(`"${input}" is not a length: ${reason}`);
    this.name = 'LengthParseError';
  }
}

// a number: 23, 23.75, .5 ; a fraction: 3/4 ; a mixed number: 23 3/4 or 23-3/4
const NUM = String.raw`(?:\d+(?:\.\d+)?|\.\d+)`;
const FRAC = String.raw`\d+\s*/\s*\d+`;
const AMOUNT = String.raw`(?:${NUM}(?:\s*-\s*|\s+)${FRAC}|${FRAC}|${NUM})`;
const FEET_INCHES = new RegExp(
  String.raw`^(${AMOUNT})\s*(?:'|ft|feet|foot)\s*(?:(${AMOUNT})\s*(?:"|''|in|inch|inches)?)?$`,
  'i',
);
const WITH_UNIT = new RegExp(
  String.raw`^(${AMOUNT})\s*("|''|in|inch|inches|mm|millimet(?:er|re)s?|cm|centimet(?:er|re)s?|m|met(?:er|re)s?)?$`,
  'i',
);

function amount(text: string, input: string): number {
  const t = text.trim();
  const mixed = /^(\S+?)(?:\s*-\s*|\s+)(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (mixed) return Number(mixed[1]) + fraction(Number(mixed[2]), Number(mixed[3]), input);
  const frac = /^(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (frac) return fraction(Number(frac[1]), Number(frac[2]), input);
  return Number(t);
}

function fraction(n: number, d: number, input: string): number {
  if (d === 0) throw new LengthParseError(input, 'a fraction cannot have 0 below the line');
  return n / d;
}

/**
 * Reads a length as people type it and returns millimetres. Accepts inches
 * with fractions (`23 3/4`, `23-3/4"`, `3/4 in`), feet and inches
 * (`1' 11 3/4"`), and metric (`603.25 mm`, `60.3 cm`, `0.6 m`). A bare
 * number or fraction is taken in `defaultUnit`.
 *
 * @example parseLength('23 3/4', 'in') // 603.25
 * @example parseLength('3/4', 'in') // 19.05
 * @example parseLength('60.3 cm', 'in') // 603
 * @throws LengthParseError saying what was wrong
 */
export function parseLength(text: string, defaultUnit: LengthUnit): number {
  const input = String(text ?? '');
  const t = input
    .trim()
    .replace(/[\u2032\u2019]/g, "'")
    .replace(/[\u2033\u201d]/g, '"');
  if (!t) throw new LengthParseError(input, 'it is empty');
  if (t.startsWith('-')) throw new LengthParseError(input, 'a length cannot be negative');
  const fi = FEET_INCHES.exec(t);
  let mm: number;
  if (fi) {
    mm = toMm(amount(at(fi, 1), input) * 12 + (fi[2] ? amount(fi[2], input) : 0));
  } else {
    const m = WITH_UNIT.exec(t);
    if (!m)
      throw new LengthParseError(
        input,
        'write a number with an optional unit, e.g. 23 3/4", 1\' 11 3/4", 603 mm or 60.3 cm',
      );
    const value = amount(at(m, 1), input);
    const unit = (m[2] ?? '').toLowerCase();
    if (unit === '') mm = defaultUnit === 'in' ? toMm(value) : value;
    else if (unit === '"' || unit === "''" || unit.startsWith('in')) mm = toMm(value);
    else if (unit === 'mm' || unit.startsWith('millimet')) mm = value;
    else if (unit === 'cm' || unit.startsWith('centimet')) mm = value * 10;
    else mm = value * 1000;
  }
  if (!Number.isFinite(mm)) throw new LengthParseError(input, 'the number is not finite');
  return mm;
}

export interface FormatLengthOptions {
  unit: LengthUnit;
  /** inches only: round to the nearest 1/denominator in (default 16) */
  denominator?: 8 | 16 | 32;
}

/**
 * Writes millimetres for people: whole inches and a reduced fraction to the
 * nearest 1/16 in (or 1/8, 1/32), or whole millimetres.
 *
 * @example formatLength(603.25, { unit: 'in' }) // '23 3/4"'
 * @example formatLength(18.256, { unit: 'in', denominator: 32 }) // '23/32"'
 * @example formatLength(603.25, { unit: 'mm' }) // '603 mm'
 */
export function formatLength(mm: number, options: FormatLengthOptions): string {
  if (!Number.isFinite(mm)) throw new RangeError(`cannot format ${mm} as a length`);
  if (options.unit === 'mm') return `${Math.round(mm)} mm`;
  const d = options.denominator ?? 16;
  const sign = mm < 0 ? '-' : '';
  const units = Math.round(Math.abs(toInches(mm)) * d);
  const whole = Math.floor(units / d);
  let n = units % d;
  let den: number = d;
  while (n > 0 && n % 2 === 0) {
    n /= 2;
    den /= 2;
  }
  if (n === 0) return `${sign}${whole}"`;
  return whole === 0 ? `${sign}${n}/${den}"` : `${sign}${whole} ${n}/${den}"`;
}

/**
 * Board feet of solid lumber: thickness x width x length in inches over 144.
 * @example boardFeet(2, 6.25, 96) // 8.333...
 */
export function boardFeet(thicknessIn: number, widthIn: number, lengthIn: number): number {
  return (thicknessIn * widthIn * lengthIn) / 144;
}

/*
 * What people read, one formatter per quantity. Each takes the unit system
 * the reader works in (`LengthUnit`: 'in' is an imperial shop or view, 'mm' a
 * metric one), so an imperial shop reads inches, feet, pounds, square feet and
 * gallons, and a metric one millimetres, metres, kilograms, square metres and
 * litres. The engine computes in metric; only these convert for display.
 */

/** Metres in one foot (exact, from the inch). */
export const M_PER_FOOT = 0.3048;
/** Pounds in one kilogram: 1 lb is exactly 0.45359237 kg (1959). */
export const LB_PER_KG = 1 / 0.45359237;
/** Litres in one US gallon (231 in³, exact). */
export const L_PER_GALLON = 3.785411784;
/** Square feet in one square metre. */
export const FT2_PER_M2 = 1 / (M_PER_FOOT * M_PER_FOOT);
/** Pascals in one pound-force per square foot (lbf = 4.4482216152605 N). */
export const PA_PER_PSF = 4.4482216152605 / (M_PER_FOOT * M_PER_FOOT);

// one decimal unless the number is whole, as people write 37.9 ft or 2 ft (common practice)
const oneDecimal = (n: number): string => {
  const r = Math.round(n * 10) / 10;
  return Number.isInteger(r) ? String(r) : r.toFixed(1);
};
const grouped = (n: number): string => Math.round(n).toLocaleString('en-US');

/**
 * A board's actual thickness: to the nearest 1/32 in (a dado is set to it), or
 * millimetres to one decimal.
 * @example formatThickness(18.26, 'in') // '23/32"'
 * @example formatThickness(18.26, 'mm') // '18.3 mm'
 */
export function formatThickness(mm: number, unit: LengthUnit): string {
  if (!Number.isFinite(mm)) throw new RangeError(`cannot format ${mm} as a thickness`);
  return unit === 'in' ? formatLength(mm, { unit: 'in', denominator: 32 }) : `${oneDecimal(mm)} mm`;
}

/**
 * A lineal length bought or run by the foot or metre (edge banding, trim):
 * feet to one decimal, or metres to one decimal.
 * @example formatLineal(37.08, 'in') // '121.7 ft'
 * @example formatLineal(37.08, 'mm') // '37.1 m'
 */
export function formatLineal(metres: number, unit: LengthUnit): string {
  if (!Number.isFinite(metres)) throw new RangeError(`cannot format ${metres} as a lineal length`);
  return unit === 'in' ? `${oneDecimal(metres / M_PER_FOOT)} ft` : `${oneDecimal(metres)} m`;
}

/**
 * A weight: whole pounds or whole kilograms (one decimal under 10).
 * @example formatWeight(54.4, 'in') // '120 lb'
 * @example formatWeight(54.4, 'mm') // '54 kg'
 */
export function formatWeight(kg: number, unit: LengthUnit): string {
  if (!Number.isFinite(kg)) throw new RangeError(`cannot format ${kg} as a weight`);
  const v = unit === 'in' ? kg * LB_PER_KG : kg;
  return `${v < 10 ? oneDecimal(v) : grouped(v)} ${unit === 'in' ? 'lb' : 'kg'}`;
}

export class WeightParseError extends Error {
  constructor(
    readonly input: string,
    reason: string,
  ) {
    super(`"${input}" is not a weight: ${reason}`);
    this.name = 'WeightParseError';
  }
}

const WEIGHT = /^((?:\d{1,3}(?:,\d{3})+|\d+)(?:\.\d+)?|\.\d+)\s*(lbs?|pounds?|#|kgs?|kilos?|kilograms?)?\.?$/i;

/**
 * Reads a weight as people type it (and as `formatWeight` writes it) and returns kilograms. A bare number is taken
 * in the unit's weight: pounds for 'in', kilograms for 'mm'; `lb`, `lbs`, `pounds`, `kg` or `kilograms` say which.
 * @example parseWeight('441 lb', 'in') // 200.03
 * @example parseWeight('1,102', 'in') // 499.86
 * @example parseWeight('200', 'mm') // 200
 * @throws WeightParseError saying what was wrong
 */
export function parseWeight(text: string, defaultUnit: LengthUnit): number {
  const input = String(text ?? '');
  const t = input.trim();
  if (!t) throw new WeightParseError(input, 'it is empty');
  if (t.startsWith('-')) throw new WeightParseError(input, 'a weight cannot be negative');
  const m = WEIGHT.exec(t);
  if (!m) throw new WeightParseError(input, 'write a number with an optional unit, e.g. 300 lb or 140 kg');
  const value = Number(at(m, 1).replace(/,/g, ''));
  const word = (m[2] ?? '').toLowerCase();
  const pounds = word === '' ? defaultUnit === 'in' : !word.startsWith('k');
  return pounds ? value / LB_PER_KG : value;
}

/**
 * An area: square feet or square metres, one decimal.
 * @example formatArea(2.9729, 'in') // '32 ft²'
 * @example formatArea(2.9729, 'mm') // '3 m²'
 */
export function formatArea(m2: number, unit: LengthUnit): string {
  if (!Number.isFinite(m2)) throw new RangeError(`cannot format ${m2} as an area`);
  return unit === 'in' ? `${oneDecimal(m2 * FT2_PER_M2)} ft²` : `${oneDecimal(m2)} m²`;
}

/**
 * A volume of finish, given in US gallons as the engine prices it: gallons or litres, one decimal.
 * @example formatVolume(0.8, 'in') // '0.8 gal'
 * @example formatVolume(0.8, 'mm') // '3 L'
 */
export function formatVolume(gallons: number, unit: LengthUnit): string {
  if (!Number.isFinite(gallons)) throw new RangeError(`cannot format ${gallons} as a volume`);
  return unit === 'in' ? `${oneDecimal(gallons)} gal` : `${oneDecimal(gallons * L_PER_GALLON)} L`;
}

/**
 * A load spread over an area (a shelf's design load): pounds per square foot or kilopascals.
 * @example formatAreaLoad(1.915, 'in') // '40 lb/ft²'
 * @example formatAreaLoad(1.915, 'mm') // '1.9 kPa'
 */
export function formatAreaLoad(kPa: number, unit: LengthUnit): string {
  if (!Number.isFinite(kPa)) throw new RangeError(`cannot format ${kPa} as a load`);
  return unit === 'in' ? `${Math.round((kPa * 1000) / PA_PER_PSF)} lb/ft²` : `${oneDecimal(kPa)} kPa`;
}

/**
 * A measured length in the reader's units with a sensible precision: inches to
 * one decimal, or millimetres to one decimal (for small measures such as a sag).
 * @example formatMeasure(3.2, 'in') // '0.13 in'
 * @example formatMeasure(3.2, 'mm') // '3.2 mm'
 */
export function formatMeasure(mm: number, unit: LengthUnit): string {
  if (!Number.isFinite(mm)) throw new RangeError(`cannot format ${mm} as a measure`);
  if (unit === 'mm') return `${oneDecimal(mm)} mm`;
  const inches = toInches(mm);
  return `${inches < 1 ? (Math.round(inches * 100) / 100).toFixed(2) : oneDecimal(inches)} in`;
}

// the units an estimate line counts in, as a person writes one and several of them
const COUNT_WORDS: Record<string, [string, string]> = {
  sheet: ['sheet', 'sheets'],
  pair: ['pair', 'pairs'],
  each: ['', ''],
  ea: ['', ''],
  set: ['set', 'sets'],
  box: ['box', 'boxes'],
  pack: ['pack', 'packs'],
  lot: ['lot', 'lots'],
  kit: ['kit', 'kits'],
  piece: ['piece', 'pieces'],
  h: ['h', 'h'],
  'bd ft': ['bd ft', 'bd ft'],
};

/**
 * How much of something, as a person writes it, in the reader's units: counts
 * take their plural ("2 sheets", "6 pairs"), banding by the foot or metre
 * ("37.9 ft"), finish by the gallon or litre ("0.8 gal"), hours and board feet
 * to two decimals at most.
 *
 * @example formatQuantity(2, 'sheet', 'in') // '2 sheets'
 * @example formatQuantity(11.55, 'm', 'in') // '37.9 ft'
 * @example formatQuantity(0.8, 'gal', 'in') // '0.8 gal'
 */
export function formatQuantity(quantity: number, unit: string, system: LengthUnit): string {
  if (!Number.isFinite(quantity)) throw new RangeError(`cannot format ${quantity} as a quantity`);
  if (unit === 'm') return formatLineal(quantity, system);
  if (unit === 'gal') return formatVolume(quantity, system);
  if (unit === 'kg') return formatWeight(quantity, system);
  if (unit === 'm2' || unit === 'm²') return formatArea(quantity, system);
  const n = Number.isInteger(quantity) ? String(quantity) : String(Math.round(quantity * 100) / 100);
  const words = COUNT_WORDS[unit];
  if (!words) return unit ? `${n} ${unit}` : n;
  const word = quantity === 1 ? words[0] : words[1];
  return word ? `${n} ${word}` : n;
}

/**
 * The factor from a line's price per stored unit to its price per the unit
 * `formatQuantity` shows (a price per metre shown per foot is times 0.3048).
 * @example unitPriceFactor('m', 'in') // 0.3048
 * @example unitPriceFactor('sheet', 'in') // 1
 */
export function unitPriceFactor(unit: string, system: LengthUnit): number {
  if (unit === 'm' && system === 'in') return M_PER_FOOT;
  if (unit === 'gal' && system === 'mm') return 1 / L_PER_GALLON;
  if (unit === 'kg' && system === 'in') return 1 / LB_PER_KG;
  if ((unit === 'm2' || unit === 'm²') && system === 'in') return 1 / FT2_PER_M2;
  return 1;
}

/**
 * The unit `formatQuantity` shows a price per, for "Unit price" columns.
 * @example displayUnit('m', 'in') // 'ft'
 */
export function displayUnit(unit: string, system: LengthUnit): string {
  if (unit === 'm') return system === 'in' ? 'ft' : 'm';
  if (unit === 'gal') return system === 'in' ? 'gal' : 'L';
  if (unit === 'kg') return system === 'in' ? 'lb' : 'kg';
  return unit;
}
