import { asc, eq } from 'drizzle-orm';
import {
  estimate,
  parseSpec,
  PriceBook,
  ShopSettings,
  traveller,
  type PriceBook as Book,
  type ShopSettings as Settings,
} from '@benchwright/pricing';
import type { Db } from '../db/client';
import { priceBooks, projectItems, shopSettings } from '../db/schema';
import { Invalid } from './errors';

/** The shop's price book and settings of record, read through the engine's own schemas. */
export function loadPricing(db: Pick<Db, 'select'>): { book: Book; settings: Settings; shopName: string } {
  const b = db.select().from(priceBooks).where(eq(priceBooks.id, 1)).get();
  const s = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
  if (!b || !s) throw new Error('the price book and shop settings are not seeded');
  return { book: PriceBook.parse(b.book), settings: ShopSettings.parse(s.settings), shopName: s.shopName };
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
 * The shop paper for a project's items (cut list, sheet drawings, pick list,
 * hours, cautions; no prices), laid out afresh at 'thorough' with today's
 * price book: the stock on the rack is what gets cut.
 */
export function travellerFor(db: Pick<Db, 'select'>, projectId: string) {
  const { book, settings } = loadPricing(db);
  return {
    units: settings.units,
    ...traveller(estimate(projectSpecs(db, projectId), book, settings, { effort: 'thorough' }), book, settings),
  };
}
