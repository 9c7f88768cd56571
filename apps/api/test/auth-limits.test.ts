import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadEnv } from '../src/env';
import { testApp } from './helpers';

const wrong = (email: string) => ({ email, password: 'not-the-password' });
const right = (email: string) => ({ email, password: 'bench-demo-2026' });

describe('TRUST_PROXY', () => {
  it('is off by default; a list of addresses or a hop count is accepted; "true" (trust anyone) is refused', () => {
    expect(loadEnv({}).TRUST_PROXY).toBe(false);
    expect(loadEnv({ TRUST_PROXY: 'false' }).TRUST_PROXY).toBe(false);
    expect(loadEnv({ TRUST_PROXY: 'loopback' }).TRUST_PROXY).toEqual(['loopback']);
    expect(loadEnv({ TRUST_PROXY: '10.0.0.0/8, 127.0.0.1' }).TRUST_PROXY).toEqual(['10.0.0.0/8', '127.0.0.1']);
    expect(loadEnv({ TRUST_PROXY: '1' }).TRUST_PROXY).toBe(1);
    expect(() => loadEnv({ TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY/);
    expect(() => loadEnv({ TRUST_PROXY: 'not-an-address' })).toThrow(/TRUST_PROXY/);
  });
  it('when off, X-Forwarded-For from the loopback does not change the client address (per-IP limits hold)', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', SIGNIN_ATTEMPTS_PER_IP: '3' });
    for (let i = 0; i < 3; i++) {
      const r = await t
        .agent()
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', `203.0.113.${i + 1}`)
        .send(wrong(`nobody${i}@example.com`));
      expect(r.status).toBe(401);
    }
    const r = await t
      .agent()
      .post('/api/auth/sign-in')
      .set('X-Forwarded-For', '203.0.113.99')
      .send(wrong('nobody9@example.com'));
    expect(r.status).toBe(429);
  });
  it('when off, the acceptance record keeps the connection’s address, not one the client names', async () => {
    const t = await testApp({ PDF_DIR: mkdtempSync(join(tmpdir(), 'bw-pdf-')) });
    const owner = await t.signIn('maren@fernhill.example');
    const priya = await t.signIn('priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id;
    const e = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    expect((await owner.post(`/api/estimates/${e.id}/send`)).status).toBe(200);
    const r = await priya
      .post(`/api/estimates/${e.id}/accept`)
      .set('X-Forwarded-For', '198.51.100.66')
      .send({ acceptedName: 'Priya Natarajan' });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    const row = t.db.$client.prepare('select accepted_ip as ip from estimates where id = ?').get(e.id) as {
      ip: string;
    };
    expect(row.ip).toMatch(/127\.0\.0\.1|::1/);
  }, 60_000);
  it('when set to the loopback, X-Forwarded-For names the client', async () => {
    const t = await testApp({ RATE_LIMITS: 'true', SIGNIN_ATTEMPTS_PER_IP: '3', TRUST_PROXY: 'loopback' });
    for (let i = 0; i < 5; i++) {
      const r = await t
        .agent()
        .post('/api/auth/sign-in')
        .set('X-Forwarded-For', `203.0.113.${i + 1}`)
        .send(wrong(`nobody${i}@example.com`));
      expect(r.status).toBe(401);
    }
  });
});

describe('POST /api/auth/sign-in: failures counted per e-mail and address', () => {
  const env = { RATE_LIMITS: 'true', TRUST_PROXY: 'loopback', SIGNIN_FAILS_PER_EMAIL_IP: '10' };
  it('after ten wrong passwords from one address, the right one from another address signs in', async () => {
    const t = await testApp(env);
    const from = (ip: string) => t.agent().post('/api/auth/sign-in').set('X-Forwarded-For', ip);
    for (let i = 0; i < 10; i++) expect((await from('198.51.100.7').send(wrong('priya@example.com'))).status).toBe(401);
    // the address that failed is stopped, even with the right password
    const stopped = await from('198.51.100.7').send(right('priya@example.com'));
    expect(stopped.status).toBe(429);
    expect(stopped.body.error.code).toBe('rate_limited');
    // the account's owner, elsewhere, is not locked out
    const owner = await from('203.0.113.20').send(right('priya@example.com'));
    expect(owner.status).toBe(200);
    expect(owner.body.user.email).toBe('priya@example.com');
  });
  it('one address trying many accounts meets the per-address limit', async () => {
    const t = await testApp({ ...env, SIGNIN_ATTEMPTS_PER_IP: '4' });
    const from = (ip: string) => t.agent().post('/api/auth/sign-in').set('X-Forwarded-For', ip);
    for (let i = 0; i < 4; i++) expect((await from('198.51.100.8').send(wrong(`c${i}@example.com`))).status).toBe(401);
    expect((await from('198.51.100.8').send(wrong('c9@example.com'))).status).toBe(429);
    expect((await from('198.51.100.9').send(right('tomasz@example.com'))).status).toBe(200);
  });
});
