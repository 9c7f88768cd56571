import { Router } from 'express';
import { StageParam } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { HoursService } from './hours.service';

/** Mounted behind requireRole('owner'). */
export function hoursRoutes(service: HoursService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ stages: service.get() });
  });
  r.post('/:stage/dismiss', (req, res) => {
    res.json({ stages: service.dismiss(currentUser(res), parse(StageParam, req.params.stage)) });
  });
  return r;
}
