// The API's error classes and zod parsing: no Express here, so lib/ and the services throw them; middleware/errors.ts turns
// them into responses.
import * as z from 'zod';
import type { ApiIssue, ErrorCode } from '@benchwright/contracts';
import { formatPath, withUnits, type LengthUnit } from '@benchwright/pricing/geometry';

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly issues?: ApiIssue[],
    /** response headers that go with the error (Retry-After) */
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}
export class Invalid extends AppError {
  constructor(message: string, issues?: ApiIssue[]) {
    super(400, 'invalid_input', message, issues);
  }
}
export class Unauthenticated extends AppError {
  constructor(message = 'Sign in to continue.') {
    super(401, 'unauthenticated', message);
  }
}
export class Forbidden extends AppError {
  constructor(message = 'Your account cannot do this. If you need to, ask the shop.') {
    super(403, 'forbidden', message);
  }
}
export class NotFound extends AppError {
  constructor(what = 'That') {
    super(404, 'not_found', `${what} was not found.`);
  }
}
export class Conflict extends AppError {
  constructor(message: string) {
    super(409, 'conflict', message);
  }
}
export class PayloadTooLarge extends AppError {
  constructor(message = 'The request body is too large.') {
    super(413, 'payload_too_large', message);
  }
}
export class UnsupportedMediaType extends AppError {
  constructor(message = 'That content type or encoding is not supported.') {
    super(415, 'unsupported_media_type', message);
  }
}
export class RateLimited extends AppError {
  constructor(message = 'Too many attempts; wait a few minutes and try again.') {
    super(429, 'rate_limited', message);
  }
}

export class Unavailable extends AppError {
  constructor(message = 'This is unavailable for a moment; try again in a few minutes.') {
    super(503, 'unavailable', message);
  }
}

/** The engine's pool has no room for another task now: try again shortly. */
export class Busy extends AppError {
  constructor(retryAfterSeconds: number, message = 'The shop’s pricing engine is busy; try again in a few seconds.') {
    super(503, 'busy', message, undefined, { 'Retry-After': String(retryAfterSeconds) });
  }
}
/** The engine stopped a task that ran past its time limit. */
export class TooComplex extends AppError {
  constructor(
    message = 'This is more than the pricing engine can work out in one go; split it into smaller requests or ask the shop.',
  ) {
    super(422, 'too_complex', message);
  }
}

/** zod issues as the API lists them: `{ path: 'items[0].spec.widthMm', message }`. */
export function zodIssues(err: z.ZodError): ApiIssue[] {
  return err.issues.map((i) => ({ path: formatPath(i.path), message: i.message }));
}

/** Parses with a zod schema, throwing Invalid with the issues listed. */
export function parse<S extends z.ZodType>(schema: S, input: unknown, units?: LengthUnit): z.infer<S> {
  // a build spec's messages give lengths in the shop's units; zod builds them as they are read, so read them inside
  return withUnits(units ?? 'mm', () => {
    const r = schema.safeParse(input);
    if (!r.success) throw new Invalid('Some fields need attention.', zodIssues(r.error));
    return r.data;
  });
}
