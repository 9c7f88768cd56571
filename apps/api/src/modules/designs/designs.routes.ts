import { Router } from 'express';
import { designs, type DesignSlug } from '@benchwright/pricing';
import { NotFound } from '../../lib/errors';

function view(slug: DesignSlug) {
  const d = designs[slug];
  return { slug: d.slug, name: d.name, summary: d.summary, defaults: d.defaults, limits: d.limits };
}

/** Anyone may read the designs. */
export function designsRoutes(): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ designs: (Object.keys(designs) as DesignSlug[]).map(view) });
  });
  r.get('/:slug', (req, res) => {
    const slug = req.params.slug;
    if (!Object.hasOwn(designs, slug)) throw new NotFound('The design');
    res.json({ design: view(slug as DesignSlug) });
  });
  return r;
}
