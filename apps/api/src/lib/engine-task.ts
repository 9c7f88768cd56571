/**
 * What the engine's worker threads run (lib/engine-pool.ts bundles this file
 * for them). Pure work on plain data: the caller reads the price
 * book and settings from the database and passes them in, so a worker never
 * opens the database.
 */
import type { MessagePort } from 'node:worker_threads';
import { MAX_PARTS, type ApiIssue } from '@benchwright/contracts';
import {
  cutList,
  estimate,
  rangeOf,
  toSvg,
  traveller,
  type BuildSpec,
  type Estimate,
  type PriceBook,
  type ShopSettings,
  type Traveller,
  validateSpec,
  type StageKey,
} from '@benchwright/pricing';

export interface EngineItem {
  spec: BuildSpec;
  quantity: number;
}

/** Items as a request gives them (already through the request schema), to check against the price book. */
export interface RequestItem {
  spec: unknown;
  quantity: number;
}

export type EngineTask =
  | { kind: 'ping' }
  | { kind: 'check'; items: RequestItem[]; book: PriceBook; settings: ShopSettings }
  | { kind: 'preview'; items: RequestItem[]; book: PriceBook; settings: ShopSettings }
  | {
      kind: 'price';
      items: EngineItem[];
      book: PriceBook;
      settings: ShopSettings;
      /** the board's stage labels, for the labour lines */
      stageLabels?: Partial<Record<StageKey, string>>;
    };

export interface PreviewResult {
  budget: { lowCents: number; highCents: number };
  checks: { code: string; level: 'error' | 'warning' | 'caution'; message: string; clientMessage?: string }[];
  items: { drawingSvg: string; massKg: number }[];
  lines: Estimate['lines'];
  totals: Estimate['totals'];
  hoursByStage: Estimate['hoursByStage'];
  costCents: number;
  marginCents: number;
}

/** The whole result of pricing at 'thorough': the estimate (lines, totals, layouts with placements and cuts) and its traveller. */
export interface PricedResult {
  estimate: Estimate;
  traveller: Traveller;
}

/** A request the engine will not work on, with the reasons (the API answers 400 with them). */
export interface Refused {
  refused: { message: string; issues: ApiIssue[] };
}

export type EngineResult<T extends EngineTask> = T extends { kind: 'preview' }
  ? PreviewResult | Refused
  : T extends { kind: 'price' }
    ? PricedResult
    : T extends { kind: 'check' }
      ? { items: EngineItem[] } | Refused
      : 'pong';

/**
 * Checks a request's items against their designs and the price book, and the
 * work they ask for against the cap: at most MAX_PARTS parts in all (each
 * piece's cut list times its quantity; the cap on pieces is in the request
 * schema). Runs on a worker: parsing and checking 20 large items takes a few
 * hundred milliseconds on a busy machine.
 */
export function checkItems(
  items: RequestItem[],
  book: PriceBook,
  settings: ShopSettings,
): { items: EngineItem[] } | Refused {
  const issues: ApiIssue[] = [];
  const ok: EngineItem[] = [];
  items.forEach((item, i) => {
    const v = validateSpec(item.spec, book, settings);
    if (v.ok) ok.push({ spec: v.spec, quantity: item.quantity });
    else
      issues.push(
        ...v.issues.map((x) => ({ path: `items[${i}].spec${x.path ? `.${x.path}` : ''}`, message: x.message })),
      );
  });
  if (issues.length) return { refused: { message: 'Some items cannot be built as given.', issues } };
  const parts = ok.reduce(
    (sum, it) => sum + it.quantity * cutList(it.spec, book, settings).parts.reduce((s, p) => s + p.quantity, 0),
    0,
  );
  if (parts > MAX_PARTS)
    return {
      refused: {
        message: `That is more than the shop prices in one request: at most ${MAX_PARTS} parts.`,
        issues: [
          {
            path: 'items',
            message: `The shop prices at most ${MAX_PARTS} parts in one request, and these items come to ${parts}: split them into smaller requests.`,
          },
        ],
      },
    };
  return { items: ok };
}

export function preview(items: EngineItem[], book: PriceBook, settings: ShopSettings): PreviewResult {
  const e = estimate(items, book, settings, { effort: 'quick' });
  const budget = rangeOf(e.totals.totalCents, settings.budgetSpread);
  return {
    budget: { lowCents: budget.lowCents, highCents: budget.highCents },
    checks: e.checks.map((c) => ({
      code: c.code,
      level: c.level,
      message: c.message,
      ...(c.clientMessage ? { clientMessage: c.clientMessage } : {}),
    })),
    items: e.pieces.map((p) => ({ drawingSvg: toSvg(p.elevation), massKg: Math.round(p.massKg * 10) / 10 })),
    lines: e.lines,
    totals: e.totals,
    hoursByStage: e.hoursByStage,
    costCents: e.costCents,
    marginCents: e.marginCents,
  };
}

export function price(
  items: EngineItem[],
  book: PriceBook,
  settings: ShopSettings,
  stageLabels?: Partial<Record<StageKey, string>>,
): PricedResult {
  const e = estimate(items, book, settings, { effort: 'thorough', ...(stageLabels ? { stageLabels } : {}) });
  return { estimate: e, traveller: traveller(e, book, settings) };
}

/** Piscina's entry: says it has started (the pool's clock for the time limit starts then), then works. */
export default function run({ task, started }: { task: EngineTask; started: MessagePort }) {
  started.postMessage('started');
  started.close();
  switch (task.kind) {
    case 'ping':
      return 'pong';
    case 'check':
      return checkItems(task.items, task.book, task.settings);
    case 'preview': {
      const c = checkItems(task.items, task.book, task.settings);
      return 'refused' in c ? c : preview(c.items, task.book, task.settings);
    }
    case 'price':
      return price(task.items, task.book, task.settings, task.stageLabels);
  }
}
