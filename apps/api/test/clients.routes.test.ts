import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { designs } from '@benchwright/pricing';
import { estimates, payments, projectEvents, projects, users } from '../src/db/schema';
import { ClientsResponse } from '@benchwright/contracts';
import { contract, testApp, tokenFrom, type TestApp } from './helpers';

/** The owner's clients (issue 10, item 4): the list and its figures, a client's page, adding one, starting a project. */
type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const OWNER = 'maren@fernhill.example';
const item = () => ({ spec: { ...designs.bookcase.defaults }, quantity: 1 });
interface Summary {
  id: string;
  name: string;
  email: string;
  projectCount: number;
  acceptedCents: number;
  paidCents: number;
  lastActivityAt: string;
  claimed: boolean;
}

describe('GET /api/clients', () => {
  let t: TestApp;
  let owner: Agent;
  let priyaId: string;
  let later: Date;
  beforeAll(async () => {
    t = await testApp();
    owner = await t.signIn(OWNER);
    priyaId = t.db.select().from(users).where(eq(users.email, 'priya@example.com')).get()!.id;
    const project = t.db.select().from(projects).where(eq(projects.clientId, priyaId)).get()!;
    // a second project, two revisions (one accepted, one superseded), payments in every state, and a late event
    const second = randomUUID();
    t.db.insert(projects).values({ id: second, clientId: priyaId, notes: 'A second piece.' }).run();
    const est = (
      projectId: string,
      revision: number,
      status: 'accepted' | 'superseded' | 'sent',
      totalCents: number,
    ) => {
      const id = randomUUID();
      t.db.insert(estimates).values({ id, projectId, revision, status, totalCents }).run();
      return id;
    };
    const accepted = est(project.id, 2, 'accepted', 120_000);
    est(project.id, 1, 'superseded', 99_000);
    est(second, 1, 'accepted', 30_500);
    const pay = (
      kind: 'deposit' | 'balance',
      status: 'open' | 'paid' | 'expired' | 'refunded' | 'partially_refunded',
      amountCents: number,
      refundedCents = 0,
    ) =>
      t.db
        .insert(payments)
        .values({
          id: randomUUID(),
          projectId: project.id,
          estimateId: accepted,
          kind,
          status,
          amountCents,
          refundedCents,
        })
        .run();
    pay('deposit', 'paid', 60_000);
    pay('balance', 'partially_refunded', 60_000, 5_000);
    pay('balance', 'open', 777);
    pay('balance', 'expired', 888);
    later = new Date(Date.now() + 86_400_000);
    t.db
      .insert(projectEvents)
      .values({ id: randomUUID(), projectId: second, kind: 'note', message: 'later', createdAt: later })
      .run();
  });

  it('gives each client their project count, accepted value, amount paid and last activity', async () => {
    const r = await owner.get('/api/clients');
    expect(r.status).toBe(200);
    const list = r.body.clients as Summary[];
    expect(list.map((c) => c.email).sort()).toEqual(['guild@example.com', 'priya@example.com', 'tomasz@example.com']);
    const priya = list.find((c) => c.id === priyaId)!;
    const ownProjects = t.db.select().from(projects).where(eq(projects.clientId, priyaId)).all().length;
    expect(priya).toMatchObject({
      name: 'Priya Natarajan',
      projectCount: ownProjects,
      acceptedCents: 150_500,
      paidCents: 115_000,
      lastActivityAt: later.toISOString(),
      claimed: true,
    });
    const tomasz = list.find((c) => c.email === 'tomasz@example.com')!;
    expect(tomasz).toMatchObject({ acceptedCents: 0, paidCents: 0 });
    // the latest first by default
    expect(list[0]!.id).toBe(priyaId);
  });

  it('searches names and e-mails (a % is a plain character), sorts either way and limits', async () => {
    const names = async (query: Record<string, string>) =>
      ((await owner.get('/api/clients').query(query)).body.clients as Summary[]).map((c) => c.name);
    expect(await names({ q: 'PRIYA' })).toEqual(['Priya Natarajan']);
    expect(await names({ q: 'example.com' })).toHaveLength(3);
    expect(await names({ q: '%' })).toEqual([]);
    expect(await names({ sort: 'name', order: 'asc' })).toEqual([
      "Alder Cross Makers' Guild",
      'Priya Natarajan',
      'Tomasz Wierzbicki',
    ]);
    expect(await names({ sort: 'accepted', order: 'desc', limit: '1' })).toEqual(['Priya Natarajan']);
    expect((await owner.get('/api/clients').query({ sort: 'colour' })).status).toBe(400);
    expect((await owner.get('/api/clients').query({ limit: '0' })).status).toBe(400);
  });

  it('pages by a keyset cursor in every sort and direction: the pages together are the whole list, once each', async () => {
    for (let i = 0; i < 7; i++)
      t.db
        .insert(users)
        .values({
          id: `walk-in-${i}`,
          email: `caller-${i}@example.com`,
          name: i % 2 ? 'Ash Caller' : 'ash caller',
          role: 'client',
        })
        .run();
    for (const sort of ['name', 'projects', 'accepted', 'paid', 'activity'])
      for (const order of ['asc', 'desc']) {
        const whole = contract(ClientsResponse, await owner.get('/api/clients').query({ sort, order, limit: '200' }));
        expect(whole.nextCursor).toBeNull();
        const paged: string[] = [];
        let cursor: string | null = null;
        do {
          const page: { clients: Summary[]; nextCursor: string | null } = contract(
            ClientsResponse,
            await owner.get('/api/clients').query({ sort, order, limit: '2', ...(cursor ? { cursor } : {}) }),
          );
          expect(page.clients.length).toBeLessThanOrEqual(2);
          paged.push(...page.clients.map((c) => c.id));
          cursor = page.nextCursor;
        } while (cursor);
        expect(paged, `${sort} ${order}`).toEqual(whole.clients.map((c) => c.id));
      }
    // 50 by default, 200 at most; a cursor of another sort, or made up, is 400
    expect((await owner.get('/api/clients').query({ limit: '201' })).status).toBe(400);
    const first = (await owner.get('/api/clients').query({ sort: 'name', limit: '1' })).body.nextCursor as string;
    expect((await owner.get('/api/clients').query({ sort: 'paid', cursor: first })).status).toBe(400);
    expect((await owner.get('/api/clients').query({ cursor: 'bm9wZQ' })).status).toBe(400);
  });

  it('reads a page in at most 3 SQL statements, as many for 200 clients as for 1', async () => {
    for (let i = 0; i < 200; i++)
      t.db
        .insert(users)
        .values({ id: randomUUID(), email: `walk-in-${i}@example.com`, name: `Walk-in ${i}`, role: 'client' })
        .run();
    const seen: string[] = [];
    const client = t.db.$client;
    const prepare = client.prepare.bind(client);
    const count = async (limit: number, sort: string) => {
      seen.length = 0;
      const r = contract(ClientsResponse, await owner.get('/api/clients').query({ limit, sort }));
      expect(r.clients).toHaveLength(limit);
      // the session's own reads are the same for every route
      return seen.filter((x) => !/\bsessions\b/.test(x));
    };
    client.prepare = ((src: string) => {
      seen.push(src);
      return prepare(src);
    }) as typeof client.prepare;
    try {
      for (const sort of ['name', 'activity']) {
        const big = await count(200, sort);
        const small = await count(1, sort);
        expect(big.length, big.join('\n')).toBeLessThanOrEqual(3);
        expect(big.length).toBe(small.length);
      }
    } finally {
      client.prepare = prepare;
    }
  });
});

describe('GET /api/clients/:id', () => {
  it('gives the client’s contact details and projects; an unknown id or a builder’s is 404', async () => {
    const t = await testApp();
    const owner = await t.signIn(OWNER);
    const tomasz = t.db.select().from(users).where(eq(users.email, 'tomasz@example.com')).get()!;
    const r = await owner.get(`/api/clients/${tomasz.id}`);
    expect(r.status).toBe(200);
    expect(r.body.client).toMatchObject({ name: 'Tomasz Wierzbicki', email: 'tomasz@example.com', address: '' });
    const own = t.db.select().from(projects).where(eq(projects.clientId, tomasz.id)).all();
    expect(r.body.client.projects.map((p: { id: string }) => p.id).sort()).toEqual(own.map((p) => p.id).sort());
    expect(r.body.client.projects[0]).toMatchObject({ status: expect.any(String), items: expect.any(Number) });
    expect((await owner.get('/api/clients/no-such-client')).status).toBe(404);
    const builder = t.db.select().from(users).where(eq(users.email, 'idris@fernhill.example')).get()!;
    expect((await owner.get(`/api/clients/${builder.id}`)).status).toBe(404);
  });
});

describe('POST /api/clients and a project started for them', () => {
  let t: TestApp;
  let owner: Agent;
  beforeAll(async () => {
    t = await testApp();
    owner = await t.signIn(OWNER);
  });

  it('adds a client who called; 409 on a taken e-mail, 400 on a bad one', async () => {
    const r = await owner
      .post('/api/clients')
      .send({ name: 'Hollis Reed', email: 'Hollis@Example.com', phone: '555-0111', address: '3 Weir Road' });
    expect(r.status).toBe(201);
    expect(r.body.client).toMatchObject({
      name: 'Hollis Reed',
      email: 'hollis@example.com',
      phone: '555-0111',
      address: '3 Weir Road',
      claimed: false,
      projectCount: 0,
    });
    const mail = t.mails().find((m) => m.to === 'hollis@example.com')!;
    expect(mail.subject).toContain('Fernhill Joinery');
    expect(mail.text).toContain('/claim-account?token=');
    expect((await owner.post('/api/clients').send({ name: 'Another', email: 'priya@example.com' })).status).toBe(409);
    const bad = await owner.post('/api/clients').send({ name: 'Someone', email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues[0].path).toBe('email');
  });

  it('only the owner sends a clientId: a client or a builder is 403, the owner without one 400', async () => {
    const hollis = t.db.select().from(users).where(eq(users.email, 'hollis@example.com')).get()!;
    const priya = await t.signIn('priya@example.com');
    const asClient = await priya.post('/api/projects').send({ clientId: hollis.id, items: [item()] });
    expect(asClient.status).toBe(403);
    const builder = await t.signIn('idris@fernhill.example');
    expect((await builder.post('/api/projects').send({ clientId: hollis.id, items: [item()] })).status).toBe(403);
    const none = await owner.post('/api/projects').send({ items: [item()] });
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('clientId');
    const idris = t.db.select().from(users).where(eq(users.email, 'idris@fernhill.example')).get()!;
    expect((await owner.post('/api/projects').send({ clientId: idris.id, items: [item()] })).status).toBe(400);
    expect(t.db.select().from(projects).where(eq(projects.clientId, hollis.id)).all()).toEqual([]);
  });

  it('starts a project for the client, who is mailed an invitation, claims the account and sees it', async () => {
    const hollis = t.db.select().from(users).where(eq(users.email, 'hollis@example.com')).get()!;
    const before = t.mails().length;
    const r = await owner
      .post('/api/projects')
      .send({ clientId: hollis.id, items: [item()], notes: 'Called about an alcove bookcase.' });
    expect(r.status).toBe(201);
    expect(r.body.project).toMatchObject({ status: 'requested', client: { id: hollis.id, name: 'Hollis Reed' } });
    const mails = t.mails().slice(before);
    // the client's invitation, and no request notice to the owner about their own request
    expect(mails.map((m) => m.to)).toEqual(['hollis@example.com']);
    expect(mails[0]!.subject).toBe('Fernhill Joinery has started a project for you');
    expect(mails[0]!.text).toContain('a bookcase');
    const token = tokenFrom(mails[0]!.text);

    const client = t.agent();
    const claimed = await client.post('/api/auth/accept-invitation').send({ token, password: 'alcove-shelves-1' });
    expect(claimed.status).toBe(200);
    expect(claimed.body.user).toMatchObject({ role: 'client', emailVerified: true });
    const mine = (await client.get('/api/projects')).body.projects as { id: string }[];
    expect(mine.map((p) => p.id)).toEqual([r.body.project.id]);
    expect((await owner.get(`/api/clients/${hollis.id}`)).body.client).toMatchObject({
      claimed: true,
      projectCount: 1,
    });
  });

  it('mails a client who has an account a link to the project instead', async () => {
    const tomasz = t.db.select().from(users).where(eq(users.email, 'tomasz@example.com')).get()!;
    const before = t.mails().length;
    const r = await owner.post('/api/projects').send({ clientId: tomasz.id, items: [item()] });
    expect(r.status).toBe(201);
    const [mail] = t.mails().slice(before);
    expect(mail).toMatchObject({ to: 'tomasz@example.com' });
    expect(mail!.text).toContain(`/projects/${r.body.project.id}`);
    expect(mail!.text).not.toContain('token=');
  });
});
