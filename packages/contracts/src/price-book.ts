// The price book as the API and the shop app speak of it: its kinds (route and file names), the CSV columns of
// each kind (derived from the engine's item schemas, so a field the engine adds gets its column by itself), and
// the request bodies and answers.
import * as z from 'zod';
import { ListCursor, ListLimit } from './project-list';
import {
  EdgeBanding,
  Finish,
  HardwareItem,
  LabourOperationFields,
  Lumber,
  SheetGood,
} from '@benchwright/pricing/geometry';

export const PRICE_BOOK_KINDS = ['sheet-goods', 'lumber', 'banding', 'hardware', 'finishes', 'labour'] as const;
export type PriceBookKind = (typeof PRICE_BOOK_KINDS)[number];
export const PriceBookKind = z.enum(PRICE_BOOK_KINDS);

/** The list each kind is in `GET /api/price-book`. */
export type PriceBookKey = 'sheetGoods' | 'lumber' | 'edgeBanding' | 'hardware' | 'finishes' | 'labourOperations';

export interface PriceKindInfo {
  kind: PriceBookKind;
  key: PriceBookKey;
  label: string;
  /** the engine's zod schema of one item: the single description of it */
  schema: z.ZodObject;
  /** the field that names an item (labour operations are named by `key`) */
  idField: string;
}

export const PRICE_KINDS: Record<PriceBookKind, PriceKindInfo> = {
  'sheet-goods': { kind: 'sheet-goods', key: 'sheetGoods', label: 'Sheet goods', schema: SheetGood, idField: 'id' },
  lumber: { kind: 'lumber', key: 'lumber', label: 'Lumber', schema: Lumber, idField: 'id' },
  banding: { kind: 'banding', key: 'edgeBanding', label: 'Edge banding', schema: EdgeBanding, idField: 'id' },
  hardware: { kind: 'hardware', key: 'hardware', label: 'Hardware', schema: HardwareItem, idField: 'id' },
  finishes: { kind: 'finishes', key: 'finishes', label: 'Finishes', schema: Finish, idField: 'id' },
  labour: {
    kind: 'labour',
    key: 'labourOperations',
    label: 'Labour operations',
    schema: LabourOperationFields,
    idField: 'key',
  },
};

/**
 * One column of a kind's table and CSV. `money`: the engine's cents, shown and written as dollars with two
 * decimals (a field ending in `Cents`, column ending in `_usd`); `json`: a field that is not a plain value,
 * written as JSON text in its cell.
 */
export interface PriceColumn {
  /** the CSV column name: the field in snake_case, `_usd` for a price */
  column: string;
  field: string;
  type: 'text' | 'number' | 'money' | 'boolean' | 'json';
  /** the allowed values of a text field that is a choice */
  options?: string[];
  /** may be left empty (the engine fills in its default or leaves it out) */
  optional: boolean;
}

interface ZodLike {
  def: { type: string; innerType?: ZodLike; values?: unknown[]; entries?: Record<string, string> };
  options?: readonly string[];
}

function columnOf(field: string, s: ZodLike): PriceColumn {
  let t = s;
  let optional = false;
  while (t.def.innerType && ['optional', 'default', 'nullable', 'prefault'].includes(t.def.type)) {
    optional = true;
    t = t.def.innerType;
  }
  const snake = field.replace(/([a-z0-9])([A-Z])/g, '$1_$2').toLowerCase();
  const base = { field, optional };
  switch (t.def.type) {
    case 'number':
      return field.endsWith('Cents')
        ? { ...base, column: snake.replace(/_cents$/, '_usd'), type: 'money' }
        : { ...base, column: snake, type: 'number' };
    case 'boolean':
      return { ...base, column: snake, type: 'boolean' };
    case 'string':
      return { ...base, column: snake, type: 'text' };
    case 'enum':
      return { ...base, column: snake, type: 'text', options: [...(t.options ?? Object.values(t.def.entries ?? {}))] };
    case 'literal':
      return { ...base, column: snake, type: 'text', options: (t.def.values ?? []).map(String) };
    default:
      return { ...base, column: snake, type: 'json' };
  }
}

/** A kind's columns in the engine schema's field order, the naming field first. */
export function priceColumns(kind: PriceBookKind): PriceColumn[] {
  const info = PRICE_KINDS[kind];
  const cols = Object.entries(info.schema.shape).map(([f, s]) => columnOf(f, s as unknown as ZodLike));
  return [...cols.filter((c) => c.field === info.idField), ...cols.filter((c) => c.field !== info.idField)];
}

const fields = z.record(z.string().max(100), z.unknown());
/** `POST /api/price-book/:kind`: a new item, as the engine's schema of the kind describes it. */
export const PriceItemBody = z.object({ item: fields }).strict();
export type PriceItemBody = z.input<typeof PriceItemBody>;
/** `PATCH /api/price-book/:kind/:id`: fields to change (the id cannot), or `retired` to retire or restore it. */
export const PriceItemPatch = z
  .object({ item: fields.optional(), retired: z.boolean().optional() })
  .strict()
  .refine((b) => b.item !== undefined || b.retired !== undefined, 'send the fields to change, or retired');
export type PriceItemPatch = z.input<typeof PriceItemPatch>;
export const PriceImportQuery = z.object({ dryRun: z.enum(['0', '1', 'true', 'false']).optional() });

/** `GET /api/price-book/versions`: the latest first, a page at a time (keyset cursor). */
export const PriceBookVersionsQuery = z.object({ cursor: ListCursor.optional(), limit: ListLimit });
export type PriceBookVersionsQuery = z.output<typeof PriceBookVersionsQuery>;

/** One item of a kind as the API gives it. */
export interface PriceBookEntry {
  id: string;
  /** ISO time it was retired, or null */
  retiredAt: string | null;
  item: Record<string, unknown>;
}
export type PriceBookView = { version: number; currency: string; note: string } & Record<
  PriceBookKey,
  PriceBookEntry[]
>;

export interface ImportRowError {
  /** the CSV record number, the header being row 1 */
  row: number;
  /** the CSV column, or '' when the row as a whole is wrong */
  column: string;
  message: string;
}
export interface ImportPreview {
  added: Record<string, unknown>[];
  changed: { id: string; before: Record<string, unknown>; after: Record<string, unknown> }[];
  errors: ImportRowError[];
}

/** The most a CSV import may be. */
export const PRICE_IMPORT_MAX_BYTES = 1024 * 1024;
