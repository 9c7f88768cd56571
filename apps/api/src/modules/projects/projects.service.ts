import { randomUUID } from 'node:crypto';
import { asc, desc, eq, inArray } from 'drizzle-orm';
import type { Project, User } from '@benchwright/contracts';
import { validateSpec } from '@benchwright/pricing';
import type { Db } from '../../db/client';
import { estimates, projectEvents, projectItems, projects, users } from '../../db/schema';
import { loadPricing, travellerFor } from '../../lib/engine';
import { queueMail } from '../../lib/mailer';
import { commentMail } from '../../lib/mail-templates';
import { queueRequestNotice } from '../../lib/request-notice';
import { addEvent } from '../../lib/timeline';
import { Forbidden, Invalid, NotFound } from '../../lib/errors';
import { listUploads } from '../uploads/uploads.repo';

/** Statuses a builder may see: the job is in the shop. */
const IN_SHOP = ['deposit_paid', 'in_production', 'ready', 'delivered'] as const;

export function createProjectsService(
  db: Db,
  urls: { portalUrl: string; shopUrl: string } = { portalUrl: '', shopUrl: '' },
) {
  function toProject(row: typeof projects.$inferSelect): Project {
    const client = db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, row.clientId)).get()!;
    const items = db
      .select()
      .from(projectItems)
      .where(eq(projectItems.projectId, row.id))
      .orderBy(asc(projectItems.position))
      .all();
    const ests = db
      .select()
      .from(estimates)
      .where(eq(estimates.projectId, row.id))
      .orderBy(asc(estimates.revision))
      .all();
    const events = db
      .select({
        id: projectEvents.id,
        kind: projectEvents.kind,
        message: projectEvents.message,
        createdAt: projectEvents.createdAt,
        by: users.name,
      })
      .from(projectEvents)
      .leftJoin(users, eq(users.id, projectEvents.actorId))
      .where(eq(projectEvents.projectId, row.id))
      .orderBy(asc(projectEvents.createdAt))
      .all();
    return {
      id: row.id,
      status: row.status,
      notes: row.notes,
      client,
      items: items.map((i) => ({ id: i.id, spec: i.spec, quantity: i.quantity })),
      estimates: ests.map((e) => ({
        id: e.id,
        revision: e.revision,
        status: e.status,
        totals: {
          subtotalCents: e.subtotalCents,
          discountCents: e.discountCents,
          taxCents: e.taxCents,
          totalCents: e.totalCents,
          depositCents: e.depositCents,
          balanceCents: e.balanceCents,
        },
      })),
      timeline: events.map((e) => ({
        id: e.id,
        kind: e.kind,
        message: e.message,
        by: e.kind === 'comment' ? e.by : null,
        at: e.createdAt.toISOString(),
      })),
      uploads: listUploads(db, row.id),
      createdAt: row.createdAt.toISOString(),
    };
  }

  /** Clients see their own drafts hidden: a client sees an estimate only once it is sent. */
  function forViewer(p: Project, viewer: User): Project {
    if (viewer.role === 'client') return { ...p, estimates: p.estimates.filter((e) => e.status !== 'draft') };
    if (viewer.role === 'builder') return { ...p, estimates: [] };
    return p;
  }

  return {
    list(viewer: User): Project[] {
      const q = db.select().from(projects);
      const rows =
        viewer.role === 'owner'
          ? q.orderBy(desc(projects.createdAt)).all()
          : viewer.role === 'client'
            ? q.where(eq(projects.clientId, viewer.id)).orderBy(desc(projects.createdAt)).all()
            : q
                .where(inArray(projects.status, [...IN_SHOP]))
                .orderBy(desc(projects.createdAt))
                .all();
      return rows.map((r) => forViewer(toProject(r), viewer));
    },

    /** A project the viewer may not see answers 404, as if it did not exist. */
    get(viewer: User, id: string): Project {
      const row = db.select().from(projects).where(eq(projects.id, id)).get();
      if (!row) throw new NotFound('The project');
      if (viewer.role === 'client' && row.clientId !== viewer.id) throw new NotFound('The project');
      if (viewer.role === 'builder' && !(IN_SHOP as readonly string[]).includes(row.status))
        throw new NotFound('The project');
      return forViewer(toProject(row), viewer);
    },

    /** For the owner pricing a request: the items' cut list, sheet layouts and pick list, laid out at 'thorough'. */
    layouts(viewer: User, id: string) {
      if (viewer.role !== 'owner')
        throw new Forbidden('Only the owner sees a request’s layouts; builders have the job’s traveller.');
      const row = db.select().from(projects).where(eq(projects.id, id)).get();
      if (!row) throw new NotFound('The project');
      return travellerFor(db, id);
    },

    /** A comment from the project's client or the owner: on the timeline, and by e-mail to the other side. */
    comment(viewer: User, id: string, message: string): Project {
      if (viewer.role === 'builder') throw new Forbidden('Comments are between the client and the owner.');
      if (viewer.role === 'client' && !viewer.emailVerified)
        throw new Forbidden(
          'Confirm your e-mail address before commenting: open the link we sent you, or ask for a new one.',
        );
      const row = db.select().from(projects).where(eq(projects.id, id)).get();
      if (!row || (viewer.role === 'client' && row.clientId !== viewer.id)) throw new NotFound('The project');
      const { shopName } = loadPricing(db);
      const client = db.select().from(users).where(eq(users.id, row.clientId)).get()!;
      db.transaction((tx) => {
        addEvent(tx, id, 'comment', message, viewer.id);
        if (viewer.role === 'client') {
          for (const owner of tx.select().from(users).where(eq(users.role, 'owner')).all())
            queueMail(
              tx,
              owner.email,
              commentMail(shopName, owner.name, viewer.name, message, `${urls.shopUrl}/requests/${id}`),
            );
        } else {
          queueMail(
            tx,
            client.email,
            commentMail(
              shopName,
              client.name,
              `${viewer.name} at ${shopName}`,
              message,
              `${urls.portalUrl}/projects/${id}`,
            ),
          );
        }
      });
      return this.get(viewer, id);
    },

    /** A client's request: every item checked against its design and the shop's price book. */
    create(client: User, input: { items: { spec: unknown; quantity: number }[]; notes: string }): Project {
      const { book, settings } = loadPricing(db);
      const issues = input.items.flatMap((item, i) => {
        const v = validateSpec(item.spec, book, settings);
        return v.ok
          ? []
          : v.issues.map((x) => ({ path: `items[${i}].spec${x.path ? `.${x.path}` : ''}`, message: x.message }));
      });
      if (issues.length) throw new Invalid('Some items cannot be built as given.', issues);
      const id = randomUUID();
      db.transaction((tx) => {
        tx.insert(projects).values({ id, clientId: client.id, notes: input.notes }).run();
        input.items.forEach((item, position) =>
          tx
            .insert(projectItems)
            .values({ id: randomUUID(), projectId: id, position, spec: item.spec, quantity: item.quantity })
            .run(),
        );
        tx.insert(projectEvents)
          .values({
            id: randomUUID(),
            projectId: id,
            kind: 'requested',
            message: `${client.name} asked for an estimate.`,
            actorId: client.id,
          })
          .run();
        // an unconfirmed client's request is kept; the shop hears of it when they confirm their address
        if (client.emailVerified)
          queueRequestNotice(tx, { shopName: loadPricing(db).shopName, shopUrl: urls.shopUrl }, id);
      });
      return this.get(client, id);
    },
  };
}
export type ProjectsService = ReturnType<typeof createProjectsService>;
