import { randomUUID } from 'node:crypto';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { and, asc, desc, eq, gt, ne } from 'drizzle-orm';
import { ESTIMATE_STATUS_LABELS, formatDate, replacedBy as replacedByWords, type User } from '@benchwright/contracts';
import {
  designs,
  formatAreaLoad,
  formatQuantity,
  specBays,
  totalsFor,
  upgradeSpec,
  type BuildSpec,
  type Drawing,
  type LengthUnit,
  type LineGroup,
  type PriceBook,
} from '@benchwright/pricing';
import type { Db } from '../../db/client';
import {
  estimateLines,
  estimates,
  payments,
  projectItems,
  projects,
  revisionRecords,
  shopSettings,
  stages,
  users,
} from '../../db/schema';
import { forClient, loadPricing, projectSpecs } from '../../lib/engine';
import { logoPng } from '../../lib/shop-logo';
import type { EnginePool } from '../../lib/engine-pool';
import { priceRecord, recordRow, recordView, storedRecord, type RevisionRecord } from '../../lib/record';
import { queueMail } from '../../lib/mailer';
import { estimateMail, withdrawnMail } from '../../lib/mail-templates';
import type { PdfPool } from '../../lib/pdf-pool';
import type { EstimateSafety } from '../../lib/pdf/estimate-pdf';
import { addEvent } from '../../lib/timeline';
import { Conflict, Invalid, NotFound } from '../../lib/errors';
import { assertCan, moveProject } from '../projects/lifecycle';

export interface EstimateDeps {
  db: Db;
  pdfDir: string;
  portalUrl: string;
  pool: EnginePool;
  /** renders the sent estimate's PDF off the request thread */
  pdfs: PdfPool;
}

type EstimateRow = typeof estimates.$inferSelect;
type LineRow = typeof estimateLines.$inferSelect;

interface EngineRecord {
  drawings: Drawing[];
  layouts: { materialId: string; materialName: string; sheetCount: number; lowerBound: number; yieldRatio: number }[];
  checks: { code: string; level: string; message: string; clientMessage?: string }[];
  totalHours: number;
  massKg: number;
}

export interface LineEdit {
  id?: string;
  group: LineGroup;
  description: string;
  quantity: number;
  unit: string;
  unitPriceCents: number;
  costCents?: number;
  overrideReason?: string | null;
}

/** Hardware a client is told is included for safety, by its price-book kind. */
const SAFETY_KINDS = new Set(['anti_tip_kit', 'caster', 'leveling_foot']);

/**
 * The estimate PDF's safety block from the revision itself: its shelves' rated load, its pieces' own checks in the
 * client's words, and the safety hardware on its lines (no anchor kit is promised unless one is priced).
 */
function safetyOf(
  record: RevisionRecord | undefined,
  book: PriceBook,
  lines: { group: string; description: string; quantity: number; unit: string }[],
  engine: EngineRecord | null,
  units: LengthUnit,
  shelfLoadKPa: number,
): EstimateSafety {
  const hasShelves = record?.estimate.pieces.some((p) => p.parts.some((x) => /shelf/i.test(x.name))) ?? false;
  const safetyNames = new Set(book.hardware.filter((h) => SAFETY_KINDS.has(h.kind)).map((h) => h.name));
  return {
    shelfLoad: hasShelves ? formatAreaLoad(record?.settings.shelfLoadKPa ?? shelfLoadKPa, units) : null,
    checks: [...new Set(forClient(engine?.checks ?? []).map((c) => c.message))],
    included: lines
      .filter((l) => l.group === 'hardware' && safetyNames.has(l.description))
      .map((l) => `${l.description}: ${formatQuantity(l.quantity, l.unit, units)}`),
  };
}

/** A short estimate number people can read over the phone: the project's first 6 characters. */
export const estimateNumber = (projectId: string) => `E-${projectId.slice(0, 6).toUpperCase()}`;

export function createEstimatesService({ db, pdfDir, portalUrl, pool, pdfs }: EstimateDeps) {
  function row(id: string): EstimateRow {
    const e = db.select().from(estimates).where(eq(estimates.id, id)).get();
    if (!e) throw new NotFound('The estimate');
    return e;
  }

  /** Owner: all. Client: their own, once sent (a draft is the shop's business). Builder: none. */
  function visible(viewer: User, e: EstimateRow): boolean {
    if (viewer.role === 'owner') return true;
    if (viewer.role !== 'client' || e.status === 'draft') return false;
    const p = db.select({ clientId: projects.clientId }).from(projects).where(eq(projects.id, e.projectId)).get();
    return p?.clientId === viewer.id;
  }

  function view(viewer: User, e: EstimateRow) {
    const lines = db
      .select()
      .from(estimateLines)
      .where(eq(estimateLines.estimateId, e.id))
      .orderBy(asc(estimateLines.position))
      .all();
    const owner = viewer.role === 'owner';
    const engine = e.engine as EngineRecord | null;
    const view = recordView(db, e.id);
    return {
      // as the revision was priced (its record): a sent estimate reads the same after the shop changes its units
      units: view?.units ?? shopUnits(),
      replacedBy: e.status === 'superseded' ? replacedBy(e) : null,
      id: e.id,
      projectId: e.projectId,
      number: estimateNumber(e.projectId),
      revision: e.revision,
      status: e.status,
      version: e.version,
      ...(owner ? { priceBookVersion: e.priceBookVersion } : {}),
      validUntil: e.validUntil?.toISOString() ?? null,
      sentAt: e.sentAt?.toISOString() ?? null,
      acceptedAt: e.acceptedAt?.toISOString() ?? null,
      acceptedName: e.acceptedName,
      lines: lines.map((l) => ({
        id: l.id,
        group: l.group,
        description: l.description,
        quantity: l.quantity,
        unit: l.unit,
        unitPriceCents: l.unitPriceCents,
        amountCents: l.amountCents,
        source: l.source,
        ...(owner ? { costCents: l.costCents, overrideReason: l.overrideReason } : {}),
      })),
      totals: {
        subtotalCents: e.subtotalCents,
        discountCents: e.discountCents,
        taxCents: e.taxCents,
        totalCents: e.totalCents,
        depositCents: e.depositCents,
        balanceCents: e.balanceCents,
      },
      hoursByStage: owner ? e.hoursByStage : undefined,
      drawings: engine?.drawings ?? [],
      // each item's choices as they were priced; a revision recorded before they were kept has none
      choices: view?.choices ?? [],
      checks: owner ? (engine?.checks ?? []) : forClient(engine?.checks ?? []),
      ...(owner && engine ? { layouts: engine.layouts, costCents: lines.reduce((a, l) => a + l.costCents, 0) } : {}),
    };
  }

  /** The shop's units, which every figure a person reads follows (the settings row only, not the price book). */
  function shopUnits(): 'in' | 'mm' {
    const s = db.select({ settings: shopSettings.settings }).from(shopSettings).where(eq(shopSettings.id, 1)).get();
    return s?.settings.units ?? 'in';
  }

  /** The revision sent after a superseded one (the next one the client was sent), for "Replaced by revision N". */
  function replacedBy(e: EstimateRow): number | null {
    const later = db
      .select({ revision: estimates.revision })
      .from(estimates)
      .where(
        and(eq(estimates.projectId, e.projectId), gt(estimates.revision, e.revision), ne(estimates.status, 'draft')),
      )
      .orderBy(asc(estimates.revision))
      .get();
    return later?.revision ?? null;
  }

  /** The project's accepted revision other than `id`, if any: while one stands, no other is sent or accepted. */
  function otherAccepted(projectId: string, id: string): EstimateRow | undefined {
    return db
      .select()
      .from(estimates)
      .where(and(eq(estimates.projectId, projectId), eq(estimates.status, 'accepted'), ne(estimates.id, id)))
      .get();
  }

  function writeLines(
    tx: Pick<Db, 'insert' | 'delete'>,
    estimateId: string,
    lines: Omit<LineRow, 'id' | 'estimateId' | 'position'>[],
  ): void {
    tx.delete(estimateLines).where(eq(estimateLines.estimateId, estimateId)).run();
    lines.forEach((l, position) =>
      tx
        .insert(estimateLines)
        .values({ id: randomUUID(), estimateId, position, ...l })
        .run(),
    );
  }

  return {
    get(viewer: User, id: string) {
      const e = row(id);
      if (!visible(viewer, e)) throw new NotFound('The estimate');
      return view(viewer, e);
    },

    /** The next revision as a draft: priced by the engine (thorough layouts), or a copy of the latest. */
    async createRevision(owner: User, projectId: string, source: 'engine' | 'copy') {
      const project = db.select().from(projects).where(eq(projects.id, projectId)).get();
      if (!project) throw new NotFound('The project');
      assertCan(db, projectId, 'start_revision');
      const latest = db
        .select()
        .from(estimates)
        .where(eq(estimates.projectId, projectId))
        .orderBy(desc(estimates.revision))
        .get();
      if (latest?.status === 'draft')
        throw new Conflict(`Revision ${latest.revision} is still a draft: edit or send it first.`);
      const id = randomUUID();
      const revision = (latest?.revision ?? 0) + 1;
      if (source === 'copy') {
        if (!latest) throw new Conflict('There is no earlier revision to copy.');
        const lines = db
          .select()
          .from(estimateLines)
          .where(eq(estimateLines.estimateId, latest.id))
          .orderBy(asc(estimateLines.position))
          .all();
        db.transaction((tx) => {
          tx.insert(estimates)
            .values({
              id,
              projectId,
              revision,
              subtotalCents: latest.subtotalCents,
              discountCents: latest.discountCents,
              taxCents: latest.taxCents,
              totalCents: latest.totalCents,
              depositCents: latest.depositCents,
              balanceCents: latest.balanceCents,
              hoursByStage: latest.hoursByStage,
              engine: latest.engine,
            })
            .run();
          // the same items and the same engine result: the copy keeps the record it was made from
          const record = storedRecord(tx, latest.id);
          if (record) tx.insert(revisionRecords).values(recordRow(id, record)).run();
          writeLines(
            tx,
            id,
            lines.map(({ id: _i, estimateId: _e, position: _p, ...l }) => l),
          );
          moveProject(tx, projectId, 'start_revision');
          addEvent(
            tx,
            projectId,
            'estimate_draft',
            `Revision ${revision} started from revision ${latest.revision}.`,
            owner.id,
          );
        });
        return view(owner, row(id));
      }
      const { book, settings, bookVersion } = loadPricing(db);
      // the labour lines name the stages as the board does (the shop may have renamed them)
      const stageLabels = Object.fromEntries(
        db
          .select()
          .from(stages)
          .all()
          .map((x) => [x.key, x.label]),
      );
      const record = await priceRecord(pool, projectSpecs(db, projectId), book, settings, bookVersion, stageLabels);
      const e = record.estimate;
      const engine: EngineRecord = {
        drawings: e.pieces.map((p) => p.elevation),
        layouts: e.layouts.map((l) => ({
          materialId: l.materialId,
          materialName: l.materialName,
          sheetCount: l.sheetCount,
          lowerBound: l.lowerBound,
          yieldRatio: l.yieldRatio,
        })),
        checks: e.checks.map((c) => ({
          code: c.code,
          level: c.level,
          message: c.message,
          ...(c.clientMessage ? { clientMessage: c.clientMessage } : {}),
        })),
        totalHours: e.totalHours,
        massKg: e.massKg,
      };
      const hours = record.traveller.hoursByStage;
      db.transaction((tx) => {
        // the engine worked outside the request thread: another revision may have been made meanwhile
        const now = tx
          .select({ revision: estimates.revision })
          .from(estimates)
          .where(eq(estimates.projectId, projectId))
          .orderBy(desc(estimates.revision))
          .get();
        if ((now?.revision ?? 0) !== revision - 1)
          throw new Conflict(`Revision ${now?.revision} was made while this one was being priced; reload the project.`);
        tx.insert(estimates)
          .values({ id, projectId, revision, ...e.totals, hoursByStage: hours, engine, priceBookVersion: bookVersion })
          .run();
        tx.insert(revisionRecords).values(recordRow(id, record)).run();
        writeLines(
          tx,
          id,
          e.lines.map((l) => ({
            group: l.group,
            description: l.description,
            quantity: l.quantity,
            unit: l.unit,
            unitPriceCents: l.unitPriceCents,
            amountCents: l.amountCents,
            costCents: l.costCents,
            source: 'computed' as const,
            overrideReason: null,
          })),
        );
        moveProject(tx, projectId, 'start_revision');
        addEvent(
          tx,
          projectId,
          'estimate_draft',
          `Revision ${revision} priced from the cut list and sheet layouts.`,
          owner.id,
        );
      });
      return view(owner, row(id));
    },

    /**
     * Edits a draft: quantities and prices of its lines, manual lines, the
     * discount. A changed computed line or a manual one needs a reason. A
     * stale version or a revision that is no longer a draft: 409.
     */
    update(owner: User, id: string, input: { version: number; lines?: LineEdit[]; discountCents?: number }) {
      const e = row(id);
      if (e.status !== 'draft')
        throw new Conflict(
          `Revision ${e.revision} is ${e.status}; only a draft changes. Start a new revision instead.`,
        );
      if (e.version !== input.version)
        throw new Conflict(
          `Revision ${e.revision} was changed by someone else (version ${e.version}, yours ${input.version}); reload it and edit again.`,
        );
      const current = db
        .select()
        .from(estimateLines)
        .where(eq(estimateLines.estimateId, id))
        .orderBy(asc(estimateLines.position))
        .all();
      const byId = new Map(current.map((l) => [l.id, l]));
      const issues: { path: string; message: string }[] = [];
      const next = (input.lines ?? current).map((l, i) => {
        const edit = l as LineEdit;
        const was = edit.id ? byId.get(edit.id) : undefined;
        if (edit.id && !was) issues.push({ path: `lines[${i}].id`, message: 'no such line on this revision' });
        const changed =
          !was ||
          was.quantity !== edit.quantity ||
          was.unitPriceCents !== edit.unitPriceCents ||
          was.description !== edit.description ||
          was.group !== edit.group;
        const source = was && !changed ? was.source : 'manual';
        const reason = edit.overrideReason?.trim() || (was && !changed ? was.overrideReason : null);
        if (source === 'manual' && !reason)
          issues.push({
            path: `lines[${i}].overrideReason`,
            message: was ? 'say why this computed line changed' : 'say why this line is added',
          });
        // an unchanged line keeps the engine's amount (rounded half to even through dinero.js), so totals never drift by a cent
        const amountCents = was && !changed ? was.amountCents : Math.round(edit.quantity * edit.unitPriceCents);
        const costCents =
          edit.costCents ?? (was ? Math.round((was.costCents * edit.quantity) / (was.quantity || 1)) : 0);
        return {
          group: edit.group,
          description: edit.description,
          quantity: edit.quantity,
          unit: edit.unit,
          unitPriceCents: edit.unitPriceCents,
          amountCents,
          costCents,
          source,
          overrideReason: reason ?? null,
        };
      });
      if (issues.length) throw new Invalid('Some lines need attention.', issues);
      const { settings } = loadPricing(db);
      const totals = totalsFor(next, settings, input.discountCents ?? e.discountCents);
      db.transaction((tx) => {
        const r = tx
          .update(estimates)
          .set({ ...totals, version: e.version + 1, updatedAt: new Date() })
          .where(and(eq(estimates.id, id), eq(estimates.version, e.version), eq(estimates.status, 'draft')))
          .run();
        if (r.changes !== 1) throw new Conflict('The revision changed while you were editing; reload it.');
        writeLines(tx, id, next);
      });
      return view(owner, row(id));
    },

    /** Freezes the draft, renders and stores the PDF, queues the mail with it attached; earlier sent revisions are superseded. */
    async send(owner: User, id: string) {
      const e = row(id);
      if (e.status !== 'draft') throw new Conflict(`Revision ${e.revision} is already ${e.status}.`);
      const accepted = otherAccepted(e.projectId, e.id);
      if (accepted)
        throw new Conflict(
          `Revision ${accepted.revision} is accepted; withdraw it before sending revision ${e.revision}.`,
        );
      assertCan(db, e.projectId, 'send_revision');
      const project = db.select().from(projects).where(eq(projects.id, e.projectId)).get()!;
      const client = db.select().from(users).where(eq(users.id, project.clientId)).get()!;
      const shop = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get()!;
      // names and the deposit rate as the revision was priced (its record), not as the book says today
      const record = storedRecord(db, e.id);
      const book = record?.book ?? loadPricing(db).book;
      const depositRate = record?.settings.depositRate ?? shop.settings.depositRate;
      const items = db
        .select()
        .from(projectItems)
        .where(eq(projectItems.projectId, e.projectId))
        .orderBy(asc(projectItems.position))
        .all();
      const lines = db
        .select()
        .from(estimateLines)
        .where(eq(estimateLines.estimateId, id))
        .orderBy(asc(estimateLines.position))
        .all();
      const sentAt = new Date();
      const validUntil = new Date(sentAt.getTime() + shop.settings.estimateValidityDays * 86_400_000);
      const engine = e.engine as EngineRecord | null;
      const nameOf = (mid: string) =>
        book.sheetGoods.find((m) => m.id === mid)?.name ?? book.lumber.find((m) => m.id === mid)?.name ?? mid;
      const units = record?.settings.units ?? shop.settings.units;
      const pdf = await pdfs.render({
        kind: 'estimate',
        input: {
          units,
          safety: safetyOf(record, book, lines, engine, units, shop.settings.shelfLoadKPa),
          shop: {
            name: shop.shopName,
            address: shop.address,
            email: shop.email,
            phone: shop.phone,
            logo: logoPng(db, pdfDir),
          },
          client: { name: client.name, email: client.email },
          number: estimateNumber(e.projectId),
          revision: e.revision,
          date: sentAt,
          validUntil,
          items: items.map((it, i) => {
            const spec = upgradeSpec(it.spec) as BuildSpec; // a bench stored before arrangements, converted
            const hasDrawers = specBays(spec).some((b) => b.compartments.some((c) => c.kind === 'drawer'));
            const top =
              spec.design === 'assembly-bench'
                ? spec.top.kind === 'torsion-box'
                  ? [spec.top.skinMaterialId, spec.top.coreMaterialId]
                  : []
                : [];
            const mats = [
              ...new Set([
                spec.carcassMaterialId,
                spec.frontMaterialId,
                spec.backMaterialId,
                ...(hasDrawers ? [spec.drawerMaterialId] : []),
                ...top,
                ...(spec.trim ? [spec.trim.lumberId] : []),
              ]),
            ].map(nameOf);
            return {
              spec,
              quantity: it.quantity,
              materials: mats,
              finish: spec.finishId ? (book.finishes.find((f) => f.id === spec.finishId)?.name ?? spec.finishId) : null,
              choices: record?.choices?.[i] ?? [],
              drawing: engine?.drawings[i] ?? {
                title: designs[spec.design].name,
                viewBox: { x: 0, y: 0, width: 1, height: 1 },
                shapes: [],
              },
            };
          }),
          lines,
          totals: {
            subtotalCents: e.subtotalCents,
            discountCents: e.discountCents,
            taxCents: e.taxCents,
            totalCents: e.totalCents,
            depositCents: e.depositCents,
            balanceCents: e.balanceCents,
          },
          depositRate,
        },
      });
      mkdirSync(pdfDir, { recursive: true });
      // stored relative to the PDF folder, so a restored backup works wherever the data folder now is
      const pdfPath = `${estimateNumber(e.projectId)}-r${e.revision}-${e.id.slice(0, 8)}.pdf`;
      writeFileSync(join(pdfDir, pdfPath), pdf);
      db.transaction((tx) => {
        const r = tx
          .update(estimates)
          .set({ status: 'sent', sentAt, validUntil, pdfPath, version: e.version + 1, updatedAt: sentAt })
          .where(and(eq(estimates.id, id), eq(estimates.status, 'draft')))
          .run();
        if (r.changes !== 1) throw new Conflict('The revision was sent or changed meanwhile.');
        moveProject(tx, e.projectId, 'send_revision');
        tx.update(estimates)
          .set({ status: 'superseded', updatedAt: sentAt })
          .where(and(eq(estimates.projectId, e.projectId), eq(estimates.status, 'sent'), ne(estimates.id, id)))
          .run();
        addEvent(
          tx,
          e.projectId,
          'estimate_sent',
          `Estimate revision ${e.revision} sent: ${fmt(e.totalCents)}.`,
          owner.id,
        );
        queueMail(
          tx,
          client.email,
          estimateMail(
            shop.shopName,
            client.name,
            e.revision,
            e.totalCents,
            e.depositCents,
            validUntil,
            `${portalUrl}/projects/${e.projectId}`,
          ),
          [
            {
              filename: `${estimateNumber(e.projectId)}-revision-${e.revision}.pdf`,
              path: pdfPath,
              contentType: 'application/pdf',
            },
          ],
        );
      });
      return view(owner, row(id));
    },

    pdfPath(viewer: User, id: string): { path: string; filename: string } {
      const e = row(id);
      if (!visible(viewer, e) || !e.pdfPath) throw new NotFound('The estimate PDF');
      return {
        path: resolve(pdfDir, e.pdfPath),
        filename: `${estimateNumber(e.projectId)}-revision-${e.revision}.pdf`,
      };
    },

    /** The client accepts the latest sent revision before it expires, by typing their name. */
    accept(client: User, id: string, input: { acceptedName: string; ip: string; userAgent: string }) {
      const e = row(id);
      if (!visible(client, e)) throw new NotFound('The estimate');
      if (e.status !== 'sent')
        throw new Conflict(
          e.status === 'superseded'
            ? `${replacedByWords(replacedBy(e) ?? e.revision + 1)}: accept the latest revision.`
            : `Revision ${e.revision} is ${ESTIMATE_STATUS_LABELS[e.status].toLowerCase()} and cannot be accepted.`,
        );
      const accepted = otherAccepted(e.projectId, e.id);
      if (accepted)
        throw new Conflict(`Revision ${accepted.revision} is already accepted; revision ${e.revision} cannot be too.`);
      assertCan(db, e.projectId, 'accept_revision');
      if (e.validUntil && e.validUntil.getTime() < Date.now()) {
        db.transaction((tx) => {
          tx.update(estimates).set({ status: 'expired', updatedAt: new Date() }).where(eq(estimates.id, id)).run();
          moveProject(tx, e.projectId, 'expire_revision');
          addEvent(tx, e.projectId, 'estimate_expired', `Estimate revision ${e.revision} expired unaccepted.`);
        });
        throw new Conflict(
          `Revision ${e.revision} expired on ${formatDate(e.validUntil)}; ask the shop for a new one.`,
        );
      }
      const at = new Date();
      db.transaction((tx) => {
        const r = tx
          .update(estimates)
          .set({
            status: 'accepted',
            acceptedAt: at,
            acceptedName: input.acceptedName,
            acceptedIp: input.ip,
            acceptedUserAgent: input.userAgent.slice(0, 300),
            version: e.version + 1,
            updatedAt: at,
          })
          .where(and(eq(estimates.id, id), eq(estimates.status, 'sent')))
          .run();
        if (r.changes !== 1) throw new Conflict('The revision changed meanwhile; reload it.');
        moveProject(tx, e.projectId, 'accept_revision');
        addEvent(
          tx,
          e.projectId,
          'estimate_accepted',
          `Estimate revision ${e.revision} accepted by ${input.acceptedName}.`,
          client.id,
        );
      });
      return view(client, row(id));
    },

    /**
     * The owner takes back an accepted revision, saying why, while no deposit
     * is paid (open checkouts are closed first by the payments service). The
     * project can then be sent a revision again; the client is told.
     */
    withdraw(owner: User, id: string, reason: string) {
      const e = row(id);
      if (e.status !== 'accepted')
        throw new Conflict(`Revision ${e.revision} is ${e.status}; only an accepted revision can be withdrawn.`);
      const client = db
        .select({ name: users.name, email: users.email })
        .from(projects)
        .innerJoin(users, eq(users.id, projects.clientId))
        .where(eq(projects.id, e.projectId))
        .get()!;
      const shop = db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get()!;
      db.transaction((tx) => {
        const deposits = tx
          .select({ status: payments.status })
          .from(payments)
          .where(and(eq(payments.estimateId, id), eq(payments.kind, 'deposit')))
          .all();
        if (deposits.some((p) => p.status === 'open'))
          throw new Conflict('The client is paying the deposit right now; try again in a few minutes.');
        if (deposits.some((p) => p.status !== 'expired'))
          throw new Conflict(
            `The deposit for revision ${e.revision} is paid; an acceptance can be withdrawn only before that.`,
          );
        const r = tx
          .update(estimates)
          .set({ status: 'withdrawn', version: e.version + 1, updatedAt: new Date() })
          .where(and(eq(estimates.id, id), eq(estimates.status, 'accepted')))
          .run();
        if (r.changes !== 1) throw new Conflict('The revision changed meanwhile; reload it.');
        moveProject(tx, e.projectId, 'withdraw_acceptance');
        addEvent(
          tx,
          e.projectId,
          'estimate_withdrawn',
          `The shop withdrew revision ${e.revision}: ${reason}`,
          owner.id,
        );
        queueMail(
          tx,
          client.email,
          withdrawnMail(shop.shopName, client.name, e.revision, reason, `${portalUrl}/projects/${e.projectId}`),
        );
      });
      return view(owner, row(id));
    },
  };
}
export type EstimatesService = ReturnType<typeof createEstimatesService>;

const fmt = (c: number) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(c / 100);
