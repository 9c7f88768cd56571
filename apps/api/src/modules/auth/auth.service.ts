import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { User } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { users } from '../../db/schema';
import { hashPassword, verifyPassword } from '../../auth/password';
import { consumeToken, issueToken, tokensIssuedSince } from '../../auth/tokens';
import { queueMail } from '../../lib/mailer';
import { queueHeldRequestNotices } from '../../lib/request-notice';
import { invitationMail, resetMail, verificationMail } from '../../lib/mail-templates';
import { Conflict, Invalid, RateLimited, Unauthenticated } from '../../lib/errors';

export interface AuthDeps {
  db: Db;
  shopName: () => string;
  portalUrl: string;
  shopUrl: string;
  /** mails per address per hour (counted from the tokens table, so a restart does not reset them) */
  mailLimits?: { enabled: boolean; resetsPerHour: number; verificationsPerHour: number };
}

const HOUR = 3600_000;

type Row = typeof users.$inferSelect;
export function toUser(u: Row): User {
  return { id: u.id, email: u.email, name: u.name, role: u.role, emailVerified: u.emailVerifiedAt !== null };
}

export function createAuthService({ db, shopName, portalUrl, shopUrl, mailLimits }: AuthDeps) {
  const overLimit = (tx: Pick<Db, 'select'>, userId: string, kind: 'reset_password' | 'verify_email', max: number) =>
    !!mailLimits?.enabled && tokensIssuedSince(tx, userId, kind, Date.now() - HOUR) >= max;

  return {
    /** A new client; the verification mail is queued in the same transaction. */
    async signUp(input: { email: string; password: string; name: string }): Promise<User> {
      if (db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).get())
        throw new Conflict('An account with this e-mail already exists; sign in or reset the password.');
      const passwordHash = await hashPassword(input.password);
      const id = randomUUID();
      try {
        db.transaction((tx) => {
          tx.insert(users).values({ id, email: input.email, name: input.name, role: 'client', passwordHash }).run();
          const token = issueToken(tx, id, 'verify_email');
          queueMail(
            tx,
            input.email,
            verificationMail(shopName(), input.name, `${portalUrl}/verify-email?token=${token}`),
          );
        });
      } catch (err) {
        if (String(err).includes('UNIQUE'))
          throw new Conflict('An account with this e-mail already exists; sign in or reset the password.');
        throw err;
      }
      return toUser(db.select().from(users).where(eq(users.id, id)).get()!);
    },

    /** Same answer for an unknown e-mail and a wrong password. */
    async signIn(input: { email: string; password: string }): Promise<User> {
      const u = db.select().from(users).where(eq(users.email, input.email)).get();
      const ok = await verifyPassword(u?.passwordHash ?? null, input.password);
      if (!u || !ok) throw new Unauthenticated('The e-mail or the password is not right.');
      return toUser(u);
    },

    verifyEmail(token: string): User {
      const user = db.transaction((tx) => {
        const userId = consumeToken(tx, token, 'verify_email');
        if (!userId) return null;
        const before = tx.select().from(users).where(eq(users.id, userId)).get()!;
        tx.update(users).set({ emailVerifiedAt: new Date() }).where(eq(users.id, userId)).run();
        // requests made before confirming were kept without telling the shop; tell it now, once
        if (before.emailVerifiedAt === null && before.role === 'client')
          queueHeldRequestNotices(tx, { shopName: shopName(), shopUrl }, userId);
        return tx.select().from(users).where(eq(users.id, userId)).get()!;
      });
      if (!user) throw new Invalid('This confirmation link has expired or was already used; sign in to get a new one.');
      return toUser(user);
    },

    /** At most `verificationsPerHour` confirmation mails an hour to an account (the sign-up's included). */
    resendVerification(user: User): void {
      if (user.emailVerified) return;
      db.transaction((tx) => {
        if (overLimit(tx, user.id, 'verify_email', mailLimits?.verificationsPerHour ?? Infinity))
          throw new RateLimited(
            'A confirmation mail was sent a short while ago; check your inbox, or try again in an hour.',
          );
        const token = issueToken(tx, user.id, 'verify_email');
        queueMail(tx, user.email, verificationMail(shopName(), user.name, `${portalUrl}/verify-email?token=${token}`));
      });
    },

    /**
     * Always answers the same; mails a link only when the account exists and has had fewer than `resetsPerHour`
     * reset mails in the last hour (so the form cannot be used to flood someone's inbox).
     */
    forgotPassword(email: string): void {
      const u = db.select().from(users).where(eq(users.email, email)).get();
      if (!u || !u.passwordHash) return;
      db.transaction((tx) => {
        if (overLimit(tx, u.id, 'reset_password', mailLimits?.resetsPerHour ?? Infinity)) return;
        const token = issueToken(tx, u.id, 'reset_password');
        const base = u.role === 'client' ? portalUrl : shopUrl;
        queueMail(tx, u.email, resetMail(shopName(), u.name, `${base}/reset-password?token=${token}`));
      });
    },

    async resetPassword(token: string, password: string): Promise<User> {
      const passwordHash = await hashPassword(password);
      const user = db.transaction((tx) => {
        const userId = consumeToken(tx, token, 'reset_password');
        if (!userId) return null;
        tx.update(users).set({ passwordHash }).where(eq(users.id, userId)).run();
        return tx.select().from(users).where(eq(users.id, userId)).get()!;
      });
      if (!user) throw new Invalid('This reset link has expired or was already used; ask for a new one.');
      return toUser(user);
    },

    /** The owner invites a builder: an account without a password, and a mail to set one. */
    invite(owner: User, input: { email: string; name: string }): User {
      const existing = db.select().from(users).where(eq(users.email, input.email)).get();
      if (existing && (existing.passwordHash || existing.role !== 'builder'))
        throw new Conflict('Someone already has an account with this e-mail.');
      const id = existing?.id ?? randomUUID();
      db.transaction((tx) => {
        if (!existing)
          tx.insert(users)
            .values({ id, email: input.email, name: input.name, role: 'builder', passwordHash: null })
            .run();
        const token = issueToken(tx, id, 'invitation');
        queueMail(
          tx,
          input.email,
          invitationMail(shopName(), input.name, owner.name, `${shopUrl}/accept-invitation?token=${token}`),
        );
      });
      return toUser(db.select().from(users).where(eq(users.id, id)).get()!);
    },

    async acceptInvitation(token: string, password: string): Promise<User> {
      const passwordHash = await hashPassword(password);
      const user = db.transaction((tx) => {
        const userId = consumeToken(tx, token, 'invitation');
        if (!userId) return null;
        tx.update(users).set({ passwordHash, emailVerifiedAt: new Date() }).where(eq(users.id, userId)).run();
        return tx.select().from(users).where(eq(users.id, userId)).get()!;
      });
      if (!user) throw new Invalid('This invitation has expired or was already used; ask the shop for a new one.');
      return toUser(user);
    },

    listStaff(): User[] {
      return db
        .select()
        .from(users)
        .all()
        .filter((u) => u.role !== 'client')
        .map(toUser);
    },
  };
}
export type AuthService = ReturnType<typeof createAuthService>;
