import { randomUUID } from 'node:crypto';
import { asc, desc, eq, sql } from 'drizzle-orm';
import { isInShop, type Project, type User } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { estimates, projectEvents, projectItems, projects, users } from '../../db/schema';
import { checkItems, loadPricing, projectSpecs, travellerFor } from '../../lib/engine';
import { recordOf } from '../../lib/record';
import { preparedOnce } from '../../lib/statements';
import type { EnginePool } from '../../lib/engine-pool';
import { queueMail } from '../../lib/mailer';
import { clientInvitationMail, commentMail, projectStartedMail } from '../../lib/mail-templates';
import { issueToken } from '../../auth/tokens';
import { designs } from '@benchwright/pricing';
import { queueRequestNotice } from '../../lib/request-notice';
import { addEvent, timelineFor } from '../../lib/timeline';
import { Forbidden, NotFound } from '../../lib/errors';
import { listUploads } from '../uploads/uploads.repo';
import { listProjects, type ProjectListOptions } from './projects.repo';

export function createProjectsService(db: Db, urls: { portalUrl: string; shopUrl: string }, pool: EnginePool) {
  // the queries of one project's page, built and prepared once, at first use (after the migrations): Drizzle
  // otherwise builds and prepares each query again on every call
  const byId = sql.placeholder('id');
  const q = () =>
    preparedOnce(db, 'project page', () => ({
      project: db.select().from(projects).where(eq(projects.id, byId)).prepare(),
      client: db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, byId)).prepare(),
      items: db
        .select()
        .from(projectItems)
        .where(eq(projectItems.projectId, byId))
        .orderBy(asc(projectItems.position))
        .prepare(),
      estimates: db
        .select()
        .from(estimates)
        .where(eq(estimates.projectId, byId))
        .orderBy(asc(estimates.revision))
        .prepare(),
      events: db
        .select({
          id: projectEvents.id,
          kind: projectEvents.kind,
          message: projectEvents.message,
          createdAt: projectEvents.createdAt,
          by: users.name,
          stageKey: projectEvents.stageKey,
          uploadId: projectEvents.uploadId,
        })
        .from(projectEvents)
        .leftJoin(users, eq(users.id, projectEvents.actorId))
        .where(eq(projectEvents.projectId, byId))
        .orderBy(asc(projectEvents.createdAt))
        .prepare(),
    }));

  function toProject(row: typeof projects.$inferSelect, viewer: User): Project {
    const client = q().client.get({ id: row.clientId })!;
    const items = q().items.all({ id: row.id });
    const ests = q().estimates.all({ id: row.id });
    const events = q().events.all({ id: row.id });
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
      timeline: timelineFor(viewer, events),
      uploads: listUploads(db, row.id),
      createdAt: row.createdAt.toISOString(),
    };
  }

  /** A client sees an estimate only once it is sent; a builder sees no estimates (no money) at all. */
  function forViewer(row: typeof projects.$inferSelect, viewer: User): Project {
    const p = toProject(row, viewer);
    if (viewer.role === 'client') return { ...p, estimates: p.estimates.filter((e) => e.status !== 'draft') };
    if (viewer.role === 'builder') return { ...p, estimates: [] };
    return p;
  }

  return {
    /** A page of summaries (no timelines, no specs): projects.repo.ts. */
    list(viewer: User, opts: ProjectListOptions) {
      return listProjects(db, viewer, opts);
    },

    /** A project the viewer may not see answers 404, as if it did not exist. */
    get(viewer: User, id: string): Project {
      const row = q().project.get({ id });
      if (!row) throw new NotFound('The project');
      if (viewer.role === 'client' && row.clientId !== viewer.id) throw new NotFound('The project');
      if (viewer.role === 'builder' && !isInShop(row.status)) throw new NotFound('The project');
      return forViewer(row, viewer);
    },

    /**
     * For the owner pricing a request: the items' cut list, sheet layouts and
     * pick list, from the latest revision's record; laid out at 'thorough' on
     * the pool only while the request has no revision yet.
     */
    async layouts(viewer: User, id: string) {
      if (viewer.role !== 'owner')
        throw new Forbidden('Only the owner sees a request’s layouts; builders have the job’s traveller.');
      const row = db.select().from(projects).where(eq(projects.id, id)).get();
      if (!row) throw new NotFound('The project');
      const latest = db
        .select()
        .from(estimates)
        .where(eq(estimates.projectId, id))
        .orderBy(desc(estimates.revision))
        .get();
      if (!latest) return travellerFor(db, pool, id);
      const record = await recordOf(db, pool, latest, () => ({ ...loadPricing(db), items: projectSpecs(db, id) }));
      return record.traveller;
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

    /** The units the shop works in: what people read, validation messages included, speaks them. */
    units() {
      return loadPricing(db).settings.units;
    },

    /**
     * A client's request: every item checked against its design and the shop's price book. With `by`, the owner
     * starts it for the client (who called or walked in): the client is mailed, with a link to claim their account
     * when they have none yet, and the owner gets no notice of their own request.
     */
    async create(client: User, input: { items: { spec: unknown; quantity: number }[]; notes: string }, by?: User) {
      const { activeBook, settings } = loadPricing(db);
      await checkItems(pool, input.items, activeBook, settings);
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
            message: by ? `${by.name} started a project for ${client.name}.` : `${client.name} asked for an estimate.`,
            actorId: by?.id ?? client.id,
          })
          .run();
        if (by) {
          const shop = loadPricing(tx).shopName;
          const what = describeItems(input.items);
          const claimed = !!tx.select({ h: users.passwordHash }).from(users).where(eq(users.id, client.id)).get()?.h;
          queueMail(
            tx,
            client.email,
            claimed
              ? projectStartedMail(shop, client.name, by.name, what, `${urls.portalUrl}/projects/${id}`)
              : clientInvitationMail(
                  shop,
                  client.name,
                  by.name,
                  `${urls.portalUrl}/claim-account?token=${issueToken(tx, client.id, 'invitation')}`,
                  what,
                ),
          );
        }
        // an unconfirmed client's request is kept; the shop hears of it when they confirm their address
        else if (client.emailVerified)
          queueRequestNotice(tx, { shopName: loadPricing(db).shopName, shopUrl: urls.shopUrl }, id);
      });
      return this.get(client, id);
    },
  };
}
/** "a bookcase and 2 wardrobes": the items by their designs' names, for a mail. */
function describeItems(items: { spec: unknown; quantity: number }[]): string {
  const names = items.map((i) => {
    const slug = (i.spec as { design?: string }).design ?? '';
    const name = (designs as Record<string, { name: string } | undefined>)[slug]?.name.toLowerCase() ?? 'piece';
    return i.quantity > 1 ? `${i.quantity} × ${name}` : `a ${name}`;
  });
  return names.length > 1 ? `${names.slice(0, -1).join(', ')} and ${names.at(-1)}` : (names[0] ?? 'a piece');
}

export type ProjectsService = ReturnType<typeof createProjectsService>;
