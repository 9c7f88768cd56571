import { designs } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

const resets = (t: Awaited<ReturnType<typeof testApp>>, to: string) =>
  t.mails().filter((m) => m.to === to && m.subject.startsWith('Reset'));

describe('POST /api/auth/forgot-password', () => {
  it('mails at most 3 reset links an hour to one address, and answers every request alike', async () => {
    const t = await testApp({ RATE_LIMITS: 'true' });
    const answers = [];
    for (let i = 0; i < 8; i++) {
      const r = await t.agent().post('/api/auth/forgot-password').send({ email: 'tomasz@example.com' });
      answers.push({ status: r.status, body: r.body });
    }
    const unknown = await t.agent().post('/api/auth/forgot-password').send({ email: 'nobody@example.com' });
    for (const a of [...answers, { status: unknown.status, body: unknown.body }])
      expect(a).toEqual({ status: 202, body: { sent: true } });
    expect(resets(t, 'tomasz@example.com')).toHaveLength(3);
    // an hour on, one more may go
    t.db.$client.prepare('update tokens set created_at = created_at - 3600001').run();
    await t.agent().post('/api/auth/forgot-password').send({ email: 'tomasz@example.com' });
    expect(resets(t, 'tomasz@example.com')).toHaveLength(4);
  });
  it('limits forgot-password requests per client address (429 beyond)', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', PASSWORD_RESETS_PER_IP: '5' });
    for (let i = 0; i < 5; i++)
      expect(
        (
          await t
            .agent()
            .post('/api/auth/forgot-password')
            .send({ email: `n${i}@example.com` })
        ).status,
      ).toBe(202);
    const r = await t.agent().post('/api/auth/forgot-password').send({ email: 'n9@example.com' });
    expect(r.status).toBe(429);
    expect(r.body.error.code).toBe('rate_limited');
  });
});

describe('POST /api/auth/resend-verification', () => {
  it('sends at most 3 confirmation mails an hour to an account (the sign-up included), then answers 429', async () => {
    const t = await testApp({ RATE_LIMITS: 'true' });
    const a = t.agent();
    await a.post('/api/auth/sign-up').send({ email: 'new@example.com', password: 'a-long-password', name: 'New' });
    for (let i = 0; i < 2; i++) expect((await a.post('/api/auth/resend-verification')).status).toBe(202);
    const r = await a.post('/api/auth/resend-verification');
    expect(r.status).toBe(429);
    expect(r.body.error.message).toMatch(/check your inbox/);
    expect(t.mails().filter((m) => m.to === 'new@example.com')).toHaveLength(3);
  });
});

const newClient = async (t: Awaited<ReturnType<typeof testApp>>, email: string) => {
  const a = t.agent();
  const r = await a.post('/api/auth/sign-up').send({ email, password: 'a-long-password', name: 'Nell Unconfirmed' });
  expect(r.status).toBe(201);
  return a;
};
const confirm = async (t: Awaited<ReturnType<typeof testApp>>, email: string) => {
  const mail = t.mails().find((m) => m.to === email && /Confirm/.test(m.subject))!;
  const token = /token=([A-Za-z0-9_-]+)/.exec(mail.text)![1];
  expect((await t.agent().post('/api/auth/verify-email').send({ token })).status).toBe(200);
};
const toOwner = (t: Awaited<ReturnType<typeof testApp>>, subject: RegExp) =>
  t.mails().filter((m) => m.to === 'maren@fernhill.example' && subject.test(m.subject));

describe('POST /api/projects/:id/comments', () => {
  it('refuses a client who has not confirmed their address (403, plain words), and mails nobody', async () => {
    const t = await testApp();
    const a = await newClient(t, 'nell@example.com');
    const p = await a.post('/api/projects').send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(p.status).toBe(201);
    const r = await a.post(`/api/projects/${p.body.project.id}/comments`).send({ message: 'Hello?' });
    expect(r.status).toBe(403);
    expect(r.body.error).toMatchObject({ code: 'forbidden', message: expect.stringMatching(/Confirm your e-mail/) });
    expect(toOwner(t, /comment/)).toEqual([]);
    await confirm(t, 'nell@example.com');
    // the session now knows the address is confirmed
    expect((await a.post(`/api/projects/${p.body.project.id}/comments`).send({ message: 'Hello?' })).status).toBe(201);
  });
  it('takes at most COMMENTS_PER_MINUTE comments a minute from one account (429 beyond)', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', COMMENTS_PER_MINUTE: '10' });
    const priya = await t.signIn('priya@example.com');
    const id = (await priya.get('/api/projects')).body.projects[0].id;
    for (let i = 0; i < 10; i++)
      expect((await priya.post(`/api/projects/${id}/comments`).send({ message: `note ${i}` })).status).toBe(201);
    const r = await priya.post(`/api/projects/${id}/comments`).send({ message: 'one more' });
    expect(r.status).toBe(429);
    expect(r.body.error.code).toBe('rate_limited');
    expect(toOwner(t, /A comment from/)).toHaveLength(10);
    // another account is not held back
    const owner = await t.signIn('maren@fernhill.example');
    expect((await owner.post(`/api/projects/${id}/comments`).send({ message: 'Noted.' })).status).toBe(201);
  });
});

describe('POST /api/projects: the owner hears of a request', () => {
  it('at once from a confirmed client', async () => {
    const t = await testApp();
    const guild = await t.signIn('guild@example.com');
    const r = await guild.post('/api/projects').send({ items: [{ spec: designs.bookcase.defaults, quantity: 2 }] });
    expect(r.status).toBe(201);
    const notices = toOwner(t, /New request/);
    expect(notices).toHaveLength(1);
    expect(notices[0]?.text).toContain(`/requests/${r.body.project.id}`);
  });
  it('from an unconfirmed client only once they confirm their address (the request is kept meanwhile)', async () => {
    const t = await testApp();
    const a = await newClient(t, 'nell@example.com');
    const r = await a.post('/api/projects').send({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] });
    expect(r.status).toBe(201);
    expect(r.body.project.status).toBe('requested');
    expect(toOwner(t, /New request/)).toEqual([]);
    await confirm(t, 'nell@example.com');
    const notices = toOwner(t, /New request/);
    expect(notices).toHaveLength(1);
    expect(notices[0]?.subject).toContain('Nell Unconfirmed');
    expect(notices[0]?.text).toContain(`/requests/${r.body.project.id}`);
  });
});
