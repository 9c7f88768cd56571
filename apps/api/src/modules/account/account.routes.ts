import { Router, type Request, type Response } from 'express';
import { ChangeEmailBody, ChangePasswordBody, ConfirmEmailChangeBody, UpdateAccountBody } from '@benchwright/contracts';
import * as z from 'zod';
import type { AppLucia } from '../../auth/lucia';
import { parse, Unauthenticated } from '../../lib/errors';
import { limiter } from '../../middleware/rate-limit';
import { currentUser } from '../../middleware/session';
import type { AccountService } from './account.service';

export interface AccountLimits {
  enabled: boolean;
  /** wrong current passwords per account in 15 minutes (e-mail and password changes together) */
  passwordChecksPerUser: number;
}

const SessionParams = z.object({ id: z.string().regex(/^[0-9a-f]{32}$/, 'not a session of this account') });

function sessionId(res: Response): string {
  if (!res.locals.sessionId) throw new Unauthenticated();
  return res.locals.sessionId;
}

/** `/api/account`, mounted behind `requireRole()`: the signed-in person's own name, e-mail, password and sessions. */
export function accountRoutes(service: AccountService, lucia: AppLucia, limits: AccountLimits): Router {
  const r = Router();
  // a stolen session must not be able to guess the password: failed checks count per account, like the sign-in's
  const passwordChecks = limiter({
    enabled: limits.enabled,
    windowMs: 15 * 60_000,
    limit: limits.passwordChecksPerUser,
    key: (_req: Request, res: Response) => `account ${res.locals.user?.id ?? ''}`,
    failuresOnly: true,
  });

  r.get('/', (_req, res) => {
    res.json({ account: service.get(currentUser(res)) });
  });

  r.patch('/', (req, res) => {
    const { name } = parse(UpdateAccountBody, req.body);
    res.json({ account: service.rename(currentUser(res), name) });
  });

  r.post('/email', passwordChecks, async (req, res) => {
    const body = parse(ChangeEmailBody, req.body);
    res.status(202).json({ account: await service.requestEmailChange(currentUser(res), body) });
  });

  r.post('/password', passwordChecks, async (req, res) => {
    const body = parse(ChangePasswordBody, req.body);
    await service.changePassword(currentUser(res), sessionId(res), body);
    res.json({ account: service.get(currentUser(res)) });
  });

  r.get('/sessions', (_req, res) => {
    res.json({ sessions: service.listSessions(currentUser(res), sessionId(res)) });
  });

  r.post('/sessions/end-others', (_req, res) => {
    res.json({ ended: service.endOtherSessions(currentUser(res), sessionId(res)) });
  });

  r.delete('/sessions/:id', (req, res) => {
    const { id } = parse(SessionParams, req.params);
    const { current } = service.endSession(currentUser(res), sessionId(res), id);
    if (current) res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  return r;
}

/** `POST /api/auth/confirm-email-change`: anyone holding the link (it may be opened in another browser). */
export function confirmEmailChangeRoute(
  service: AccountService,
  limits: { enabled: boolean; failuresPerIp: number },
): Router {
  const r = Router();
  // bad links per address, counted like failed sign-ins
  const failures = limiter({
    enabled: limits.enabled,
    windowMs: 15 * 60_000,
    limit: limits.failuresPerIp,
    failuresOnly: true,
  });
  r.post('/confirm-email-change', failures, (req, res) => {
    const { token } = parse(ConfirmEmailChangeBody, req.body);
    res.json({ user: service.confirmEmailChange(token) });
  });
  return r;
}
