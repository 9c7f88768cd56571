import { eq } from 'drizzle-orm';
import { ProjectResponse, ProjectsResponse } from '@benchwright/contracts';
import { beforeAll, describe, expect, it } from 'vitest';
import { jobs, users } from '../src/db/schema';
import { keysOf, lifecycleApp, payDeposit, twoRevisions } from './project-states';

/**
 * Tomasz's project taken through a whole story: two revisions, comments both
 * ways, acceptance, the deposit, a refund asked and made, stage moves, an
 * assignment and an hour log. Each role then reads the same timeline.
 */
async function story() {
  const t = await lifecycleApp();
  const { owner, tomasz, projectId, r1 } = await twoRevisions(t);
  expect(
    (
      await tomasz
        .post(`/api/projects/${projectId}/comments`)
        .send({ message: 'Could the top be oiled, not lacquered?' })
    ).status,
  ).toBe(201);
  await owner.post(`/api/projects/${projectId}/comments`).send({ message: 'Yes, at no extra cost.' });
  await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
  await payDeposit(t, r1.id);
  // the refund's two events, as the payments service writes them (asking the card processor needs the stand-in)
  const { addEvent } = await import('../src/lib/timeline');
  const maren = t.db.select().from(users).where(eq(users.email, 'maren@fernhill.example')).get()!;
  t.db.transaction((tx) => {
    addEvent(
      tx,
      projectId,
      'refund_requested',
      'Refund of $25.00 asked of the card processor by Maren Holt.',
      maren.id,
    );
    addEvent(tx, projectId, 'refund', '$25.00 of the deposit refunded.');
  });
  const job = t.db.select().from(jobs).where(eq(jobs.projectId, projectId)).get()!;
  const idris = await t.signIn('idris@fernhill.example');
  const idrisId = t.db.select().from(users).where(eq(users.email, 'idris@fernhill.example')).get()!.id;
  expect((await owner.patch(`/api/jobs/${job.id}`).send({ builderId: idrisId, dueDate: '2026-12-24' })).status).toBe(
    200,
  );
  expect((await idris.patch(`/api/jobs/${job.id}`).send({ stageKey: 'cutting' })).status).toBe(200);
  expect((await idris.post(`/api/jobs/${job.id}/time`).send({ stageKey: 'cutting', hours: 2 })).status).toBe(201);
  return { t, owner, tomasz, idris, projectId };
}

type Event = { kind: string; message: string; by: string | null };

// the story is told once (it prices a revision at 'thorough'); the tests only read it
let told: Awaited<ReturnType<typeof story>>;
beforeAll(async () => {
  told = await story();
}, 120_000);

describe('GET /api/projects/:id timeline', () => {
  it('gives the owner every event', async () => {
    const { owner, projectId } = told;
    const kinds = ProjectResponse.parse((await owner.get(`/api/projects/${projectId}`)).body).project.timeline.map(
      (e: Event) => e.kind,
    );
    for (const k of [
      'requested',
      'estimate_draft',
      'estimate_sent',
      'comment',
      'estimate_accepted',
      'deposit_paid',
      'refund_requested',
      'refund',
      'assigned',
      'stage',
      'hours',
    ])
      expect(kinds, k).toContain(k);
  });

  it('gives the builder only what the job needs: no money, no amounts, no comments, no estimates', async () => {
    const { idris, projectId } = told;
    const r = await idris.get(`/api/projects/${projectId}`);
    expect(r.status).toBe(200);
    const p = ProjectResponse.parse(r.body).project;
    const kinds = new Set(p.timeline.map((e: Event) => e.kind));
    expect([...kinds].sort()).toEqual(['assigned', 'deposit_paid', 'hours', 'requested', 'stage']);
    expect(p.timeline.find((e: Event) => e.kind === 'deposit_paid')!.message).toBe(
      'Accepted as a job and put on the board.',
    );
    expect(p.timeline.map((e: Event) => e.message)).toContain('Assigned to Idris Kane.');
    const text = JSON.stringify(r.body);
    expect(text).not.toMatch(/\$|lacquered|extra cost|refund|revision/i);
    expect(keysOf(r.body).filter((k) => k.endsWith('Cents'))).toEqual([]);
    expect(p.estimates).toEqual([]);
  });

  it('gives the client their request, sent estimates, acceptance, payments, refunds, stage news and comments; no drafts, no internal events', async () => {
    const { tomasz, projectId } = told;
    const timeline: Event[] = ProjectResponse.parse((await tomasz.get(`/api/projects/${projectId}`)).body).project
      .timeline;
    const kinds = timeline.map((e) => e.kind);
    expect([...new Set(kinds)].sort()).toEqual([
      'comment',
      'deposit_paid',
      'estimate_accepted',
      'estimate_sent',
      'refund',
      'requested',
      'stage',
    ]);
    expect(timeline.find((e) => e.kind === 'estimate_sent')!.message).toMatch(/revision 1 sent: \$[\d,]+\.\d\d/);
    expect(timeline.filter((e) => e.kind === 'comment').map((e) => e.by)).toEqual(['Tomasz Wierzbicki', 'Maren Holt']);
    expect(JSON.stringify(timeline)).not.toMatch(/priced|started from|asked of the card processor|logged|Assigned/);
    // the shop's words stay in the shop: stage news and the request in the client's own
    expect(timeline.find((e) => e.kind === 'stage')!.message).toBe('Your piece is being cut.');
    expect(timeline.find((e) => e.kind === 'requested')!.message).toBe('You asked for an estimate.');
    expect(JSON.stringify(timeline)).not.toMatch(/Moved to|on the board|Tomasz Wierzbicki asked/);
  });
});

describe('GET /api/projects', () => {
  it('gives the builder each project in the shop with no key ending in Cents and no money in the timeline', async () => {
    const { idris, tomasz, projectId } = told;
    const r = await idris.get('/api/projects');
    expect(ProjectsResponse.parse(r.body).projects.map((p: { id: string }) => p.id)).toEqual([projectId]);
    expect(keysOf(r.body).filter((k) => k.endsWith('Cents'))).toEqual([]);
    expect(JSON.stringify(r.body)).not.toMatch(/\$|lacquered|extra cost|refund/i);
    const ownId = ProjectsResponse.parse((await tomasz.get('/api/projects')).body).projects[0]!.id;
    const own = ProjectResponse.parse((await tomasz.get(`/api/projects/${ownId}`)).body).project;
    expect(own.timeline.some((e: Event) => e.kind === 'refund_requested')).toBe(false);
    expect(own.timeline.some((e: Event) => e.kind === 'estimate_draft')).toBe(false);
  });
});
