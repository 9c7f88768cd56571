// The start-up move of a price book kept as one document (price_books, before the book became rows) into the
// per-kind tables: its items become rows and version 1, and the four fields that were not items (shop rate, labour
// cost per hour, kerf, sheet trim) move into the shop settings. Idempotent: the old row is deleted in the same
// transaction, so a second start finds nothing to move. At start-up rather than in SQL so that each item goes through
// the engine's schema, as every write does.
import { eq } from 'drizzle-orm';
import { PriceBook, ShopSettings } from '@benchwright/pricing';
import type { Db } from './client';
import { priceBooks, shopSettings } from './schema';
import { latestVersion, saveDocument } from '../lib/price-book';

const MOVED = ['shopRateCents', 'labourCostPerHourCents', 'kerfMm', 'sheetTrimMm'] as const;

/** Moves the old document over if there is one; returns whether it did. */
export function movePriceBookDocument(db: Db): boolean {
  return db.transaction((tx) => {
    const old = tx.select().from(priceBooks).where(eq(priceBooks.id, 1)).get();
    if (!old) return false;
    const doc = old.book;
    if (!latestVersion(tx)) saveDocument(tx, PriceBook.parse(doc), 'Moved over from the single price-book document.');
    const s = tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
    if (s) {
      const settings: Record<string, unknown> = { ...s.settings };
      for (const k of MOVED) if (doc[k] !== undefined && settings[k] === undefined) settings[k] = doc[k];
      tx.update(shopSettings)
        .set({ settings: ShopSettings.parse(settings) })
        .where(eq(shopSettings.id, 1))
        .run();
    }
    tx.delete(priceBooks).run();
    return true;
  });
}
