import type { Request, RequestHandler, Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { RateLimited } from '../lib/errors';

export interface LimiterOptions {
  /** false turns the limiter off (RATE_LIMITS=false) */
  enabled: boolean;
  windowMs: number;
  limit: number;
  /** what is counted: by default the client's address (req.ip, which TRUST_PROXY decides) */
  key?: (req: Request, res: Response) => string;
  /** count only the requests that fail (status >= 400) */
  failuresOnly?: boolean;
  message?: string;
}

/** The client's address as a limiter key (IPv6 by its /56, so one client cannot rotate through its addresses). */
export const ipKey = (req: Request): string => ipKeyGenerator(req.ip ?? '');

/**
 * One express-rate-limit limiter in memory (counts start again on restart; the limits that must outlive a restart,
 * the mails per address, are counted from the tokens table instead). Over the limit it answers 429 `rate_limited`
 * through the one error handler.
 */
export function limiter(o: LimiterOptions): RequestHandler<Record<string, string>> {
  return rateLimit({
    windowMs: o.windowMs,
    limit: o.limit,
    keyGenerator: o.key ?? ipKey,
    skipSuccessfulRequests: o.failuresOnly ?? false,
    skip: () => !o.enabled,
    handler: () => {
      throw new RateLimited(o.message);
    },
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // req.ip is decided by TRUST_PROXY on purpose; a forwarded header from an untrusted peer is ignored, not an error
    validate: { xForwardedForHeader: false, keyGeneratorIpFallback: false },
  });
}
