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

describe('session lifetime', () => {
  it('ends a session SESSION_MAX_DAYS after sign-in, however active it has been', async () => {
    const t = await testApp({ SESSION_MAX_DAYS: '30' });
    const a = await t.signIn('priya@example.com');
    expect((await a.get('/api/auth/me')).status).toBe(200);
    const day = 24 * 3600_000;
    // 29 days on, still in; Lucia's sliding expiry alone would keep it going for ever
    t.db.$client.prepare('update sessions set created_at = ?').run(Date.now() - 29 * day);
    expect((await a.get('/api/auth/me')).status).toBe(200);
    t.db.$client
      .prepare('update sessions set created_at = ?, expires_at = ?')
      .run(Date.now() - 30 * day - 1000, Math.floor(Date.now() / 1000) + 29 * 24 * 3600);
    const r = await a.get('/api/auth/me');
    expect(r.status).toBe(401);
    expect(r.headers['set-cookie']?.[0]).toMatch(/bw_session=;/);
    expect(t.db.$client.prepare('select count(*) as n from sessions').get()).toEqual({ n: 0 });
  });
  it('stamps each new session with its sign-in time', async () => {
    const t = await testApp();
    const before = Date.now();
    await t.signIn('tomasz@example.com');
    const row = t.db.$client.prepare('select created_at from sessions').get() as { created_at: number };
    expect(row.created_at).toBeGreaterThanOrEqual(before - 1000);
    expect(row.created_at).toBeLessThanOrEqual(Date.now());
  });
  it('a password reset ends every session of the user and starts one for the resetting browser', async () => {
    const t = await testApp();
    const laptop = await t.signIn('tomasz@example.com');
    const phone = await t.signIn('tomasz@example.com');
    const other = await t.signIn('priya@example.com');
    await t.agent().post('/api/auth/forgot-password').send({ email: 'tomasz@example.com' });
    const mail = t.mails().find((m) => m.to === 'tomasz@example.com' && m.subject.startsWith('Reset'))!;
    const token = /token=([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    const browser = t.agent();
    expect(
      (await browser.post('/api/auth/reset-password').send({ token, password: 'a-brand-new-password' })).status,
    ).toBe(200);
    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await browser.get('/api/auth/me')).body.user.email).toBe('tomasz@example.com');
    expect((await other.get('/api/auth/me')).status).toBe(200);
  });
});
