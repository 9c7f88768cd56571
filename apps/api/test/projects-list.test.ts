import { beforeAll, describe, expect, it } from 'vitest';
import {
  PROJECT_SORTS,
  PROJECT_STATUSES,
  ProjectsResponse,
  type ProjectSort,
  type ProjectSummary,
} from '@benchwright/contracts';
import { seedScale } from '../src/db/seed-scale';
import { encodeCursor } from '../src/lib/cursor';
import { testApp, type TestApp } from './helpers';

type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const COUNT = 450;

let t: TestApp;
let owner: Agent;
let clientEmail: string;
beforeAll(async () => {
  t = await testApp();
  const { clients } = await seedScale(t.db, COUNT);
  clientEmail = clients[0]!;
  owner = await t.signIn('maren@fernhill.example');
});

/** Every page of the list, following nextCursor; each page parsed with the contract. */
async function walk(agent: Agent, query: Record<string, string | number>) {
  const all: ProjectSummary[] = [];
  let cursor: string | null = null;
  let pages = 0;
  do {
    const r = await agent.get('/api/projects').query(cursor ? { ...query, cursor } : query);
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const page = ProjectsResponse.parse(r.body);
    all.push(...page.projects);
    cursor = page.nextCursor;
    if (++pages > 1000) throw new Error('the cursor never ends');
  } while (cursor);
  return { all, pages };
}

interface Row {
  id: string;
  status: string;
  clientId: string;
  created: number;
  updated: number;
  client: string;
  rank: number;
  total: number;
  sentTotal: number;
}
const rows = () =>
  t.db.$client
    .prepare(
      `SELECT p.id, p.status, p.client_id AS clientId, p.created_at AS created, p.updated_at AS updated,
              u.name AS client, p.status_rank AS rank, p.latest_total_cents AS total, p.sent_total_cents AS sentTotal
         FROM projects p JOIN users u ON u.id = p.client_id`,
    )
    .all() as Row[];
const keyOf: Record<ProjectSort, (r: Row) => string | number> = {
  created: (r) => r.created,
  updated: (r) => r.updated,
  client: (r) => r.client,
  status: (r) => r.rank,
  total: (r) => r.total,
};
/** the order the API promises: the sort key, then the id, both in the direction asked */
function expected(all: Row[], sort: ProjectSort, dir: 'asc' | 'desc') {
  const k = keyOf[sort];
  const sign = dir === 'asc' ? 1 : -1;
  return [...all]
    .sort((a, b) => {
      const ka = k(a);
      const kb = k(b);
      if (ka !== kb) return (ka < kb ? -1 : 1) * sign;
      return (a.id < b.id ? -1 : a.id > b.id ? 1 : 0) * sign;
    })
    .map((r) => r.id);
}

describe('GET /api/projects: sorting and paging', () => {
  for (const sort of PROJECT_SORTS)
    for (const dir of ['asc', 'desc'] as const)
      it(`sorted by ${sort} ${dir}, walks every project once, in order, across pages`, async () => {
        const { all, pages } = await walk(owner, { sort, dir, limit: 97 });
        const ids = all.map((p) => p.id);
        expect(new Set(ids).size).toBe(ids.length);
        expect(ids).toEqual(expected(rows(), sort, dir));
        expect(pages).toBe(Math.ceil((COUNT + 3) / 97));
      });

  it('gives summaries: status, client, items with the design’s name, the latest estimate; no timeline, no specs', async () => {
    const r = ProjectsResponse.parse((await owner.get('/api/projects').query({ limit: 200 })).body);
    expect(r.projects).toHaveLength(200);
    expect(r.nextCursor).toEqual(expect.any(String));
    const body = JSON.stringify(r);
    expect(body).not.toMatch(/"timeline"|"spec"|"widthMm"/);
    const quoted = r.projects.find((p) => p.status === 'estimating')!;
    expect(quoted.latestEstimate).toMatchObject({ revision: 1, status: 'draft' });
    expect(quoted.items[0]).toEqual({
      design: expect.any(String),
      name: expect.any(String),
      quantity: expect.any(Number),
    });
    expect(r.projects.find((p) => p.status === 'requested')!.latestEstimate).toBeNull();
  });

  it('defaults to 50 a page, newest first', async () => {
    const r = ProjectsResponse.parse((await owner.get('/api/projects')).body);
    expect(r.projects.map((p) => p.id)).toEqual(expected(rows(), 'created', 'desc').slice(0, 50));
  });
});

describe('GET /api/projects: filters', () => {
  it('by status, one or several, across pages', async () => {
    const { all } = await walk(owner, { status: 'requested,estimate_sent', limit: 60 });
    const want = rows().filter((r) => r.status === 'requested' || r.status === 'estimate_sent');
    expect(all.map((p) => p.id).sort()).toEqual(want.map((r) => r.id).sort());
    expect(new Set(all.map((p) => p.status))).toEqual(new Set(['requested', 'estimate_sent']));
  });

  it('by words of the client’s name or the notes, case aside, with % and _ taken literally', async () => {
    const byNotes = await walk(owner, { q: 'LAUNDRY', limit: 50 });
    expect(byNotes.all.length).toBe(Math.ceil(COUNT / 6));
    expect(byNotes.all.every((p) => /laundry/i.test(p.notes))).toBe(true);
    const byName = await walk(owner, { q: 'priya', sort: 'client', dir: 'asc' });
    expect(byName.all.map((p) => p.client.name)).toEqual(['Priya Natarajan']);
    expect((await walk(owner, { q: '%' })).all).toEqual([]);
    expect((await walk(owner, { q: 'no._' })).all).toEqual([]);
  });

  it('combines a status, a search and a sort', async () => {
    const { all } = await walk(owner, { status: 'closed', q: 'laundry', sort: 'total', dir: 'desc', limit: 7 });
    expect(all.length).toBeGreaterThan(3);
    expect(all.every((p) => p.status === 'closed' && /laundry/.test(p.notes))).toBe(true);
    const totals = all.map((p) => p.latestEstimate!.totals.totalCents);
    expect(totals).toEqual([...totals].sort((a, b) => b - a));
  });
});

describe('GET /api/projects: who sees what', () => {
  it('gives a client only their own, with no drafts, sorted by what they were sent', async () => {
    const client = await t.signIn(clientEmail);
    const { all } = await walk(client, { sort: 'total', dir: 'desc', limit: 4 });
    const own = rows().filter((r) => r.clientId === all[0]!.client.id);
    expect(all.map((p) => p.id).sort()).toEqual(own.map((r) => r.id).sort());
    expect(own.length).toBe(COUNT / 9);
    expect(all.every((p) => p.latestEstimate?.status !== 'draft')).toBe(true);
    expect(all.filter((p) => p.status === 'estimating').every((p) => p.latestEstimate === null)).toBe(true);
    const totals = all.map((p) => p.latestEstimate?.totals.totalCents ?? 0);
    expect(totals).toEqual([...totals].sort((a, b) => b - a));
    // the owner's cursor is no key to another's projects: the client's filter holds on every page
    const ownerPage = ProjectsResponse.parse((await owner.get('/api/projects').query({ limit: 2 })).body);
    const r = await client.get('/api/projects').query({ cursor: ownerPage.nextCursor! });
    expect(ProjectsResponse.parse(r.body).projects.every((p) => p.client.id === all[0]!.client.id)).toBe(true);
  });

  it('gives a builder the projects in the shop, no money, and refuses a sort by total', async () => {
    const idris = await t.signIn('idris@fernhill.example');
    const { all } = await walk(idris, { limit: 100 });
    const inShop = rows().filter((r) => ['deposit_paid', 'in_production', 'ready', 'delivered'].includes(r.status));
    expect(all.map((p) => p.id).sort()).toEqual(inShop.map((r) => r.id).sort());
    expect(all.every((p) => p.latestEstimate === null)).toBe(true);
    const r = await idris.get('/api/projects').query({ sort: 'total' });
    expect(r.status).toBe(400);
    expect(r.body.error.issues).toEqual([{ path: 'sort', message: expect.stringContaining('created') }]);
  });
});

describe('GET /api/projects: bad input', () => {
  it.each([
    ['limit=0', 'limit'],
    ['limit=201', 'limit'],
    ['limit=ten', 'limit'],
    ['limit=1.5', 'limit'],
    ['sort=price', 'sort'],
    ['dir=up', 'dir'],
    ['status=lost', 'status'],
    ['status=requested,', 'status'],
    [`q=${'x'.repeat(101)}`, 'q'],
    ['q=a%00b', 'q'],
  ])('answers 400 for %s, naming the field', async (query, path) => {
    const r = await owner.get(`/api/projects?${query}`);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(r.body.error.issues.map((i: { path: string }) => i.path.replace(/\[\d+\]$/, ''))).toContain(path);
  });

  const forged = (o: unknown) => Buffer.from(JSON.stringify(o)).toString('base64url');
  it.each([
    ['not base64', 'this is not a cursor!'],
    ['not JSON', Buffer.from('{{{').toString('base64url')],
    ['JSON of another shape', forged({ hello: 'there' })],
    ['a key of the wrong type', forged({ s: 'created', d: 'desc', k: 'yesterday', i: 'x' })],
    ['another sort’s cursor', encodeCursor({ sort: 'client', dir: 'desc', key: 'Ada', id: 'x' })],
    ['another direction’s cursor', encodeCursor({ sort: 'created', dir: 'asc', key: 1, id: 'x' })],
    ['an oversized key', forged({ s: 'created', d: 'desc', k: 1e300, i: 'x' })],
    ['too long', 'A'.repeat(401)],
  ])('answers 400 for a cursor that is %s, never a 500', async (_what, cursor) => {
    const r = await owner.get('/api/projects').query({ cursor });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe('cursor');
  });

  it('takes a cursor that was never given out but is well formed (a keyset position), and pages on from it', async () => {
    const r = await owner
      .get('/api/projects')
      .query({ cursor: encodeCursor({ sort: 'created', dir: 'desc', key: 0, id: 'x' }) });
    expect(ProjectsResponse.parse(r.body)).toEqual({ projects: [], nextCursor: null });
  });
});

describe('GET /api/projects: statements', () => {
  it('reads a page of 200 in at most 3 SQL statements, the same as a page of 1', async () => {
    const seen: string[] = [];
    // statements are prepared once and reused (lib/statements.ts): count each one run, not each one prepared
    const proto = Object.getPrototypeOf(t.db.$client.prepare('SELECT 1')) as Record<
      'all' | 'get' | 'run' | 'iterate',
      (this: { source: string }, ...args: unknown[]) => unknown
    >;
    const originals = { all: proto.all, get: proto.get, run: proto.run, iterate: proto.iterate };
    const count = async (limit: number) => {
      seen.length = 0;
      const r = await owner.get('/api/projects').query({ limit, sort: 'client', dir: 'asc' });
      expect(ProjectsResponse.parse(r.body).projects).toHaveLength(limit);
      // the session's own reads are the same for every route
      return seen.filter((s) => !/\bsessions\b/.test(s));
    };
    for (const m of ['all', 'get', 'run', 'iterate'] as const) {
      const original = originals[m];
      proto[m] = function (this: { source: string }, ...args: unknown[]) {
        seen.push(this.source);
        return original.apply(this, args);
      };
    }
    try {
      const big = await count(200);
      const small = await count(1);
      expect(big.length, big.join('\n')).toBeGreaterThan(0);
      expect(big.length, big.join('\n')).toBeLessThanOrEqual(3);
      expect(big.length).toBe(small.length);
    } finally {
      Object.assign(proto, originals);
    }
  });
});

it('every status has projects in the scale seed', () => {
  expect(new Set(rows().map((r) => r.status))).toEqual(new Set(PROJECT_STATUSES));
});

it('keeps each item’s design in its own column, from its spec, on insert and when the spec changes', () => {
  const db = t.db.$client;
  const { id: projectId } = db.prepare('SELECT id FROM projects LIMIT 1').get() as { id: string };
  const id = `design-column-${Date.now()}`;
  db.prepare('INSERT INTO project_items (id, project_id, position, spec, quantity) VALUES (?, ?, 99, ?, 1)').run(
    id,
    projectId,
    JSON.stringify({ design: 'bookcase', widthMm: 800 }),
  );
  const design = () =>
    (db.prepare('SELECT design FROM project_items WHERE id = ?').get(id) as { design: string }).design;
  expect(design()).toBe('bookcase');
  db.prepare('UPDATE project_items SET spec = ? WHERE id = ?').run(JSON.stringify({ design: 'wall-cabinet' }), id);
  expect(design()).toBe('wall-cabinet');
  db.prepare('UPDATE project_items SET spec = ? WHERE id = ?').run(JSON.stringify({ widthMm: 1 }), id);
  expect(design()).toBe('');
  db.prepare('DELETE FROM project_items WHERE id = ?').run(id);
});
