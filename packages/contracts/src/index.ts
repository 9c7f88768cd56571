import * as z from 'zod';
import { BuildSpec, LINE_GROUPS, type Drawing, type LineGroup } from '@benchwright/pricing/geometry';
import { multiLine, singleLine } from './text';
import { ESTIMATE_STATUSES, PROJECT_STATUSES, STAGE_KEYS, type EstimateStatus } from './lifecycle';

export { LINE_GROUPS, LINE_GROUP_LABELS, type LineGroup } from '@benchwright/pricing/geometry';
export { isPlainText, isSingleLine, multiLine, singleLine } from './text';
export * from './lifecycle';
export * from './project-list';
export * from './responses';
export * from './labels';
export { formatDate, formatDateTime } from './format';

/** Every error the API answers with (DESIGN.md section 10). */
export const ERROR_CODES = [
  'invalid_input',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'payload_too_large',
  'unsupported_media_type',
  'rate_limited',
  'internal',
  'unavailable',
  'busy',
  'too_complex',
] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];
export interface ApiIssue {
  path: string;
  message: string;
}
export interface ApiError {
  error: { code: ErrorCode; message: string; issues?: ApiIssue[] };
}

export const ROLES = ['client', 'owner', 'builder'] as const;
export type Role = (typeof ROLES)[number];

export const PASSWORD_MIN = 10;
const email = z
  .string({ error: 'enter your e-mail address' })
  .trim()
  .toLowerCase()
  .pipe(z.email('enter a valid e-mail address').max(254, 'use at most 254 characters'));
const password = z
  .string()
  .min(PASSWORD_MIN, `use at least ${PASSWORD_MIN} characters`)
  .max(200, 'use at most 200 characters');
const name = singleLine().min(1, 'enter your name').max(120, 'use at most 120 characters');
const token = z.string().min(16, 'this link is not valid').max(200, 'this link is not valid');

export const SignUpBody = z.object({ email, password, name });
export type SignUpBody = z.input<typeof SignUpBody>;
export const SignInBody = z.object({ email, password: z.string().min(1, 'enter your password').max(200) });
export type SignInBody = z.input<typeof SignInBody>;
export const VerifyEmailBody = z.object({ token });
export const ForgotPasswordBody = z.object({ email });
export type ForgotPasswordBody = z.input<typeof ForgotPasswordBody>;
export const ResetPasswordBody = z.object({ token, password });
export type ResetPasswordBody = z.input<typeof ResetPasswordBody>;
export const InvitationBody = z.object({ email, name });
export type InvitationBody = z.input<typeof InvitationBody>;
export const AcceptInvitationBody = z.object({ token, password });
export type AcceptInvitationBody = z.input<typeof AcceptInvitationBody>;

/** The account page: a new name. */
export const UpdateAccountBody = z.object({ name });
export type UpdateAccountBody = z.input<typeof UpdateAccountBody>;
const currentPassword = z.string().min(1, 'enter your current password').max(200, 'use at most 200 characters');
/** A new e-mail address: it takes effect when the link mailed to it is followed. */
export const ChangeEmailBody = z.object({ email, currentPassword });
export type ChangeEmailBody = z.input<typeof ChangeEmailBody>;
export const ConfirmEmailChangeBody = z.object({ token });
/** A new password: the current one is asked for, and the account's other sessions end. */
export const ChangePasswordBody = z
  .object({ currentPassword, newPassword: password })
  .refine((b) => b.currentPassword !== b.newPassword, {
    path: ['newPassword'],
    message: 'choose a password other than the current one',
  });
export type ChangePasswordBody = z.input<typeof ChangePasswordBody>;

/** One signed-in browser. `id` is a digest of the session, never the session's own secret id. */
export const AccountSession = z.object({
  id: z.string(),
  createdAt: z.string(),
  lastSeenAt: z.string().nullable(),
  userAgent: z.string(),
  current: z.boolean(),
});
export type AccountSession = z.infer<typeof AccountSession>;
export const AccountSessionsResponse = z.object({ sessions: z.array(AccountSession) });

export const User = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  emailVerified: z.boolean(),
});
export type User = z.infer<typeof User>;
/** The account page's subject: the user and the address waiting for its link, if any. */
export const Account = User.extend({ pendingEmail: z.string().nullable() });
export type Account = z.infer<typeof Account>;
export const AccountResponse = z.object({ account: Account });

export const ItemInput = z.object({
  spec: BuildSpec,
  quantity: z.number().int('enter a whole number').min(1, 'at least 1').max(50, 'at most 50'),
});
/**
 * The most work one request may ask of the engine: pieces (the sum of the
 * items' quantities) here; parts (counted from the cut list, which needs the
 * price book) by the API before pricing.
 */
export const MAX_PIECES = 40;
export const MAX_PARTS = 2000;
const Items = z
  .array(ItemInput)
  .min(1, 'add at least one item')
  .max(20, 'at most 20 items')
  .refine((items) => items.reduce((s, i) => s + (Number.isFinite(i.quantity) ? i.quantity : 0), 0) <= MAX_PIECES, {
    error: (iss) =>
      `at most ${MAX_PIECES} pieces in one request; these items add up to ${(iss.input as { quantity: number }[]).reduce((s, i) => s + i.quantity, 0)}`,
  });
export const QuotePreviewBody = z.object({ items: Items });
export type QuotePreviewBody = z.input<typeof QuotePreviewBody>;
export const CreateProjectBody = z.object({
  /** the owner only: the client the project is started for (403 from anyone else) */
  clientId: z.string().min(1).max(64).optional(),
  items: Items,
  notes: multiLine().max(4000, 'use at most 4000 characters').default(''),
});
export type CreateProjectBody = z.input<typeof CreateProjectBody>;
/** A comment on a project, from its client or the owner; it goes on the timeline and by e-mail to the other side. */
export const CommentBody = z.object({
  message: multiLine().min(1, 'write a comment first').max(2000, 'use at most 2000 characters'),
});
export type CommentBody = z.input<typeof CommentBody>;

/** Response schemas: the API's tests parse what it answers with these; the apps read the inferred types. */
export const Totals = z.object({
  subtotalCents: z.number().int(),
  discountCents: z.number().int(),
  taxCents: z.number().int(),
  totalCents: z.number().int(),
  depositCents: z.number().int(),
  balanceCents: z.number().int(),
});
export const EstimateSummary = z.object({
  id: z.string(),
  revision: z.number().int().min(1),
  status: z.enum(ESTIMATE_STATUSES),
  totals: Totals,
});
export type EstimateSummary = z.infer<typeof EstimateSummary>;
export const TimelineEvent = z.object({
  id: z.string(),
  kind: z.string(),
  message: z.string(),
  /** who did it, when a person did (a comment's author) */
  by: z.string().nullable(),
  at: z.iso.datetime(),
  /** stage news and progress photos: the stage's key */
  stage: z.enum(STAGE_KEYS).optional(),
  /** progress photos (upload ids): the photo of a `progress_photo` event, or, for the client, those under stage news */
  photos: z.array(z.string()).optional(),
});
export type TimelineEvent = z.infer<typeof TimelineEvent>;
/** Files a project accepts (`POST /api/projects/:id/uploads`, multipart field `file`): the type is read from the bytes. */
export const UPLOAD_MAX_BYTES = 15 * 1024 * 1024;
export const UPLOADS_PER_PROJECT = 30;
export const UPLOAD_MIME_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'application/pdf'] as const;
export const UPLOAD_KINDS = ['image', 'pdf'] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];
/** The optional text fields of an upload: `purpose: 'progress'` records the job's current stage (shop staff). */
export const UploadFields = z.object({
  purpose: z.enum(['attachment', 'progress']).default('attachment'),
});
/** One file attached to a project, as the project lists it. */
export const UploadSummary = z.object({
  id: z.string(),
  /** the uploaded name, display text only */
  name: z.string(),
  kind: z.enum(UPLOAD_KINDS),
  mimeType: z.string(),
  sizeBytes: z.number().int(),
  /** who attached it */
  by: z.object({ id: z.string(), name: z.string() }),
  /** the job's stage for a progress photo, else null */
  stageKey: z.string().nullable(),
  at: z.iso.datetime(),
});
export type UploadSummary = z.infer<typeof UploadSummary>;
export const Project = z.object({
  id: z.string(),
  status: z.enum(PROJECT_STATUSES),
  notes: z.string(),
  client: z.object({ id: z.string(), name: z.string() }),
  items: z.array(z.object({ id: z.string(), spec: z.unknown(), quantity: z.number().int() })),
  /** none for a builder: a builder sees no money */
  estimates: z.array(EstimateSummary),
  /** cut per viewer by the API's timelineFor */
  timeline: z.array(TimelineEvent),
  /** files attached to the project, oldest first */
  uploads: z.array(UploadSummary),
  createdAt: z.iso.datetime(),
});
export type Project = z.infer<typeof Project>;
/** `GET /api/projects/:id`, `POST /api/projects`, `POST /api/projects/:id/comments` */
export const ProjectResponse = z.object({ project: Project });
/** One piece of a project as a list shows it: the design's slug and name, and how many. */
export const ItemSummary = z.object({ design: z.string(), name: z.string(), quantity: z.number().int() });
/**
 * A project in a list (`GET /api/projects`): no timeline, no specs. `latestEstimate` is the latest revision the
 * viewer may see (a client: the latest sent; a builder: none).
 */
export const ProjectSummary = z.object({
  id: z.string(),
  status: z.enum(PROJECT_STATUSES),
  notes: z.string(),
  client: z.object({ id: z.string(), name: z.string() }),
  items: z.array(ItemSummary),
  latestEstimate: EstimateSummary.nullable(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
});
export type ProjectSummary = z.infer<typeof ProjectSummary>;
/** `GET /api/projects`: a page; `nextCursor` is null on the last one. */
export const ProjectsResponse = z.object({ projects: z.array(ProjectSummary), nextCursor: z.string().nullable() });
export type ProjectsResponse = z.infer<typeof ProjectsResponse>;

/** `GET /api/lead-time?hours=N`: when a job of N hours could start and finish, from the board and the shop's capacity. */
export const LeadTimeQuery = z.object({
  hours: z.coerce.number('give the job’s hours').min(0, 'at least 0 hours').max(10_000, 'at most 10000 hours'),
});
export interface LeadTimeView {
  /** week 1 is this week */
  startWeek: number;
  finishWeek: number;
  /** the Monday of the start week and the Friday of the finish week, as dates (YYYY-MM-DD) */
  startDate: string;
  finishDate: string;
}
export interface Design {
  slug: string;
  name: string;
  summary: string;
  defaults: unknown;
  limits: Record<string, [number, number]>;
  /** the choices for each field, keyed by the spec field's dotted path (`carcassMaterialId`, `top.skinMaterialId`) */
  options: Record<string, DesignOption[]>;
  /** the shop's units: the configurator starts in them (lengths, and a load in lb or kg) */
  units: 'in' | 'mm';
}
/** One thing a client may pick for a field: a price-book item by its plain name, with a short note; no cost. */
export interface DesignOption {
  id: string;
  name: string;
  note?: string;
  thicknessMm?: number;
}
export interface QuotePreview {
  budget: { lowCents: number; highCents: number };
  checks: { code: string; level: 'error' | 'warning' | 'caution'; message: string }[];
  items: { drawingSvg: string; massKg: number }[];
  /** the request's shop hours, all stages (for the lead time; not a price) */
  hours: number;
  /** owner only */
  lines?: unknown[];
  totals?: EstimateSummary['totals'];
}

export const CreateEstimateBody = z.object({ source: z.enum(['engine', 'copy']).default('engine') });
export const EstimateLineInput = z.object({
  id: z.string().max(64).optional(),
  group: z.enum(LINE_GROUPS),
  description: singleLine().min(1, 'describe the line').max(300),
  quantity: z.number().min(0, 'at least 0').max(100000),
  unit: singleLine().min(1).max(20),
  unitPriceCents: z.number().int('whole cents').min(-10_000_000).max(100_000_000),
  costCents: z.number().int().min(0).max(100_000_000).optional(),
  overrideReason: singleLine().max(500).nullable().optional(),
});
export const UpdateEstimateBody = z.object({
  version: z.number().int().min(1),
  lines: z.array(EstimateLineInput).max(300).optional(),
  discountCents: z.number().int().min(0).max(100_000_000).optional(),
});
export type UpdateEstimateBody = z.input<typeof UpdateEstimateBody>;
export const AcceptEstimateBody = z.object({
  acceptedName: singleLine().min(2, 'type your full name to accept').max(120),
});
/** The owner takes back an accepted revision (before any deposit); the reason goes on the timeline and to the client. */
export const WithdrawEstimateBody = z.object({
  reason: z.string().trim().min(3, 'say why the revision is withdrawn').max(500, 'use at most 500 characters'),
});
export type WithdrawEstimateBody = z.input<typeof WithdrawEstimateBody>;
export const RefundBody = z.object({
  amountCents: z.number().int().min(1, 'at least 1 cent').max(100_000_000).optional(),
});
/** The portal's return from Checkout: the session id Stripe put in `success_url`. */
export const ConfirmPaymentBody = z.object({
  sessionId: z
    .string()
    .min(1, 'the checkout session id is missing')
    .max(255)
    .regex(/^cs_\w+$/, 'a checkout session id (cs_...)'),
});
export type ConfirmPaymentBody = z.input<typeof ConfirmPaymentBody>;
export const UpdateJobBody = z
  .object({
    stageKey: z.enum(STAGE_KEYS).optional(),
    position: z.number().int().min(0).max(10000).optional(),
    builderId: z.string().max(64).nullable().optional(),
    dueDate: z.iso.date('use a date like 2026-12-24').nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'change at least one of stageKey, position, builderId, dueDate');
export const LogTimeBody = z.object({
  stageKey: z.enum(STAGE_KEYS),
  hours: z.number().gt(0, 'more than 0 hours').max(24, 'at most 24 hours at a time'),
  note: multiLine().max(500).default(''),
});

/** A board stage named in a path. */
export const StageParam = z.enum(STAGE_KEYS, 'Name a stage of the board.');

/**
 * `POST /api/hours-feedback/:stage/apply`: the price-book version the owner saw the suggestion against (409 if the
 * book changed since).
 */
export const ApplyHoursBody = z.object({
  version: z.number('Send the price-book version you saw.').int().min(1, 'Send the price-book version you saw.'),
});
export type ApplyHoursBody = z.infer<typeof ApplyHoursBody>;

/** `PUT /api/jobs/:id/checks/:key`: a step of the stage checklist ticked or unticked. */
export const CheckBody = z.object({ done: z.boolean() });
export const CheckKey = z
  .string()
  .regex(/^[a-z_]+\.[a-z-]+$/, 'Name a step of the checklist.')
  .max(80);

/** `GET /api/estimates/:id`: what a client sees; the owner also gets the fields marked owner. */
export interface EstimateView {
  id: string;
  projectId: string;
  number: string;
  revision: number;
  status: EstimateStatus;
  /** the shop's units: what the figures a person reads are written in */
  units: 'in' | 'mm';
  /** a superseded revision: the revision sent after it */
  replacedBy: number | null;
  version: number;
  /** owner: the price-book version the revision was priced with (null before versions were kept) */
  priceBookVersion?: number | null;
  validUntil: string | null;
  sentAt: string | null;
  acceptedAt: string | null;
  acceptedName: string | null;
  lines: {
    id: string;
    group: LineGroup;
    description: string;
    quantity: number;
    unit: string;
    unitPriceCents: number;
    amountCents: number;
    source: 'computed' | 'manual';
    /** owner */ costCents?: number;
    /** owner */ overrideReason?: string | null;
  }[];
  totals: EstimateSummary['totals'];
  drawings: Drawing[];
  /** per item, the client's choices in plain words as the revision was priced (none for one recorded before) */
  choices: { label: string; value: string }[][];
  checks: { code: string; level: 'error' | 'warning' | 'caution'; message: string }[];
  /** owner */
  hoursByStage?: Record<string, number>;
  /** owner */
  layouts?: { materialId: string; materialName: string; sheetCount: number; lowerBound: number; yieldRatio: number }[];
  /** owner */
  costCents?: number;
}
export * from './price-book';
export * from './settings';
export * from './clients';
