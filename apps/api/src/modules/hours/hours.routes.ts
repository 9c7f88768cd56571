import { Router } from 'express';
import { ApplyHoursBody, StageParam } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { HoursService } from './hours.service';

/** Mounted behind requireRole('owner'). */
export function hoursRoutes(service: HoursService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json(service.get());
  });
  r.post('/:stage/dismiss', (req, res) => {
    res.json(service.dismiss(currentUser(res), parse(StageParam, req.params.stage)));
  });
  r.post('/:stage/apply', (req, res) => {
    const stage = parse(StageParam, req.params.stage);
    const body = parse(ApplyHoursBody, req.body);
    res.json(service.apply(currentUser(res), stage, body.version));
  });
  return r;
}
