import type { RequestHandler } from 'express';
import { Forbidden } from '../lib/errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses a state-changing request whose Origin is not one of the apps'. A
 * request without an Origin (curl, server to server) passes; the Stripe
 * webhook is mounted before this and so is exempt.
 */
export function originCheck(allowed: readonly string[]): RequestHandler {
  const set = new Set(allowed);
  return (req, _res, next) => {
    const origin = req.headers.origin;
    if (SAFE.has(req.method) || origin === undefined || set.has(origin)) return next();
    throw new Forbidden(`Requests from ${origin} are not accepted.`);
  };
}
