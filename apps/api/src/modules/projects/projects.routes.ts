import { Router, type RequestHandler } from 'express';
import { CommentBody, CreateProjectBody, ProjectListQuery } from '@benchwright/contracts';
import type { User } from '@benchwright/contracts';
import { Forbidden, Invalid, parse } from '../../lib/errors';
import { limiter } from '../../middleware/rate-limit';
import { currentUser } from '../../middleware/session';
import type { ProjectsService } from './projects.service';

/** Mounted behind requireRole('client', 'owner', 'builder'); ownership is checked in the service. */
export function projectsRoutes(
  service: ProjectsService,
  /** the client a project is started for by the owner (ClientsService.clientUser) */
  clientOf: (id: string) => User,
  limits: { enabled: boolean; commentsPerMinute: number } = { enabled: false, commentsPerMinute: 10 },
  /** Idempotency-Key on the creating routes (middleware/idempotency.ts) */
  idempotent: RequestHandler = (_req, _res, next) => next(),
): Router {
  const r = Router();
  // per account (every comment mails the other side)
  const comments = limiter({
    enabled: limits.enabled,
    windowMs: 60_000,
    limit: limits.commentsPerMinute,
    key: (_req, res) => `user ${currentUser(res).id}`,
    message: 'That is a lot of comments in a minute; wait a moment and send it again.',
  });
  r.get('/', (req, res) => {
    res.json(service.list(currentUser(res), parse(ProjectListQuery, req.query)));
  });
  r.get('/:id', (req, res) => {
    res.json({ project: service.get(currentUser(res), req.params.id) });
  });
  r.get('/:id/layouts', async (req, res) => {
    res.json({ layouts: await service.layouts(currentUser(res), req.params.id) });
  });
  r.post('/:id/comments', idempotent, comments, (req, res) => {
    const { message } = parse(CommentBody, req.body);
    // the limiter's handler type widens the params: the path above guarantees the id
    const { id } = req.params as { id: string };
    res.status(201).json({ project: service.comment(currentUser(res), id, message) });
  });
  // a client's request; or the owner's, for a client (`clientId`), which only the owner may send
  r.post('/', idempotent, async (req, res) => {
    const user = currentUser(res);
    if (user.role === 'builder') throw new Forbidden('Only a client or the owner can start a project.');
    const { clientId, ...body } = parse(CreateProjectBody, req.body, service.units());
    if (user.role === 'client') {
      if (clientId !== undefined) throw new Forbidden('Only the owner can start a project for a client.');
      return void res.status(201).json({ project: await service.create(user, body) });
    }
    if (clientId === undefined)
      throw new Invalid('Choose the client the project is for.', [{ path: 'clientId', message: 'choose a client' }]);
    const client = clientOf(clientId);
    res.status(201).json({ project: await service.create(client, body, user) });
  });
  return r;
}
