import { eq } from 'drizzle-orm';
import { PriceBook, ShopSettings, type PriceBook as Book, type ShopSettings as Settings } from '@benchwright/pricing';
import type { Db } from '../db/client';
import { priceBooks, shopSettings } from '../db/schema';

/** The shop's price book and settings of record, read through the engine's own schemas. */
export function loadPricing(db: Pick<Db, 'select'>): { book: Book; settings: Settings; shopName: string } {
  const b = db.select().from(priceBooks).where(eq(priceBooks.id, 1)).get();
  const s = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
  if (!b || !s) throw new Error('the price book and shop settings are not seeded');
  return { book: PriceBook.parse(b.book), settings: ShopSettings.parse(s.settings), shopName: s.shopName };
}
