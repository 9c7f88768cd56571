// Keyset cursors for the lists: opaque to the caller (base64url of JSON), and checked on the way back in, so a
// cursor that was edited, truncated or made for another sort is a 400, never a 500 or a wrong page.
import * as z from 'zod';
import { Invalid } from './errors';

/** Where a page ended: the sort it belongs to, the last row's sort key and id. */
export interface CursorPosition {
  sort: string;
  dir: 'asc' | 'desc';
  key: string | number;
  id: string;
}

const Stored = z.object({
  s: z.string().max(40),
  d: z.enum(['asc', 'desc']),
  k: z.union([z.string().max(300), z.number().int().safe()]),
  i: z.string().min(1).max(64),
});

/** `encodeCursor({ sort: 'created', dir: 'desc', key: 1764633600000, id: 'p1' })` -> an opaque string */
export function encodeCursor(c: CursorPosition): string {
  return Buffer.from(JSON.stringify({ s: c.sort, d: c.dir, k: c.key, i: c.id })).toString('base64url');
}

const bad = () =>
  new Invalid('This page link is no longer valid; start again from the first page.', [
    { path: 'cursor', message: 'not a cursor this list gave out, or one for another sort' },
  ]);

/**
 * The position in `cursor`, which must have been made for this sort and direction, with a key of the sort's type.
 * Anything else is a 400 on `cursor`.
 */
export function decodeCursor(cursor: string, sort: string, dir: 'asc' | 'desc', keyType: 'string' | 'number') {
  if (!/^[A-Za-z0-9_-]+$/.test(cursor)) throw bad();
  let raw: unknown;
  try {
    raw = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8'));
  } catch {
    throw bad();
  }
  const r = Stored.safeParse(raw);
  if (!r.success || r.data.s !== sort || r.data.d !== dir || typeof r.data.k !== keyType) throw bad();
  return { key: r.data.k, id: r.data.i };
}
