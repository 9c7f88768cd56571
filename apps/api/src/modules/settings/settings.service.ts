import { randomUUID } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { and, asc, eq } from 'drizzle-orm';
import { ShopProfile, UpdateSettingsBody, type SettingsView } from '@benchwright/contracts';
import { ShopSettings } from '@benchwright/pricing';
import type * as z from 'zod';
import type { Db } from '../../db/client';
import { shopSettings, stages } from '../../db/schema';
import { Conflict, Invalid, NotFound, zodIssues } from '../../lib/errors';
import { logoFile } from '../../lib/shop-logo';
import { logoToPng } from './logo';

/**
 * The shop's settings: its profile, the engine's ShopSettings and the board's stage names, in one row and the stages
 * table. The engine reads them afresh for each preview and each new revision (lib/engine.ts `loadPricing`); a revision
 * keeps the settings it was priced with in its record, so a change never reaches a sent estimate.
 */
export function createSettingsService(db: Db, pdfDir: string) {
  function view(): SettingsView {
    const row = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
    if (!row) throw new Error('the shop settings are not seeded');
    return {
      version: row.version,
      profile: { shopName: row.shopName, address: row.address, phone: row.phone, email: row.email },
      values: ShopSettings.parse(row.settings),
      stages: db.select().from(stages).orderBy(asc(stages.position)).all(),
      logo: row.logoPath !== null,
      updatedAt: row.updatedAt.toISOString(),
    };
  }

  return {
    view,

    /** Applies a change read at `version`; 409 when someone saved since, 400 naming each field that does not fit. */
    update(body: z.output<typeof UpdateSettingsBody>): SettingsView {
      db.transaction((tx) => {
        const row = tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).get();
        if (!row) throw new Error('the shop settings are not seeded');
        if (row.version !== body.version)
          throw new Conflict('Someone else changed the settings since you opened them; reload to see their changes.');
        const profile = ShopProfile.safeParse({
          shopName: row.shopName,
          address: row.address,
          phone: row.phone,
          email: row.email,
          ...body.profile,
        });
        const values = ShopSettings.safeParse({ ...(row.settings as object), ...body.values });
        const issues = [
          ...(profile.success ? [] : zodIssues(profile.error).map((i) => ({ ...i, path: `profile.${i.path}` }))),
          ...(values.success ? [] : zodIssues(values.error).map((i) => ({ ...i, path: `values.${i.path}` }))),
        ];
        if (!profile.success || !values.success) throw new Invalid('Some settings need attention.', issues);
        const done = tx
          .update(shopSettings)
          .set({ ...profile.data, settings: values.data, version: row.version + 1, updatedAt: new Date() })
          .where(and(eq(shopSettings.id, 1), eq(shopSettings.version, body.version)))
          .run();
        if (done.changes !== 1)
          throw new Conflict('Someone else changed the settings since you opened them; reload to see their changes.');
        for (const [key, label] of Object.entries(body.stages ?? {}))
          if (label !== undefined)
            tx.update(stages)
              .set({ label })
              .where(eq(stages.key, key as (typeof stages.$inferSelect)['key']))
              .run();
      });
      return view();
    },

    /** The logo's PNG file, for `GET /api/settings/logo`; 404 when the shop has none. */
    logoFile(): string {
      const f = logoFile(db, pdfDir);
      if (!f) throw new NotFound('The logo');
      return f;
    },

    /**
     * Stores an upload as the shop's logo (a new file each time: mail queued with the old one still points at it).
     */
    async setLogo(bytes: Buffer): Promise<SettingsView> {
      const png = await logoToPng(bytes);
      const rel = `shop/logo-${randomUUID()}.png`;
      const abs = resolve(pdfDir, rel);
      mkdirSync(dirname(abs), { recursive: true });
      writeFileSync(abs, png);
      db.update(shopSettings).set({ logoPath: rel, updatedAt: new Date() }).where(eq(shopSettings.id, 1)).run();
      return view();
    },
  };
}
export type SettingsService = ReturnType<typeof createSettingsService>;
