import { and, count, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { projectItems, projects, users } from '../db/schema';
import { queueMail } from './mailer';
import { requestNotice } from './mail-templates';

type Tx = Pick<Db, 'select' | 'insert'>;

/**
 * Mails every owner about a client's request (in the caller's transaction). Only for clients who have confirmed
 * their address: a request from an unconfirmed client is kept, and its notice goes when they confirm
 * (`queueHeldRequestNotices`), so an unconfirmed sign-up cannot be used to mail the shop.
 */
export function queueRequestNotice(tx: Tx, shop: { shopName: string; shopUrl: string }, projectId: string): void {
  const row = tx
    .select({ clientName: users.name })
    .from(projects)
    .innerJoin(users, eq(users.id, projects.clientId))
    .where(eq(projects.id, projectId))
    .get();
  if (!row) return;
  const items = tx.select({ n: count() }).from(projectItems).where(eq(projectItems.projectId, projectId)).get()?.n ?? 0;
  for (const owner of tx.select().from(users).where(eq(users.role, 'owner')).all())
    queueMail(
      tx,
      owner.email,
      requestNotice(shop.shopName, owner.name, row.clientName, items, `${shop.shopUrl}/requests/${projectId}`),
    );
}

/** When a client confirms their address: the notices of the requests they made before, still waiting. */
export function queueHeldRequestNotices(tx: Tx, shop: { shopName: string; shopUrl: string }, clientId: string): void {
  const waiting = tx
    .select({ id: projects.id })
    .from(projects)
    .where(and(eq(projects.clientId, clientId), eq(projects.status, 'requested')))
    .all();
  for (const p of waiting) queueRequestNotice(tx, shop, p.id);
}
