import { createHash } from 'node:crypto';
import { and, eq, ne } from 'drizzle-orm';
import type { Account, AccountSession, User } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { sessions, users } from '../../db/schema';
import { hashPassword, verifyPassword } from '../../auth/password';
import { consumeToken, issueToken, tokensIssuedSince } from '../../auth/tokens';
import { queueMail } from '../../lib/mailer';
import { emailChangeMail, emailChangeNoticeMail } from '../../lib/mail-templates';
import { Conflict, Invalid, NotFound, RateLimited } from '../../lib/errors';
import { toUser } from '../auth/auth.service';

export interface AccountDeps {
  db: Db;
  shopName: () => string;
  portalUrl: string;
  shopUrl: string;
  /** a session ends this long after sign-in, however active (SESSION_MAX_DAYS) */
  sessionMaxAgeMs: number;
  /** confirmation mails to a new address per account per hour, counted from the tokens table */
  mailLimits?: { enabled: boolean; perHour: number };
}

const HOUR = 3600_000;
const TAKEN = 'Someone already has an account with this e-mail.';

/**
 * The public id of a session: a digest of its id. Lucia's session id is the cookie's secret, so it never leaves the
 * server, not even to its own user.
 */
export function sessionHandle(sessionId: string): string {
  return createHash('sha256').update(`session:${sessionId}`).digest('hex').slice(0, 32);
}

export function createAccountService({ db, shopName, portalUrl, shopUrl, sessionMaxAgeMs, mailLimits }: AccountDeps) {
  const row = (userId: string) => {
    const u = db.select().from(users).where(eq(users.id, userId)).get();
    if (!u) throw new NotFound('The account');
    return u;
  };
  const toAccount = (u: typeof users.$inferSelect): Account => ({ ...toUser(u), pendingEmail: u.pendingEmail });
  const checkPassword = async (hash: string | null, given: string) => {
    if (!(await verifyPassword(hash, given)))
      throw new Invalid('The current password is not right.', [
        { path: 'currentPassword', message: 'the current password is not right' },
      ]);
  };
  /** The user's sessions that still count: not past Lucia's sliding expiry nor the absolute lifetime. */
  const liveSessions = (userId: string, now = Date.now()) =>
    db
      .select()
      .from(sessions)
      .where(eq(sessions.userId, userId))
      .all()
      .filter((s) => s.expiresAt * 1000 > now && now - s.createdAt.getTime() < sessionMaxAgeMs);

  return {
    get(user: User): Account {
      return toAccount(row(user.id));
    },

    rename(user: User, name: string): Account {
      db.update(users).set({ name }).where(eq(users.id, user.id)).run();
      return toAccount(row(user.id));
    },

    /**
     * Asks for a new address: the link goes to the new one, a notice to the old one, and the account keeps its old
     * address until the link is followed. A second request replaces the first (its link stops working).
     */
    async requestEmailChange(user: User, input: { email: string; currentPassword: string }): Promise<Account> {
      const u = row(user.id);
      await checkPassword(u.passwordHash, input.currentPassword);
      if (input.email === u.email)
        throw new Invalid('That is already your e-mail.', [{ path: 'email', message: 'this is already your e-mail' }]);
      if (db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).get()) throw new Conflict(TAKEN);
      db.transaction((tx) => {
        if (mailLimits?.enabled && tokensIssuedSince(tx, u.id, 'change_email', Date.now() - HOUR) >= mailLimits.perHour)
          throw new RateLimited(
            'A confirmation mail was sent a short while ago; check that inbox, or try again in an hour.',
          );
        tx.update(users).set({ pendingEmail: input.email }).where(eq(users.id, u.id)).run();
        const token = issueToken(tx, u.id, 'change_email');
        const base = u.role === 'client' ? portalUrl : shopUrl;
        queueMail(tx, input.email, emailChangeMail(shopName(), u.name, `${base}/confirm-email?token=${token}`));
        queueMail(tx, u.email, emailChangeNoticeMail(shopName(), u.name, input.email));
      });
      return toAccount(row(user.id));
    },

    /** Follows the link: the pending address becomes the account's, confirmed (the link proved it is theirs). */
    confirmEmailChange(token: string): User {
      const user = db.transaction((tx) => {
        const userId = consumeToken(tx, token, 'change_email');
        if (!userId) return null;
        const u = tx.select().from(users).where(eq(users.id, userId)).get();
        if (!u?.pendingEmail) return null;
        const pending = u.pendingEmail;
        if (tx.select({ id: users.id }).from(users).where(eq(users.email, pending)).get()) throw new Conflict(TAKEN);
        tx.update(users)
          .set({ email: pending, pendingEmail: null, emailVerifiedAt: new Date() })
          .where(eq(users.id, userId))
          .run();
        return tx.select().from(users).where(eq(users.id, userId)).get()!;
      });
      if (!user) throw new Invalid('This link has expired or was already used; ask for the change again.');
      return toUser(user);
    },

    /** The current password is asked for; every other session of the account ends, this one stays. */
    async changePassword(
      user: User,
      currentSessionId: string,
      input: { currentPassword: string; newPassword: string },
    ): Promise<void> {
      const u = row(user.id);
      await checkPassword(u.passwordHash, input.currentPassword);
      const passwordHash = await hashPassword(input.newPassword);
      db.transaction((tx) => {
        tx.update(users).set({ passwordHash }).where(eq(users.id, u.id)).run();
        tx.delete(sessions)
          .where(and(eq(sessions.userId, u.id), ne(sessions.id, currentSessionId)))
          .run();
      });
    },

    listSessions(user: User, currentSessionId: string): AccountSession[] {
      return liveSessions(user.id)
        .sort((a, b) => b.lastSeenAt.getTime() - a.lastSeenAt.getTime())
        .map((s) => ({
          id: sessionHandle(s.id),
          createdAt: s.createdAt.toISOString(),
          lastSeenAt: s.lastSeenAt.getTime() > 0 ? s.lastSeenAt.toISOString() : null,
          userAgent: s.userAgent,
          current: s.id === currentSessionId,
        }));
    },

    /** Ends one of the user's sessions by its public id (404 for any other); says whether it was the caller's. */
    endSession(user: User, currentSessionId: string, handle: string): { current: boolean } {
      const s = db
        .select({ id: sessions.id })
        .from(sessions)
        .where(eq(sessions.userId, user.id))
        .all()
        .find((x) => sessionHandle(x.id) === handle);
      if (!s) throw new NotFound('That session');
      db.delete(sessions).where(eq(sessions.id, s.id)).run();
      return { current: s.id === currentSessionId };
    },

    endOtherSessions(user: User, currentSessionId: string): number {
      return db
        .delete(sessions)
        .where(and(eq(sessions.userId, user.id), ne(sessions.id, currentSessionId)))
        .run().changes;
    },

    touch(sessionId: string, at: Date): void {
      db.update(sessions).set({ lastSeenAt: at }).where(eq(sessions.id, sessionId)).run();
    },
  };
}
export type AccountService = ReturnType<typeof createAccountService>;
