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
