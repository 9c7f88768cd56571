import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, type DatabaseSession, type DatabaseUser } from 'lucia';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';
import { stmt } from '../lib/statements';

interface SessionUserRow {
  id: string;
  userId: string;
  expiresAt: number;
  createdAt: number;
  userAgent: string;
  lastSeenAt: number;
  email: string;
  name: string;
  role: 'client' | 'owner' | 'builder';
  emailVerifiedAt: number | null;
}

/**
 * Drizzle's adapter, but the lookup every signed-in request makes is one prepared statement (the session joined to
 * its user, only the columns the session and user attributes read) instead of two queries built and prepared on
 * each call; the writes (sign-in, expiry, sign-out) stay the adapter's.
 */
class SessionAdapter extends DrizzleSQLiteAdapter {
  private readonly sqlite: Db['$client'];
  constructor(db: Db) {
    super(db as never, sessions, users);
    this.sqlite = db.$client;
  }
  override async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = stmt(
      this.sqlite,
      `SELECT s.id, s.user_id AS userId, s.expires_at AS expiresAt, s.created_at AS createdAt,
              s.user_agent AS userAgent, s.last_seen_at AS lastSeenAt,
              u.email, u.name, u.role, u.email_verified_at AS emailVerifiedAt
         FROM sessions s JOIN users u ON u.id = s.user_id WHERE s.id = ?`,
    ).get(sessionId) as SessionUserRow | undefined;
    if (!row) return [null, null];
    return [
      {
        id: row.id,
        userId: row.userId,
        expiresAt: new Date(row.expiresAt * 1000),
        attributes: {
          createdAt: new Date(row.createdAt),
          userAgent: row.userAgent,
          lastSeenAt: new Date(row.lastSeenAt),
        },
      },
      {
        id: row.userId,
        attributes: { email: row.email, name: row.name, role: row.role, emailVerifiedAt: row.emailVerifiedAt },
      },
    ];
  }
}

export function createLucia(db: Db, secure: boolean) {
  const adapter = new SessionAdapter(db);
  return new Lucia(adapter, {
    sessionCookie: { name: 'bw_session', attributes: { secure, sameSite: 'lax' } },
    getUserAttributes: (u) => ({ email: u.email, name: u.name, role: u.role, emailVerifiedAt: u.emailVerifiedAt }),
    getSessionAttributes: (s) => ({
      createdAt: new Date(s.createdAt),
      userAgent: s.userAgent ?? '',
      lastSeenAt: new Date(s.lastSeenAt ?? 0),
    }),
  });
}
export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseSessionAttributes: {
      /** when the user signed in: the session ends SESSION_MAX_DAYS after it, however active */
      createdAt: Date;
      /** the browser's User-Agent at sign-in (account page) */
      userAgent: string;
      /** the last request made with it, written at most once a minute */
      lastSeenAt: Date;
    };
    DatabaseUserAttributes: {
      email: string;
      name: string;
      role: 'client' | 'owner' | 'builder';
      emailVerifiedAt: number | Date | null;
    };
  }
}

/** Starts a session now (its absolute lifetime counts from here) and gives the cookie to set. */
export async function startSession(lucia: AppLucia, userId: string, userAgent = ''): Promise<string> {
  const now = new Date();
  const session = await lucia.createSession(userId, {
    createdAt: now,
    lastSeenAt: now,
    userAgent: userAgent.slice(0, 300),
  });
  return lucia.createSessionCookie(session.id).serialize();
}
