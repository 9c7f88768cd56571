import * as z from 'zod';
import { PROJECT_STATUSES } from './lifecycle';
import { singleLine } from './text';

/**
 * `GET /api/projects`: one page of project summaries. The list is keyset-paged: `nextCursor` (opaque) names
 * where the next page starts, and is null on the last page. A cursor belongs to its sort and direction.
 */
export const PROJECT_SORTS = ['created', 'updated', 'client', 'status', 'total'] as const;
export type ProjectSort = (typeof PROJECT_SORTS)[number];
export const SORT_DIRECTIONS = ['asc', 'desc'] as const;
export type SortDirection = (typeof SORT_DIRECTIONS)[number];
export const LIST_LIMIT_DEFAULT = 50;
export const LIST_LIMIT_MAX = 200;

/** A page size: 1 to 200, 50 when absent. */
export const ListLimit = z.coerce
  .number('give the page size as a number')
  .int('a whole number')
  .min(1, 'at least 1')
  .max(LIST_LIMIT_MAX, `at most ${LIST_LIMIT_MAX}`)
  .default(LIST_LIMIT_DEFAULT);
/** An opaque cursor as the API gave it (its contents are checked by the API). */
export const ListCursor = z.string().min(1, 'the cursor is empty').max(400, 'this cursor is not valid');

/** `status` is one status or several, comma-separated (`?status=requested,estimating`). */
const Statuses = z
  .string()
  .max(400)
  .transform((s) => s.split(',').map((x) => x.trim()))
  .pipe(z.array(z.enum(PROJECT_STATUSES, 'not a project status')).min(1));

export const ProjectListQuery = z.object({
  status: Statuses.optional(),
  /** words of the client's name or the project's notes */
  q: singleLine().trim().max(100, 'use at most 100 characters').optional(),
  sort: z.enum(PROJECT_SORTS).default('created'),
  dir: z.enum(SORT_DIRECTIONS).default('desc'),
  cursor: ListCursor.optional(),
  limit: ListLimit,
});
export type ProjectListQuery = z.input<typeof ProjectListQuery>;

/** `GET /api/jobs`: the open jobs and a page of delivered ones; `stage=delivered` with a cursor for more. */
export const JobsQuery = z.object({
  stage: z.literal('delivered', 'only the delivered jobs are paged: stage=delivered').optional(),
  cursor: ListCursor.optional(),
  limit: ListLimit,
});
export type JobsQuery = z.output<typeof JobsQuery>;

/** `GET /api/payments`: the latest first, a page at a time. */
export const PaymentsQuery = z.object({ cursor: ListCursor.optional(), limit: ListLimit });
export type PaymentsQuery = z.output<typeof PaymentsQuery>;
