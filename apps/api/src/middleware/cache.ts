import type { RequestHandler } from 'express';

/** `Cache-Control: no-store` on every answer (routes that send files set their own, never `public`). */
export const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};
