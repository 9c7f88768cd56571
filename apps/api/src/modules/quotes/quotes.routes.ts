import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { QuotePreviewBody } from '@benchwright/contracts';
import { estimate, rangeOf, toSvg, validateSpec } from '@benchwright/pricing';
import type { Db } from '../../db/client';
import { loadPricing } from '../../lib/engine';
import { Invalid, parse, RateLimited } from '../../lib/errors';

/**
 * The budget range, checks and drawings for items, nothing stored. Cost
 * prices and markup never leave the shop: only the owner gets the lines.
 */
export function quotesRoutes(db: Db, opts: { enabled: boolean; perMinute: number }): Router {
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
  r.post('/preview', limiter, (req, res) => {
    const body = parse(QuotePreviewBody, req.body);
    const { book, settings } = loadPricing(db);
    const issues = body.items.flatMap((item, i) => {
      const v = validateSpec(item.spec, book, settings);
      return v.ok
        ? []
        : v.issues.map((x) => ({ path: `items[${i}].spec${x.path ? `.${x.path}` : ''}`, message: x.message }));
    });
    if (issues.length) throw new Invalid('Some items cannot be built as given.', issues);
    const e = estimate(body.items, book, settings, { effort: 'quick' });
    const budget = rangeOf(e.totals.totalCents, settings.budgetSpread);
    const owner = res.locals.user?.role === 'owner';
    // the shop hours of the whole request, for everyone: an hour count is not a price, and it gives the lead time
    const hours = Object.values(e.hoursByStage).reduce((s: number, h) => s + (h ?? 0), 0);
    res.json({
      quote: {
        budget: { lowCents: budget.lowCents, highCents: budget.highCents },
        checks: e.checks.map((c) => ({ code: c.code, level: c.level, message: c.message })),
        items: e.pieces.map((p) => ({ drawingSvg: toSvg(p.elevation), massKg: Math.round(p.massKg * 10) / 10 })),
        hours: Math.round(hours * 10) / 10,
        ...(owner
          ? {
              lines: e.lines,
              totals: e.totals,
              hoursByStage: e.hoursByStage,
              costCents: e.costCents,
              marginCents: e.marginCents,
            }
          : {}),
      },
    });
  });
  return r;
}
