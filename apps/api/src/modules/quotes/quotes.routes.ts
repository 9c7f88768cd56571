import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { QuotePreviewBody } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { forClient, loadPricing } from '../../lib/engine';
import type { EnginePool } from '../../lib/engine-pool';
import { Invalid, parse, RateLimited } from '../../lib/errors';

/**
 * The budget range, checks and drawings for items, nothing stored. Cost
 * prices and markup never leave the shop: only the owner gets the lines.
 * The engine runs on the pool at 'quick' (2 s limit by default).
 */
export function quotesRoutes(db: Db, pool: EnginePool, opts: { enabled: boolean; perMinute: number }): Router {
  const r = Router();
  const limiter = rateLimit({
    windowMs: 60_000,
    limit: opts.perMinute,
    skip: () => !opts.enabled,
    handler: () => {
      throw new RateLimited();
    },
    standardHeaders: 'draft-8',
    legacyHeaders: false,
  });
  r.post('/preview', limiter, async (req, res) => {
    const { activeBook: book, settings } = loadPricing(db);
    const body = parse(QuotePreviewBody, req.body, settings.units);
    const q = await pool.run({ kind: 'preview', items: body.items, book, settings });
    if ('refused' in q) throw new Invalid(q.refused.message, q.refused.issues);
    const owner = res.locals.user?.role === 'owner';
    // the shop hours of the whole request, for everyone: an hour count is not a price, and it gives the lead time
    const hours = Object.values(q.hoursByStage).reduce((s: number, h) => s + (h ?? 0), 0);
    res.json({
      quote: {
        budget: q.budget,
        // the client reads what they can do; the owner keeps the shop's wording
        checks: owner ? q.checks : forClient(q.checks),
        items: q.items,
        hours: Math.round(hours * 10) / 10,
        ...(owner
          ? {
              lines: q.lines,
              totals: q.totals,
              hoursByStage: q.hoursByStage,
              costCents: q.costCents,
              marginCents: q.marginCents,
            }
          : {}),
      },
    });
  });
  return r;
}
