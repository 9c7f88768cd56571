import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia } from 'lucia';
import type { Db } from '../db/client';
import { sessions, users } from '../db/schema';

export function createLucia(db: Db, secure: boolean) {
  const adapter = new DrizzleSQLiteAdapter(db as never, sessions, users);
  return new Lucia(adapter, {
    sessionCookie: { name: 'bw_session', attributes: { secure, sameSite: 'lax' } },
    getUserAttributes: (u) => ({ email: u.email, name: u.name, role: u.role, emailVerifiedAt: u.emailVerifiedAt }),
  });
}
export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: {
      email: string;
      name: string;
      role: 'client' | 'owner' | 'builder';
      emailVerifiedAt: number | Date | null;
    };
  }
}
