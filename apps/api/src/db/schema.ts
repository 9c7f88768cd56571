import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ESTIMATE_STATUSES, PROJECT_STATUSES, STAGE_KEYS } from '@benchwright/contracts';
import { LINE_GROUPS, type Choice, type ShopSettings, type StageKey } from '@benchwright/pricing';
import type { LayoutRecord, RevisionRecord } from '../lib/record';

/**
 * A mail's attachment: a file by its path relative to the PDF folder, or small bytes kept in the row (base64), such as
 * a progress photo's thumbnail shown inline by its `cid`.
 */
export type MailAttachment =
  | { filename: string; path: string; contentType: string; cid?: string }
  | { filename: string; content: string; contentType: string; cid: string };

const now = sql`(unixepoch() * 1000)`;
/** `CASE status WHEN 'requested' THEN 0 ... END`, in the order of PROJECT_STATUSES */
const STATUS_RANK = sql.raw(
  `(CASE "status" ${PROJECT_STATUSES.map((st, i) => `WHEN '${st}' THEN ${i}`).join(' ')} END)`,
);
const createdAt = () => integer({ mode: 'timestamp_ms' }).notNull().default(now);

export const users = sqliteTable(
  'users',
  {
    id: text().primaryKey(),
    email: text().notNull().unique(),
    name: text().notNull(),
    role: text({ enum: ['client', 'owner', 'builder'] }).notNull(),
    /** null for a builder who has not yet accepted the invitation */
    passwordHash: text(),
    emailVerifiedAt: integer({ mode: 'timestamp_ms' }),
    /** a client's contact details, as the owner took them down */
    phone: text().notNull().default(''),
    address: text().notNull().default(''),
    /** a new address asked for on the account page: it replaces `email` only when its link is followed */
    pendingEmail: text(),
    createdAt: createdAt(),
  },
  // the project list sorted by client; the clients list sorted by name (keyset on name without case, then id)
  (t) => [
    index('users_name').on(t.name, t.id),
    index('users_role_name_nocase').on(t.role, sql`${t.name} collate nocase`, t.id),
  ],
);

/**
 * Lucia's session table: expires_at is an integer of seconds (sliding). created_at (ms) bounds the session's whole
 * life (SESSION_MAX_DAYS) however active it is; it is set on sign-in, and the sessions older than the column (0) are
 * over.
 */
export const sessions = sqliteTable('sessions', {
  id: text().primaryKey(),
  userId: text()
    .notNull()
    .references(() => users.id, { onDelete: 'cascade' }),
  expiresAt: integer().notNull(),
  createdAt: integer({ mode: 'timestamp_ms' })
    .notNull()
    .default(sql`0`),
  /** the browser's User-Agent at sign-in, cut to 300 characters: shown on the account page */
  userAgent: text().notNull().default(''),
  /** the last request made with the session, written at most once a minute */
  lastSeenAt: integer({ mode: 'timestamp_ms' })
    .notNull()
    .default(sql`0`),
});

/** Single-use, expiring tokens, stored as SHA-256 hashes only. */
export const tokens = sqliteTable(
  'tokens',
  {
    id: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text({ enum: ['verify_email', 'reset_password', 'invitation', 'change_email'] }).notNull(),
    tokenHash: text().notNull().unique(),
    expiresAt: integer({ mode: 'timestamp_ms' }).notNull(),
    usedAt: integer({ mode: 'timestamp_ms' }),
    createdAt: createdAt(),
  },
  (t) => [index('tokens_user_kind').on(t.userId, t.kind)],
);

/** One row: the shop's profile and the engine's ShopSettings (validated by its zod schema). */
export const shopSettings = sqliteTable('shop_settings', {
  id: integer().primaryKey(),
  shopName: text().notNull(),
  address: text().notNull().default(''),
  email: text().notNull().default(''),
  phone: text().notNull().default(''),
  settings: text({ mode: 'json' }).$type<ShopSettings>().notNull(),
  /** optimistic locking: a save must name the version it read */
  version: integer().notNull().default(1),
  /** the logo as a PNG, relative to PDF_DIR (old ones stay: queued mail may still point at them) */
  logoPath: text(),
  updatedAt: createdAt(),
});

/**
 * Before the price book became rows: one row holding the whole engine PriceBook document. Kept only so that a
 * database from then can be moved over at start-up (src/db/price-book-move.ts), which empties it.
 */
export const priceBooks = sqliteTable('price_books', {
  id: integer().primaryKey(),
  book: text({ mode: 'json' }).$type<Record<string, unknown>>().notNull(),
  updatedAt: createdAt(),
});

/**
 * A price-book kind's items, a row each. The item itself is the engine's zod schema of its kind (price-book.ts),
 * stored whole as JSON and parsed with that schema on every write and read, so the engine stays the single
 * description of an item; id and name are copied out for ordering and look-up. Retired items are kept (estimates
 * name them) and hidden from new choices.
 */
function priceItemTable<N extends string>(name: N) {
  return sqliteTable(name, {
    id: text().primaryKey(),
    name: text().notNull(),
    position: integer().notNull(),
    item: text({ mode: 'json' }).$type<Record<string, unknown>>().notNull(),
    retiredAt: integer({ mode: 'timestamp_ms' }),
    updatedAt: createdAt(),
  });
}
export const priceSheetGoods = priceItemTable('price_sheet_goods');
export const priceLumber = priceItemTable('price_lumber');
export const priceEdgeBanding = priceItemTable('price_edge_banding');
export const priceHardware = priceItemTable('price_hardware');
export const priceFinishes = priceItemTable('price_finishes');
export const priceLabourOperations = priceItemTable('price_labour_operations');

/**
 * Every change to the price book is a new version: its number, when, who, what changed, the book's metadata, and
 * a snapshot of every kind's rows as they stood after it (src/lib/price-book.ts `PriceBookSnapshot`), so any
 * version's book can be read back.
 */
export const priceBookVersions = sqliteTable('price_book_versions', {
  number: integer().primaryKey(),
  createdAt: createdAt(),
  /** null for the seed and the start-up move */
  userId: text().references(() => users.id),
  summary: text().notNull(),
  currency: text({ enum: ['USD'] }).notNull(),
  note: text().notNull().default(''),
  snapshot: text({ mode: 'json' }).$type<Record<string, unknown>>().notNull(),
});

export const projects = sqliteTable(
  'projects',
  {
    id: text().primaryKey(),
    clientId: text()
      .notNull()
      .references(() => users.id),
    status: text({ enum: PROJECT_STATUSES }).notNull().default('requested'),
    notes: text().notNull().default(''),
    createdAt: createdAt(),
    updatedAt: createdAt(),
    /**
     * The total of the latest revision (the owner's view) and of the latest revision sent (a client's), kept by
     * triggers on `estimates` (migration 0005) so that the list sorts by total on an index; 0 while there is none.
     */
    latestTotalCents: integer().notNull().default(0),
    sentTotalCents: integer().notNull().default(0),
    /** the status's place in the lifecycle, for sorting the list by status in that order */
    statusRank: integer().generatedAlwaysAs(STATUS_RANK, { mode: 'virtual' }),
  },
  // one index per sort of GET /api/projects (id breaks ties, so the keyset is total), the status filter with the
  // default sort, and a client's own list
  (t) => [
    index('projects_client_created').on(t.clientId, t.createdAt, t.id),
    // sorted by client: users by name (users_name), then each client's projects by id
    index('projects_client_id').on(t.clientId, t.id),
    // the clients list: a client's latest project change (last activity)
    index('projects_client_updated').on(t.clientId, t.updatedAt),
    index('projects_status_created').on(t.status, t.createdAt, t.id),
    index('projects_created').on(t.createdAt, t.id),
    index('projects_updated').on(t.updatedAt, t.id),
    index('projects_status_rank').on(t.statusRank, t.id),
    index('projects_latest_total').on(t.latestTotalCents, t.id),
    index('projects_sent_total').on(t.sentTotalCents, t.id),
  ],
);

export const projectItems = sqliteTable(
  'project_items',
  {
    id: text().primaryKey(),
    projectId: text()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    position: integer().notNull(),
    spec: text({ mode: 'json' }).notNull(),
    quantity: integer().notNull(),
    /**
     * the spec's design slug, kept by the database itself (triggers in migration 0013 set it from `spec` on every
     * insert and spec update), so the project list names the items without parsing each spec; never written by code
     */
    design: text().notNull().default(''),
  },
  (t) => [index('project_items_project').on(t.projectId, t.position)],
);

/**
 * Files attached to a project. `fileName` is the uploaded name, kept as display text only; the bytes live under
 * random names in UPLOADS_DIR, and the paths here are relative to it.
 */
export const uploads = sqliteTable(
  'uploads',
  {
    id: text().primaryKey(),
    projectId: text()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    uploaderId: text()
      .notNull()
      .references(() => users.id),
    fileName: text().notNull(),
    /** read from the bytes, never from the request */
    mimeType: text().notNull(),
    kind: text({ enum: ['image', 'pdf'] })
      .notNull()
      .default('image'),
    /** the stored (re-encoded) file's size */
    sizeBytes: integer().notNull(),
    storagePath: text().notNull(),
    /** images only: a small WebP */
    thumbnailPath: text(),
    /** a progress photo: the job's stage when it was added */
    stageKey: text(),
    createdAt: createdAt(),
  },
  (t) => [index('uploads_project').on(t.projectId)],
);

export const estimates = sqliteTable(
  'estimates',
  {
    id: text().primaryKey(),
    projectId: text()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    revision: integer().notNull(),
    status: text({ enum: ESTIMATE_STATUSES }).notNull().default('draft'),
    /** optimistic locking: every edit must name the version it read */
    version: integer().notNull().default(1),
    subtotalCents: integer().notNull().default(0),
    discountCents: integer().notNull().default(0),
    taxCents: integer().notNull().default(0),
    totalCents: integer().notNull().default(0),
    depositCents: integer().notNull().default(0),
    balanceCents: integer().notNull().default(0),
    hoursByStage: text({ mode: 'json' }).$type<Partial<Record<StageKey, number>>>().notNull().default({}),
    /** the engine's layouts, drawings and checks, kept with the revision */
    engine: text({ mode: 'json' }),
    validUntil: integer({ mode: 'timestamp_ms' }),
    sentAt: integer({ mode: 'timestamp_ms' }),
    acceptedAt: integer({ mode: 'timestamp_ms' }),
    acceptedName: text(),
    acceptedIp: text(),
    acceptedUserAgent: text(),
    pdfPath: text(),
    /** the price-book version the revision was priced with; null for revisions priced before versions were kept */
    priceBookVersion: integer(),
    createdAt: createdAt(),
    updatedAt: createdAt(),
  },
  (t) => [uniqueIndex('estimates_project_revision').on(t.projectId, t.revision)],
);

/**
 * The revision of record (lib/record.ts): the engine's whole result, its traveller and the price book and
 * settings it used, written once when the revision is priced and never changed (a few hundred kilobytes, so
 * kept apart from the estimates rows that lists read). A revision priced before records were kept gets its
 * row on first read.
 */
export const revisionRecords = sqliteTable('revision_records', {
  estimateId: text()
    .primaryKey()
    .references(() => estimates.id, { onDelete: 'cascade' }),
  record: text({ mode: 'json' }).$type<RevisionRecord>().notNull(),
  /**
   * the record's `settings.units`, kept apart so the estimate view reads its units without loading the whole
   * record; written with the record (`recordRow` in lib/record.ts), never changed
   */
  units: text({ enum: ['in', 'mm'] })
    .notNull()
    .default('in'),
  /** the record's `choices` (the client's choices per item, in plain words), kept apart for the same reason */
  choices: text({ mode: 'json' })
    .$type<Choice[][]>()
    .notNull()
    .default(sql`'[]'`),
  createdAt: createdAt(),
});

export const estimateLines = sqliteTable('estimate_lines', {
  id: text().primaryKey(),
  estimateId: text()
    .notNull()
    .references(() => estimates.id, { onDelete: 'cascade' }),
  position: integer().notNull(),
  group: text({ enum: LINE_GROUPS }).notNull(),
  description: text().notNull(),
  quantity: real().notNull(),
  unit: text().notNull(),
  unitPriceCents: integer().notNull(),
  amountCents: integer().notNull(),
  costCents: integer().notNull(),
  source: text({ enum: ['computed', 'manual'] }).notNull(),
  overrideReason: text(),
});

export const payments = sqliteTable(
  'payments',
  {
    id: text().primaryKey(),
    projectId: text()
      .notNull()
      .references(() => projects.id),
    estimateId: text().references(() => estimates.id),
    kind: text({ enum: ['deposit', 'balance'] }).notNull(),
    status: text({ enum: ['open', 'paid', 'expired', 'refunded', 'partially_refunded'] })
      .notNull()
      .default('open'),
    amountCents: integer().notNull(),
    refundedCents: integer().notNull().default(0),
    attempt: integer().notNull().default(1),
    stripeSessionId: text().unique(),
    stripePaymentIntentId: text(),
    checkoutUrl: text(),
    createdAt: createdAt(),
    updatedAt: createdAt(),
  },
  // the payments page, latest first; a project's payments
  (t) => [index('payments_created').on(t.createdAt, t.id), index('payments_project').on(t.projectId)],
);

/** Every Stripe event id once: a redelivered event is recognised and ignored. */
export const stripeEvents = sqliteTable('stripe_events', {
  id: text().primaryKey(),
  type: text().notNull(),
  receivedAt: createdAt(),
});

export const stages = sqliteTable('stages', {
  key: text({ enum: STAGE_KEYS }).primaryKey(),
  label: text().notNull(),
  position: integer().notNull(),
});

export const jobs = sqliteTable(
  'jobs',
  {
    id: text().primaryKey(),
    projectId: text()
      .notNull()
      .unique()
      .references(() => projects.id),
    stageKey: text({ enum: STAGE_KEYS })
      .notNull()
      .references(() => stages.key),
    position: integer().notNull().default(0),
    builderId: text().references(() => users.id),
    dueDate: text(),
    hoursBudget: text({ mode: 'json' }).$type<Partial<Record<StageKey, number>>>().notNull().default({}),
    createdAt: createdAt(),
    updatedAt: createdAt(),
  },
  // the board: open jobs by stage; the delivered ones a page at a time, the latest first
  (t) => [index('jobs_stage_updated').on(t.stageKey, t.updatedAt, t.id)],
);

/** A job's sheets laid out again with the stock of the day (owner's action); the revision's own layout stays. */
export const jobLayouts = sqliteTable(
  'job_layouts',
  {
    id: text().primaryKey(),
    jobId: text()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    actorId: text().references(() => users.id),
    record: text({ mode: 'json' }).$type<LayoutRecord>().notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('job_layouts_job').on(t.jobId)],
);

/** A step of a job's stage checklist ticked off: who and when (unticking removes the row). */
export const jobChecks = sqliteTable(
  'job_checks',
  {
    jobId: text()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    itemKey: text().notNull(),
    userId: text()
      .notNull()
      .references(() => users.id),
    checkedAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.jobId, t.itemKey] })],
);

/**
 * Per stage, the owner's last answer to the hours suggestion (applied or dismissed) and the price-book version
 * the last applied one wrote: the stage then compares only jobs priced from that version on (and, after a
 * dismissal, delivered after it). See modules/hours/hours.service.ts.
 */
export const hoursFeedbackMarks = sqliteTable('hours_feedback_marks', {
  stageKey: text({ enum: STAGE_KEYS }).primaryKey(),
  action: text({ enum: ['applied', 'dismissed'] }).notNull(),
  userId: text()
    .notNull()
    .references(() => users.id),
  at: integer({ mode: 'timestamp_ms' }).notNull(),
  /** the price-book version the stage's last applied suggestion wrote; kept when a later one is dismissed */
  appliedVersion: integer(),
});

export const timeEntries = sqliteTable(
  'time_entries',
  {
    id: text().primaryKey(),
    jobId: text()
      .notNull()
      .references(() => jobs.id, { onDelete: 'cascade' }),
    userId: text()
      .notNull()
      .references(() => users.id),
    stageKey: text().notNull(),
    hours: real().notNull(),
    note: text().notNull().default(''),
    loggedAt: createdAt(),
  },
  (t) => [index('time_entries_job').on(t.jobId, t.stageKey)],
);

/** The project's timeline. */
export const projectEvents = sqliteTable(
  'project_events',
  {
    id: text().primaryKey(),
    projectId: text()
      .notNull()
      .references(() => projects.id, { onDelete: 'cascade' }),
    kind: text().notNull(),
    message: text().notNull(),
    actorId: text().references(() => users.id),
    /** `stage` events: the stage entered; `progress_photo` events: the stage the photo was taken in */
    stageKey: text({ enum: STAGE_KEYS }),
    /** `progress_photo` events: the photo (its row may since have been removed) */
    uploadId: text(),
    createdAt: createdAt(),
  },
  // a project's events; the latest of them for the clients list's last activity
  (t) => [
    index('project_events_project').on(t.projectId),
    index('project_events_project_created').on(t.projectId, t.createdAt),
  ],
);

export const comments = sqliteTable('comments', {
  id: text().primaryKey(),
  projectId: text()
    .notNull()
    .references(() => projects.id, { onDelete: 'cascade' }),
  authorId: text()
    .notNull()
    .references(() => users.id),
  body: text().notNull(),
  createdAt: createdAt(),
});

/** Mail waits here, written in the same transaction as the change that causes it; a worker sends it. */
export const outbox = sqliteTable(
  'outbox',
  {
    id: text().primaryKey(),
    /** the same Message-ID on every attempt, so a relay or client can drop a duplicate */
    messageId: text().notNull().unique(),
    to: text().notNull(),
    subject: text().notNull(),
    text: text().notNull(),
    html: text().notNull(),
    attachments: text({ mode: 'json' }).$type<MailAttachment[]>().notNull().default([]),
    status: text({ enum: ['pending', 'sent'] })
      .notNull()
      .default('pending'),
    attempts: integer().notNull().default(0),
    nextAttemptAt: integer({ mode: 'timestamp_ms' }).notNull().default(now),
    lastError: text(),
    createdAt: createdAt(),
    sentAt: integer({ mode: 'timestamp_ms' }),
  },
  (t) => [index('outbox_pending').on(t.status, t.nextAttemptAt)],
);

/**
 * Idempotency-Key records (middleware/idempotency.ts): the first answer to a creating request, per user and key, kept
 * 24 hours so that a retry gets the same answer instead of doing the work again. status is null while the first
 * request is being handled.
 */
export const idempotencyKeys = sqliteTable(
  'idempotency_keys',
  {
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    key: text().notNull(),
    /** SHA-256 of the method, path and body: the same key with another request is refused */
    requestHash: text().notNull(),
    status: integer(),
    body: text(),
    createdAt: integer({ mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.key] }), index('idempotency_keys_created').on(t.createdAt)],
);
