// The API's answers, route by route, as zod schemas: the API's tests parse every response with its schema, so an
// answer that drifts from here (a field renamed, dropped, or added where the object is strict) fails a test; the
// apps read the inferred types. `GET /api/projects` and the project itself are in index.ts.
import * as z from 'zod';
import { LINE_GROUPS } from '@benchwright/pricing/geometry';
import { ESTIMATE_STATUSES, PROJECT_STATUSES, STAGE_KEYS } from './lifecycle';

const ROLE = z.enum(['client', 'owner', 'builder']);
const iso = z.iso.datetime();
const cents = z.number().int();
const hours = z.number().min(0);
const Check = z.object({ code: z.string(), level: z.enum(['error', 'warning', 'caution']), message: z.string() });
const TotalsShape = z.strictObject({
  subtotalCents: cents,
  discountCents: cents,
  taxCents: cents,
  totalCents: cents,
  depositCents: cents,
  balanceCents: cents,
});

/** `GET /api/auth/me`, sign-in, sign-up, verify, reset: the signed-in person */
export const UserResponse = z.strictObject({
  user: z.strictObject({
    id: z.string(),
    email: z.string(),
    name: z.string(),
    role: ROLE,
    emailVerified: z.boolean(),
  }),
});

/** `GET /api/estimates/:id` and every route that answers an estimate; the fields marked owner only to the owner */
export const EstimateViewSchema = z.strictObject({
  id: z.string(),
  projectId: z.string(),
  number: z.string(),
  revision: z.number().int().min(1),
  status: z.enum(ESTIMATE_STATUSES),
  /** the shop's units: what the figures a person reads are written in */
  units: z.enum(['in', 'mm']),
  /** a superseded revision: the revision sent after it */
  replacedBy: z.number().int().min(1).nullable(),
  /** owner: the price-book version the revision was priced with */
  priceBookVersion: z.number().int().min(1).nullable().optional(),
  version: z.number().int().min(1),
  validUntil: iso.nullable(),
  sentAt: iso.nullable(),
  acceptedAt: iso.nullable(),
  acceptedName: z.string().nullable(),
  lines: z.array(
    z.strictObject({
      id: z.string(),
      group: z.enum(LINE_GROUPS),
      description: z.string(),
      quantity: z.number(),
      unit: z.string(),
      unitPriceCents: cents,
      amountCents: cents,
      source: z.enum(['computed', 'manual']),
      costCents: cents.optional(),
      overrideReason: z.string().nullable().optional(),
    }),
  ),
  totals: TotalsShape,
  drawings: z.array(z.unknown()),
  /** per item, the client's choices in plain words as the revision was priced; empty for a revision recorded before */
  choices: z.array(z.array(z.strictObject({ label: z.string().min(1), value: z.string() }))),
  checks: z.array(Check),
  hoursByStage: z.record(z.string(), hours).optional(),
  layouts: z
    .array(
      z.object({
        materialId: z.string(),
        materialName: z.string(),
        sheetCount: z.number().int(),
        lowerBound: z.number().int(),
        yieldRatio: z.number(),
      }),
    )
    .optional(),
  costCents: cents.optional(),
});
export const EstimateResponse = z.strictObject({ estimate: EstimateViewSchema });
/** a client's Checkout Session for a deposit or the balance */
export const CheckoutResponse = z.strictObject({ url: z.url() });

/** A job as the board shows it. */
const StageHours = z.object({ total: hours }).catchall(hours);
export const JobSchema = z.strictObject({
  id: z.string(),
  project: z.strictObject({ id: z.string(), status: z.enum(PROJECT_STATUSES), notes: z.string() }),
  clientName: z.string(),
  stage: z.enum(STAGE_KEYS),
  position: z.number().int(),
  builder: z.strictObject({ id: z.string(), name: z.string() }).nullable(),
  dueDate: z.string().nullable(),
  hoursBudgeted: StageHours,
  hoursLogged: StageHours,
});
/** `GET /api/jobs/:id`, `PATCH /api/jobs/:id`, `POST /api/jobs/:id/time` */
export const JobResponse = z.strictObject({ job: JobSchema });
/** `GET /api/jobs`: the open jobs and a page of delivered ones; `nextCursor` pages the delivered */
export const JobsResponse = z.strictObject({ jobs: z.array(JobSchema), nextCursor: z.string().nullable() });
/** `GET /api/jobs/stages` */
export const StagesResponse = z.strictObject({
  stages: z.array(z.strictObject({ key: z.enum(STAGE_KEYS), label: z.string(), position: z.number().int() })),
});

const PAYMENT_STATUSES = ['open', 'paid', 'expired', 'refunded', 'partially_refunded'] as const;
/** `GET /api/payments`: the latest first, a page at a time (no checkout URLs) */
export const PaymentsResponse = z.strictObject({
  payments: z.array(
    z.strictObject({
      id: z.string(),
      projectId: z.string(),
      clientName: z.string(),
      kind: z.enum(['deposit', 'balance']),
      status: z.enum(PAYMENT_STATUSES),
      amountCents: cents,
      refundedCents: cents,
      stripePaymentIntentId: z.string().nullable(),
      createdAt: iso,
    }),
  ),
  nextCursor: z.string().nullable(),
});
/** `POST /api/payments/:id/refund` (202: the card processor confirms by webhook) */
export const RefundResponse = z.strictObject({
  refund: z.object({ id: z.string(), amountCents: cents, status: z.string() }),
});
/** `POST /api/payments/confirm` */
export const PaymentConfirmResponse = z.strictObject({
  payment: z.strictObject({
    id: z.string(),
    kind: z.enum(['deposit', 'balance']),
    status: z.enum(PAYMENT_STATUSES),
    amountCents: cents,
  }),
});

/** `GET /api/overview` (owner) */
export const OverviewResponse = z.strictObject({
  overview: z.strictObject({
    month: z.string().regex(/^\d{4}-\d{2}$/),
    pipeline: z.record(z.enum(PROJECT_STATUSES), z.number().int().min(0)),
    acceptedThisMonth: z.strictObject({ count: z.number().int(), totalCents: cents }),
    collectedThisMonth: z.strictObject({ depositsCents: cents, balancesCents: cents }),
    winRate: z.strictObject({ quoted: z.number().int(), won: z.number().int() }),
    hours: z.array(
      z.strictObject({
        jobId: z.string(),
        clientName: z.string(),
        stage: z.enum(STAGE_KEYS),
        budgetHours: hours,
        usedHours: hours,
      }),
    ),
  }),
});

/** `GET /api/lead-time?hours=N` */
export const LeadTimeResponse = z.strictObject({
  leadTime: z.strictObject({
    startWeek: z.number().int().min(1),
    finishWeek: z.number().int().min(1),
    startDate: z.iso.date(),
    finishDate: z.iso.date(),
  }),
});

/** `GET /api/designs`, `GET /api/designs/:slug` */
const DesignSchema = z.strictObject({
  slug: z.string(),
  name: z.string(),
  summary: z.string(),
  defaults: z.unknown(),
  limits: z.record(z.string(), z.tuple([z.number(), z.number()])),
  /** the choices for each field, keyed by the field's dotted path: names and notes only, never a cost or price */
  options: z.record(
    z.string(),
    z.array(
      z.strictObject({
        id: z.string(),
        name: z.string(),
        note: z.string().optional(),
        thicknessMm: z.number().positive().optional(),
      }),
    ),
  ),
  /** the shop's units: the configurator starts in them */
  units: z.enum(['in', 'mm']),
});
export const DesignsResponse = z.strictObject({ designs: z.array(DesignSchema) });
export const DesignResponse = z.strictObject({ design: DesignSchema });

/** `POST /api/quotes/preview`: lines and totals for the owner only */
export const QuotePreviewResponse = z.strictObject({
  quote: z.strictObject({
    budget: z.strictObject({ lowCents: cents, highCents: cents }),
    checks: z.array(Check),
    items: z.array(z.strictObject({ drawingSvg: z.string(), massKg: z.number() })),
    hours: hours,
    /** owner */ lines: z.array(z.unknown()).optional(),
    /** owner */ totals: TotalsShape.optional(),
    /** owner */ hoursByStage: z.record(z.string(), hours).optional(),
    /** owner */ costCents: cents.optional(),
    /** owner */ marginCents: cents.optional(),
  }),
});

/** `POST /api/projects/:id/uploads` (201) */
export const UploadResponse = z.strictObject({
  upload: z.strictObject({
    id: z.string(),
    name: z.string(),
    kind: z.enum(['image', 'pdf']),
    mimeType: z.string(),
    sizeBytes: z.number().int(),
    by: z.strictObject({ id: z.string(), name: z.string() }),
    stageKey: z.string().nullable(),
    at: iso,
  }),
});

/** `GET /api/mail/failed` (owner) */
export const FailedMailsResponse = z.strictObject({
  mails: z.array(
    z.strictObject({
      id: z.string(),
      to: z.string(),
      subject: z.string(),
      attempts: z.number().int(),
      lastError: z.string().nullable(),
      nextAttemptAt: iso,
      createdAt: iso,
    }),
  ),
});

/** One time standard an applied hours suggestion changes: minutes per unit of its driver, now and after. */
const StandardChangeSchema = z.strictObject({
  key: z.string(),
  name: z.string(),
  driver: z.string(),
  minutes: z.number().min(0),
  newMinutes: z.number().min(0),
});
export type StandardChange = z.infer<typeof StandardChangeSchema>;
const StageFeedbackSchema = z.strictObject({
  stage: z.enum(STAGE_KEYS),
  label: z.string(),
  jobs: z.number().int().min(0),
  ratios: z.array(z.number()),
  medianRatio: z.number().nullable(),
  suggestedFactor: z.number().positive().nullable(),
  /** what applying the suggestion would write; empty without a suggestion */
  standards: z.array(StandardChangeSchema),
  lastAction: z
    .strictObject({
      action: z.enum(['applied', 'dismissed']),
      at: iso,
      appliedVersion: z.number().int().min(1).nullable(),
    })
    .nullable(),
});
export type StageFeedback = z.infer<typeof StageFeedbackSchema>;
/** `GET /api/hours-feedback`, `POST /api/hours-feedback/:stage/dismiss` (owner) */
export const HoursFeedbackResponse = z.strictObject({
  stages: z.array(StageFeedbackSchema),
  /** the price book's version the suggestions were read against: send it back to apply one */
  priceBookVersion: z.number().int().min(1),
  /** the shop's units, which the standards are shown in */
  units: z.enum(['in', 'mm']),
});
/** `POST /api/hours-feedback/:stage/apply` (owner): the feedback after, and what was applied */
export const HoursAppliedResponse = HoursFeedbackResponse.extend({
  applied: z.strictObject({
    stage: z.enum(STAGE_KEYS),
    factor: z.number().positive(),
    version: z.number().int().min(1),
    changes: z.array(StandardChangeSchema),
  }),
});

/** `GET /api/price-book/versions` (owner): the price book's versions, the latest first, a page at a time */
export const PriceBookVersionsResponse = z.strictObject({
  versions: z.array(
    z.strictObject({
      version: z.number().int().min(1),
      createdAt: iso,
      /** who made the change; null for the seed and the start-up move */
      by: z.strictObject({ id: z.string(), name: z.string() }).nullable(),
      summary: z.string(),
    }),
  ),
  nextCursor: z.string().nullable(),
});
export type PriceBookVersionSummary = z.infer<typeof PriceBookVersionsResponse>['versions'][number];
