import { Router } from 'express';
import { CommentBody, CreateProjectBody } from '@benchwright/contracts';
import { Forbidden, parse } from '../../middleware/errors';
import { currentUser } from '../../middleware/session';
import type { ProjectsService } from './projects.service';

/** Mounted behind requireRole('client', 'owner', 'builder'); ownership is checked in the service. */
export function projectsRoutes(service: ProjectsService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ projects: service.list(currentUser(res)) });
  });
  r.get('/:id', (req, res) => {
    res.json({ project: service.get(currentUser(res), req.params.id) });
  });
  r.get('/:id/layouts', async (req, res) => {
    res.json({ layouts: await service.layouts(currentUser(res), req.params.id) });
  });
  r.post('/:id/comments', (req, res) => {
    const { message } = parse(CommentBody, req.body);
    res.status(201).json({ project: service.comment(currentUser(res), req.params.id, message) });
  });
  r.post('/', async (req, res) => {
    const user = currentUser(res);
    if (user.role !== 'client') throw new Forbidden('Only a client can request an estimate.');
    const body = parse(CreateProjectBody, req.body);
    res.status(201).json({ project: await service.create(user, body) });
  });
  return r;
}
