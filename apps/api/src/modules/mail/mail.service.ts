import { and, asc, eq, gte } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { outbox } from '../../db/schema';
import { Conflict, NotFound } from '../../lib/errors';

/** The owner's view of the outbox: mail the relay has refused so far, and a way to try again now. */
export function createMailService(db: Db) {
  return {
    /** Pending mail that has failed at least once, oldest first; the worker keeps retrying it with backoff. */
    failed() {
      return db
        .select({
          id: outbox.id,
          to: outbox.to,
          subject: outbox.subject,
          attempts: outbox.attempts,
          lastError: outbox.lastError,
          nextAttemptAt: outbox.nextAttemptAt,
          createdAt: outbox.createdAt,
        })
        .from(outbox)
        .where(and(eq(outbox.status, 'pending'), gte(outbox.attempts, 1)))
        .orderBy(asc(outbox.createdAt))
        .all()
        .map((m) => ({ ...m, nextAttemptAt: m.nextAttemptAt.toISOString(), createdAt: m.createdAt.toISOString() }));
    },
    /** Moves a pending mail's next attempt to now (the worker picks it up on its next tick). */
    retry(id: string) {
      const m = db.select().from(outbox).where(eq(outbox.id, id)).get();
      if (!m) throw new NotFound('The mail');
      if (m.status === 'sent') throw new Conflict('That mail has been sent already.');
      db.update(outbox).set({ nextAttemptAt: new Date() }).where(eq(outbox.id, id)).run();
      return { id, nextAttemptAt: new Date().toISOString() };
    },
  };
}
export type MailService = ReturnType<typeof createMailService>;
