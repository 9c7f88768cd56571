import * as z from 'zod';

/**
 * Characters refused in text people type: C0 and C1 controls (NUL, escape, line breaks...), DEL, the Unicode line and
 * paragraph separators, and the bidirectional embeddings, overrides and isolates (U+202A-202E, U+2066-2069), which can
 * make a name read differently from what it is in mails, PDFs and the shop's screens.
 */
const BIDI = '\u202A-\u202E\u2066-\u2069';
const SEPARATORS = '\u2028\u2029';
const SINGLE_LINE_BAD = new RegExp(`[\\u0000-\\u001F\\u007F-\\u009F${SEPARATORS}${BIDI}]`, 'u');
/** the same, but a line feed is allowed (carriage returns are made line feeds first) */
const MULTI_LINE_BAD = new RegExp(`[\\u0000-\\u0009\\u000B-\\u001F\\u007F-\\u009F${SEPARATORS}${BIDI}]`, 'u');

/** true when `s` holds no control or direction-changing character (a single line). */
export const isSingleLine = (s: string): boolean => !SINGLE_LINE_BAD.test(s);
/** true when `s` holds no control or direction-changing character other than line feeds. */
export const isPlainText = (s: string): boolean => !MULTI_LINE_BAD.test(s);

/** A trimmed one-line text field: names, line descriptions, units. */
export const singleLine = () =>
  z
    .string()
    .trim()
    .refine(isSingleLine, 'use one line of plain text (no line breaks, control or direction-changing characters)');

/** A trimmed text that may run over several lines (notes, comments): line feeds only, no other controls. */
export const multiLine = () =>
  z
    .string()
    .overwrite((s) => s.replace(/\r\n?/g, '\n'))
    .trim()
    .refine(isPlainText, 'use plain text (line breaks are fine; no control or direction-changing characters)');
