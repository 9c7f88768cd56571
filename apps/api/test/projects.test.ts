import { designs } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

describe('GET /api/projects', () => {
  it('gives a client only their own projects, the owner all, and a builder none not yet in the shop', async () => {
    const t = await testApp();
    const priya = await t.signIn('priya@example.com');
    const own = (await priya.get('/api/projects')).body.projects;
    expect(own).toHaveLength(1);
    expect(own[0]).toMatchObject({ status: 'requested', client: { name: 'Priya Natarajan' }, latestEstimate: null });
    expect(own[0].timeline).toBeUndefined();
    const one = (await priya.get(`/api/projects/${own[0].id}`)).body.project;
    expect(one.timeline[0].kind).toBe('requested');
    expect(one.estimates).toEqual([]);
    const owner = await t.signIn('maren@fernhill.example');
    expect((await owner.get('/api/projects')).body.projects).toHaveLength(3);
    const builder = await t.signIn('idris@fernhill.example');
    expect((await builder.get('/api/projects')).body.projects).toEqual([]);
  });
  it('answers 401 when not signed in', async () => {
    const t = await testApp();
    const r = await t.agent().get('/api/projects');
    expect(r.status).toBe(401);
    expect(r.body).toEqual({ error: { code: 'unauthenticated', message: 'Sign in to continue.' } });
  });
});

describe('GET /api/projects/:id', () => {
  it("answers 404 for another client's project, never the data", async () => {
    const t = await testApp();
    const tomasz = await t.signIn('tomasz@example.com');
    const owner = await t.signIn('maren@fernhill.example');
    const priyas = (await owner.get('/api/projects')).body.projects.find(
      (p: { client: { name: string } }) => p.client.name === 'Priya Natarajan',
    );
    const r = await tomasz.get(`/api/projects/${priyas.id}`);
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
    expect(JSON.stringify(r.body)).not.toContain('Priya');
    expect((await owner.get(`/api/projects/${priyas.id}`)).body.project.id).toBe(priyas.id);
    expect((await (await t.signIn('idris@fernhill.example')).get(`/api/projects/${priyas.id}`)).status).toBe(404);
  });
});

describe('GET /api/projects/:id/layouts', () => {
  it('gives the owner the request’s cut list, drawn sheets and pick list; nobody else', async () => {
    const t = await testApp();
    const owner = await t.signIn('maren@fernhill.example');
    const priyas = (await owner.get('/api/projects')).body.projects.find(
      (p: { client: { name: string } }) => p.client.name === 'Priya Natarajan',
    );
    const r = await owner.get(`/api/projects/${priyas.id}/layouts`);
    expect(r.status).toBe(200);
    const l = r.body.layouts;
    expect(l.pieces.map((p: { quantity: number }) => p.quantity)).toEqual(
      priyas.items.map((i: { quantity: number }) => i.quantity),
    );
    expect(l.materials[0].sheets[0].drawing.shapes.length).toBeGreaterThan(3);
    expect(l.pickList.length).toBeGreaterThan(0);
    expect(['in', 'mm']).toContain(l.units);
    const priya = await t.signIn('priya@example.com');
    expect((await priya.get(`/api/projects/${priyas.id}/layouts`)).status).toBe(403);
    expect((await owner.get('/api/projects/no-such/layouts')).status).toBe(404);
  });
});

describe('POST /api/projects/:id/comments', () => {
  it('puts the client’s and the owner’s comments on the timeline, mails the other side, and keeps everyone else out', async () => {
    const t = await testApp();
    const priya = await t.signIn('priya@example.com');
    const owner = await t.signIn('maren@fernhill.example');
    const id = (await priya.get('/api/projects')).body.projects[0].id;
    const r = await priya.post(`/api/projects/${id}/comments`).send({ message: '  Could the bench be 2 in lower?  ' });
    expect(r.status).toBe(201);
    expect(r.body.project.timeline.at(-1)).toMatchObject({
      kind: 'comment',
      message: 'Could the bench be 2 in lower?',
      by: 'Priya Natarajan',
    });
    const reply = await owner.post(`/api/projects/${id}/comments`).send({ message: 'Yes: revision 2 is on its way.' });
    expect(reply.body.project.timeline.at(-1)).toMatchObject({ kind: 'comment', by: 'Maren Holt' });
    const mails = t.mails().filter((m) => /A comment from/.test(m.subject));
    expect(mails.map((m) => m.to).sort()).toEqual(['maren@fernhill.example', 'priya@example.com']);
    expect(mails.find((m) => m.to === 'maren@fernhill.example')!.text).toContain('Could the bench be 2 in lower?');
    expect((await priya.post(`/api/projects/${id}/comments`).send({ message: '   ' })).body.error.issues[0]).toEqual({
      path: 'message',
      message: 'write a comment first',
    });
    expect(
      (await (await t.signIn('tomasz@example.com')).post(`/api/projects/${id}/comments`).send({ message: 'hi' }))
        .status,
    ).toBe(404);
    expect(
      (await (await t.signIn('idris@fernhill.example')).post(`/api/projects/${id}/comments`).send({ message: 'hi' }))
        .status,
    ).toBe(403);
  });
});

describe('POST /api/projects', () => {
  it('when every item is valid, records the request (201, requested)', async () => {
    const t = await testApp();
    const a = await t.signIn('guild@example.com');
    const r = await a
      .post('/api/projects')
      .send({ items: [{ spec: designs['base-cabinet'].defaults, quantity: 3 }], notes: 'For the corner' });
    expect(r.status).toBe(201);
    expect(r.body.project).toMatchObject({ status: 'requested', notes: 'For the corner', items: [{ quantity: 3 }] });
    expect((await a.get('/api/projects')).body.projects).toHaveLength(2);
  });
  it('when an item breaks its design limits, answers 400 naming the field and the limit', async () => {
    const t = await testApp();
    const a = await t.signIn('guild@example.com');
    const r = await a
      .post('/api/projects')
      .send({ items: [{ spec: { ...designs.bookcase.defaults, widthMm: 100 }, quantity: 1 }] });
    expect(r.status).toBe(400);
    // the demo shop works in inches, so the message does too
    expect(r.body.error.issues).toContainEqual({
      path: 'items[0].spec.widthMm',
      message: '3 15/16 in is below the 12 in minimum.',
    });
  });
  it('when a shelf span is more than its material can carry, answers 400 and says what to change', async () => {
    const t = await testApp();
    const a = await t.signIn('guild@example.com');
    const spec = { ...designs.bookcase.defaults, widthMm: 1067, carcassMaterialId: 'mdf-18' };
    const r = await a.post('/api/projects').send({ items: [{ spec, quantity: 1 }] });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].message).toMatch(/cannot carry this span.*thicker shelf/);
  });
  it('refuses the owner without a client (400 on clientId): the owner starts a project only for a client', async () => {
    const t = await testApp();
    const r = await (await t.signIn('maren@fernhill.example'))
      .post('/api/projects')
      .send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(r.status).toBe(400);
    expect(r.body.error.issues).toEqual([{ path: 'clientId', message: 'choose a client' }]);
  });
});

describe('GET /api/designs', () => {
  it('lists the four designs with defaults and limits, to anyone', async () => {
    const t = await testApp();
    const r = await t.agent().get('/api/designs');
    expect(r.body.designs.map((d: { slug: string }) => d.slug)).toEqual([
      'assembly-bench',
      'base-cabinet',
      'wall-cabinet',
      'bookcase',
    ]);
    expect((await t.agent().get('/api/designs/bookcase')).body.design.limits.widthMm).toEqual([305, 1067]);
    expect((await t.agent().get('/api/designs/sofa')).status).toBe(404);
  });
});

describe('POST /api/quotes/preview', () => {
  it('gives anyone the budget range, checks and drawing, and no cost lines', async () => {
    const t = await testApp();
    const r = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(r.status).toBe(200);
    const q = r.body.quote;
    expect(q.budget.lowCents).toBeLessThan(q.budget.highCents);
    expect(q.items[0].drawingSvg).toMatch(/^<svg/);
    expect(q.checks.some((c: { code: string }) => c.code === 'anchor')).toBe(true);
    expect(q.lines).toBeUndefined();
    expect(JSON.stringify(r.body)).not.toMatch(/costCents|marginCents/);
  });
  it('gives the owner the lines and totals as well', async () => {
    const t = await testApp();
    const r = await (await t.signIn('maren@fernhill.example'))
      .post('/api/quotes/preview')
      .send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(r.body.quote.lines.length).toBeGreaterThan(3);
    expect(r.body.quote.totals.totalCents).toBeGreaterThanOrEqual(r.body.quote.budget.lowCents);
    expect(r.body.quote.totals.totalCents).toBeLessThanOrEqual(r.body.quote.budget.highCents);
  });
  it('prices a single-sided bench whose back is wider than a sheet (the back turns), never a 500', async () => {
    const t = await testApp();
    const b = designs['assembly-bench'].defaults;
    const spec = {
      ...b,
      widthMm: 1828.8,
      depthMm: 914.4,
      heightMm: 889,
      backMaterialId: 'birch-ply-6',
      overhangBackMm: 0,
      overhangLeftMm: 76.2,
      overhangRightMm: 76.2,
      cases: [
        {
          widthMm: 1676.4,
          depthMm: 838.2,
          xMm: null,
          row: 'front',
          facing: 'front',
          bays: [0, 1, 2].map(() => ({ ...b.cases[0]!.bays[0]!, widthMm: null })),
        },
      ],
      workingLoadKg: 100,
    };
    const r = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec, quantity: 1 }] });
    expect(r.body.error).toBeUndefined();
    expect(r.status).toBe(200);
  });
  it('answers 400 in the error shape, in the shop units and the screen words, for a drawer taller than a shop builds', async () => {
    const t = await testApp();
    const spec = {
      ...designs.bookcase.defaults,
      widthMm: 1000,
      heightMm: 1800,
      bays: [
        {
          widthMm: null,
          compartments: [{ kind: 'drawer', heightMm: null, doors: 1, adjustableShelves: 0, fixedShelves: 0 }],
        },
      ],
    };
    const r = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec, quantity: 1 }] });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBeTruthy();
    expect(r.body.error.issues).toContainEqual({
      path: 'items[0].spec.bays[0].compartments[0].heightMm',
      message: expect.stringMatching(
        /^Bay 1, Section 1: the drawer front would be [\d /]+ in tall, more than the 18 in/,
      ),
    });
  });
  it('gives a client no lines either', async () => {
    const t = await testApp();
    const r = await (await t.signIn('priya@example.com'))
      .post('/api/quotes/preview')
      .send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(r.body.quote.lines).toBeUndefined();
  });
});
