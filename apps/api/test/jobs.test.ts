import { eq } from 'drizzle-orm';
import { describe, expect, it, vi } from 'vitest';
import { jobs, users } from '../src/db/schema';
import { payDeposit, twoRevisions } from './project-states';

// each test prices a revision at 'thorough' and renders its PDF: slow on a busy machine
vi.setConfig({ testTimeout: 90_000 });

/** Tomasz's bookcase accepted and its deposit paid: a job in Material. */
async function onTheBoard() {
  const { t, owner, tomasz, projectId, r1 } = await twoRevisions();
  await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
  await payDeposit(t, r1.id);
  const job = t.db.select().from(jobs).where(eq(jobs.projectId, projectId)).get()!;
  const idris = await t.signIn('idris@fernhill.example');
  const idrisId = t.db.select().from(users).where(eq(users.email, 'idris@fernhill.example')).get()!.id;
  return { t, owner, idris, idrisId, job };
}

describe('PATCH /api/jobs/:id', () => {
  it('refuses a builder who sets the builder or the due date (403) and changes nothing', async () => {
    const { t, idris, idrisId, job } = await onTheBoard();
    for (const body of [{ builderId: idrisId }, { builderId: null }, { dueDate: '2026-12-24' }, { dueDate: null }]) {
      const r = await idris.patch(`/api/jobs/${job.id}`).send(body);
      expect(r.status, JSON.stringify(body)).toBe(403);
      expect(r.body.error).toEqual({
        code: 'forbidden',
        message: 'Only the owner assigns the builder and the due date.',
      });
    }
    // a stage move that carries an assignment is refused whole
    expect((await idris.patch(`/api/jobs/${job.id}`).send({ stageKey: 'cutting', builderId: idrisId })).status).toBe(
      403,
    );
    expect(t.db.select().from(jobs).where(eq(jobs.id, job.id)).get()).toMatchObject({
      builderId: null,
      dueDate: null,
      stageKey: 'material',
    });
  });

  it('lets a builder move stages and log hours', async () => {
    const { idris, job } = await onTheBoard();
    const moved = await idris.patch(`/api/jobs/${job.id}`).send({ stageKey: 'cutting', position: 0 });
    expect(moved.status).toBe(200);
    expect(moved.body.job.stage).toBe('cutting');
    const logged = await idris.post(`/api/jobs/${job.id}/time`).send({ stageKey: 'cutting', hours: 1.5 });
    expect(logged.status).toBe(201);
    expect(logged.body.job.hoursLogged).toMatchObject({ cutting: 1.5, total: 1.5 });
  });

  it('lets the owner assign the builder and the due date', async () => {
    const { owner, idrisId, job } = await onTheBoard();
    const r = await owner.patch(`/api/jobs/${job.id}`).send({ builderId: idrisId, dueDate: '2026-12-24' });
    expect(r.status).toBe(200);
    expect(r.body.job).toMatchObject({ builder: { id: idrisId, name: 'Idris Kane' }, dueDate: '2026-12-24' });
  });
});
