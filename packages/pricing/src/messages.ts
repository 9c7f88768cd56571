import { formatLength, type LengthUnit } from './units';

/**
 * How the engine's messages speak: lengths in the units they are given (the
 * shop's, by default) and the screen's own words ("Bay 1, Section 2").
 *
 * The design schemas build their messages while zod parses, where no argument
 * can reach them; `withUnits` sets the units for the length of one synchronous
 * call instead (parsing never awaits, so no other call can see them).
 */
let current: LengthUnit = 'mm';

/** Runs `fn` with messages speaking `units`, then restores the units before. */
export function withUnits<T>(units: LengthUnit, fn: () => T): T {
  const before = current;
  current = units;
  try {
    return fn();
  } finally {
    current = before;
  }
}

/** The units messages speak in now. */
export function messageUnits(): LengthUnit {
  return current;
}

/**
 * A length as a sentence reads it: `72 in`, `23 3/4 in`, `1829 mm`.
 * @example withUnits('in', () => len(1828.8)) // '72 in'
 */
export function len(mm: number, units: LengthUnit = current): string {
  return formatLength(mm, { unit: units }).replace(/"$/, ' in');
}

/** The name of a length unit in a sentence: `inches` or `millimeters`. */
export function unitWord(units: LengthUnit = current): string {
  return units === 'in' ? 'inches' : 'millimeters';
}

/** A bay and a section as the screen numbers them, from zero-based indexes: `Bay 2, Section 1`. */
export function where(bay: number, section?: number): string {
  return section === undefined ? `Bay ${bay + 1}` : `Bay ${bay + 1}, Section ${section + 1}`;
}

/** The first letter in capitals, and a full stop at the end if there is none. */
export function sentence(text: string): string {
  const t = text.trim();
  if (!t) return t;
  const s = t.charAt(0).toUpperCase() + t.slice(1);
  return /[.!?]$/.test(s) ? s : `${s}.`;
}
