import type { ErrorRequestHandler, RequestHandler } from 'express';
import * as z from 'zod';
import { AppError, Invalid, NotFound, zodIssues } from '../lib/errors';

export const notFoundRoute: RequestHandler = (req) => {
  throw new NotFound(`${req.method} ${req.path}`);
};

interface HttpishError {
  type?: string;
  status?: number;
  statusCode?: number;
}

/** The one place that writes error responses; no stack trace ever leaves the server. */
export function errorHandler(log: { error: (o: object, msg: string) => void }): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let e: AppError;
    if (err instanceof AppError) e = err;
    else if (err instanceof z.ZodError) e = new Invalid('Some fields need attention.', zodIssues(err));
    else {
      const h = err as HttpishError;
      const status = h.status ?? h.statusCode;
      if (h.type === 'entity.too.large' || status === 413)
        e = new AppError(413, 'payload_too_large', 'The request body is too large.');
      else if (h.type === 'entity.parse.failed') e = new Invalid('The request body is not valid JSON.');
      else if (h.type === 'encoding.unsupported' || h.type === 'charset.unsupported' || status === 415)
        e = new AppError(415, 'unsupported_media_type', 'That content type or encoding is not supported.');
      else if (status && status >= 400 && status < 500) e = new Invalid('The request could not be read.');
      else {
        log.error({ err, path: req.path }, 'unhandled error');
        e = new AppError(500, 'internal', 'Something went wrong on our side; it has been logged.');
      }
    }
    if (res.headersSent) return;
    if (e.headers) res.set(e.headers);
    res
      .status(e.status)
      .json({ error: { code: e.code, message: e.message, ...(e.issues ? { issues: e.issues } : {}) } });
  };
}
