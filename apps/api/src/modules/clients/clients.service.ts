import { randomUUID } from 'node:crypto';
import { and, desc, eq, sql } from 'drizzle-orm';
import type { ClientDetail, ClientsQuery, ClientSummary, CreateClientBody, User } from '@benchwright/contracts';
import type * as z from 'zod';
import type { Db } from '../../db/client';
import { projectItems, projects, users } from '../../db/schema';
import { issueToken } from '../../auth/tokens';
import { Conflict, Invalid, NotFound } from '../../lib/errors';
import { decodeCursor, encodeCursor } from '../../lib/cursor';
import { loadPricing } from '../../lib/engine';
import { queueMail } from '../../lib/mailer';
import { clientInvitationMail } from '../../lib/mail-templates';

type Query = z.output<typeof ClientsQuery>;
type NewClient = z.output<typeof CreateClientBody>;

/** Each figure of a client, as a correlated subquery on `u` (each an index look-up: see the indexes in schema.ts). */
const PROJECTS = `(select count(*) from projects p where p.client_id = u.id)`;
const ACCEPTED = `(select coalesce(sum(e.total_cents), 0) from projects p
    join estimates e on e.project_id = p.id and e.status = 'accepted' where p.client_id = u.id)`;
const PAID = `(select coalesce(sum(pm.amount_cents - pm.refunded_cents), 0) from projects p
    join payments pm on pm.project_id = p.id
    where p.client_id = u.id and pm.status in ('paid', 'refunded', 'partially_refunded'))`;
/** the latest of: the account made, a project changed, an event on a project */
const ACTIVITY = `max(u.created_at,
    coalesce((select max(p.updated_at) from projects p where p.client_id = u.id), 0),
    coalesce((select max((select max(ev.created_at) from project_events ev where ev.project_id = p.id))
                from projects p where p.client_id = u.id), 0))`;

/** The figures of the clients named in a JSON array of ids, in one statement. */
const FIGURES = `
  select u.id, u.name, u.email, u.phone, u.address, u.password_hash is not null as claimed, u.created_at as createdAt,
    ${PROJECTS} as projectCount, ${ACCEPTED} as acceptedCents, ${PAID} as paidCents, ${ACTIVITY} as lastActivity
  from users u
  where u.role = 'client' and u.id in (select value from json_each(?))`;

/**
 * Each sort's key as SQL on `u`, and its type in a cursor. By name, the page walks users_role_name_nocase; by a
 * figure, the key is computed for each client that matches (one correlated look-up each: a shop has hundreds of
 * clients, not millions; a figure cannot be indexed without being kept on the row), and only the page's clients
 * get their other figures.
 */
const KEYS: Record<Query['sort'], { sql: string; type: 'string' | 'number' }> = {
  name: { sql: 'u.name collate nocase', type: 'string' },
  projects: { sql: PROJECTS, type: 'number' },
  accepted: { sql: ACCEPTED, type: 'number' },
  paid: { sql: PAID, type: 'number' },
  activity: { sql: ACTIVITY, type: 'number' },
};

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
    /**
     * A page of clients in two statements whatever its size: the page's ids by the sort's key (keyset: after the
     * cursor's key and id, the id breaking ties in the same direction), then the page's figures.
     */
    list(query: Query): { clients: ClientSummary[]; nextCursor: string | null } {
      const key = KEYS[query.sort];
      const where = [`u.role = 'client'`];
      const params: (string | number)[] = [];
      if (query.q) {
        where.push(`(lower(u.name) like ? escape '\\' or lower(u.email) like ? escape '\\')`);
        params.push(like(query.q), like(query.q));
      }
      const dir = query.order === 'asc' ? 'asc' : 'desc';
      // by name, the expression itself (with its collation, so that the index serves); by a figure, its column
      const k = query.sort === 'name' ? key.sql : 'k';
      if (query.cursor) {
        const at = decodeCursor(query.cursor, query.sort, dir, key.type);
        where.push(`(${k}, u.id) ${dir === 'asc' ? '>' : '<'} (?, ?)`);
        params.push(at.key, at.id);
      }
      // 1: the page's ids and keys, one row more than asked to know whether another page follows
      const page = db.$client
        .prepare(
          `select u.id, ${key.sql} as k from users u where ${where.join(' and ')}
            order by ${k} ${dir}, u.id ${dir} limit ?`,
        )
        .all(...params, query.limit + 1) as { id: string; k: string | number }[];
      const more = page.length > query.limit;
      if (more) page.pop();
      if (!page.length) return { clients: [], nextCursor: null };
      // 2: their figures
      const rows = db.$client.prepare(FIGURES).all(JSON.stringify(page.map((r) => r.id))) as Row[];
      const byId = new Map(rows.map((r) => [r.id, r]));
      const last = page.at(-1)!;
      return {
        clients: page.map((p) => summary(byId.get(p.id)!)),
        nextCursor: more ? encodeCursor({ sort: query.sort, dir, key: last.k, id: last.id }) : null,
      };
    },

    get(id: string): ClientDetail {
      const r = db.$client.prepare(FIGURES).get(JSON.stringify([id])) as Row | undefined;
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
