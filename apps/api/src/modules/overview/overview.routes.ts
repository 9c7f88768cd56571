import { Router } from 'express';
import type { OverviewService } from './overview.service';

/** Mounted behind requireRole('owner'). */
export function overviewRoutes(service: OverviewService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ overview: service.get() });
  });
  return r;
}
