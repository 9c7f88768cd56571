import { randomUUID } from 'node:crypto';
import { and, desc, eq, sql } from 'drizzle-orm';
import type { ClientDetail, ClientsQuery, ClientSummary, CreateClientBody, User } from '@benchwright/contracts';
import type * as z from 'zod';
import type { Db } from '../../db/client';
import { projectItems, projects, users } from '../../db/schema';
import { issueToken } from '../../auth/tokens';
import { Conflict, Invalid, NotFound } from '../../lib/errors';
import { loadPricing } from '../../lib/engine';
import { queueMail } from '../../lib/mailer';
import { clientInvitationMail } from '../../lib/mail-templates';

type Query = z.output<typeof ClientsQuery>;
type NewClient = z.output<typeof CreateClientBody>;

/**
 * The figures of each client in one statement: projects, the accepted revisions' totals, what was paid less
 * refunds, and the latest event on any of their projects, each summed per client in a grouped subquery (never a
 * query per row).
 */
const FIGURES = sql`
  select u.id, u.name, u.email, u.phone, u.address, u.password_hash is not null as claimed, u.created_at as createdAt,
    coalesce(p.n, 0) as projectCount,
    coalesce(a.cents, 0) as acceptedCents,
    coalesce(m.cents, 0) as paidCents,
    max(u.created_at, coalesce(p.last, 0), coalesce(ev.last, 0)) as lastActivity
  from users u
  left join (
    select client_id, count(*) as n, max(updated_at) as last from projects group by client_id
  ) p on p.client_id = u.id
  left join (
    select pr.client_id, sum(e.total_cents) as cents from estimates e join projects pr on pr.id = e.project_id
    where e.status = 'accepted' group by pr.client_id
  ) a on a.client_id = u.id
  left join (
    select pr.client_id, sum(pm.amount_cents - pm.refunded_cents) as cents from payments pm
    join projects pr on pr.id = pm.project_id
    where pm.status in ('paid', 'refunded', 'partially_refunded') group by pr.client_id
  ) m on m.client_id = u.id
  left join (
    select pr.client_id, max(ev.created_at) as last from project_events ev join projects pr on pr.id = ev.project_id
    group by pr.client_id
  ) ev on ev.client_id = u.id
  where u.role = 'client'`;

interface Row {
  id: string;
  name: string;
  email: string;
  phone: string;
  address: string;
  claimed: number;
  createdAt: number;
  projectCount: number;
  acceptedCents: number;
  paidCents: number;
  lastActivity: number;
}

const ORDER: Record<Query['sort'], string> = {
  name: 'name collate nocase',
  projects: 'projectCount',
  accepted: 'acceptedCents',
  paid: 'paidCents',
  activity: 'lastActivity',
};

const summary = (r: Row): ClientSummary => ({
  id: r.id,
  name: r.name,
  email: r.email,
  phone: r.phone,
  claimed: !!r.claimed,
  projectCount: r.projectCount,
  acceptedCents: r.acceptedCents,
  paidCents: r.paidCents,
  lastActivityAt: new Date(r.lastActivity).toISOString(),
});

/** `%` and `_` in the search are literal */
const like = (q: string) => `%${q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export function createClientsService(db: Db, urls: { portalUrl: string }) {
  return {
    list(query: Query): ClientSummary[] {
      const where = query.q
        ? sql` and (lower(u.name) like ${like(query.q)} escape '\\' or lower(u.email) like ${like(query.q)} escape '\\')`
        : sql``;
      const dir = query.order === 'asc' ? 'asc' : 'desc';
      const rows = db.all<Row>(
        sql`select * from (${FIGURES}${where}) order by ${sql.raw(ORDER[query.sort])} ${sql.raw(dir)}, name collate nocase asc, id asc limit ${query.limit}`,
      );
      return rows.map(summary);
    },

    get(id: string): ClientDetail {
      const r = db.get<Row | undefined>(sql`${FIGURES} and u.id = ${id}`);
      if (!r) throw new NotFound('The client');
      const list = db
        .select({
          id: projects.id,
          status: projects.status,
          notes: projects.notes,
          createdAt: projects.createdAt,
          items: sql<number>`(select count(*) from ${projectItems} where ${projectItems.projectId} = ${projects.id})`,
        })
        .from(projects)
        .where(eq(projects.clientId, id))
        .orderBy(desc(projects.createdAt))
        .all();
      return {
        ...summary(r),
        address: r.address,
        createdAt: new Date(r.createdAt).toISOString(),
        projects: list.map((p) => ({ ...p, createdAt: p.createdAt.toISOString() })),
      };
    },

    /**
     * A client the owner took down (by phone, at the door): an account without a password, and a mail inviting them
     * to claim it in the portal (the invitation token of the builders' flow; accepting it sets the password).
     */
    create(owner: User, input: NewClient): ClientDetail {
      const id = randomUUID();
      try {
        db.transaction((tx) => {
          if (tx.select({ id: users.id }).from(users).where(eq(users.email, input.email)).get())
            throw new Conflict('Someone already has an account with this e-mail.');
          tx.insert(users)
            .values({
              id,
              email: input.email,
              name: input.name,
              role: 'client',
              passwordHash: null,
              phone: input.phone,
              address: input.address,
            })
            .run();
          const token = issueToken(tx, id, 'invitation');
          queueMail(
            tx,
            input.email,
            clientInvitationMail(
              loadPricing(tx).shopName,
              input.name,
              owner.name,
              `${urls.portalUrl}/claim-account?token=${token}`,
            ),
          );
        });
      } catch (err) {
        if (String(err).includes('UNIQUE')) throw new Conflict('Someone already has an account with this e-mail.');
        throw err;
      }
      return this.get(id);
    },

    /** The client a project is started for by the owner: a client of the shop, else 400 on `clientId`. */
    clientUser(id: string): User {
      const u = db
        .select()
        .from(users)
        .where(and(eq(users.id, id), eq(users.role, 'client')))
        .get();
      if (!u)
        throw new Invalid('There is no such client.', [{ path: 'clientId', message: 'choose a client of the shop' }]);
      return { id: u.id, email: u.email, name: u.name, role: u.role, emailVerified: u.emailVerifiedAt !== null };
    },
  };
}
export type ClientsService = ReturnType<typeof createClientsService>;
