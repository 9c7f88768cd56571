import { createHash } from 'node:crypto';
import type { RequestHandler } from 'express';
import { and, eq, lt } from 'drizzle-orm';
import type { Db } from '../db/client';
import { idempotencyKeys } from '../db/schema';
import { AppError, Conflict, Invalid } from '../lib/errors';

export const IDEMPOTENCY_TTL_MS = 24 * 3600_000;
/** a first request still marked in progress after this long is taken to have died with its process */
const ABANDONED_MS = 60_000;
/** what clients send: a UUID is typical; any printable ASCII up to 255 characters is taken */
const KEY = /^[\x21-\x7E]{1,255}$/;

/** JSON with the keys of every object sorted, so that the same body hashes the same whatever its key order. */
function stableJson(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(stableJson).join(',')}]`;
  if (v && typeof v === 'object')
    return `{${Object.keys(v)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${stableJson((v as Record<string, unknown>)[k])}`)
      .join(',')}}`;
  return JSON.stringify(v) ?? 'null';
}

/**
 * `Idempotency-Key` for creating routes (mount after the session, on the routes that create something).
 *
 * Without the header the request goes through as before. With it, the first request by a user with a key does the
 * work and its answer (status and JSON body) is kept for 24 hours, when it succeeded (2xx); a repeat by the same user
 * with the same key and the same method, path and body gets that answer again (header `Idempotent-Replayed: true`)
 * without doing the work again. The same key with another request is refused (409), and so is a repeat while the
 * first is still being handled. A failed first request (4xx, 5xx) keeps nothing, so it can be retried with its key.
 *
 * Keys are scoped to the signed-in user and kept in the `idempotency_keys` table, so they survive a restart. The
 * answer is recorded synchronously right after the route's own transaction, with no await in between, so only a
 * process killed between the two could let a retry do the work twice.
 */
export function idempotency(db: Db): RequestHandler {
  return (req, res, next) => {
    const key = req.get('Idempotency-Key');
    if (key === undefined) return next();
    if (!KEY.test(key))
      throw new Invalid('The Idempotency-Key header must be 1 to 255 printable characters (a UUID is usual).');
    const user = res.locals.user;
    if (!user) return next(); // requireRole answers first where the routes need a user
    const now = Date.now();
    const hash = createHash('sha256')
      .update(`${req.method} ${req.baseUrl}${req.path}\n${stableJson(req.body ?? null)}`)
      .digest('hex');
    const where = and(eq(idempotencyKeys.userId, user.id), eq(idempotencyKeys.key, key));

    const claimed = db.transaction((tx) => {
      tx.delete(idempotencyKeys)
        .where(lt(idempotencyKeys.createdAt, new Date(now - IDEMPOTENCY_TTL_MS)))
        .run();
      const row = tx.select().from(idempotencyKeys).where(where).get();
      if (row && row.requestHash !== hash)
        return new Conflict(
          'This Idempotency-Key was already used for a different request; send a new key with a new request.',
        );
      if (row && row.status !== null) return { replay: row };
      if (row && now - row.createdAt.getTime() < ABANDONED_MS)
        return new Conflict('The first request with this Idempotency-Key is still being handled; try again shortly.');
      if (row) tx.delete(idempotencyKeys).where(where).run();
      tx.insert(idempotencyKeys)
        .values({ userId: user.id, key, requestHash: hash, createdAt: new Date(now) })
        .run();
      return null;
    });
    if (claimed instanceof AppError) throw claimed;
    if (claimed) {
      res.set('Idempotent-Replayed', 'true');
      res.status(claimed.replay.status!).type('application/json').send(claimed.replay.body);
      return;
    }

    let settled = false;
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      if (!settled) {
        settled = true;
        if (res.statusCode >= 200 && res.statusCode < 300)
          db.update(idempotencyKeys)
            .set({ status: res.statusCode, body: JSON.stringify(body) })
            .where(where)
            .run();
        else db.delete(idempotencyKeys).where(where).run();
      }
      return json(body);
    };
    // an answer sent without res.json: nothing to replay, so the key is let go (if the client goes away before the
    // answer, res.json still records it when the route finishes)
    res.on('finish', () => {
      if (!settled) {
        settled = true;
        db.delete(idempotencyKeys).where(where).run();
      }
    });
    next();
  };
}
