import { Router } from 'express';
import { designs, type DesignSlug, type LengthUnit, type PriceBook } from '@benchwright/pricing';
import type { Db } from '../../db/client';
import { loadPricing } from '../../lib/engine';
import { NotFound } from '../../lib/errors';
import { designOptions } from './design-options';

function view(slug: DesignSlug, book: PriceBook, units: LengthUnit) {
  const d = designs[slug];
  return {
    slug: d.slug,
    name: d.name,
    summary: d.summary,
    defaults: d.defaults,
    limits: d.limits,
    options: designOptions(slug, book, units),
    units,
  };
}

/** Anyone may read the designs, with the choices the shop's active price book offers for each (no costs). */
export function designsRoutes(db: Db): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    const { activeBook, settings } = loadPricing(db);
    res.json({ designs: (Object.keys(designs) as DesignSlug[]).map((s) => view(s, activeBook, settings.units)) });
  });
  r.get('/:slug', (req, res) => {
    const slug = req.params.slug;
    if (!Object.hasOwn(designs, slug)) throw new NotFound('The design');
    const { activeBook, settings } = loadPricing(db);
    res.json({ design: view(slug as DesignSlug, activeBook, settings.units) });
  });
  return r;
}
