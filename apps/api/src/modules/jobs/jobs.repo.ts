// The board's reads: jobs with their project, client, builder and logged hours in two statements whatever their
// number (the jobs, then their hours), and the delivered ones a keyset page at a time.
import { STAGE_KEYS, type StageKey } from '@benchwright/pricing';
import type { ProjectStatus } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { decodeCursor, encodeCursor } from '../../lib/cursor';
import { stmt } from '../../lib/statements';

type Hours = Partial<Record<StageKey, number>> & { total: number };
export interface JobView {
  id: string;
  project: { id: string; status: ProjectStatus; notes: string };
  clientName: string;
  stage: StageKey;
  position: number;
  builder: { id: string; name: string } | null;
  dueDate: string | null;
  hoursBudgeted: Hours;
  hoursLogged: Hours;
}

interface Row {
  id: string;
  stage: StageKey;
  position: number;
  dueDate: string | null;
  hoursBudget: string;
  updatedAt: number;
  projectId: string;
  projectStatus: ProjectStatus;
  notes: string;
  clientName: string;
  builderId: string | null;
  builderName: string | null;
}
const SELECT = `SELECT j.id, j.stage_key AS stage, j.position, j.due_date AS dueDate, j.hours_budget AS hoursBudget,
       j.updated_at AS updatedAt, p.id AS projectId, p.status AS projectStatus, p.notes, c.name AS clientName,
       b.id AS builderId, b.name AS builderName
  FROM jobs j JOIN projects p ON p.id = j.project_id JOIN users c ON c.id = p.client_id
  LEFT JOIN users b ON b.id = j.builder_id`;

const round2 = (n: number) => Math.round(n * 100) / 100;

function views(db: Db, rows: Row[]): JobView[] {
  if (!rows.length) return [];
  const logged = stmt(
    db.$client,
    `SELECT job_id AS jobId, stage_key AS stage, sum(hours) AS hours FROM time_entries
        WHERE job_id IN (SELECT value FROM json_each(?)) GROUP BY job_id, stage_key`,
  ).all(JSON.stringify(rows.map((r) => r.id))) as { jobId: string; stage: string; hours: number }[];
  const byJob = new Map<string, Map<string, number>>();
  for (const l of logged) byJob.set(l.jobId, (byJob.get(l.jobId) ?? new Map()).set(l.stage, l.hours));
  return rows.map((r) => {
    const budget = JSON.parse(r.hoursBudget) as Partial<Record<StageKey, number>>;
    const mine = byJob.get(r.id) ?? new Map<string, number>();
    let total = 0;
    for (const h of mine.values()) total += h;
    return {
      id: r.id,
      project: { id: r.projectId, status: r.projectStatus, notes: r.notes },
      clientName: r.clientName,
      stage: r.stage,
      position: r.position,
      builder: r.builderId ? { id: r.builderId, name: r.builderName ?? '' } : null,
      dueDate: r.dueDate,
      hoursBudgeted: { ...budget, total: round2(Object.values(budget).reduce((s: number, h) => s + (h ?? 0), 0)) },
      hoursLogged: {
        ...Object.fromEntries(STAGE_KEYS.map((k) => [k, round2(mine.get(k) ?? 0)])),
        total: round2(total),
      },
    };
  });
}

/** One job as the board shows it. */
export function jobView(db: Db, id: string): JobView | undefined {
  return views(db, stmt(db.$client, `${SELECT} WHERE j.id = ?`).all(id) as Row[])[0];
}

/** The jobs still in the shop (every stage but Delivered), in board order. */
export function openJobs(db: Db): JobView[] {
  return views(
    db,
    stmt(
      db.$client,
      `${SELECT} WHERE j.stage_key <> 'delivered' ORDER BY j.position, j.created_at, j.id`,
    ).all() as Row[],
  );
}

/** A page of delivered jobs, the latest moved first (keyset on updated_at, id). */
export function deliveredJobs(db: Db, limit: number, cursor?: string) {
  const at = cursor ? decodeCursor(cursor, 'delivered', 'desc', 'number') : null;
  const rows = stmt(
    db.$client,
    `${SELECT} WHERE j.stage_key = 'delivered' ${at ? 'AND (j.updated_at, j.id) < (?, ?)' : ''}
        ORDER BY j.updated_at DESC, j.id DESC LIMIT ?`,
  ).all(...(at ? [at.key, at.id] : []), limit + 1) as Row[];
  const more = rows.length > limit;
  const page = more ? rows.slice(0, limit) : rows;
  const last = page.at(-1);
  return {
    jobs: views(db, page),
    nextCursor:
      more && last ? encodeCursor({ sort: 'delivered', dir: 'desc', key: last.updatedAt, id: last.id }) : null,
  };
}
