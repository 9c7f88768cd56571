import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { designs } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

describe('Cache-Control', () => {
  it('answers personal JSON with no-store', async () => {
    const t = await testApp();
    const priya = await t.signIn('priya@example.com');
    for (const path of ['/api/auth/me', '/api/projects', '/api/designs'])
      expect((await priya.get(path)).headers['cache-control'], path).toBe('no-store');
    const err = await t.agent().get('/api/projects');
    expect(err.status).toBe(401);
    expect(err.headers['cache-control']).toBe('no-store');
  });
  it('sends the estimate PDF private, never public', async () => {
    const t = await testApp({ PDF_DIR: mkdtempSync(join(tmpdir(), 'bw-pdf-')) });
    const owner = await t.signIn('maren@fernhill.example');
    const priya = await t.signIn('priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id;
    const e = await owner.post(`/api/projects/${projectId}/estimates`).send({});
    expect(e.status, JSON.stringify(e.body)).toBe(201);
    const sent = await owner.post(`/api/estimates/${e.body.estimate.id}/send`);
    expect(sent.status, JSON.stringify(sent.body)).toBe(200);
    const pdf = await priya.get(`/api/estimates/${e.body.estimate.id}/pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect(pdf.headers['cache-control']).toBe('private, no-store');
  }, 60_000);
});

describe('control characters in what people type', () => {
  it('refuses a name with a right-to-left override or a line break, and notes or comments with NUL (400)', async () => {
    const t = await testApp();
    for (const name of ['Ann\u202Eeil', 'Ann\nBcc: x@example.com']) {
      const r = await t
        .agent()
        .post('/api/auth/sign-up')
        .send({ email: 'ann@example.com', password: 'a-long-password', name });
      expect(r.status).toBe(400);
      expect(r.body.error.issues[0].path).toBe('name');
    }
    const guild = await t.signIn('guild@example.com');
    const items = [{ spec: designs.bookcase.defaults, quantity: 1 }];
    const p = await guild.post('/api/projects').send({ items, notes: 'two\u0000parts' });
    expect(p.status).toBe(400);
    expect(p.body.error.issues[0].path).toBe('notes');
    const ok = await guild.post('/api/projects').send({ items, notes: 'Two lines:\nthe second' });
    expect(ok.status).toBe(201);
    expect(ok.body.project.notes).toBe('Two lines:\nthe second');
    const c = await guild.post(`/api/projects/${ok.body.project.id}/comments`).send({ message: 'a\u202Eb' });
    expect(c.status).toBe(400);
  });
});
