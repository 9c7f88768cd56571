import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { and, asc, desc, eq, gte, isNotNull } from 'drizzle-orm';
import { stageChecklist, type StageKey, type Traveller } from '@benchwright/pricing';
import { formatDate, type JobsQuery, type User } from '@benchwright/contracts';
import type { Db, Tx } from '../../db/client';
import {
  estimates,
  jobChecks,
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
import { logoPng } from '../../lib/shop-logo';
import type { EnginePool } from '../../lib/engine-pool';
import { latestRelayout, recordOf, relayoutRecord, roundedHours, totalOf } from '../../lib/record';
import type { PdfPool } from '../../lib/pdf-pool';
import { queueMail } from '../../lib/mailer';
import { balanceRequestMail, stageMail } from '../../lib/mail-templates';
import { addEvent, STAGE_NEWS } from '../../lib/timeline';
import { Conflict, Forbidden, Invalid, NotFound } from '../../lib/errors';
import { balanceSettled, closeIfSettled, moveProject } from '../projects/lifecycle';
import { deliveredJobs, jobView, openJobs } from './jobs.repo';

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

/**
 * `pdfDir`: where the shop's logo is kept (lib/shop-logo.ts), for the traveller PDF; `uploadsDir`: the progress
 * photos' thumbnails, shown in the stage mail.
 */
export function createJobsService(
  db: Db,
  portalUrl: string,
  pool: EnginePool,
  shopUrl: string,
  pdfs: PdfPool,
  pdfDir?: string,
  uploadsDir?: string,
) {
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
    return jobView(db, j.id)!;
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

  /** The job's stage checklist from its paper, with who ticked each step and when. */
  function checklistOf(jobId: string, paper: Traveller) {
    const done = new Map(
      db
        .select({ key: jobChecks.itemKey, at: jobChecks.checkedAt, by: users.name })
        .from(jobChecks)
        .innerJoin(users, eq(users.id, jobChecks.userId))
        .where(eq(jobChecks.jobId, jobId))
        .all()
        .map((c) => [c.key, { by: c.by, at: c.at.toISOString() }]),
    );
    return stageChecklist(paper).map((i) => ({ ...i, done: done.get(i.key) ?? null }));
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
    /**
     * The board: every job still in the shop, and the delivered ones a page at a time (the latest first);
     * `stage: 'delivered'` asks for the delivered ones alone, from a cursor.
     */
    list(query: JobsQuery) {
      const delivered = deliveredJobs(db, query.limit, query.cursor);
      if (query.stage === 'delivered') return delivered;
      if (query.cursor) throw new Invalid('A cursor pages the delivered jobs: ask with stage=delivered.');
      return { jobs: [...openJobs(db), ...delivered.jobs], nextCursor: delivered.nextCursor };
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
      const on = (iso: string) => formatDate(iso);
      return {
        job: view(j),
        ...paper,
        checklist: checklistOf(j.id, paper),
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
      const layout = await relayoutRecord(pool, record.items, book, settings, record.choices);
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
      const pdf = await pdfs.render({
        kind: 'traveller',
        input: {
          shopName: loadPricing(db).shopName,
          logo: pdfDir ? logoPng(db, pdfDir) : null,
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
        },
      });
      return { pdf, filename: `traveller-${job.clientName.replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}.pdf` };
    },
    /** Ticks or unticks a step of the job's checklist (a step the job's paper does not have is 404). */
    async check(actor: User, id: string, key: string, done: boolean) {
      const j = row(id);
      const { record } = await accepted(j);
      const paper = latestRelayout(db, j.id)?.record.traveller ?? record.traveller;
      if (!stageChecklist(paper).some((i) => i.key === key))
        throw new NotFound('That step is not on this job’s checklist.');
      if (done)
        db.insert(jobChecks).values({ jobId: j.id, itemKey: key, userId: actor.id }).onConflictDoNothing().run();
      else
        db.delete(jobChecks)
          .where(and(eq(jobChecks.jobId, j.id), eq(jobChecks.itemKey, key)))
          .run();
      return checklistOf(j.id, paper);
    },
    /** The part labels (30 to a Letter sheet), each with a QR code that opens the job's page in the shop app. */
    async labelsPdf(id: string): Promise<{ pdf: Buffer; filename: string }> {
      const { job, units, pieces } = await this.traveller(id);
      const pdf = await pdfs.render({
        kind: 'labels',
        input: {
          shopName: loadPricing(db).shopName,
          clientName: job.clientName,
          jobUrl: `${shopUrl}/jobs/${job.id}`,
          units,
          traveller: { pieces },
        },
      });
      return { pdf, filename: `labels-${job.clientName.replace(/[^A-Za-z0-9]+/g, '-').toLowerCase()}.pdf` };
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
