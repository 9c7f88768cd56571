import { desc, eq, isNull } from 'drizzle-orm';
import {
  choicesOf,
  STAGE_KEYS,
  type Choice,
  type Estimate,
  type LengthUnit,
  type PriceBook,
  type ShopSettings,
  type StageKey,
  type Traveller,
} from '@benchwright/pricing';
import type { Db } from '../db/client';
import { estimates, jobLayouts, revisionRecords } from '../db/schema';
import type { EnginePool } from './engine-pool';
import type { EngineItem, PricedResult } from './engine-task';

/** The traveller as the API gives it: the engine's paper and the length unit it is drawn in. */
export type TravellerPaper = Traveller & { units: LengthUnit };

/**
 * The revision of record: everything the engine said when the revision was
 * priced, and what it was priced with. Written once; the estimate's view and
 * PDF, the owner's layouts panel, the job's traveller and its PDF and the
 * job's hour budget are all read from it, so the paper the builder cuts from
 * is the one the client accepted, whatever the price book says later.
 */
export interface RevisionRecord {
  kind: 'revision';
  /** when the engine priced it (ISO) */
  pricedAt: string;
  /** true for a revision priced before records were kept: its record was made on first read, with that day's book */
  backfilled?: boolean;
  items: EngineItem[];
  /** the price book and shop settings it was priced with, as they were */
  book: PriceBook;
  /** the price-book version that book was; absent in records made before versions were kept */
  priceBookVersion?: number;
  settings: ShopSettings;
  /** the engine's whole result: lines, totals, layouts with placements and cuts, pieces, checks, hours */
  estimate: Estimate;
  /** the shop paper, hours as budgeted (rounded as the job's budget is) */
  traveller: TravellerPaper;
  /**
   * each item's choices in plain words, as the book named them when it was priced; absent in records made before
   * they were kept and in backfilled ones (which would read a later book), which then show none
   */
  choices?: Choice[][];
}

/** A job laid out again with the stock of the day ("lay out again with today's stock"). */
export interface LayoutRecord {
  kind: 'relayout';
  laidOutAt: string;
  book: PriceBook;
  settings: ShopSettings;
  layouts: Estimate['layouts'];
  traveller: TravellerPaper;
}

/** Hours by stage rounded to the hundredth, as the revision and the job's budget keep them. */
export function roundedHours(h: Partial<Record<StageKey, number>>): Record<StageKey, number> {
  return Object.fromEntries(STAGE_KEYS.map((k) => [k, Math.round((h[k] ?? 0) * 100) / 100])) as Record<
    StageKey,
    number
  >;
}
export const totalOf = (h: Partial<Record<StageKey, number>>) =>
  Math.round(Object.values(h).reduce((s: number, x) => s + (x ?? 0), 0) * 100) / 100;

function paper(r: PricedResult, settings: ShopSettings): TravellerPaper {
  const hoursByStage = roundedHours(r.traveller.hoursByStage);
  return { ...r.traveller, hoursByStage, totalHours: totalOf(hoursByStage), units: settings.units };
}

/** Prices items at 'thorough' on the pool and makes the record of it. */
export async function priceRecord(
  pool: EnginePool,
  items: EngineItem[],
  book: PriceBook,
  settings: ShopSettings,
  priceBookVersion?: number,
  stageLabels?: Partial<Record<StageKey, string>>,
): Promise<RevisionRecord> {
  const r = await pool.run({ kind: 'price', items, book, settings, ...(stageLabels ? { stageLabels } : {}) });
  return {
    kind: 'revision',
    pricedAt: new Date().toISOString(),
    items,
    book,
    ...(priceBookVersion !== undefined ? { priceBookVersion } : {}),
    settings,
    estimate: r.estimate,
    traveller: paper(r, settings),
    choices: items.map((it) => choicesOf(it.spec, book, settings.units)),
  };
}

/**
 * Lays a job's items out again with today's book on the pool. `choices` are the accepted revision's: the
 * traveller's piece section keeps what the client chose, in the words of the book they accepted.
 */
export async function relayoutRecord(
  pool: EnginePool,
  items: EngineItem[],
  book: PriceBook,
  settings: ShopSettings,
  choices?: Choice[][],
): Promise<LayoutRecord> {
  const r = await pool.run({ kind: 'price', items, book, settings });
  const traveller = paper(r, settings);
  return {
    kind: 'relayout',
    laidOutAt: new Date().toISOString(),
    book,
    settings,
    layouts: r.estimate.layouts,
    traveller: {
      ...traveller,
      pieces: traveller.pieces.map(({ choices: _today, ...p }, i) =>
        choices?.[i] ? { ...p, choices: choices[i] } : p,
      ),
    },
  };
}

/** The latest layout made again for a job, if any. */
export function latestRelayout(db: Pick<Db, 'select'>, jobId: string) {
  return db
    .select()
    .from(jobLayouts)
    .where(eq(jobLayouts.jobId, jobId))
    .orderBy(desc(jobLayouts.createdAt))
    .limit(1)
    .get();
}

/** A revision's stored record, if it has one. */
/** The row that keeps a revision's record, with the units people read it in beside it. */
export function recordRow(estimateId: string, record: RevisionRecord) {
  return { estimateId, record, units: record.settings.units, choices: record.choices ?? [] };
}

/**
 * What the estimate view needs of a revision's record, read from its own columns: the units it was priced in
 * and the client's choices per item. The record itself (layouts, traveller, drawings) stays unread.
 */
export function recordView(
  db: Pick<Db, 'select'>,
  estimateId: string,
): { units: 'in' | 'mm'; choices: Choice[][] } | undefined {
  return db
    .select({ units: revisionRecords.units, choices: revisionRecords.choices })
    .from(revisionRecords)
    .where(eq(revisionRecords.estimateId, estimateId))
    .get();
}

export function storedRecord(db: Pick<Db, 'select'>, estimateId: string): RevisionRecord | undefined {
  return db
    .select({ record: revisionRecords.record })
    .from(revisionRecords)
    .where(eq(revisionRecords.estimateId, estimateId))
    .get()?.record;
}

/** A revision's record; one priced before records were kept gets one now, once (the only time a stored revision is priced again). */
export async function recordOf(
  db: Db,
  pool: EnginePool,
  row: typeof estimates.$inferSelect,
  load: () => { items: EngineItem[]; book: PriceBook; settings: ShopSettings },
): Promise<RevisionRecord> {
  const stored = storedRecord(db, row.id);
  if (stored) return stored;
  const { items, book, settings } = load();
  // no choices: they would be read from that day's book, not the one the revision was priced with
  const { choices: _today, ...priced } = await priceRecord(pool, items, book, settings);
  const record = { ...priced, backfilled: true };
  db.insert(revisionRecords).values(recordRow(row.id, record)).onConflictDoNothing().run();
  return storedRecord(db, row.id)!;
}

/**
 * Gives every revision priced before records were kept its record, one at a
 * time on the pool (index.ts runs it in the background after start-up), so
 * that the routes find one ready; `recordOf` covers a read that comes first.
 */
export async function backfillRecords(
  db: Db,
  pool: EnginePool,
  load: (projectId: string) => { items: EngineItem[]; book: PriceBook; settings: ShopSettings },
): Promise<number> {
  const missing = db
    .select()
    .from(estimates)
    .leftJoin(revisionRecords, eq(revisionRecords.estimateId, estimates.id))
    .where(isNull(revisionRecords.estimateId))
    .all()
    .map((r) => r.estimates);
  for (const row of missing) await recordOf(db, pool, row, () => load(row.projectId));
  return missing.length;
}
