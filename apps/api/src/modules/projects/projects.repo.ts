// The project list (GET /api/projects): a keyset page of summaries in three statements whatever the page size
// (the page, its items, its latest estimates), each on an index (see the projects table in db/schema.ts).
import { designs, type DesignSlug } from '@benchwright/pricing';
import {
  IN_SHOP_STATUSES,
  type EstimateStatus,
  type ProjectSort,
  type ProjectStatus,
  type ProjectSummary,
  type SortDirection,
  type User,
} from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { decodeCursor, encodeCursor } from '../../lib/cursor';
import { stmt } from '../../lib/statements';
import { Invalid } from '../../lib/errors';

export interface ProjectListOptions {
  status?: ProjectStatus[];
  q?: string;
  sort: ProjectSort;
  dir: SortDirection;
  cursor?: string;
  limit: number;
}

/** The SQL of each sort's key (every one indexed with the id after it), and the key's type in a cursor. */
function sortKey(sort: ProjectSort, viewer: User): { sql: string; type: 'string' | 'number' } {
  switch (sort) {
    case 'created':
      return { sql: 'p.created_at', type: 'number' };
    case 'updated':
      return { sql: 'p.updated_at', type: 'number' };
    case 'client':
      return { sql: 'u.name', type: 'string' };
    case 'status':
      return { sql: 'p.status_rank', type: 'number' };
    case 'total':
      if (viewer.role === 'builder')
        throw new Invalid('Builders see no prices, so the list cannot be sorted by total.', [
          { path: 'sort', message: 'sort by created, updated, client or status' },
        ]);
      // a client sorts by what they were sent; the owner by the latest revision, draft or not
      return { sql: viewer.role === 'client' ? 'p.sent_total_cents' : 'p.latest_total_cents', type: 'number' };
  }
}

/** `%`, `_` and the escape itself taken literally in LIKE */
const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

interface PageRow {
  id: string;
  status: ProjectStatus;
  notes: string;
  createdAt: number;
  updatedAt: number;
  clientId: string;
  clientName: string;
  k: string | number;
}
interface EstimateRow {
  projectId: string;
  id: string;
  revision: number;
  status: EstimateStatus;
  subtotalCents: number;
  discountCents: number;
  taxCents: number;
  totalCents: number;
  depositCents: number;
  balanceCents: number;
}

export function listProjects(
  db: Db,
  viewer: User,
  opts: ProjectListOptions,
): { projects: ProjectSummary[]; nextCursor: string | null } {
  const key = sortKey(opts.sort, viewer);
  const where: string[] = [];
  const params: (string | number)[] = [];
  if (viewer.role === 'client') {
    where.push('p.client_id = ?');
    params.push(viewer.id);
  } else if (viewer.role === 'builder') {
    where.push(`p.status IN (${IN_SHOP_STATUSES.map(() => '?').join(', ')})`);
    params.push(...IN_SHOP_STATUSES);
  }
  if (opts.status?.length) {
    where.push(`p.status IN (${opts.status.map(() => '?').join(', ')})`);
    params.push(...opts.status);
  }
  if (opts.q) {
    where.push(`(u.name LIKE ? ESCAPE '\\' OR p.notes LIKE ? ESCAPE '\\')`);
    params.push(likePattern(opts.q), likePattern(opts.q));
  }
  const cmp = opts.dir === 'desc' ? '<' : '>';
  if (opts.cursor) {
    const at = decodeCursor(opts.cursor, opts.sort, opts.dir, key.type);
    where.push(`(${key.sql}, p.id) ${cmp} (?, ?)`);
    params.push(at.key, at.id);
  }
  const dir = opts.dir.toUpperCase();
  // sorted by client, walk the users by name and each one's projects by id (CROSS JOIN keeps that order in
  // SQLite's planner), so a page stops after its rows instead of sorting every project
  const from =
    opts.sort === 'client'
      ? 'users u CROSS JOIN projects p ON p.client_id = u.id'
      : 'projects p JOIN users u ON u.id = p.client_id';
  // 1: the page, one row more than asked to know whether another page follows
  const rows = stmt(
    db.$client,
    `SELECT p.id, p.status, p.notes, p.created_at AS createdAt, p.updated_at AS updatedAt,
              p.client_id AS clientId, u.name AS clientName, ${key.sql} AS k
         FROM ${from}
        ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
        ORDER BY ${key.sql} ${dir}, p.id ${dir}
        LIMIT ?`,
  ).all(...params, opts.limit + 1) as PageRow[];
  const more = rows.length > opts.limit;
  const page = more ? rows.slice(0, opts.limit) : rows;
  if (!page.length) return { projects: [], nextCursor: null };
  const ids = JSON.stringify(page.map((r) => r.id));

  // 2: their items, the design from its own column (the database fills it from the spec: migration 0013)
  const items = stmt(
    db.$client,
    `SELECT project_id AS projectId, design, quantity
         FROM project_items WHERE project_id IN (SELECT value FROM json_each(?))
        ORDER BY project_id, position`,
  ).all(ids) as { projectId: string; design: string; quantity: number }[];
  const itemsOf = new Map<string, ProjectSummary['items']>();
  for (const i of items) {
    const slug = i.design;
    const name = slug in designs ? designs[slug as DesignSlug].name : 'Custom piece';
    const list = itemsOf.get(i.projectId) ?? [];
    list.push({ design: slug, name, quantity: i.quantity });
    itemsOf.set(i.projectId, list);
  }

  // 3: the latest revision each viewer may see (a client: the latest sent; a builder: none, no money)
  const latestOf = new Map<string, ProjectSummary['latestEstimate']>();
  if (viewer.role !== 'builder') {
    const sent = viewer.role === 'client' ? `AND status <> 'draft'` : '';
    const ests = stmt(
      db.$client,
      `SELECT e.project_id AS projectId, e.id, e.revision, e.status, e.subtotal_cents AS subtotalCents,
                e.discount_cents AS discountCents, e.tax_cents AS taxCents, e.total_cents AS totalCents,
                e.deposit_cents AS depositCents, e.balance_cents AS balanceCents
           FROM estimates e
          WHERE e.project_id IN (SELECT value FROM json_each(?))
            AND e.revision = (SELECT max(revision) FROM estimates WHERE project_id = e.project_id ${sent})`,
    ).all(ids) as EstimateRow[];
    for (const e of ests)
      latestOf.set(e.projectId, {
        id: e.id,
        revision: e.revision,
        status: e.status,
        totals: {
          subtotalCents: e.subtotalCents,
          discountCents: e.discountCents,
          taxCents: e.taxCents,
          totalCents: e.totalCents,
          depositCents: e.depositCents,
          balanceCents: e.balanceCents,
        },
      });
  }

  const last = page.at(-1)!;
  return {
    projects: page.map((r) => ({
      id: r.id,
      status: r.status,
      notes: r.notes,
      client: { id: r.clientId, name: r.clientName },
      items: itemsOf.get(r.id) ?? [],
      latestEstimate: latestOf.get(r.id) ?? null,
      createdAt: new Date(r.createdAt).toISOString(),
      updatedAt: new Date(r.updatedAt).toISOString(),
    })),
    nextCursor: more ? encodeCursor({ sort: opts.sort, dir: opts.dir, key: last.k, id: last.id }) : null,
  };
}
