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

/**
 * The session id from a Cookie header, or null. Lucia's parser decodes every cookie with decodeURIComponent and
 * throws on broken %-encoding anywhere in the header (`bw_session=%zz`), which made every route answer 500; this one
 * looks only at our cookie and takes a value it cannot decode as no session.
 */
export function sessionIdFromCookies(header: string | undefined, name: string): string | null {
  if (!header) return null;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq < 0 || part.slice(0, eq).trim() !== name) continue;
    let value = part.slice(eq + 1).trim();
    if (value.startsWith('"') && value.endsWith('"') && value.length >= 2) value = value.slice(1, -1);
    try {
      value = decodeURIComponent(value);
    } catch {
      return null;
    }
    // Lucia's ids are lowercase base32; anything else cannot be a session of ours
    return /^[a-z0-9]{1,255}$/.test(value) ? value : null;
  }
  return null;
}

/** How often a session's `lastSeenAt` is written: at most once a minute, so a busy page is not a write a request. */
export const LAST_SEEN_EVERY_MS = 60_000;

/**
 * Reads the session cookie, refreshes it when Lucia says so, and sets res.locals.user. `touch` records that the
 * session was used (the account page's "last seen"); it is called at most once a minute per session.
 */
export function sessionMiddleware(
  lucia: AppLucia,
  maxAgeMs = 30 * 24 * 3600_000,
  touch?: (sessionId: string, at: Date) => void,
): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = null;
    res.locals.sessionId = null;
    const id = sessionIdFromCookies(req.headers.cookie, lucia.sessionCookieName);
    if (!id) return next();
    let { session, user } = await lucia.validateSession(id);
    // Lucia slides the expiry on use; a session also ends maxAgeMs after sign-in, however active
    if (session && Date.now() - session.createdAt.getTime() >= maxAgeMs) {
      await lucia.invalidateSession(session.id);
      session = null;
      user = null;
    }
    if (session?.fresh) res.append('Set-Cookie', lucia.createSessionCookie(session.id).serialize());
    if (!session || !user) {
      res.append('Set-Cookie', lucia.createBlankSessionCookie().serialize());
      return next();
    }
    res.locals.sessionId = session.id;
    const now = Date.now();
    if (touch && now - session.lastSeenAt.getTime() >= LAST_SEEN_EVERY_MS) touch(session.id, new Date(now));
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
