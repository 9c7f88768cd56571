import { eq, isNotNull } from 'drizzle-orm';
import { basename, isAbsolute, relative, sep } from 'node:path';
import type { Db } from './client';
import { estimates, outbox } from './schema';

/**
 * Rewrites file paths stored absolute by earlier versions (estimate PDFs and pending mail's attachments) as paths
 * relative to the PDF folder, where the code now resolves them. Run at start-up after the migrations; it changes
 * only absolute paths, so running it again does nothing. (Done here rather than in a SQL migration: SQLite has no
 * path functions, and the PDF folder is configuration, not data.) Returns the count of rows changed.
 */
export function relativeFilePaths(db: Db, pdfDir: string): number {
  const rel = (p: string) => (!isAbsolute(p) ? p : p.startsWith(pdfDir + sep) ? relative(pdfDir, p) : basename(p));
  let changed = 0;
  db.transaction((tx) => {
    for (const e of tx
      .select({ id: estimates.id, pdfPath: estimates.pdfPath })
      .from(estimates)
      .where(isNotNull(estimates.pdfPath))
      .all()) {
      if (e.pdfPath && isAbsolute(e.pdfPath)) {
        tx.update(estimates)
          .set({ pdfPath: rel(e.pdfPath) })
          .where(eq(estimates.id, e.id))
          .run();
        changed++;
      }
    }
    for (const m of tx.select({ id: outbox.id, attachments: outbox.attachments }).from(outbox).all()) {
      if (m.attachments.some((a) => 'path' in a && isAbsolute(a.path))) {
        tx.update(outbox)
          .set({ attachments: m.attachments.map((a) => ('path' in a ? { ...a, path: rel(a.path) } : a)) })
          .where(eq(outbox.id, m.id))
          .run();
        changed++;
      }
    }
  });
  return changed;
}
