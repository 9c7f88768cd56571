import { describe, expect, it } from 'vitest';
import { PORTAL, testApp, tokenFrom } from './helpers';

describe('POST /api/auth/sign-up', () => {
  it('creates a client, signs them in and queues the verification mail', async () => {
    const t = await testApp();
    const a = t.agent();
    const r = await a
      .post('/api/auth/sign-up')
      .set('Origin', PORTAL)
      .send({ email: 'New.Client@Example.com', password: 'a-long-password', name: 'Ada Client' });
    expect(r.status).toBe(201);
    expect(r.body.user).toMatchObject({ email: 'new.client@example.com', role: 'client', emailVerified: false });
    const cookie = r.headers['set-cookie']?.[0];
    expect(cookie).toMatch(/bw_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/);
    expect((await a.get('/api/auth/me')).body.user.email).toBe('new.client@example.com');
    const mail = t.mails().find((m) => m.to === 'new.client@example.com')!;
    expect(mail.subject).toMatch(/Confirm your e-mail/);
    expect(mail.text).toContain(`${PORTAL}/verify-email?token=`);
    expect(mail.html).toContain('Confirm my e-mail');
  });
  it('when the e-mail is malformed or the password short, answers 400 with field issues', async () => {
    const t = await testApp();
    const r = await t.agent().post('/api/auth/sign-up').send({ email: 'not-an-email', password: 'short', name: 'X' });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('invalid_input');
    expect(r.body.error.issues).toEqual(
      expect.arrayContaining([
        { path: 'email', message: 'enter a valid e-mail address' },
        { path: 'password', message: 'use at least 10 characters' },
      ]),
    );
  });
  it('when the e-mail is taken, answers 409', async () => {
    const t = await testApp();
    const r = await t
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: 'priya@example.com', password: 'a-long-password', name: 'P' });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('conflict');
  });
  it('when sign-ups from one address pass the hourly limit, answers 429', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', SIGNUPS_PER_IP: '2' });
    for (let i = 0; i < 2; i++)
      expect(
        (
          await t
            .agent()
            .post('/api/auth/sign-up')
            .send({ email: `c${i}@example.com`, password: 'a-long-password', name: 'C' })
        ).status,
      ).toBe(201);
    const r = await t
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: 'c9@example.com', password: 'a-long-password', name: 'C' });
    expect(r.status).toBe(429);
    expect(r.body.error.code).toBe('rate_limited');
  });
});

describe('POST /api/auth/sign-in', () => {
  it('answers the same for an unknown e-mail and a wrong password', async () => {
    const t = await testApp();
    const a = await t
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@example.com', password: 'whatever-it-is' });
    const b = await t
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'priya@example.com', password: 'whatever-it-is' });
    expect(a.status).toBe(401);
    expect(b.status).toBe(401);
    expect(a.body).toEqual(b.body);
    expect(a.body.error.code).toBe('unauthenticated');
  });
  it('signs in with the demo password and returns the role', async () => {
    const t = await testApp();
    const a = await t.signIn('maren@fernhill.example');
    expect((await a.get('/api/auth/me')).body.user).toMatchObject({ role: 'owner', name: 'Maren Holt' });
  });
  it('after 10 failed sign-ins for one e-mail, answers 429, and successful ones are not counted', async () => {
    const t = await testApp({ RATE_LIMITS: 'true' });
    for (let i = 0; i < 3; i++) await t.signIn('priya@example.com');
    for (let i = 0; i < 10; i++)
      expect(
        (await t.agent().post('/api/auth/sign-in').send({ email: 'priya@example.com', password: 'wrong-password' }))
          .status,
      ).toBe(401);
    const r = await t
      .agent()
      .post('/api/auth/sign-in')
      .send({ email: 'priya@example.com', password: 'wrong-password' });
    expect(r.status).toBe(429);
    // another e-mail from the same address is still let through
    expect(
      (await t.agent().post('/api/auth/sign-in').send({ email: 'tomasz@example.com', password: 'bench-demo-2026' }))
        .status,
    ).toBe(200);
  });
});

describe('POST /api/auth/sign-out', () => {
  it('ends the session', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    expect((await a.post('/api/auth/sign-out')).status).toBe(204);
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });
});

describe('POST /api/auth/verify-email', () => {
  it('verifies the e-mail once; the link cannot be used twice', async () => {
    const t = await testApp();
    const a = t.agent();
    await a.post('/api/auth/sign-up').send({ email: 'v@example.com', password: 'a-long-password', name: 'V' });
    const token = tokenFrom(t.mails().find((m) => m.to === 'v@example.com')!.text);
    const r = await t.agent().post('/api/auth/verify-email').send({ token });
    expect(r.status).toBe(200);
    expect(r.body.user.emailVerified).toBe(true);
    const again = await t.agent().post('/api/auth/verify-email').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error.message).toMatch(/expired or was already used/);
  });
});

describe('POST /api/auth/forgot-password and /reset-password', () => {
  it('mails a single-use link that sets a new password; the old one stops working', async () => {
    const t = await testApp();
    expect((await t.agent().post('/api/auth/forgot-password').send({ email: 'tomasz@example.com' })).status).toBe(202);
    expect((await t.agent().post('/api/auth/forgot-password').send({ email: 'nobody@example.com' })).status).toBe(202);
    const mails = t.mails().filter((m) => m.subject.startsWith('Reset'));
    expect(mails.map((m) => m.to)).toEqual(['tomasz@example.com']);
    const token = tokenFrom(mails[0]?.text);
    expect(
      (await t.agent().post('/api/auth/reset-password').send({ token, password: 'a-brand-new-password' })).status,
    ).toBe(200);
    expect(
      (await t.agent().post('/api/auth/sign-in').send({ email: 'tomasz@example.com', password: 'bench-demo-2026' }))
        .status,
    ).toBe(401);
    expect(
      (
        await t
          .agent()
          .post('/api/auth/sign-in')
          .send({ email: 'tomasz@example.com', password: 'a-brand-new-password' })
      ).status,
    ).toBe(200);
    expect(
      (await t.agent().post('/api/auth/reset-password').send({ token, password: 'yet-another-password' })).status,
    ).toBe(400);
  });
  it('refuses an expired link', async () => {
    const t = await testApp();
    await t.agent().post('/api/auth/forgot-password').send({ email: 'tomasz@example.com' });
    const token = tokenFrom(t.mails().find((m) => m.subject.startsWith('Reset'))!.text);
    t.db.$client.prepare('update tokens set expires_at = 0').run();
    expect(
      (await t.agent().post('/api/auth/reset-password').send({ token, password: 'a-brand-new-password' })).status,
    ).toBe(400);
  });
});

describe('POST /api/users/invitations', () => {
  it('when the owner invites a builder, the mail leads to setting a password, and the builder can sign in', async () => {
    const t = await testApp();
    const owner = await t.signIn('maren@fernhill.example');
    const r = await owner.post('/api/users/invitations').send({ email: 'sam@fernhill.example', name: 'Sam Reed' });
    expect(r.status).toBe(201);
    expect(r.body.user).toMatchObject({ role: 'builder', email: 'sam@fernhill.example' });
    const mail = t.mails().find((m) => m.to === 'sam@fernhill.example')!;
    expect(mail.text).toContain('http://127.0.0.1:5174/accept-invitation?token=');
    const b = t.agent();
    expect(
      (await b.post('/api/auth/accept-invitation').send({ token: tokenFrom(mail.text), password: 'builder-password' }))
        .status,
    ).toBe(200);
    expect((await b.get('/api/auth/me')).body.user.role).toBe('builder');
  });
  it('refuses clients and builders (403) and anonymous callers (401)', async () => {
    const t = await testApp();
    for (const email of ['priya@example.com', 'idris@fernhill.example']) {
      const a = await t.signIn(email);
      const r = await a.post('/api/users/invitations').send({ email: 'x@example.com', name: 'X' });
      expect(r.status).toBe(403);
      expect(r.body.error.code).toBe('forbidden');
    }
    expect((await t.agent().post('/api/users/invitations').send({ email: 'x@example.com', name: 'X' })).status).toBe(
      401,
    );
  });
});

describe('origin check', () => {
  it('refuses a state-changing request from another origin, and lets one without an Origin through', async () => {
    const t = await testApp();
    const bad = await t
      .agent()
      .post('/api/auth/sign-in')
      .set('Origin', 'http://evil.example')
      .send({ email: 'priya@example.com', password: 'bench-demo-2026' });
    expect(bad.status).toBe(403);
    expect(bad.body.error.code).toBe('forbidden');
    expect(
      (await t.agent().post('/api/auth/sign-in').send({ email: 'priya@example.com', password: 'bench-demo-2026' }))
        .status,
    ).toBe(200);
    expect(
      (
        await t
          .agent()
          .post('/api/auth/sign-in')
          .set('Origin', 'http://localhost:5174')
          .send({ email: 'priya@example.com', password: 'bench-demo-2026' })
      ).status,
    ).toBe(200);
  });
  it('asks no CSRF token or Content-Type of a bodiless POST', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    expect((await a.post('/api/auth/sign-out').set('Origin', PORTAL)).status).toBe(204);
  });
});
