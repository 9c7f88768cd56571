import { Router, type RequestHandler } from 'express';
import { ClientsQuery, CreateClientBody } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { ClientsService } from './clients.service';

/** `/api/clients`: mounted behind requireRole('owner'). */
export function clientsRoutes(service: ClientsService, idempotent: RequestHandler): Router {
  const r = Router();
  r.get('/', (req, res) => {
    res.json(service.list(parse(ClientsQuery, req.query)));
  });
  r.get('/:id', (req, res) => {
    res.json({ client: service.get(req.params.id) });
  });
  r.post('/', idempotent, (req, res) => {
    const body = parse(CreateClientBody, req.body);
    res.status(201).json({ client: service.create(currentUser(res), body) });
  });
  return r;
}
