import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia } from 'lucia';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';

export function createLucia(db: Db, secure: boolean) {
  const adapter = new DrizzleSQLiteAdapter(db as never, sessions, users);
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
