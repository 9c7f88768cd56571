// The price book as rows: one table per kind, each item the engine's own zod schema of its kind (parsed on every
// read and write), and a new version for every change, with a snapshot so any version's book can be read back.
import { asc, desc, eq } from 'drizzle-orm';
import {
  designs,
  PriceBook,
  validateSpec,
  type DesignSlug,
  type PriceBook as Book,
  type ShopSettings,
} from '@benchwright/pricing';
import { PRICE_BOOK_KINDS, PRICE_KINDS, type PriceBookKind, type PriceBookView } from '@benchwright/contracts';
import type { Db, Tx } from '../db/client';
import {
  priceBookVersions,
  priceEdgeBanding,
  priceFinishes,
  priceHardware,
  priceLabourOperations,
  priceLumber,
  priceSheetGoods,
} from '../db/schema';

export const PRICE_TABLES = {
  'sheet-goods': priceSheetGoods,
  lumber: priceLumber,
  banding: priceEdgeBanding,
  hardware: priceHardware,
  finishes: priceFinishes,
  labour: priceLabourOperations,
} as const;

/** The engine's PriceBook list of each kind (the engine calls the labour operations `labour`). */
export const BOOK_LIST: Record<PriceBookKind, keyof Book> = {
  'sheet-goods': 'sheetGoods',
  lumber: 'lumber',
  banding: 'edgeBanding',
  hardware: 'hardware',
  finishes: 'finishes',
  labour: 'labour',
};

export interface PriceRow {
  id: string;
  item: Record<string, unknown>;
  retiredAt: Date | null;
}
export type BookRows = Record<PriceBookKind, PriceRow[]>;
export interface BookMeta {
  currency: 'USD';
  note: string;
}

/** A version's snapshot: every kind's rows as they stood after it. */
export interface PriceBookSnapshot {
  rows: Record<PriceBookKind, { id: string; item: Record<string, unknown>; retiredAt: string | null }[]>;
}

/** An item through its kind's engine schema; throws the ZodError for the caller to turn into issues. */
export function parseItem(kind: PriceBookKind, raw: unknown): Record<string, unknown> {
  return PRICE_KINDS[kind].schema.parse(raw) as Record<string, unknown>;
}
export const idOf = (kind: PriceBookKind, item: Record<string, unknown>) => String(item[PRICE_KINDS[kind].idField]);

/** Every kind's rows in their order, each item parsed with its engine schema. */
export function readRows(db: Pick<Db, 'select'>): BookRows {
  const out = {} as BookRows;
  for (const kind of PRICE_BOOK_KINDS) {
    const t = PRICE_TABLES[kind];
    out[kind] = db
      .select()
      .from(t)
      .orderBy(asc(t.position), asc(t.id))
      .all()
      .map((r) => ({ id: r.id, item: parseItem(kind, r.item), retiredAt: r.retiredAt }));
  }
  return out;
}

/** The latest version's number and metadata (not its snapshot), or undefined before the book is seeded. */
export function latestVersion(db: Pick<Db, 'select'>) {
  return db
    .select({ number: priceBookVersions.number, currency: priceBookVersions.currency, note: priceBookVersions.note })
    .from(priceBookVersions)
    .orderBy(desc(priceBookVersions.number))
    .limit(1)
    .get();
}

/** The engine's PriceBook input from rows: the active items only, or every item for pricing what exists. */
export function bookInput(rows: BookRows, meta: BookMeta, withRetired: boolean): Record<string, unknown> {
  const book: Record<string, unknown> = { currency: meta.currency, note: meta.note };
  for (const kind of PRICE_BOOK_KINDS)
    book[BOOK_LIST[kind]] = rows[kind].filter((r) => withRetired || !r.retiredAt).map((r) => r.item);
  return book;
}

/**
 * Today's book for the engine. `active` (the default) leaves retired items out: new requests and previews choose
 * only from it. `all` keeps them, so that a project that already uses a retired item can still be priced again.
 */
export function loadBook(db: Pick<Db, 'select'>, which: 'active' | 'all' = 'active'): { book: Book; version: number } {
  const v = latestVersion(db);
  if (!v) throw new Error('the price book is not seeded');
  return { book: PriceBook.parse(bookInput(readRows(db), v, which === 'all')), version: v.number };
}

type Books = { all: Book; active: Book; version: number };
/**
 * The books last read from each database handle, by version: every change to the rows makes a new version
 * (saveChange), so one cheap look at the latest version number says whether the parsed books still hold. Reading
 * and parsing every item costs milliseconds, and every preview and revision needs the book. Callers treat the
 * books as read-only.
 */
const cache = new WeakMap<object, Books>();

/** Today's book both ways from one read: every item (`all`) and the active ones (`active`). */
export function loadBooks(db: Pick<Db, 'select'>): Books {
  const v = latestVersion(db);
  if (!v) throw new Error('the price book is not seeded');
  const hit = cache.get(db);
  if (hit?.version === v.number) return hit;
  const rows = readRows(db);
  const books = {
    all: PriceBook.parse(bookInput(rows, v, true)),
    active: PriceBook.parse(bookInput(rows, v, false)),
    version: v.number,
  };
  cache.set(db, books);
  return books;
}

/** The whole book of a version as it was, retired items included and marked. */
export function bookAtVersion(db: Pick<Db, 'select'>, n: number): PriceBookView | undefined {
  const v = db.select().from(priceBookVersions).where(eq(priceBookVersions.number, n)).get();
  if (!v) return undefined;
  const snap = v.snapshot as unknown as PriceBookSnapshot;
  const view = { version: v.number, currency: v.currency, note: v.note } as PriceBookView;
  for (const kind of PRICE_BOOK_KINDS) view[PRICE_KINDS[kind].key] = snap.rows[kind] ?? [];
  return view;
}

/** Today's book as the API gives it. */
export function bookView(db: Pick<Db, 'select'>): PriceBookView {
  const v = latestVersion(db);
  if (!v) throw new Error('the price book is not seeded');
  const rows = readRows(db);
  const view = { version: v.number, currency: v.currency, note: v.note } as PriceBookView;
  for (const kind of PRICE_BOOK_KINDS)
    view[PRICE_KINDS[kind].key] = rows[kind].map((r) => ({
      id: r.id,
      retiredAt: r.retiredAt ? r.retiredAt.toISOString() : null,
      item: r.item,
    }));
  return view;
}

/** What is wrong with a book as a whole, item by item where the fault is one item's. */
export interface BookIssue {
  kind: PriceBookKind | null;
  id: string | null;
  field: string | null;
  message: string;
}

function bookIssues(input: Record<string, unknown>, rows: BookRows, withRetired: boolean): BookIssue[] {
  const r = PriceBook.safeParse(input);
  if (r.success) return [];
  return r.error.issues.map((i) => {
    const kind = PRICE_BOOK_KINDS.find((k) => BOOK_LIST[k] === i.path[0]) ?? null;
    const list = kind ? rows[kind].filter((x) => withRetired || !x.retiredAt) : [];
    const at = typeof i.path[1] === 'number' ? list[i.path[1]] : undefined;
    return {
      kind,
      id: at?.id ?? null,
      field: typeof i.path[2] === 'string' ? i.path[2] : null,
      message: i.message,
    };
  });
}

/** Every string in a design's defaults: the price-book ids it chooses. */
function idsIn(v: unknown, out = new Set<string>()): Set<string> {
  if (typeof v === 'string') out.add(v);
  else if (Array.isArray(v)) v.forEach((x) => idsIn(x, out));
  else if (v && typeof v === 'object') Object.values(v).forEach((x) => idsIn(x, out));
  return out;
}

/**
 * Checks a book about to be saved: every item once across the kinds, the engine's rules for a whole book on the
 * active items, and every design's defaults still valid with the active items (so that the configurator's starting
 * point never fails). `touched` are the items the change makes, to name when a design's defaults break.
 */
export function checkBook(
  rows: BookRows,
  meta: BookMeta,
  settings: ShopSettings,
  touched: { kind: PriceBookKind; id: string }[],
  /** the book before the change: a design whose defaults already failed with it is not the change's fault */
  before?: BookRows,
): BookIssue[] {
  const issues = bookIssues(bookInput(rows, meta, true), rows, true);
  const active = bookInput(rows, meta, false);
  for (const i of bookIssues(active, rows, false))
    if (!issues.some((x) => x.message === i.message && x.id === i.id)) issues.push(i);
  if (issues.length) return issues;
  const book = PriceBook.parse(active);
  const old = before ? PriceBook.safeParse(bookInput(before, meta, false)) : undefined;
  for (const slug of Object.keys(designs) as DesignSlug[]) {
    const d = designs[slug];
    const v = validateSpec(d.defaults, book, settings);
    if (v.ok) continue;
    if (old?.success && !validateSpec(d.defaults, old.data, settings).ok) continue;
    const used = idsIn(d.defaults);
    const culprits = touched.filter((t) => used.has(t.id));
    const message = `the ${d.name.toLowerCase()} design's starting point would no longer be valid: ${v.issues[0]?.message ?? 'it fails its checks'}`;
    if (culprits.length) for (const c of culprits) issues.push({ kind: c.kind, id: c.id, field: null, message });
    else issues.push({ kind: null, id: null, field: null, message });
  }
  return issues;
}

/**
 * Writes the given rows of a kind (inserted or updated in place, order kept) and a new version with a snapshot of
 * the whole book after the change, in the caller's transaction. Returns the new version's number.
 */
export function saveChange(
  tx: Tx,
  rows: BookRows,
  changed: { kind: PriceBookKind; id: string }[],
  meta: BookMeta,
  by: { userId: string | null; summary: string },
): number {
  const now = new Date();
  for (const kind of PRICE_BOOK_KINDS) {
    const t = PRICE_TABLES[kind];
    rows[kind].forEach((r, position) => {
      if (!changed.some((c) => c.kind === kind && c.id === r.id)) return;
      const values = {
        id: r.id,
        name: String(r.item.name ?? r.id),
        position,
        item: r.item,
        retiredAt: r.retiredAt,
        updatedAt: now,
      };
      tx.insert(t).values(values).onConflictDoUpdate({ target: t.id, set: values }).run();
    });
  }
  const last = latestVersion(tx);
  const number = (last?.number ?? 0) + 1;
  const snapshot: PriceBookSnapshot = { rows: {} as PriceBookSnapshot['rows'] };
  for (const kind of PRICE_BOOK_KINDS)
    snapshot.rows[kind] = rows[kind].map((r) => ({
      id: r.id,
      item: r.item,
      retiredAt: r.retiredAt ? r.retiredAt.toISOString() : null,
    }));
  tx.insert(priceBookVersions)
    .values({
      number,
      userId: by.userId,
      summary: by.summary,
      currency: meta.currency,
      note: meta.note,
      snapshot: snapshot as unknown as Record<string, unknown>,
      createdAt: now,
    })
    .run();
  return number;
}

/** Writes a whole engine PriceBook document as rows and version 1 (or the next), in the caller's transaction. */
export function saveDocument(tx: Tx, doc: Book, summary: string): number {
  const rows = {} as BookRows;
  const changed: { kind: PriceBookKind; id: string }[] = [];
  for (const kind of PRICE_BOOK_KINDS) {
    rows[kind] = (doc[BOOK_LIST[kind]] as unknown as Record<string, unknown>[]).map((raw) => {
      const item = parseItem(kind, raw);
      changed.push({ kind, id: idOf(kind, item) });
      return { id: idOf(kind, item), item, retiredAt: null };
    });
  }
  return saveChange(tx, rows, changed, { currency: doc.currency, note: doc.note }, { userId: null, summary });
}
