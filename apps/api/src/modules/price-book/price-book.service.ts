import { isDeepStrictEqual } from 'node:util';
import { desc, eq, lt } from 'drizzle-orm';
import * as z from 'zod';
import { ShopSettings } from '@benchwright/pricing';
import {
  PRICE_BOOK_KINDS,
  PRICE_KINDS,
  type ApiIssue,
  type ImportPreview,
  type ImportRowError,
  type PriceBookEntry,
  type PriceBookKind,
  PriceItemPatch,
  type User,
} from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { priceBookVersions, shopSettings, users } from '../../db/schema';
import { decodeCursor, encodeCursor } from '../../lib/cursor';
import { Invalid, NotFound } from '../../lib/errors';
import {
  bookView,
  checkBook,
  idOf,
  latestVersion,
  readRows,
  saveChange,
  type BookIssue,
  type BookRows,
  type PriceRow,
} from '../../lib/price-book';
import { columnOf, fromCsv, toCsv } from './price-book.csv';

const entry = (r: PriceRow): PriceBookEntry => ({
  id: r.id,
  retiredAt: r.retiredAt ? r.retiredAt.toISOString() : null,
  item: r.item,
});

/** An item's fields through its kind's engine schema, or the field errors as the API's issues. */
function parseItemOrIssues(kind: PriceBookKind, raw: unknown) {
  const r = PRICE_KINDS[kind].schema.safeParse(raw);
  if (r.success) return { item: r.data as Record<string, unknown> };
  return { issues: r.error.issues.map((i) => ({ path: ['item', ...i.path].join('.'), message: i.message })) };
}

const bookIssue = (i: BookIssue): ApiIssue => ({ path: i.field ? `item.${i.field}` : 'item', message: i.message });

/** The price book, the owner's data: read, add, edit, retire, CSV out and in; every change a new version. */
export function createPriceBookService(db: Db) {
  function settings() {
    const s = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
    if (!s) throw new Error('the shop settings are not seeded');
    return ShopSettings.parse(s.settings);
  }
  function meta() {
    const v = latestVersion(db);
    if (!v) throw new Error('the price book is not seeded');
    return { currency: v.currency, note: v.note };
  }
  /** Another kind that already has this id (ids are one namespace across the book: specs name items by id). */
  function usedElsewhere(rows: BookRows, kind: PriceBookKind, id: string) {
    return PRICE_BOOK_KINDS.find((k) => k !== kind && rows[k].some((r) => r.id === id));
  }

  /** Checks the book after a change and saves it with a new version, in one transaction. */
  function commit(rows: BookRows, kind: PriceBookKind, ids: string[], user: User, summary: string) {
    const touched = ids.map((id) => ({ kind, id }));
    const issues = checkBook(rows, meta(), settings(), touched, readRows(db));
    if (issues.length) throw new Invalid('That change would leave the price book unusable.', issues.map(bookIssue));
    return db.transaction((tx) => saveChange(tx, rows, touched, meta(), { userId: user.id, summary }));
  }

  return {
    view: () => bookView(db),

    /**
     * The book's versions, the latest first, `limit` a page: one statement a page (the snapshots are not read),
     * keyed on the version number, which is the table's primary key.
     */
    versions(q: { cursor?: string; limit: number }) {
      const after = q.cursor ? Number(decodeCursor(q.cursor, 'version', 'desc', 'number').key) : undefined;
      const rows = db
        .select({
          version: priceBookVersions.number,
          createdAt: priceBookVersions.createdAt,
          summary: priceBookVersions.summary,
          userId: priceBookVersions.userId,
          userName: users.name,
        })
        .from(priceBookVersions)
        .leftJoin(users, eq(users.id, priceBookVersions.userId))
        .where(after === undefined ? undefined : lt(priceBookVersions.number, after))
        .orderBy(desc(priceBookVersions.number))
        .limit(q.limit + 1)
        .all();
      const more = rows.length > q.limit;
      const page = more ? rows.slice(0, q.limit) : rows;
      const last = page.at(-1);
      return {
        versions: page.map((r) => ({
          version: r.version,
          createdAt: r.createdAt.toISOString(),
          by: r.userId ? { id: r.userId, name: r.userName ?? '' } : null,
          summary: r.summary,
        })),
        nextCursor:
          more && last
            ? encodeCursor({ sort: 'version', dir: 'desc', key: last.version, id: String(last.version) })
            : null,
      };
    },

    add(user: User, kind: PriceBookKind, raw: Record<string, unknown>) {
      const p = parseItemOrIssues(kind, raw);
      if (p.issues) throw new Invalid('Some fields need attention.', p.issues);
      const rows = readRows(db);
      const id = idOf(kind, p.item);
      const idPath = `item.${PRICE_KINDS[kind].idField}`;
      const other = rows[kind].some((r) => r.id === id) ? kind : usedElsewhere(rows, kind, id);
      if (other)
        throw new Invalid('That id is taken.', [
          { path: idPath, message: `"${id}" is already in ${PRICE_KINDS[other].label.toLowerCase()}` },
        ]);
      const row: PriceRow = { id, item: p.item, retiredAt: null };
      rows[kind].push(row);
      const version = commit(rows, kind, [id], user, `Added ${PRICE_KINDS[kind].label.toLowerCase()}: ${id}.`);
      return { entry: entry(row), version };
    },

    edit(user: User, kind: PriceBookKind, id: string, patch: z.output<typeof PriceItemPatch>) {
      const rows = readRows(db);
      const row = rows[kind].find((r) => r.id === id);
      if (!row) throw new NotFound('That price-book item');
      const idField = PRICE_KINDS[kind].idField;
      const what: string[] = [];
      if (patch.item) {
        if (idField in patch.item && patch.item[idField] !== id)
          throw new Invalid('An item keeps its id.', [
            { path: `item.${idField}`, message: 'the id cannot change; retire this item and add a new one' },
          ]);
        const p = parseItemOrIssues(kind, { ...row.item, ...patch.item });
        if (p.issues) throw new Invalid('Some fields need attention.', p.issues);
        if (!isDeepStrictEqual(p.item, row.item)) what.push('edited');
        row.item = p.item;
      }
      if (patch.retired !== undefined && patch.retired !== Boolean(row.retiredAt)) {
        row.retiredAt = patch.retired ? new Date() : null;
        what.push(patch.retired ? 'retired' : 'restored');
      }
      if (!what.length) return { entry: entry(row), version: latestVersion(db)!.number };
      const version = commit(rows, kind, [id], user, `${PRICE_KINDS[kind].label}: ${id} ${what.join(' and ')}.`);
      return { entry: entry(row), version };
    },

    csv: (kind: PriceBookKind) => toCsv(kind, readRows(db)[kind]),

    /**
     * A CSV import: the preview of what it would add and change and its errors, row by row; unless `dryRun`, it is
     * then saved in one transaction as one new version, or refused whole (400, an issue per bad row) if any row is bad.
     */
    import(user: User, kind: PriceBookKind, text: string, dryRun: boolean) {
      const { rows: csvRows, errors } = fromCsv(kind, text);
      const rows = readRows(db);
      const idField = PRICE_KINDS[kind].idField;
      const preview: ImportPreview = { added: [], changed: [], errors };
      const seen = new Map<string, number>();
      const rowOf = new Map<string, number>();
      const touched: string[] = [];
      const now = new Date();
      for (const r of csvRows) {
        const p = PRICE_KINDS[kind].schema.safeParse(r.raw);
        if (!p.success) {
          for (const i of p.error.issues)
            errors.push({ row: r.row, column: columnOf(kind, i.path[0] as string | undefined), message: i.message });
          continue;
        }
        const item = p.data as Record<string, unknown>;
        const id = idOf(kind, item);
        const column = columnOf(kind, idField);
        const first = seen.get(id);
        if (first !== undefined) {
          errors.push({ row: r.row, column, message: `"${id}" is also on row ${first}` });
          continue;
        }
        seen.set(id, r.row);
        const other = usedElsewhere(rows, kind, id);
        if (other) {
          errors.push({
            row: r.row,
            column,
            message: `"${id}" is already in ${PRICE_KINDS[other].label.toLowerCase()}`,
          });
          continue;
        }
        const existing = rows[kind].find((x) => x.id === id);
        if (!existing) {
          rows[kind].push({ id, item, retiredAt: r.retired ? now : null });
          preview.added.push(item);
        } else {
          if (isDeepStrictEqual(existing.item, item) && r.retired === Boolean(existing.retiredAt)) continue;
          preview.changed.push({
            id,
            before: { ...existing.item, retired: Boolean(existing.retiredAt) },
            after: { ...item, retired: r.retired },
          });
          existing.item = item;
          existing.retiredAt = r.retired ? (existing.retiredAt ?? now) : null;
        }
        rowOf.set(id, r.row);
        touched.push(id);
      }
      if (!errors.length && touched.length) {
        const issues = checkBook(
          rows,
          meta(),
          settings(),
          touched.map((id) => ({ kind, id })),
          readRows(db),
        );
        for (const i of issues)
          errors.push({
            row: (i.kind === kind && i.id ? rowOf.get(i.id) : undefined) ?? 0,
            column: i.kind === kind ? columnOf(kind, i.field ?? undefined) : '',
            message: i.message,
          });
      }
      errors.sort((a, b) => a.row - b.row);
      if (dryRun) return { preview };
      if (errors.length)
        throw new Invalid(
          `The file has ${errors.length} problem${errors.length === 1 ? '' : 's'}; nothing was saved.`,
          errors.map(importIssue),
        );
      if (!touched.length) return { preview, version: latestVersion(db)!.number };
      const version = db.transaction((tx) =>
        saveChange(
          tx,
          rows,
          touched.map((id) => ({ kind, id })),
          meta(),
          {
            userId: user.id,
            summary: `${PRICE_KINDS[kind].label} imported from CSV: ${preview.added.length} added, ${preview.changed.length} changed.`,
          },
        ),
      );
      return { preview, version };
    },
  };
}

/** An import error as the API's issue: `rows.<row>.<column>`. */
const importIssue = (e: ImportRowError): ApiIssue => ({
  path: `rows.${e.row}${e.column ? `.${e.column}` : ''}`,
  message: e.message,
});

export type PriceBookService = ReturnType<typeof createPriceBookService>;
