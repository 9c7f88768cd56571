import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

describe('session cookie', () => {
  it('when the cookie has broken %-encoding, treats the request as anonymous (no 500)', async () => {
    const t = await testApp();
    for (const cookie of ['bw_session=%zz', 'bw_session=%', 'other=%E0%A4%A; bw_session=abc', 'bw_session=%C0%80']) {
      const health = await t.agent().get('/api/health').set('Cookie', cookie);
      expect(health.status).toBe(200);
      const me = await t.agent().get('/api/auth/me').set('Cookie', cookie);
      expect(me.status).toBe(401);
      expect(me.body.error.code).toBe('unauthenticated');
      const designs = await t.agent().get('/api/designs').set('Cookie', cookie);
      expect(designs.status).toBe(200);
    }
  });
  it('when the cookie is malformed, a sign-in still works and sets a good session', async () => {
    const t = await testApp();
    const r = await t
      .agent()
      .post('/api/auth/sign-in')
      .set('Cookie', 'bw_session=%zz')
      .send({ email: 'priya@example.com', password: 'bench-demo-2026' });
    expect(r.status).toBe(200);
  });
});
