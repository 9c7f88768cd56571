import { beforeAll, describe, expect, it } from 'vitest';
import { testApp, type TestApp } from './helpers';

/**
 * The estimate routes one by one (DESIGN.md section 10), each describe on a fresh app with the demo seed: the
 * happy path, then the refusals (wrong role, wrong state 409, invalid body 400, not found 404). The whole
 * scenario runs in flow.test.ts.
 */
type Agent = Awaited<ReturnType<TestApp['signIn']>>;
interface Ctx {
  t: TestApp;
  owner: Agent;
  priya: Agent;
  tomasz: Agent;
  builder: Agent;
  /** Priya's request */
  projectId: string;
}

async function fresh(): Promise<Ctx> {
  const t = await testApp();
  const owner = await t.signIn('maren@fernhill.example');
  const priya = await t.signIn('priya@example.com');
  const tomasz = await t.signIn('tomasz@example.com');
  const builder = await t.signIn('idris@fernhill.example');
  const projectId = (await priya.get('/api/projects')).body.projects[0].id as string;
  return { t, owner, priya, tomasz, builder, projectId };
}
async function draft(c: Ctx) {
  const r = await c.owner.post(`/api/projects/${c.projectId}/estimates`).send({});
  expect(r.status).toBe(201);
  return r.body.estimate as { id: string; version: number; revision: number };
}
async function sent(c: Ctx) {
  const d = await draft(c);
  const r = await c.owner.post(`/api/estimates/${d.id}/send`);
  expect(r.status).toBe(200);
  return r.body.estimate as { id: string; version: number; revision: number };
}
/** a response body as bytes */
const bytes = (req: ReturnType<Agent['get']>) =>
  req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (b: Buffer) => chunks.push(b));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

describe('POST /api/projects/:id/estimates', () => {
  let c: Ctx;
  beforeAll(async () => {
    c = await fresh();
  });
  it('when the project is a request, prices revision 1 as a draft from the engine', async () => {
    const r = await c.owner.post(`/api/projects/${c.projectId}/estimates`).send({});
    expect(r.status).toBe(201);
    expect(r.body.estimate).toMatchObject({ revision: 1, status: 'draft', version: 1 });
    expect(r.body.estimate.lines.length).toBeGreaterThan(0);
    expect(r.body.estimate.totals.totalCents).toBeGreaterThan(0);
    expect((await c.owner.get(`/api/projects/${c.projectId}`)).body.project.status).toBe('estimating');
  });
  it('when a draft is open, refuses another revision with 409', async () => {
    const r = await c.owner.post(`/api/projects/${c.projectId}/estimates`).send({});
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('conflict');
  });
  it('refuses an unknown source with 400', async () => {
    const r = await c.owner.post(`/api/projects/${c.projectId}/estimates`).send({ source: 'guess' });
    expect(r.status).toBe(400);
    expect(r.body.error.issues.length).toBeGreaterThan(0);
  });
  it('refuses the client and the builder with 403', async () => {
    expect((await c.priya.post(`/api/projects/${c.projectId}/estimates`).send({})).status).toBe(403);
    expect((await c.builder.post(`/api/projects/${c.projectId}/estimates`).send({})).status).toBe(403);
  });
  it('answers 404 for a project that does not exist', async () => {
    expect((await c.owner.post('/api/projects/no-such-project/estimates').send({})).status).toBe(404);
  });
});

describe('GET /api/estimates/:id', () => {
  let c: Ctx;
  let id: string;
  beforeAll(async () => {
    c = await fresh();
    id = (await draft(c)).id;
  });
  it('gives the owner the draft with its lines, costs and totals', async () => {
    const r = await c.owner.get(`/api/estimates/${id}`);
    expect(r.status).toBe(200);
    expect(r.body.estimate).toMatchObject({ id, status: 'draft' });
    expect(r.body.estimate.lines[0]).toHaveProperty('costCents');
    expect(Object.keys(r.body.estimate.totals).sort()).toEqual(
      ['balanceCents', 'depositCents', 'discountCents', 'subtotalCents', 'taxCents', 'totalCents'].sort(),
    );
  });
  it('while it is a draft, answers its client 404', async () => {
    expect((await c.priya.get(`/api/estimates/${id}`)).status).toBe(404);
  });
  it('once sent, gives its client the estimate without the costs', async () => {
    expect((await c.owner.post(`/api/estimates/${id}/send`)).status).toBe(200);
    const r = await c.priya.get(`/api/estimates/${id}`);
    expect(r.status).toBe(200);
    expect(r.body.estimate.status).toBe('sent');
    expect(r.body.estimate.lines[0]).not.toHaveProperty('costCents');
  });
  it('answers another client 404, the builder 403 and no session 401', async () => {
    expect((await c.tomasz.get(`/api/estimates/${id}`)).status).toBe(404);
    expect((await c.builder.get(`/api/estimates/${id}`)).status).toBe(403);
    expect((await c.t.agent().get(`/api/estimates/${id}`)).status).toBe(401);
  });
  it('reads the units it is shown in from the revision’s own column, never loading its whole record', async () => {
    const row = c.t.db.$client
      .prepare(
        `SELECT units, json_extract(record, '$.settings.units') AS recorded FROM revision_records WHERE estimate_id = ?`,
      )
      .get(id) as { units: string; recorded: string };
    expect(row.units).toBe(row.recorded);
    // the column, not the record, is what the view shows: set apart from the record, the view follows the column
    const other = row.units === 'in' ? 'mm' : 'in';
    c.t.db.$client.prepare('UPDATE revision_records SET units = ? WHERE estimate_id = ?').run(other, id);
    const seen: string[] = [];
    const proto = Object.getPrototypeOf(c.t.db.$client.prepare('SELECT 1')) as Record<
      'all' | 'get' | 'iterate',
      (this: { source: string }, ...args: unknown[]) => unknown
    >;
    const originals = { all: proto.all, get: proto.get, iterate: proto.iterate };
    for (const m of ['all', 'get', 'iterate'] as const) {
      const original = originals[m];
      proto[m] = function (this: { source: string }, ...args: unknown[]) {
        seen.push(this.source);
        return original.apply(this, args);
      };
    }
    let r;
    try {
      r = await c.owner.get(`/api/estimates/${id}`);
    } finally {
      Object.assign(proto, originals);
      c.t.db.$client.prepare('UPDATE revision_records SET units = ? WHERE estimate_id = ?').run(row.units, id);
    }
    expect(r.status).toBe(200);
    expect(r.body.estimate.units).toBe(other);
    expect(seen.filter((s) => /revision_records/.test(s) && /"record"|\brecord\b/.test(s))).toEqual([]);
  });
});

describe('PATCH /api/estimates/:id', () => {
  let c: Ctx;
  let d: { id: string; version: number };
  beforeAll(async () => {
    c = await fresh();
    d = await draft(c);
  });
  it('when the draft is at the given version, saves the change and moves the version on', async () => {
    const r = await c.owner.patch(`/api/estimates/${d.id}`).send({ version: d.version, discountCents: 2500 });
    expect(r.status).toBe(200);
    expect(r.body.estimate.version).toBe(d.version + 1);
    expect(r.body.estimate.totals.discountCents).toBe(2500);
  });
  it('when the version is stale, refuses with 409 and keeps the saved change', async () => {
    const r = await c.owner.patch(`/api/estimates/${d.id}`).send({ version: d.version, discountCents: 99 });
    expect(r.status).toBe(409);
    expect((await c.owner.get(`/api/estimates/${d.id}`)).body.estimate.totals.discountCents).toBe(2500);
  });
  it('refuses a malformed edit with 400 and the issues', async () => {
    const r = await c.owner.patch(`/api/estimates/${d.id}`).send({ version: 'two', discountCents: -1 });
    expect(r.status).toBe(400);
    expect(r.body.error.issues.map((i: { path: string }) => i.path).sort()).toEqual(['discountCents', 'version']);
  });
  it('refuses the client with 403', async () => {
    expect((await c.priya.patch(`/api/estimates/${d.id}`).send({ version: 2 })).status).toBe(403);
  });
  it('once the revision is sent, refuses any edit with 409', async () => {
    expect((await c.owner.post(`/api/estimates/${d.id}/send`)).status).toBe(200);
    const now = (await c.owner.get(`/api/estimates/${d.id}`)).body.estimate;
    const r = await c.owner.patch(`/api/estimates/${d.id}`).send({ version: now.version, discountCents: 1 });
    expect(r.status).toBe(409);
  });
});

describe('POST /api/estimates/:id/send', () => {
  let c: Ctx;
  let d: { id: string };
  beforeAll(async () => {
    c = await fresh();
    d = await draft(c);
  });
  it('when the estimate is a draft, freezes it and mails the PDF to the client', async () => {
    const r = await c.owner.post(`/api/estimates/${d.id}/send`);
    expect(r.status).toBe(200);
    expect(r.body.estimate.status).toBe('sent');
    expect(r.body.estimate.validUntil).toEqual(expect.any(String));
    const mail = c.t.mails().find((m) => m.to === 'priya@example.com');
    expect(mail).toBeDefined();
    expect(mail!.attachments).toEqual([expect.objectContaining({ contentType: 'application/pdf' })]);
    expect((await c.owner.get(`/api/projects/${c.projectId}`)).body.project.status).toBe('estimate_sent');
  });
  it('when it is sent already, refuses with 409', async () => {
    expect((await c.owner.post(`/api/estimates/${d.id}/send`)).status).toBe(409);
  });
  it('refuses the client with 403 and an unknown estimate with 404', async () => {
    expect((await c.priya.post(`/api/estimates/${d.id}/send`)).status).toBe(403);
    expect((await c.owner.post('/api/estimates/no-such-estimate/send')).status).toBe(404);
  });
  it('when the client has accepted another revision meanwhile, refuses with 409 (one deposit a project)', async () => {
    // issue 13, defect 2: revision 1 sent, revision 2 started, revision 1 accepted; revision 2 must not go out
    const r2 = await c.owner.post(`/api/projects/${c.projectId}/estimates`).send({ source: 'copy' });
    expect(r2.status).toBe(201);
    expect((await c.priya.post(`/api/estimates/${d.id}/accept`).send({ acceptedName: 'Priya Natarajan' })).status).toBe(
      200,
    );
    const r = await c.owner.post(`/api/estimates/${r2.body.estimate.id}/send`);
    expect(r.status).toBe(409);
    expect((await c.owner.get(`/api/projects/${c.projectId}`)).body.project.status).toBe('accepted');
  });
});

describe('GET /api/estimates/:id/pdf', () => {
  let c: Ctx;
  let id: string;
  beforeAll(async () => {
    c = await fresh();
    id = (await sent(c)).id;
  });
  it('when the estimate is sent, gives its client the PDF', async () => {
    const r = await bytes(c.priya.get(`/api/estimates/${id}/pdf`));
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/application\/pdf/);
    expect((r.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });
  it('is not cached by shared caches', async () => {
    // issue 13, defect 10: the estimate PDF went out with Cache-Control: public
    const r = await bytes(c.priya.get(`/api/estimates/${id}/pdf`));
    expect(r.headers['cache-control'] ?? '').not.toMatch(/public/);
  });
  it('answers another client 404, the builder 403 and no session 401', async () => {
    expect((await bytes(c.tomasz.get(`/api/estimates/${id}/pdf`))).status).toBe(404);
    expect((await bytes(c.builder.get(`/api/estimates/${id}/pdf`))).status).toBe(403);
    expect((await bytes(c.t.agent().get(`/api/estimates/${id}/pdf`))).status).toBe(401);
  });
  it('answers 404 for a draft, which has no PDF yet', async () => {
    const d = await c.owner.post(`/api/projects/${c.projectId}/estimates`).send({ source: 'copy' });
    expect(d.status).toBe(201);
    expect((await bytes(c.owner.get(`/api/estimates/${d.body.estimate.id}/pdf`))).status).toBe(404);
  });
});

describe('POST /api/estimates/:id/accept', () => {
  let c: Ctx;
  let id: string;
  beforeAll(async () => {
    c = await fresh();
    id = (await sent(c)).id;
  });
  it('refuses a missing name with 400', async () => {
    const r = await c.priya.post(`/api/estimates/${id}/accept`).send({});
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe('acceptedName');
  });
  it('refuses the owner with 403 and another client with 404', async () => {
    expect((await c.owner.post(`/api/estimates/${id}/accept`).send({ acceptedName: 'Maren Holt' })).status).toBe(403);
    expect((await c.tomasz.post(`/api/estimates/${id}/accept`).send({ acceptedName: 'Tomasz W' })).status).toBe(404);
  });
  it('when the estimate is sent, records the acceptance with the name and time', async () => {
    const r = await c.priya.post(`/api/estimates/${id}/accept`).send({ acceptedName: 'Priya Natarajan' });
    expect(r.status).toBe(200);
    expect(r.body.estimate).toMatchObject({ status: 'accepted', acceptedName: 'Priya Natarajan' });
    expect(r.body.estimate.acceptedAt).toEqual(expect.any(String));
    expect((await c.priya.get(`/api/projects/${c.projectId}`)).body.project.status).toBe('accepted');
  });
  it('when it is accepted already, refuses with 409', async () => {
    expect((await c.priya.post(`/api/estimates/${id}/accept`).send({ acceptedName: 'Priya Natarajan' })).status).toBe(
      409,
    );
  });
});
