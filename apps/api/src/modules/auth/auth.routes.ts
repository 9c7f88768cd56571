import { Router, type Request } from 'express';
import {
  AcceptInvitationBody,
  ForgotPasswordBody,
  ResetPasswordBody,
  SignInBody,
  SignUpBody,
  VerifyEmailBody,
} from '@benchwright/contracts';
import { startSession as newSession, type AppLucia } from '../../auth/lucia';
import { parse } from '../../lib/errors';
import { ipKey, limiter } from '../../middleware/rate-limit';
import { currentUser, requireRole } from '../../middleware/session';
import type { AuthService } from './auth.service';

export interface Limits {
  enabled: boolean;
  /** failed sign-ins per (e-mail, client address) in 15 minutes */
  signInFailsPerEmailIp: number;
  /** failed sign-ins per client address in 15 minutes, whatever the e-mail */
  signInAttemptsPerIp: number;
  signUpsPerIp: number;
  /** forgot-password requests per client address in an hour, whatever the answer */
  passwordResetsPerIp: number;
}

function emailKey(req: Request): string {
  const e = (req.body as { email?: unknown } | undefined)?.email;
  return typeof e === 'string' ? e.trim().toLowerCase() : '(none)';
}

export function authRoutes(service: AuthService, lucia: AppLucia, limits: Limits): Router {
  const r = Router();
  const { enabled } = limits;
  const window15 = 15 * 60_000;
  // Failed sign-ins only (successful ones are not counted). Counted per (e-mail, address) together, so ten wrong
  // passwords from one place do not lock the account for its owner elsewhere, and per address, so one place cannot
  // try many accounts.
  const perEmailIp = limiter({
    enabled,
    windowMs: window15,
    limit: limits.signInFailsPerEmailIp,
    key: (req) => `${ipKey(req)} ${emailKey(req)}`,
    failuresOnly: true,
  });
  const perIp = limiter({ enabled, windowMs: window15, limit: limits.signInAttemptsPerIp, failuresOnly: true });
  const signUps = limiter({ enabled, windowMs: 60 * 60_000, limit: limits.signUpsPerIp });
  const resetsPerIp = limiter({ enabled, windowMs: 60 * 60_000, limit: limits.passwordResetsPerIp });

  const startSession = async (req: Request, res: import('express').Response, userId: string) => {
    res.append('Set-Cookie', await newSession(lucia, userId, req.get('user-agent') ?? ''));
  };

  r.post('/sign-up', signUps, async (req, res) => {
    const body = parse(SignUpBody, req.body);
    const user = await service.signUp(body);
    await startSession(req, res, user.id);
    res.status(201).json({ user });
  });

  r.post('/sign-in', perIp, perEmailIp, async (req, res) => {
    const body = parse(SignInBody, req.body);
    const user = await service.signIn(body);
    await startSession(req, res, user.id);
    res.json({ user });
  });

  r.post('/sign-out', requireRole(), async (_req, res) => {
    if (res.locals.sessionId) await lucia.invalidateSession(res.locals.sessionId);
    res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize());
    res.status(204).end();
  });

  r.get('/me', requireRole(), (_req, res) => {
    res.json({ user: currentUser(res) });
  });

  r.post('/verify-email', (req, res) => {
    const { token } = parse(VerifyEmailBody, req.body);
    res.json({ user: service.verifyEmail(token) });
  });

  r.post('/resend-verification', requireRole(), (_req, res) => {
    service.resendVerification(currentUser(res));
    res.status(202).json({ sent: true });
  });

  r.post('/forgot-password', resetsPerIp, (req, res) => {
    const { email } = parse(ForgotPasswordBody, req.body);
    service.forgotPassword(email);
    res.status(202).json({ sent: true });
  });

  r.post('/reset-password', async (req, res) => {
    const { token, password } = parse(ResetPasswordBody, req.body);
    const user = await service.resetPassword(token, password);
    await lucia.invalidateUserSessions(user.id);
    await startSession(req, res, user.id);
    res.json({ user });
  });

  r.post('/accept-invitation', async (req, res) => {
    const { token, password } = parse(AcceptInvitationBody, req.body);
    const user = await service.acceptInvitation(token, password);
    await startSession(req, res, user.id);
    res.json({ user });
  });

  return r;
}
