import * as z from 'zod';
import { BuildSpec, LINE_GROUPS, type Drawing, type LineGroup } from '@benchwright/pricing/geometry';

export { LINE_GROUPS, LINE_GROUP_LABELS, type LineGroup } from '@benchwright/pricing/geometry';

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
const name = z.string().trim().min(1, 'enter your name').max(120, 'use at most 120 characters');
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

export const User = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(ROLES),
  emailVerified: z.boolean(),
});
export type User = z.infer<typeof User>;

export const ItemInput = z.object({
  spec: BuildSpec,
  quantity: z.number().int('enter a whole number').min(1, 'at least 1').max(50, 'at most 50'),
});
export const QuotePreviewBody = z.object({
  items: z.array(ItemInput).min(1, 'add at least one item').max(20, 'at most 20 items'),
});
export type QuotePreviewBody = z.input<typeof QuotePreviewBody>;
export const CreateProjectBody = z.object({
  items: z.array(ItemInput).min(1, 'add at least one item').max(20, 'at most 20 items'),
  notes: z.string().max(4000, 'use at most 4000 characters').default(''),
});
export type CreateProjectBody = z.input<typeof CreateProjectBody>;
/** A comment on a project, from its client or the owner; it goes on the timeline and by e-mail to the other side. */
export const CommentBody = z.object({
  message: z.string().trim().min(1, 'write a comment first').max(2000, 'use at most 2000 characters'),
});
export type CommentBody = z.input<typeof CommentBody>;

export const PROJECT_STATUSES = [
  'requested',
  'estimating',
  'estimate_sent',
  'accepted',
  'deposit_paid',
  'in_production',
  'ready',
  'delivered',
  'closed',
  'declined',
  'expired',
  'cancelled',
] as const;
export type ProjectStatus = (typeof PROJECT_STATUSES)[number];
export const ESTIMATE_STATUSES = ['draft', 'sent', 'accepted', 'superseded', 'expired'] as const;
export type EstimateStatus = (typeof ESTIMATE_STATUSES)[number];

export interface EstimateSummary {
  id: string;
  revision: number;
  status: EstimateStatus;
  totals: {
    subtotalCents: number;
    discountCents: number;
    taxCents: number;
    totalCents: number;
    depositCents: number;
    balanceCents: number;
  };
}
export interface TimelineEvent {
  id: string;
  kind: string;
  message: string;
  /** who did it, when a person did (a comment's author) */
  by: string | null;
  at: string;
}
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
export interface UploadSummary {
  id: string;
  /** the uploaded name, display text only */
  name: string;
  kind: UploadKind;
  mimeType: string;
  sizeBytes: number;
  /** who attached it */
  by: { id: string; name: string };
  /** the job's stage for a progress photo, else null */
  stageKey: string | null;
  at: string;
}
export interface Project {
  id: string;
  status: ProjectStatus;
  notes: string;
  client: { id: string; name: string };
  items: { id: string; spec: unknown; quantity: number }[];
  estimates: EstimateSummary[];
  timeline: TimelineEvent[];
  /** files attached to the project, oldest first */
  uploads: UploadSummary[];
  createdAt: string;
}

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
  description: z.string().trim().min(1, 'describe the line').max(300),
  quantity: z.number().min(0, 'at least 0').max(100000),
  unit: z.string().trim().min(1).max(20),
  unitPriceCents: z.number().int('whole cents').min(-10_000_000).max(100_000_000),
  costCents: z.number().int().min(0).max(100_000_000).optional(),
  overrideReason: z.string().trim().max(500).nullable().optional(),
});
export const UpdateEstimateBody = z.object({
  version: z.number().int().min(1),
  lines: z.array(EstimateLineInput).max(300).optional(),
  discountCents: z.number().int().min(0).max(100_000_000).optional(),
});
export type UpdateEstimateBody = z.input<typeof UpdateEstimateBody>;
export const AcceptEstimateBody = z.object({
  acceptedName: z.string().trim().min(2, 'type your full name to accept').max(120),
});
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
export const STAGE_KEYS = ['material', 'cutting', 'casework', 'drawers_doors', 'finish', 'ready', 'delivered'] as const;
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
  note: z.string().max(500).default(''),
});

/** `GET /api/estimates/:id`: what a client sees; the owner also gets the fields marked owner. */
export interface EstimateView {
  id: string;
  projectId: string;
  number: string;
  revision: number;
  status: EstimateStatus;
  version: number;
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
  checks: { code: string; level: 'error' | 'warning' | 'caution'; message: string }[];
  /** owner */
  hoursByStage?: Record<string, number>;
  /** owner */
  layouts?: { materialId: string; materialName: string; sheetCount: number; lowerBound: number; yieldRatio: number }[];
  /** owner */
  costCents?: number;
}
