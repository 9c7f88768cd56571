// A price-book kind as CSV, out and in (papaparse). The columns are the engine schema's fields in snake_case
// (priceColumns in packages/contracts), prices in dollars, and a last column `retired` (yes or empty).
import Papa from 'papaparse';
import {
  PRICE_KINDS,
  priceColumns,
  type ImportRowError,
  type PriceBookKind,
  type PriceColumn,
} from '@benchwright/contracts';
import type { PriceRow } from '../../lib/price-book';

export const RETIRED_COLUMN = 'retired';

function cell(c: PriceColumn, v: unknown): string {
  if (v === undefined || v === null) return '';
  switch (c.type) {
    case 'money':
      return (Number(v) / 100).toFixed(2);
    case 'json':
      return JSON.stringify(v);
    default:
      return String(v);
  }
}

/** The kind's rows as CSV text, header first. */
export function toCsv(kind: PriceBookKind, rows: PriceRow[]): string {
  const cols = priceColumns(kind);
  return Papa.unparse(
    {
      fields: [...cols.map((c) => c.column), RETIRED_COLUMN],
      data: rows.map((r) => [...cols.map((c) => cell(c, r.item[c.field])), r.retiredAt ? 'yes' : '']),
    },
    // a cell starting with = + - @ is written with a leading ' so a spreadsheet does not run it as a formula
    { newline: '\r\n', escapeFormulae: true },
  );
}

/** One data row read from a CSV: its record number (the header is row 1) and its fields before the engine's schema. */
export interface CsvRow {
  row: number;
  raw: Record<string, unknown>;
  retired: boolean;
}

const MONEY = /^-?\d+(\.\d{1,2})?$/;
const NUMBER = /^-?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/** Reads a value of a column from its cell; an empty cell is left out (the engine's default or "required"). */
function read(c: PriceColumn, text: string): { value?: unknown; error?: string } {
  if (text === '') return {};
  switch (c.type) {
    case 'money':
      if (!MONEY.test(text)) return { error: 'write a price in dollars with at most two decimals, like 42.50' };
      return { value: Math.round(Number(text) * 100) };
    case 'number':
      if (!NUMBER.test(text)) return { error: `"${text.slice(0, 40)}" is not a number` };
      return { value: Number(text) };
    case 'boolean':
      if (!/^(true|false|yes|no)$/i.test(text)) return { error: 'write yes or no' };
      return { value: /^(true|yes)$/i.test(text) };
    case 'json':
      try {
        return { value: JSON.parse(text) };
      } catch {
        return { error: 'not valid JSON' };
      }
    default:
      // the ' that the export puts before a cell a spreadsheet would take for a formula
      return { value: /^'[=+\-@\t\r]/.test(text) ? text.slice(1) : text };
  }
}

/**
 * Parses a kind's CSV into rows of raw fields, with an error per bad cell or row (the header's problems as row 1).
 * Comma-separated only: a file with another delimiter reads as one column and is told so.
 */
export function fromCsv(kind: PriceBookKind, text: string): { rows: CsvRow[]; errors: ImportRowError[] } {
  const cols = priceColumns(kind);
  const errors: ImportRowError[] = [];
  const parsed = Papa.parse<string[]>(text, { delimiter: ',', header: false, skipEmptyLines: false });
  const records = parsed.data;
  const header = (records[0] ?? []).map((h) => h.trim());
  if (header.length === 0 || (header.length === 1 && header[0] === ''))
    return { rows: [], errors: [{ row: 1, column: '', message: 'the file is empty: it needs a header row' }] };
  const expected = [...cols.map((c) => c.column), RETIRED_COLUMN];
  if (header.length === 1 && /[;\t|]/.test(header[0] ?? ''))
    return {
      rows: [],
      errors: [{ row: 1, column: '', message: 'the file is not comma-separated: save it as CSV with commas' }],
    };
  header.forEach((h, i) => {
    if (!expected.includes(h))
      errors.push({ row: 1, column: h, message: `not a column of ${PRICE_KINDS[kind].label.toLowerCase()}` });
    else if (header.indexOf(h) !== i) errors.push({ row: 1, column: h, message: 'this column is there twice' });
  });
  for (const c of expected)
    if (!header.includes(c)) errors.push({ row: 1, column: c, message: 'this column is missing' });
  if (errors.length) return { rows: [], errors };

  const bad = new Map<number, string>();
  for (const e of parsed.errors) if (e.row !== undefined && !bad.has(e.row)) bad.set(e.row, e.message);
  const rows: CsvRow[] = [];
  records.forEach((rec, i) => {
    if (i === 0) return;
    const row = i + 1;
    if (rec.every((c) => c.trim() === '')) return;
    const parseError = bad.get(i);
    if (parseError) return void errors.push({ row, column: '', message: parseError });
    if (rec.length !== header.length)
      return void errors.push({
        row,
        column: '',
        message: `this row has ${rec.length} cells; the header has ${header.length}`,
      });
    const raw: Record<string, unknown> = {};
    let retired = false;
    header.forEach((h, j) => {
      const text = (rec[j] ?? '').trim();
      if (h === RETIRED_COLUMN) {
        if (/^(yes|true)$/i.test(text)) retired = true;
        else if (!/^(no|false|)$/i.test(text)) errors.push({ row, column: h, message: 'write yes or leave it empty' });
        return;
      }
      const c = cols.find((x) => x.column === h)!;
      const r = read(c, text);
      if (r.error) errors.push({ row, column: h, message: r.error });
      else if (r.value !== undefined) raw[c.field] = r.value;
    });
    rows.push({ row, raw, retired });
  });
  return { rows, errors };
}

/** The CSV column of an item field, for errors the engine's schema reports by field. */
export function columnOf(kind: PriceBookKind, field: string | undefined): string {
  return priceColumns(kind).find((c) => c.field === field)?.column ?? '';
}
