import { describe, expect, it } from 'vitest';
import { AccountResponse, AccountSessionsResponse } from '@benchwright/contracts';
import { DEMO_PASSWORD } from '../src/db/seed';
import { testApp, tokenFrom } from './helpers';

const sessionsOf = (t: Awaited<ReturnType<typeof testApp>>) =>
  t.db.$client.prepare('select id, user_agent, last_seen_at from sessions').all() as {
    id: string;
    user_agent: string;
    last_seen_at: number;
  }[];

describe('GET /api/account', () => {
  it('answers the signed-in person with no address waiting', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    const r = await a.get('/api/account');
    expect(r.status).toBe(200);
    const { account } = AccountResponse.parse(r.body);
    expect(account).toMatchObject({ email: 'priya@example.com', role: 'client', pendingEmail: null });
  });
  it('when not signed in, answers 401', async () => {
    const t = await testApp();
    expect((await t.agent().get('/api/account')).status).toBe(401);
  });
});

describe('PATCH /api/account', () => {
  it('changes the name', async () => {
    const t = await testApp();
    const a = await t.signIn('idris@fernhill.example');
    const r = await a.patch('/api/account').send({ name: '  Idris K. Kane ' });
    expect(r.status).toBe(200);
    expect(r.body.account.name).toBe('Idris K. Kane');
    expect((await a.get('/api/auth/me')).body.user.name).toBe('Idris K. Kane');
  });
  it('refuses an empty name or one with control characters, with the field named', async () => {
    const t = await testApp();
    const a = await t.signIn('idris@fernhill.example');
    for (const name of ['', 'Idris\u202eKane']) {
      const r = await a.patch('/api/account').send({ name });
      expect(r.status).toBe(400);
      expect(r.body.error.issues[0].path).toBe('name');
    }
  });
});

describe('POST /api/account/email', () => {
  it('mails a link to the new address and keeps the old one until it is followed', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    const r = await a.post('/api/account/email').send({ email: 'Priya.N@Example.org', currentPassword: DEMO_PASSWORD });
    expect(r.status).toBe(202);
    expect(r.body.account).toMatchObject({ email: 'priya@example.com', pendingEmail: 'priya.n@example.org' });
    // until the link is followed, the old address stays: signing in with it still works, with the new one not
    expect((await a.get('/api/auth/me')).body.user.email).toBe('priya@example.com');
    const link = t.mails().find((m) => m.to === 'priya.n@example.org');
    expect(link?.text).toMatch(/http:\/\/127\.0\.0\.1:5173\/confirm-email\?token=/);
    const notice = t.mails().find((m) => m.to === 'priya@example.com' && /new e-mail was asked/.test(m.subject));
    expect(notice?.text).toContain('priya.n@example.org');
    expect(
      (await t.agent().post('/api/auth/sign-in').send({ email: 'priya.n@example.org', password: DEMO_PASSWORD }))
        .status,
    ).toBe(401);

    const c = await t
      .agent()
      .post('/api/auth/confirm-email-change')
      .send({ token: tokenFrom(link?.text) });
    expect(c.status).toBe(200);
    expect(c.body.user).toMatchObject({ email: 'priya.n@example.org', emailVerified: true });
    expect((await a.get('/api/account')).body.account).toMatchObject({
      email: 'priya.n@example.org',
      pendingEmail: null,
    });
    expect(
      (await t.agent().post('/api/auth/sign-in').send({ email: 'priya.n@example.org', password: DEMO_PASSWORD }))
        .status,
    ).toBe(200);
    // the link works once
    expect(
      (
        await t
          .agent()
          .post('/api/auth/confirm-email-change')
          .send({ token: tokenFrom(link?.text) })
      ).status,
    ).toBe(400);
  });
  it('a second request replaces the first: the first link stops working', async () => {
    const t = await testApp();
    const a = await t.signIn('tomasz@example.com');
    await a.post('/api/account/email').send({ email: 'first@example.org', currentPassword: DEMO_PASSWORD });
    await a.post('/api/account/email').send({ email: 'second@example.org', currentPassword: DEMO_PASSWORD });
    const first = tokenFrom(t.mails().find((m) => m.to === 'first@example.org')?.text);
    expect((await t.agent().post('/api/auth/confirm-email-change').send({ token: first })).status).toBe(400);
    expect((await a.get('/api/auth/me')).body.user.email).toBe('tomasz@example.com');
  });
  it('asks for the current password, names the field when it is wrong, and changes nothing', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    const r = await a.post('/api/account/email').send({ email: 'p@example.org', currentPassword: 'not-the-password' });
    expect(r.status).toBe(400);
    expect(r.body.error.issues).toEqual([{ path: 'currentPassword', message: 'the current password is not right' }]);
    expect((await a.get('/api/account')).body.account.pendingEmail).toBeNull();
    expect(t.mails().filter((m) => m.to === 'p@example.org')).toEqual([]);
  });
  it("refuses another account's address (409) and the same address (400)", async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    const taken = await a
      .post('/api/account/email')
      .send({ email: 'tomasz@example.com', currentPassword: DEMO_PASSWORD });
    expect(taken.status).toBe(409);
    const same = await a
      .post('/api/account/email')
      .send({ email: 'priya@example.com', currentPassword: DEMO_PASSWORD });
    expect(same.status).toBe(400);
    expect(same.body.error.issues[0].path).toBe('email');
  });
  it('when the address was taken in the meantime, the link answers 409 and changes nothing', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    await a.post('/api/account/email').send({ email: 'shared@example.org', currentPassword: DEMO_PASSWORD });
    const token = tokenFrom(t.mails().find((m) => m.to === 'shared@example.org')?.text);
    await t
      .agent()
      .post('/api/auth/sign-up')
      .send({ email: 'shared@example.org', password: 'a-long-password-1', name: 'Sam' });
    expect((await t.agent().post('/api/auth/confirm-email-change').send({ token })).status).toBe(409);
    expect((await a.get('/api/auth/me')).body.user.email).toBe('priya@example.com');
  });
  it('sends at most VERIFY_MAILS_PER_HOUR links an hour (429 after)', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', VERIFY_MAILS_PER_HOUR: '2' });
    const a = await t.signIn('priya@example.com');
    const ask = (n: number) =>
      a.post('/api/account/email').send({ email: `p${n}@example.org`, currentPassword: DEMO_PASSWORD });
    expect((await ask(1)).status).toBe(202);
    expect((await ask(2)).status).toBe(202);
    expect((await ask(3)).status).toBe(429);
  });
});

describe('POST /api/account/password', () => {
  it('asks for the current password, then ends every other session and keeps this one', async () => {
    const t = await testApp();
    const laptop = await t.signIn('tomasz@example.com');
    const phone = await t.signIn('tomasz@example.com');
    const other = await t.signIn('priya@example.com');
    const wrong = await laptop
      .post('/api/account/password')
      .send({ currentPassword: 'not-the-password', newPassword: 'a-brand-new-password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.issues[0].path).toBe('currentPassword');
    expect((await phone.get('/api/auth/me')).status).toBe(200);

    const r = await laptop
      .post('/api/account/password')
      .send({ currentPassword: DEMO_PASSWORD, newPassword: 'a-brand-new-password' });
    expect(r.status).toBe(200);
    expect((await laptop.get('/api/auth/me')).status).toBe(200);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await other.get('/api/auth/me')).status).toBe(200);
    const signIn = (password: string) =>
      t.agent().post('/api/auth/sign-in').send({ email: 'tomasz@example.com', password });
    expect((await signIn(DEMO_PASSWORD)).status).toBe(401);
    expect((await signIn('a-brand-new-password')).status).toBe(200);
  });
  it('refuses a short new password or the same one, with the field named', async () => {
    const t = await testApp();
    const a = await t.signIn('tomasz@example.com');
    for (const newPassword of ['short', DEMO_PASSWORD]) {
      const r = await a.post('/api/account/password').send({ currentPassword: DEMO_PASSWORD, newPassword });
      expect(r.status).toBe(400);
      expect(r.body.error.issues[0].path).toBe('newPassword');
    }
  });
  it('limits wrong current passwords per account (429), like failed sign-ins', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', ACCOUNT_PASSWORD_CHECKS: '3' });
    const a = await t.signIn('tomasz@example.com');
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++)
      statuses.push(
        (
          await a
            .post('/api/account/password')
            .send({ currentPassword: `guess-${i}`, newPassword: 'a-brand-new-password' })
        ).status,
      );
    expect(statuses).toEqual([400, 400, 400, 429]);
  });
});

describe('GET /api/account/sessions', () => {
  it("lists the person's own live sessions with sign-in time, last use and browser, this one marked", async () => {
    const t = await testApp();
    const phone = t.agent();
    await phone
      .post('/api/auth/sign-in')
      .set('User-Agent', 'Phone browser 1.0')
      .send({ email: 'priya@example.com', password: DEMO_PASSWORD });
    const laptop = t.agent();
    await laptop
      .post('/api/auth/sign-in')
      .set('User-Agent', 'Laptop browser 2.0')
      .send({ email: 'priya@example.com', password: DEMO_PASSWORD });
    await t.signIn('tomasz@example.com');
    const r = await laptop.get('/api/account/sessions');
    expect(r.status).toBe(200);
    const { sessions } = AccountSessionsResponse.parse(r.body);
    expect(sessions.map((s) => [s.userAgent, s.current]).sort()).toEqual([
      ['Laptop browser 2.0', true],
      ['Phone browser 1.0', false],
    ]);
    // the ids shown are not the session secrets
    const secrets = sessionsOf(t).map((s) => s.id);
    for (const s of sessions) {
      expect(secrets).not.toContain(s.id);
      expect(Date.parse(s.createdAt)).toBeGreaterThan(Date.now() - 60_000);
      expect(s.lastSeenAt).not.toBeNull();
    }
  });
  it('records the last use at most once a minute', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    const old = Date.now() - 5 * 60_000;
    t.db.$client.prepare('update sessions set last_seen_at = ?').run(old);
    await a.get('/api/auth/me');
    const seen = sessionsOf(t)[0]!.last_seen_at;
    expect(seen).toBeGreaterThan(old + 4 * 60_000);
    await a.get('/api/auth/me');
    expect(sessionsOf(t)[0]!.last_seen_at).toBe(seen);
  });
});

describe('DELETE /api/account/sessions/:id and POST /api/account/sessions/end-others', () => {
  it('ends one chosen session of the person, and answers 404 for another person’s', async () => {
    const t = await testApp();
    const laptop = await t.signIn('priya@example.com');
    const phone = await t.signIn('priya@example.com');
    const tomasz = await t.signIn('tomasz@example.com');
    const list = (await laptop.get('/api/account/sessions')).body.sessions as { id: string; current: boolean }[];
    const phoneId = list.find((s) => !s.current)!.id;
    // Tomasz cannot end Priya's session
    expect((await tomasz.delete(`/api/account/sessions/${phoneId}`)).status).toBe(404);
    expect((await phone.get('/api/auth/me')).status).toBe(200);
    expect((await laptop.delete(`/api/account/sessions/${phoneId}`)).status).toBe(204);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.get('/api/auth/me')).status).toBe(200);
    expect((await laptop.delete('/api/account/sessions/not-a-handle')).status).toBe(400);
  });
  it('ending this session signs out and clears the cookie', async () => {
    const t = await testApp();
    const a = await t.signIn('priya@example.com');
    const mine = ((await a.get('/api/account/sessions')).body.sessions as { id: string }[])[0]!.id;
    const r = await a.delete(`/api/account/sessions/${mine}`);
    expect(r.status).toBe(204);
    expect(String(r.headers['set-cookie'])).toMatch(/bw_session=;/);
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });
  it("ends all the person's other sessions and no one else's", async () => {
    const t = await testApp();
    const laptop = await t.signIn('priya@example.com');
    const phone = await t.signIn('priya@example.com');
    const tablet = await t.signIn('priya@example.com');
    const tomasz = await t.signIn('tomasz@example.com');
    const r = await laptop.post('/api/account/sessions/end-others');
    expect(r.status).toBe(200);
    expect(r.body.ended).toBe(2);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect((await tablet.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.get('/api/auth/me')).status).toBe(200);
    expect((await tomasz.get('/api/auth/me')).status).toBe(200);
  });
});
