import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { ProjectResponse } from '@benchwright/contracts';
import { describe, expect, it, vi } from 'vitest';
import { estimates, jobs, payments, projects } from '../src/db/schema';
import { openJob } from '../src/modules/jobs/jobs.service';
import { lifecycleApp, payDeposit, twoRevisions } from './project-states';

// each test prices a revision at 'thorough' and renders its PDF: slow on a busy machine
vi.setConfig({ testTimeout: 90_000 });

const status = (t: Awaited<ReturnType<typeof lifecycleApp>>, projectId: string) =>
  t.db.select().from(projects).where(eq(projects.id, projectId)).get()!.status;

describe('POST /api/estimates/:id/send', () => {
  it('when another revision of the project is accepted, refuses the send (409) and changes nothing', async () => {
    const { owner, tomasz, projectId, r1, r2 } = await twoRevisions();
    const accepted = await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    expect(accepted.status).toBe(200);
    const sent = await owner.post(`/api/estimates/${r2.id}/send`);
    expect(sent.status).toBe(409);
    expect(sent.body.error.code).toBe('conflict');
    expect(sent.body.error.message).toMatch(/revision 1 is accepted/i);
    expect((await owner.get(`/api/estimates/${r2.id}`)).body.estimate.status).toBe('draft');
    expect((await owner.get(`/api/estimates/${r1.id}`)).body.estimate.status).toBe('accepted');
    expect(ProjectResponse.parse((await owner.get(`/api/projects/${projectId}`)).body).project.status).toBe('accepted');
    // and the client cannot accept it either
    expect((await tomasz.post(`/api/estimates/${r2.id}/accept`).send({ acceptedName: 'Tomasz W' })).status).toBe(404);
  });
});

describe('POST /api/projects/:id/estimates', () => {
  it('once a revision is accepted, refuses a new one (409) in plain words', async () => {
    const { t, owner, tomasz, projectId, r1, r2 } = await twoRevisions();
    await owner.patch(`/api/estimates/${r2.id}`).send({ version: r2.version, discountCents: 0 });
    t.db.delete(estimates).where(eq(estimates.id, r2.id)).run();
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    const r = await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'copy' });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toBe('A new revision cannot be started while the project is accepted.');
  });
});

describe('POST /api/estimates/:id/accept', () => {
  it('when another revision is already accepted, refuses the second acceptance (409)', async () => {
    const { t, tomasz, projectId, r1, r2 } = await twoRevisions();
    expect((await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz W' })).status).toBe(200);
    // a second revision out as sent beside it, as the old send allowed
    t.db.update(estimates).set({ status: 'sent', sentAt: new Date() }).where(eq(estimates.id, r2.id)).run();
    const r = await tomasz.post(`/api/estimates/${r2.id}/accept`).send({ acceptedName: 'Tomasz W' });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/revision 1 is already accepted/i);
    expect(status(t, projectId)).toBe('accepted');
  });
});

describe('POST /api/estimates/:id/withdraw', () => {
  it('lets the owner take back an accepted revision with a reason; the client is told and a revision can be sent again', async () => {
    const { t, owner, tomasz, projectId, r1, r2 } = await twoRevisions();
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    const r = await owner
      .post(`/api/estimates/${r1.id}/withdraw`)
      .send({ reason: 'The walnut price went up; revision 2 has the new price.' });
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.estimate.status).toBe('withdrawn');
    expect(status(t, projectId)).toBe('estimating');
    const seen = ProjectResponse.parse((await tomasz.get(`/api/projects/${projectId}`)).body).project.timeline.at(-1);
    expect(seen).toMatchObject({
      kind: 'estimate_withdrawn',
      message: 'The shop withdrew revision 1: The walnut price went up; revision 2 has the new price.',
    });
    const mail = t.mails().find((m) => m.to === 'tomasz@example.com' && /withdrawn/.test(m.subject));
    expect(mail?.text).toContain('The walnut price went up');
    // the withdrawn revision can no longer be accepted or paid; the next one goes out and is accepted
    expect((await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz W' })).status).toBe(409);
    expect((await tomasz.post(`/api/estimates/${r1.id}/deposit-checkout`)).status).toBe(409);
    expect((await owner.post(`/api/estimates/${r2.id}/send`)).status).toBe(200);
    expect((await tomasz.post(`/api/estimates/${r2.id}/accept`).send({ acceptedName: 'Tomasz W' })).status).toBe(200);
    expect(status(t, projectId)).toBe('accepted');
  });

  it('refuses a revision that is not accepted (409), a missing reason (400), and anyone but the owner (403)', async () => {
    const { owner, tomasz, r1 } = await twoRevisions();
    const notYet = await owner.post(`/api/estimates/${r1.id}/withdraw`).send({ reason: 'changed my mind' });
    expect(notYet.status).toBe(409);
    expect(notYet.body.error.message).toBe('Revision 1 is sent; only an accepted revision can be withdrawn.');
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    const none = await owner.post(`/api/estimates/${r1.id}/withdraw`).send({});
    expect(none.status).toBe(400);
    expect(none.body.error.issues[0].path).toBe('reason');
    expect((await tomasz.post(`/api/estimates/${r1.id}/withdraw`).send({ reason: 'no longer wanted' })).status).toBe(
      403,
    );
    expect((await owner.post('/api/estimates/no-such/withdraw').send({ reason: 'typo in it' })).status).toBe(404);
  });

  it('once the deposit is paid, refuses (409) and the job stands', async () => {
    const { t, owner, tomasz, projectId, r1 } = await twoRevisions();
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    await payDeposit(t, r1.id);
    expect(status(t, projectId)).toBe('deposit_paid');
    const r = await owner.post(`/api/estimates/${r1.id}/withdraw`).send({ reason: 'too late now' });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/deposit for revision 1 is paid/);
    expect((await owner.get(`/api/estimates/${r1.id}`)).body.estimate.status).toBe('accepted');
    expect(t.db.select().from(jobs).where(eq(jobs.projectId, projectId)).all()).toHaveLength(1);
  });
});

describe('a paid deposit', () => {
  it('creates exactly one job, however many times it is reported', async () => {
    const { t, tomasz, projectId, r1 } = await twoRevisions();
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    await payDeposit(t, r1.id);
    await payDeposit(t, r1.id); // a second deposit for the same accepted revision
    t.db.transaction((tx) => openJob(tx, projectId, {}));
    expect(t.db.select().from(jobs).where(eq(jobs.projectId, projectId)).all()).toHaveLength(1);
    expect(status(t, projectId)).toBe('deposit_paid');
  });

  it('for a revision withdrawn meanwhile makes no job, and tells the owner to refund it', async () => {
    const { t, owner, tomasz, projectId, r1 } = await twoRevisions();
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    expect((await owner.post(`/api/estimates/${r1.id}/withdraw`).send({ reason: 'price changed' })).status).toBe(200);
    await payDeposit(t, r1.id);
    expect(status(t, projectId)).toBe('estimating');
    expect(t.db.select().from(jobs).where(eq(jobs.projectId, projectId)).all()).toHaveLength(0);
    const timeline = ProjectResponse.parse((await owner.get(`/api/projects/${projectId}`)).body).project.timeline;
    expect(timeline.at(-1)).toMatchObject({ kind: 'deposit_unmatched' });
    expect(timeline.at(-1)!.message).toMatch(/Refund it/);
    expect(
      ProjectResponse.parse((await tomasz.get(`/api/projects/${projectId}`)).body).project.timeline.some(
        (e: { kind: string }) => e.kind === 'deposit_unmatched',
      ),
    ).toBe(false);
  });
});

describe('PATCH /api/jobs/:id (stage rules through the lifecycle)', () => {
  it('starts production, asks for the balance at Ready, closes on delivery once the balance is settled, then holds', async () => {
    const { t, owner, tomasz, projectId, r1 } = await twoRevisions();
    await tomasz.post(`/api/estimates/${r1.id}/accept`).send({ acceptedName: 'Tomasz Wierzbicki' });
    await payDeposit(t, r1.id);
    const job = t.db.select().from(jobs).where(eq(jobs.projectId, projectId)).get()!;
    const move = (stageKey: string) => owner.patch(`/api/jobs/${job.id}`).send({ stageKey });
    expect((await move('cutting')).status).toBe(200);
    expect(status(t, projectId)).toBe('in_production');
    expect((await move('ready')).status).toBe(200);
    expect(status(t, projectId)).toBe('ready');
    expect((await move('finish')).status).toBe(200);
    expect(status(t, projectId)).toBe('in_production');
    expect((await move('delivered')).status).toBe(200);
    expect(status(t, projectId)).toBe('delivered');
    // the balance comes in after delivery: closed, decided in one place
    t.db
      .insert(payments)
      .values({
        id: randomUUID(),
        projectId,
        estimateId: r1.id,
        kind: 'balance',
        status: 'paid',
        amountCents: r1.totals.balanceCents,
      })
      .run();
    expect((await move('ready')).status).toBe(200);
    expect(status(t, projectId)).toBe('ready');
    expect((await move('delivered')).status).toBe(200);
    expect(status(t, projectId)).toBe('closed');
    const held = await move('finish');
    expect(held.status).toBe(409);
    expect(held.body.error.message).toMatch(/closed/);
    expect(status(t, projectId)).toBe('closed');
  });
});
