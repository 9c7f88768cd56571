import { designs } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

const body = (notes = 'For the hall') => ({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }], notes });
const count = (t: Awaited<ReturnType<typeof testApp>>, sql: string) =>
  (t.db.$client.prepare(sql).get() as { n: number }).n;
const projectCount = (t: Awaited<ReturnType<typeof testApp>>) => count(t, 'select count(*) as n from projects');

describe('POST /api/projects with an Idempotency-Key', () => {
  it('when retried with the same key, answers the first result and makes no second project', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const before = projectCount(t);
    const first = await guild.post('/api/projects').set('Idempotency-Key', 'attempt-1').send(body());
    expect(first.status).toBe(201);
    const again = await guild.post('/api/projects').set('Idempotency-Key', 'attempt-1').send(body());
    expect(again.status).toBe(201);
    expect(again.body).toEqual(first.body);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(projectCount(t)).toBe(before + 1);
    // the owner was told once
    expect(t.mails().filter((m) => /New request/.test(m.subject))).toHaveLength(1);
  });
  it('the same body with the keys of its objects in another order counts as the same request', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const a = await guild.post('/api/projects').set('Idempotency-Key', 'k').send(body());
    const b = body();
    const reordered = { notes: b.notes, items: [{ quantity: 1, spec: b.items[0]!.spec }] };
    const r = await guild.post('/api/projects').set('Idempotency-Key', 'k').send(reordered);
    expect(r.status).toBe(201);
    expect(r.body.project.id).toBe(a.body.project.id);
  });
  it('when the same key comes with another body, answers 409 in plain words and does nothing', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    await guild.post('/api/projects').set('Idempotency-Key', 'attempt-1').send(body());
    const before = projectCount(t);
    const r = await guild.post('/api/projects').set('Idempotency-Key', 'attempt-1').send(body('Something else'));
    expect(r.status).toBe(409);
    expect(r.body.error).toMatchObject({ code: 'conflict', message: expect.stringMatching(/different request/) });
    expect(projectCount(t)).toBe(before);
  });
  it('keeps keys apart per user, and without a key every request creates', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const priya = await t.signIn('priya@example.com');
    const before = projectCount(t);
    const g = await guild.post('/api/projects').set('Idempotency-Key', 'shared').send(body());
    const p = await priya.post('/api/projects').set('Idempotency-Key', 'shared').send(body());
    expect([g.status, p.status]).toEqual([201, 201]);
    expect(p.body.project.id).not.toBe(g.body.project.id);
    expect(p.body.project.client.name).toBe('Priya Natarajan');
    await guild.post('/api/projects').send(body());
    await guild.post('/api/projects').send(body());
    expect(projectCount(t)).toBe(before + 4);
  });
  it('keeps nothing for a refused request, so it can be retried with its key once put right', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const bad = { items: [{ spec: { ...designs.bookcase.defaults, widthMm: 100 }, quantity: 1 }], notes: '' };
    expect((await guild.post('/api/projects').set('Idempotency-Key', 'k2').send(bad)).status).toBe(400);
    expect((await guild.post('/api/projects').set('Idempotency-Key', 'k2').send(body())).status).toBe(201);
  });
  it('forgets a key after 24 hours', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const before = projectCount(t);
    await guild.post('/api/projects').set('Idempotency-Key', 'old').send(body());
    t.db.$client.prepare('update idempotency_keys set created_at = created_at - 86400001').run();
    expect((await guild.post('/api/projects').set('Idempotency-Key', 'old').send(body())).status).toBe(201);
    expect(projectCount(t)).toBe(before + 2);
    expect(count(t, 'select count(*) as n from idempotency_keys')).toBe(1);
  });
  it('when five copies arrive at once, makes one project; each copy gets it or a 409 to retry', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const before = projectCount(t);
    const rs = await Promise.all(
      Array.from({ length: 5 }, () => guild.post('/api/projects').set('Idempotency-Key', 'burst').send(body())),
    );
    const created = rs.filter((r) => r.status === 201);
    expect(created.length).toBeGreaterThanOrEqual(1);
    expect(new Set(created.map((r) => r.body.project.id)).size).toBe(1);
    for (const r of rs) expect([201, 409]).toContain(r.status);
    expect(projectCount(t)).toBe(before + 1);
  });
  it('refuses a malformed key (400)', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const r = await guild.post('/api/projects').set('Idempotency-Key', 'x'.repeat(256)).send(body());
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
  });
  it('answers a repeat that arrives while the first is still in hand with 409', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    // the first request's record as it stands while its work runs
    await guild.post('/api/projects').set('Idempotency-Key', 'busy').send(body());
    t.db.$client.prepare("update idempotency_keys set status = null, body = null where key = 'busy'").run();
    const r = await guild.post('/api/projects').set('Idempotency-Key', 'busy').send(body());
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/still being handled/);
  });
});

describe('POST /api/projects/:id/comments with an Idempotency-Key', () => {
  it('records a retried comment once and mails it once', async () => {
    const t = await testApp();
    const priya = await t.signIn('priya@example.com');
    const id = (await priya.get('/api/projects')).body.projects[0].id;
    const send = () => priya.post(`/api/projects/${id}/comments`).set('Idempotency-Key', 'c-1').send({ message: 'Hi' });
    const a = await send();
    const b = await send();
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(b.body).toEqual(a.body);
    expect(count(t, "select count(*) as n from project_events where kind = 'comment'")).toBe(1);
    expect(t.mails().filter((m) => /A comment from/.test(m.subject))).toHaveLength(1);
  });
});
