import { createHash, randomBytes, randomUUID } from 'node:crypto';
import { and, count, eq, gt, isNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { tokens } from '../db/schema';

export type TokenKind = 'verify_email' | 'reset_password' | 'invitation' | 'change_email';

export const TOKEN_LIFETIME_MS: Record<TokenKind, number> = {
  verify_email: 48 * 3600_000,
  reset_password: 3600_000,
  invitation: 7 * 24 * 3600_000,
  change_email: 48 * 3600_000,
};

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

type Tx = Pick<Db, 'insert' | 'update' | 'select'>;

/** Issues a token; only its hash is stored. Earlier unused tokens of the kind are spent. */
export function issueToken(tx: Tx, userId: string, kind: TokenKind, now = Date.now()): string {
  const token = randomBytes(32).toString('base64url');
  tx.update(tokens)
    .set({ usedAt: new Date(now) })
    .where(and(eq(tokens.userId, userId), eq(tokens.kind, kind), isNull(tokens.usedAt)))
    .run();
  tx.insert(tokens)
    .values({
      id: randomUUID(),
      userId,
      kind,
      tokenHash: hashToken(token),
      expiresAt: new Date(now + TOKEN_LIFETIME_MS[kind]),
    })
    .run();
  return token;
}

/** Spends a token once: returns its user id, or null when it is unknown, used or expired. */
export function consumeToken(tx: Tx, token: string, kind: TokenKind, now = Date.now()): string | null {
  const row = tx
    .select()
    .from(tokens)
    .where(and(eq(tokens.tokenHash, hashToken(token)), eq(tokens.kind, kind)))
    .get();
  if (!row || row.usedAt || row.expiresAt.getTime() < now) return null;
  const r = tx
    .update(tokens)
    .set({ usedAt: new Date(now) })
    .where(and(eq(tokens.id, row.id), isNull(tokens.usedAt)))
    .run();
  return r.changes === 1 ? row.userId : null;
}

/** How many tokens of a kind were issued to a user since a moment: the per-address mail limits count these rows. */
export function tokensIssuedSince(tx: Pick<Db, 'select'>, userId: string, kind: TokenKind, since: number): number {
  const row = tx
    .select({ n: count() })
    .from(tokens)
    .where(and(eq(tokens.userId, userId), eq(tokens.kind, kind), gt(tokens.createdAt, new Date(since))))
    .get();
  return row?.n ?? 0;
}
