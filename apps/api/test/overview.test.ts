import { describe, expect, it } from 'vitest';
import { testApp } from './helpers';

// the money side is walked in flow.test.ts (accepted value, deposits, win rate, hours after a real payment)
describe('GET /api/overview', () => {
  it('counts every project once under its status, and nothing won or collected in a shop with requests only; owner only', async () => {
    const t = await testApp();
    const owner = await t.signIn('maren@fernhill.example');
    const o = (await owner.get('/api/overview')).body.overview;
    const projects = (await owner.get('/api/projects')).body.projects as { status: string }[];
    expect(Object.values(o.pipeline as Record<string, number>).reduce((a, b) => a + b, 0)).toBe(projects.length);
    expect(o.pipeline.requested).toBe(projects.filter((p) => p.status === 'requested').length);
    expect(o.acceptedThisMonth).toEqual({ count: 0, totalCents: 0 });
    expect(o.collectedThisMonth).toEqual({ depositsCents: 0, balancesCents: 0 });
    expect(o.winRate).toEqual({ quoted: 0, won: 0 });
    expect(o.hours).toEqual([]);
    expect(o.month).toMatch(/^\d{4}-\d\d$/);
    expect((await (await t.signIn('idris@fernhill.example')).get('/api/overview')).status).toBe(403);
  });
});
