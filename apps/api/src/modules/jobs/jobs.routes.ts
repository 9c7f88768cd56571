import { Router } from 'express';
import { CheckBody, CheckKey, JobsQuery, LogTimeBody, UpdateJobBody } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { JobsService } from './jobs.service';

/** Mounted behind requireRole('owner', 'builder'). */
export function jobsRoutes(service: JobsService): Router {
  const r = Router();
  r.get('/stages', (_req, res) => {
    res.json({ stages: service.stages() });
  });
  r.get('/', (req, res) => {
    res.json(service.list(parse(JobsQuery, req.query)));
  });
  r.get('/:id', (req, res) => {
    res.json({ job: service.get(req.params.id) });
  });
  r.get('/:id/traveller.pdf', async (req, res) => {
    const { pdf, filename } = await service.travellerPdf(req.params.id);
    res.type('application/pdf').attachment(filename).send(pdf);
  });
  r.get('/:id/labels.pdf', async (req, res) => {
    const { pdf, filename } = await service.labelsPdf(req.params.id);
    res.type('application/pdf').attachment(filename).send(pdf);
  });
  r.get('/:id/traveller', async (req, res) => {
    res.json({ traveller: await service.traveller(req.params.id) });
  });
  r.put('/:id/checks/:key', async (req, res) => {
    const key = parse(CheckKey, req.params.key);
    const { done } = parse(CheckBody, req.body);
    res.json({ checklist: await service.check(currentUser(res), req.params.id, key, done) });
  });
  r.post('/:id/relayout', async (req, res) => {
    res.status(201).json({ traveller: await service.relayout(currentUser(res), req.params.id) });
  });
  r.patch('/:id', (req, res) => {
    res.json({ job: service.update(currentUser(res), req.params.id, parse(UpdateJobBody, req.body)) });
  });
  r.post('/:id/time', (req, res) => {
    res.status(201).json({ job: service.logTime(currentUser(res), req.params.id, parse(LogTimeBody, req.body)) });
  });
  return r;
}
