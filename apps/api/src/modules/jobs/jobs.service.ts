import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { and, asc, desc, eq, gte, isNotNull } from 'drizzle-orm';
import { STAGE_KEYS, type StageKey } from '@benchwright/pricing';
import type { User } from '@benchwright/contracts';
import type { Db, Tx } from '../../db/client';
import {
  estimates,
  jobLayouts,
  jobs,
  projectEvents,
  projects,
  stages,
  timeEntries,
  uploads,
  users,
  type MailAttachment,
} from '../../db/schema';
import { loadPricing, projectSpecs } from '../../lib/engine';
import type { EnginePool } from '../../lib/engine-pool';
import { latestRelayout, recordOf, relayoutRecord, roundedHours, totalOf } from '../../lib/record';
import { renderTravellerPdf } from '../../lib/pdf/traveller-pdf';
import { queueMail } from '../../lib/mailer';
import { balanceRequestMail, stageMail } from '../../lib/mail-templates';
import { addEvent, STAGE_NEWS } from '../../lib/timeline';
import { Conflict, Forbidden, Invalid, NotFound } from '../../lib/errors';
import { balanceSettled, closeIfSettled, moveProject } from '../projects/lifecycle';

/**
 * A paid deposit puts the project's job on the board, in Material, with the
 * accepted revision's hour budget: exactly one job a project (the payments
 * service calls this in its transaction; only this module writes the jobs table).
 */
export function openJob(tx: Tx, projectId: string, hoursBudget: Partial<Record<StageKey, number>>): void {
  tx.insert(jobs)
    .values({ id: randomUUID(), projectId, stageKey: 'material', hoursBudget })
    .onConflictDoNothing({ target: jobs.projectId })
    .run();
}

type InlinePhoto = Extract<MailAttachment, { cid: string }>;

/** The most photos one stage mail shows (their thumbnails, inline): a mail stays small. */
const PHOTOS_PER_MAIL = 8;

export function createJobsService(db: Db, portalUrl: string, pool: EnginePool, uploadsDir?: string) {
  /**
   * The progress photos added while the job was in `stage` this time round (since it last entered it), as inline
   * attachments of their thumbnails. Read in the move's transaction; a thumbnail gone from the disk is left out.
   */
  function stagePhotos(tx: Tx, job: typeof jobs.$inferSelect, stage: StageKey): InlinePhoto[] {
    if (!uploadsDir) return [];
    const entered =
      tx
        .select({ at: projectEvents.createdAt })
        .from(projectEvents)
        .where(and(eq(projectEvents.projectId, job.projectId), eq(projectEvents.kind, 'stage')))
        .orderBy(desc(projectEvents.createdAt))
        .get()?.at ?? job.createdAt;
    const rows = tx
      .select({ id: uploads.id, thumbnailPath: uploads.thumbnailPath })
      .from(uploads)
      .where(
        and(
          eq(uploads.projectId, job.projectId),
          eq(uploads.stageKey, stage),
          isNotNull(uploads.thumbnailPath),
          gte(uploads.createdAt, entered),
        ),
      )
      .orderBy(asc(uploads.createdAt))
      .all()
      .slice(0, PHOTOS_PER_MAIL);
    return rows.flatMap((r, i) => {
      try {
        const content = readFileSync(join(uploadsDir, r.thumbnailPath!)).toString('base64');
        return [
          { filename: `photo-${i + 1}.webp`, content, contentType: 'image/webp', cid: `photo-${r.id}@benchwright` },
        ];
      } catch {
        return [];
      }
    });
  }

  function view(j: typeof jobs.$inferSelect) {
    const project = db.select().from(projects).where(eq(projects.id, j.projectId)).get()!;
    const client = db.select({ name: users.name }).from(users).where(eq(users.id, project.clientId)).get()!;
    const builder = j.builderId
      ? db.select({ id: users.id, name: users.name }).from(users).where(eq(users.id, j.builderId)).get()
      : null;
    const entries = db.select().from(timeEntries).where(eq(timeEntries.jobId, j.id)).all();
    const logged = Object.fromEntries(
      STAGE_KEYS.map((k) => [
        k,
        Math.round(entries.filter((e) => e.stageKey === k).reduce((s, e) => s + e.hours, 0) * 100) / 100,
      ]),
    );
    const budget = j.hoursBudget;
    return {
      id: j.id,
      project: { id: project.id, status: project.status, notes: project.notes },
      clientName: client.name,
      stage: j.stageKey,
      position: j.position,
      builder: builder ?? null,
      dueDate: j.dueDate,
      hoursBudgeted: {
        ...budget,
        total: Math.round(Object.values(budget).reduce((s: number, h) => s + (h ?? 0), 0) * 100) / 100,
      },
      hoursLogged: { ...logged, total: Math.round(entries.reduce((s, e) => s + e.hours, 0) * 100) / 100 },
    };
  }

  function row(id: string) {
    const j = db.select().from(jobs).where(eq(jobs.id, id)).get();
    if (!j) throw new NotFound('The job');
    return j;
  }

  /**
   * The stage rules of the board (DESIGN.md section 3), applied in the
   * caller's transaction through the project's lifecycle: leaving Material
   * starts production, Ready asks for the balance, Delivered closes the
   * project once the balance is settled; a move back from Ready or Delivered
   * to an earlier stage resumes production. A move the lifecycle refuses is a 409.
   */
  function onStageChange(tx: Tx, job: typeof jobs.$inferSelect, from: StageKey, to: StageKey, actor: User): void {
    const project = tx.select().from(projects).where(eq(projects.id, job.projectId)).get()!;
    const client = tx.select().from(users).where(eq(users.id, project.clientId)).get()!;
    const label = tx.select().from(stages).where(eq(stages.key, to)).get()?.label ?? to;
    const shop = loadPricing(tx).shopName;
    const url = `${portalUrl}/projects/${project.id}`;
    if (project.status === 'closed')
      throw new Conflict('This project is closed: delivered and paid in full. Its job stays in Delivered.');
    const fromLabel = tx.select().from(stages).where(eq(stages.key, from)).get()?.label ?? from;
    // one mail per move, with the photos of the stage just left (read before this move's event is written)
    const photos = stagePhotos(tx, job, from);
    const shown = { photos, fromLabel };
    addEvent(tx, project.id, 'stage', `Moved to ${label}.`, actor.id, { stageKey: to });
    let news = STAGE_NEWS[to];
    if (to === 'ready') {
      moveProject(tx, project.id, 'mark_ready');
      if (!balanceSettled(tx, project.id)) {
        const est = tx
          .select()
          .from(estimates)
          .where(eq(estimates.projectId, project.id))
          .all()
          .find((e) => e.status === 'accepted');
        queueMail(tx, client.email, balanceRequestMail(shop, client.name, est?.balanceCents ?? 0, url, shown), photos);
        return;
      }
    } else if (to === 'delivered') {
      moveProject(tx, project.id, 'deliver');
      news = 'Your piece has been delivered. Thank you for having us build it.';
      closeIfSettled(tx, project.id);
    } else if (project.status === 'deposit_paid' && to !== 'material') {
      moveProject(tx, project.id, 'start_production');
      news = `Your material is in and your piece is now being built in the shop. ${news}`;
    } else if (from === 'ready' || from === 'delivered') moveProject(tx, project.id, 'resume_work');
    queueMail(tx, client.email, stageMail(shop, client.name, news, url, shown), photos);
  }

  /** The job's paper: the accepted revision and its record. */
  async function accepted(j: typeof jobs.$inferSelect) {
    const est =
      db
        .select()
        .from(estimates)
        .where(eq(estimates.projectId, j.projectId))
        .all()
        .find((e) => e.status === 'accepted') ??
      db.select().from(estimates).where(eq(estimates.projectId, j.projectId)).orderBy(desc(estimates.revision)).get();
    if (!est) throw new Conflict('The job has no estimate to work from.');
    const record = await recordOf(db, pool, est, () => ({ ...loadPricing(db), items: projectSpecs(db, j.projectId) }));
    return { est, record };
  }

  return {
    stages() {
      return db.select().from(stages).orderBy(asc(stages.position)).all();
    },
    list() {
      return db.select().from(jobs).orderBy(asc(jobs.position), asc(jobs.createdAt)).all().map(view);
    },
    get(id: string) {
      return view(row(id));
    },
    /**
     * The job's traveller, read from the accepted revision's record (or the
     * latest "lay out again", which says so), with the job's board state; the
     * hours are the job's budget. Nothing is priced or laid out here.
     */
    async traveller(id: string) {
      const j = row(id);
      const { est, record } = await accepted(j);
      const again = latestRelayout(db, j.id);
      const paper = again?.record.traveller ?? record.traveller;
      const budget = roundedHours(j.hoursBudget);
      const on = (iso: string) => new Date(iso).toLocaleDateString('en-US', { dateStyle: 'long', timeZone: 'UTC' });
      return {
        job: view(j),
        ...paper,
        hoursByStage: budget,
        totalHours: totalOf(budget),
        layout: again
          ? {
              source: 'relayout' as const,
              revision: est.revision,
              at: again.record.laidOutAt,
              note: `Laid out again on ${on(again.record.laidOutAt)} with the stock of that day; the sheets of revision ${est.revision} as accepted are kept.`,
            }
          : {
              source: 'revision' as const,
              revision: est.revision,
              at: record.pricedAt,
              note: `Sheets as laid out for revision ${est.revision} on ${on(record.pricedAt)}.`,
            },
      };
    },
    /**
     * "Lay out again with today's stock" (owner): the accepted revision's
     * items laid out with today's price book and settings, kept as a new
     * layout record beside the revision's own; the traveller then shows it and
     * says so.
     */
    async relayout(actor: User, id: string) {
      if (actor.role !== 'owner') throw new Forbidden('Only the owner lays a job out again.');
      const j = row(id);
      const { record } = await accepted(j);
      const { book, settings } = loadPricing(db);
      const layout = await relayoutRecord(pool, record.items, book, settings);
      db.transaction((tx) => {
        tx.insert(jobLayouts).values({ id: randomUUID(), jobId: j.id, actorId: actor.id, record: layout }).run();
        addEvent(tx, j.projectId, 'relayout', 'The sheets were laid out again with today’s stock.', actor.id);
      });
      return this.traveller(id);
    },
    /** The traveller as a PDF for the shop floor. */
    async travellerPdf(id: string): Promise<{ pdf: Buffer; filename: string }> {
      const { job, units, layout, ...t } = await this.traveller(id);
      const labels = Object.fromEntries(this.stages().map((x) => [x.key, x.label]));
      const pdf = await renderTravellerPdf({
        shopName: loadPricing(db).shopName,
        clientName: job.clientName,
        notes: job.project.notes,
        stageLabel: labels[job.stage] ?? job.stage,
        builderName: job.builder?.name ?? null,
        dueDate: job.dueDate,
        units,
        stageLabels: labels,
        hoursLogged: job.hoursLogged,
        layoutNote: layout.note,
        traveller: t,
      });
      return { pdf, filename: `traveller-${job.clientName.replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}.pdf` };
    },
    update(
      actor: User,
      id: string,
      input: { stageKey?: StageKey; position?: number; builderId?: string | null; dueDate?: string | null },
    ) {
      const j = row(id);
      if (actor.role !== 'owner' && (input.builderId !== undefined || input.dueDate !== undefined))
        throw new Forbidden('Only the owner assigns the builder and the due date.');
      if (input.builderId) {
        const b = db.select().from(users).where(eq(users.id, input.builderId)).get();
        if (!b || b.role === 'client')
          throw new Invalid('Choose a builder of the shop.', [
            { path: 'builderId', message: 'not a member of the shop' },
          ]);
      }
      db.transaction((tx) => {
        tx.update(jobs)
          .set({
            ...(input.stageKey ? { stageKey: input.stageKey } : {}),
            ...(input.position !== undefined ? { position: input.position } : {}),
            ...(input.builderId !== undefined ? { builderId: input.builderId } : {}),
            ...(input.dueDate !== undefined ? { dueDate: input.dueDate } : {}),
            updatedAt: new Date(),
          })
          .where(eq(jobs.id, id))
          .run();
        if (input.stageKey && input.stageKey !== j.stageKey) onStageChange(tx, j, j.stageKey, input.stageKey, actor);
        if (input.builderId !== undefined && input.builderId !== j.builderId) {
          const name = input.builderId
            ? tx.select({ name: users.name }).from(users).where(eq(users.id, input.builderId)).get()!.name
            : null;
          addEvent(tx, j.projectId, 'assigned', name ? `Assigned to ${name}.` : 'No builder assigned.', actor.id);
        }
        if (input.dueDate !== undefined && input.dueDate !== j.dueDate)
          addEvent(tx, j.projectId, 'assigned', input.dueDate ? `Due ${input.dueDate}.` : 'No due date.', actor.id);
      });
      return view(row(id));
    },
    logTime(actor: User, id: string, input: { stageKey: StageKey; hours: number; note: string }) {
      const j = row(id);
      const label = db.select().from(stages).where(eq(stages.key, input.stageKey)).get()?.label ?? input.stageKey;
      db.transaction((tx) => {
        tx.insert(timeEntries)
          .values({
            id: randomUUID(),
            jobId: j.id,
            userId: actor.id,
            stageKey: input.stageKey,
            hours: input.hours,
            note: input.note,
          })
          .run();
        addEvent(tx, j.projectId, 'hours', `${input.hours} h logged on ${label} by ${actor.name}.`, actor.id);
      });
      return view(row(id));
    },
  };
}
export type JobsService = ReturnType<typeof createJobsService>;
