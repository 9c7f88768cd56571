import type { RequestHandler } from 'express';
import type { Role, User } from '@benchwright/contracts';
import type { AppLucia } from '../auth/lucia';
import { Forbidden, Unauthenticated } from '../lib/errors';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- Express types res.locals through its global namespace
  namespace Express {
    interface Locals {
      user: User | null;
      sessionId: string | null;
    }
  }
}

/** Reads the session cookie, refreshes it when Lucia says so, and sets res.locals.user. */
export function sessionMiddleware(lucia: AppLucia): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.sessionId = null;
    const id = lucia.readSessionCookie(req.headers.cookie ?? '');
    if (!id) return next();
    const { session, user } = await lucia.validateSession(id);
    if (session?.fresh) res.append('Set-Cookie', lucia.createSessionCookie(session.id).serialize());
    if (!session || !user) {
      res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize());
      return next();
    }
    res.locals.sessionId = session.id;
    res.locals.user = {
      id: user.id,
      email: user.email,
      name: user.name,
      role: user.role,
      emailVerified: user.emailVerifiedAt !== null,
    };
    next();
  };
}

/** Admits signed-in users of the given roles; mounted where a router is. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (_req, res, next) => {
    const u = res.locals.user;
    if (!u) throw new Unauthenticated();
    if (roles.length && !roles.includes(u.role)) throw new Forbidden();
    next();
  };
}

export function currentUser(res: { locals: { user: User | null } }): User {
  if (!res.locals.user) throw new Unauthenticated();
  return res.locals.user;
}
