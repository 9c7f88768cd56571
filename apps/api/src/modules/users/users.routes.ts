import { Router } from 'express';
import { InvitationBody } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { AuthService } from '../auth/auth.service';

/** Mounted behind requireRole('owner'). */
export function usersRoutes(service: AuthService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ users: service.listStaff() });
  });
  r.post('/invitations', (req, res) => {
    const body = parse(InvitationBody, req.body);
    const user = service.invite(currentUser(res), body);
    res.status(201).json({ user });
  });
  return r;
}
