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
