import type { ErrorRequestHandler, RequestHandler } from 'express';
import * as z from 'zod';
import multer from 'multer';
import { UPLOAD_MAX_BYTES } from '@benchwright/contracts';
import { AppError, Invalid, NotFound, PayloadTooLarge, UnsupportedMediaType, zodIssues } from '../lib/errors';

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
    else if (err instanceof multer.MulterError) e = multerError(err);
    else {
      const h = err as HttpishError;
      const status = h.status ?? h.statusCode;
      if (h.type === 'entity.too.large' || status === 413) e = new PayloadTooLarge();
      else if (h.type === 'entity.parse.failed') e = new Invalid('The request body is not valid JSON.');
      else if (h.type === 'encoding.unsupported' || h.type === 'charset.unsupported' || status === 415)
        e = new UnsupportedMediaType();
      else if (status && status >= 400 && status < 500) e = new Invalid('The request could not be read.');
      else {
        log.error({ err, path: req.path }, 'unhandled error');
        e = new AppError(
          500,
          'internal',
          'Something went wrong at our end, so that did not go through. Please try again in a moment; if it keeps happening, write to us.',
        );
      }
    }
    if (res.headersSent) return;
    if (e.headers) res.set(e.headers);
    res
      .status(e.status)
      .json({ error: { code: e.code, message: e.message, ...(e.issues ? { issues: e.issues } : {}) } });
  };
}

/** multer's refusals of a multipart body: a file over the limit is 413, anything else malformed is 400. */
function multerError(err: multer.MulterError): AppError {
  if (err.code === 'LIMIT_FILE_SIZE')
    return new PayloadTooLarge(`That file is over ${UPLOAD_MAX_BYTES / 1024 / 1024} MB; attach a smaller one.`);
  if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT')
    return new Invalid('Send one file, in the form field `file`.', [{ path: 'file', message: 'one file only' }]);
  return new Invalid('The upload could not be read.');
}
