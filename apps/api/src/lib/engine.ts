import { asc, eq } from 'drizzle-orm';
import { parseSpec, ShopSettings, type PriceBook as Book, type ShopSettings as Settings } from '@benchwright/pricing';
import type { Db } from '../db/client';
import { projectItems, shopSettings } from '../db/schema';
import { loadBooks } from './price-book';
import { Invalid } from './errors';
import type { EnginePool } from './engine-pool';
import type { RequestItem } from './engine-task';

/**
 * The shop's price book and settings of record, read through the engine's own schemas, with the book's version.
 * `book` is every item, retired ones too, for pricing what a project already uses; new requests and previews check
 * against `activeBook`, from which retired items are hidden.
 */
export function loadPricing(db: Pick<Db, 'select'>): {
  book: Book;
  activeBook: Book;
  bookVersion: number;
  settings: Settings;
  shopName: string;
} {
  const s = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
  if (!s) throw new Error('the shop settings are not seeded');
  const b = loadBooks(db);
  return {
    book: b.all,
    activeBook: b.active,
    bookVersion: b.version,
    settings: ShopSettings.parse(s.settings),
    shopName: s.shopName,
  };
}

/** A project's items as stored, parsed back through their designs. */
export function projectSpecs(db: Pick<Db, 'select'>, projectId: string) {
  const items = db
    .select()
    .from(projectItems)
    .where(eq(projectItems.projectId, projectId))
    .orderBy(asc(projectItems.position))
    .all();
  return items.map((i) => {
    const r = parseSpec(i.spec);
    if (!r.ok) throw new Invalid('A stored item no longer fits its design.', r.issues);
    return { spec: r.spec, quantity: i.quantity };
  });
}

/**
 * Checks a request's items against their designs, the price book and the cap
 * on parts, on a worker of the pool (engine-task.ts `checkItems`); Invalid
 * (400) naming what is wrong.
 */
export async function checkItems(pool: EnginePool, items: RequestItem[], book: Book, settings: Settings) {
  const r = await pool.run({ kind: 'check', items, book, settings });
  if ('refused' in r) throw new Invalid(r.refused.message, r.refused.issues);
  return r.items;
}

/**
 * The shop paper for a project's items (cut list, sheet drawings, pick list,
 * hours, cautions; no prices), laid out afresh at 'thorough' with today's
 * price book on a worker of the engine pool.
 */
export async function travellerFor(db: Pick<Db, 'select'>, pool: EnginePool, projectId: string) {
  const { book, settings } = loadPricing(db);
  const r = await pool.run({ kind: 'price', items: projectSpecs(db, projectId), book, settings });
  return { units: settings.units, ...r.traveller };
}

/** A check as the client reads it: the shop's remedy replaced by what the client can do, where they differ. */
export function forClient<C extends { code: string; level: string; message: string; clientMessage?: string }>(
  checks: readonly C[],
): { code: string; level: C['level']; message: string }[] {
  return checks.map((c) => ({ code: c.code, level: c.level, message: c.clientMessage ?? c.message }));
}
