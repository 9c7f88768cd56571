// The shop's logo as stored: a PNG under PDF_DIR (settings module writes it), read by the PDFs and the mail.
import { readFileSync } from 'node:fs';
import { isAbsolute, resolve } from 'node:path';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { shopSettings } from '../db/schema';

/** The logo's stored path, relative to PDF_DIR, or null when the shop has none. */
export function logoPath(db: Pick<Db, 'select'>): string | null {
  return db.select({ p: shopSettings.logoPath }).from(shopSettings).where(eq(shopSettings.id, 1)).get()?.p ?? null;
}

/** The logo's absolute path under `pdfDir`, or null. */
export function logoFile(db: Pick<Db, 'select'>, pdfDir: string): string | null {
  const p = logoPath(db);
  return p === null ? null : isAbsolute(p) ? p : resolve(pdfDir, p);
}

/** The logo's PNG bytes for react-pdf, or null when there is none or its file is gone (a paper without it). */
export function logoPng(db: Pick<Db, 'select'>, pdfDir: string): Buffer | null {
  const f = logoFile(db, pdfDir);
  if (!f) return null;
  try {
    return readFileSync(f);
  } catch {
    return null;
  }
}
