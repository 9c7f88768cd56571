import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';
const ROUTES: [Method, string][] = [
  ['post', '/api/auth/sign-up'],
  ['post', '/api/auth/sign-in'],
  ['post', '/api/auth/sign-out'],
  ['get', '/api/auth/me'],
  ['post', '/api/auth/verify-email'],
  ['post', '/api/auth/resend-verification'],
  ['post', '/api/auth/forgot-password'],
  ['post', '/api/auth/reset-password'],
  ['post', '/api/auth/accept-invitation'],
  ['get', '/api/users'],
  ['post', '/api/users/invitations'],
  ['get', '/api/designs'],
  ['get', '/api/designs/bookcase'],
  ['post', '/api/quotes/preview'],
  ['get', '/api/projects'],
  ['get', '/api/projects/nope'],
  ['post', '/api/projects'],
  ['get', '/api/health'],
  ['post', '/api/projects/nope/estimates'],
  ['post', '/api/projects/nope/balance-checkout'],
  ['get', '/api/estimates/nope'],
  ['patch', '/api/estimates/nope'],
  ['post', '/api/estimates/nope/send'],
  ['get', '/api/estimates/nope/pdf'],
  ['post', '/api/estimates/nope/accept'],
  ['post', '/api/estimates/nope/deposit-checkout'],
  ['post', '/api/estimates/nope/withdraw'],
  ['get', '/api/payments'],
  ['post', '/api/payments/nope/refund'],
  ['post', '/api/payments/confirm'],
  ['post', '/api/webhooks/stripe'],
  ['get', '/api/jobs'],
  ['get', '/api/jobs/nope/traveller'],
  ['get', '/api/jobs/nope/traveller.pdf'],
  ['get', '/api/projects/nope/layouts'],
  ['get', '/api/mail/failed'],
  ['post', '/api/projects/nope/comments'],
  ['post', '/api/mail/nope/retry'],
  ['patch', '/api/jobs/nope'],
  ['post', '/api/jobs/nope/time'],
];
const CODES = [
  'invalid_input',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'payload_too_large',
  'unsupported_media_type',
  'rate_limited',
];

function checkShape(status: number, body: unknown) {
  expect(status).toBeLessThan(500);
  if (status >= 400) {
    const e = (body as { error: { code: string; message: string; issues?: { path: string; message: string }[] } })
      .error;
    expect(CODES).toContain(e.code);
    expect(typeof e.message).toBe('string');
    expect(JSON.stringify(body)).not.toMatch(/at .*\.ts:\d+|node_modules|stack/i);
    for (const i of e.issues ?? []) expect(Object.keys(i).sort()).toEqual(['message', 'path']);
  }
}

describe('bad input on every route', () => {
  it('never answers 500 or a stack trace, signed in as each role or not at all', async () => {
    const t = await testApp();
    const agents = [
      t.agent(),
      await t.signIn('priya@example.com'),
      await t.signIn('maren@fernhill.example'),
      await t.signIn('idris@fernhill.example'),
    ];
    const bodies: unknown[] = [
      null,
      0,
      'text',
      [],
      {},
      { email: 5 },
      { email: 'a@b.c', password: ['x'] },
      { items: 'x' },
      { items: [{}] },
      { items: [{ spec: { design: 'bookcase', widthMm: 'wide' }, quantity: -1 }] },
      { items: [{ spec: { design: '__proto__' }, quantity: 1 }] },
      { token: 'x'.repeat(300) },
      { __proto__: { admin: true } },
    ];
    for (const a of agents) {
      for (const [method, path] of ROUTES) {
        for (const body of bodies) {
          const r = await (
            a as never as Record<
              Method,
              (p: string) => { send: (b: unknown) => Promise<{ status: number; body: unknown }> }
            >
          )
            [method](path)
            .send(body as object);
          checkShape(r.status, r.body);
        }
      }
    }
  }, 120_000); // about 2,000 requests: allow for a busy machine
  it('answers malformed JSON with 400, an oversized body with 413, an unknown route with 404', async () => {
    const t = await testApp();
    const bad = await t.agent().post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    expect(bad.body.error).toEqual({ code: 'invalid_input', message: 'The request body is not valid JSON.' });
    const big = await t
      .agent()
      .post('/api/quotes/preview')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ items: [], pad: 'x'.repeat(200_000) }));
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('payload_too_large');
    const none = await t.agent().get('/api/nothing-here');
    expect(none.status).toBe(404);
    expect(none.body.error.code).toBe('not_found');
  });
});

describe('GET /api/health', () => {
  it('answers 200 with the database, migration level and version once ready', async () => {
    const t = await testApp();
    const r = await t.agent().get('/api/health');
    expect(r.status).toBe(200);
    expect(r.body.health).toMatchObject({ status: 'ok', database: 'ok', version: '0.1.0' });
    expect(r.body.health.migrations).toBeGreaterThanOrEqual(1);
  });
});

describe('bad input on the money routes, with real ids', () => {
  it('answers 400 with issues, never a 500, for malformed edits, acceptances and hour logs', async () => {
    const t = await testApp();
    const owner = await t.signIn('maren@fernhill.example');
    const priya = await t.signIn('priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id;
    const est = await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'nonsense' });
    expect(est.status).toBe(400);
    const draft = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    for (const body of [
      {},
      { version: 'one' },
      { version: 1, lines: [{ group: 'gold' }] },
      { version: 1, lines: [{ group: 'other', description: '', quantity: -1, unit: '', unitPriceCents: 1.5 }] },
      { version: 1, discountCents: -5 },
    ]) {
      const r = await owner.patch(`/api/estimates/${draft.id}`).send(body);
      expect(r.status).toBe(400);
      expect(r.body.error.issues.length).toBeGreaterThan(0);
    }
    expect((await owner.patch(`/api/estimates/${draft.id}`).send({ version: 99 })).status).toBe(409);
    expect(
      (await priya.post(`/api/estimates/${draft.id}/accept`).send({ acceptedName: 'Priya Natarajan' })).status,
    ).toBe(404);
    expect((await owner.post(`/api/projects/${projectId}/estimates`).send({})).status).toBe(409);
  });
});
