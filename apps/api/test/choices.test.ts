import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EstimateResponse } from '@benchwright/contracts';
import { designs } from '@benchwright/pricing';
import { estimates, jobs, revisionRecords } from '../src/db/schema';
import { storedRecord } from '../src/lib/record';
import { binary, contract, pdfText, testApp, type TestApp } from './helpers';

const walnutBench = {
  ...designs['assembly-bench'].defaults,
  trim: { lumberId: 'walnut-4-4', widthMm: 88.9, thicknessMm: 19.05 },
};

describe('the client’s choices kept with the revision', () => {
  let t: TestApp;
  let owner: Awaited<ReturnType<TestApp['signIn']>>;
  let client: Awaited<ReturnType<TestApp['signIn']>>;
  let estimateId: string;
  let trimOnRevision: string | undefined;
  let jobId: string;
  let travellerChoices: { label: string; value: string }[] | undefined;

  beforeAll(async () => {
    t = await testApp({ PDF_DIR: join(mkdtempSync(join(tmpdir(), 'bw-choices-')), 'pdf') });
    await t.app.pool.warm();
    owner = await t.signIn('maren@fernhill.example');
    client = await t.signIn('guild@example.com');
  }, 60_000);
  afterAll(async () => {
    await t.app.pool.close();
  });

  it('a new revision of a bench with walnut trim carries its choices in the estimate JSON', async () => {
    const p = await client.post('/api/projects').send({ items: [{ spec: walnutBench, quantity: 1 }] });
    expect(p.status).toBe(201);
    const r = await owner.post(`/api/projects/${p.body.project.id}/estimates`).send({});
    expect(r.status).toBe(201);
    const est = contract(EstimateResponse, r).estimate;
    estimateId = est.id;
    expect(est.choices).toHaveLength(1);
    const trim = est.choices[0]!.find((c) => c.label === 'Trim');
    expect(trim?.value).toBe('Black walnut, 3 1/2 in wide, 3/4 in thick');
    trimOnRevision = trim?.value;
    expect(est.choices[0]!.find((c) => c.label === 'Arrangement')?.value).toMatch(/^Main case 62 in wide/);
    // and on the shop paper kept in the record
    const piece = storedRecord(t.db, est.id)!.traveller.pieces[0]!;
    expect(piece.choices?.find((c) => c.label === 'Trim')?.value).toBe(trimOnRevision);
  }, 120_000);

  it('the sent estimate’s PDF names the trim’s species', async () => {
    const s = await owner.post(`/api/estimates/${estimateId}/send`);
    expect(s.status).toBe(200);
    const pdf = await binary(client.get(`/api/estimates/${estimateId}/pdf`));
    expect(pdf.status).toBe(200);
    const text = pdfText(pdf.body as Buffer).replace(/\s+/g, ' ');
    expect(text).toContain('Trim: Black walnut, 3 1/2 in wide');
    expect(text).toContain('Arrangement: Main case 62 in wide');
  }, 120_000);

  it('the traveller and its PDF carry the choices in the piece section', async () => {
    expect(
      (await client.post(`/api/estimates/${estimateId}/accept`).send({ acceptedName: 'Guild Member' })).status,
    ).toBe(200);
    // the job a paid deposit makes (modules/payments), with the revision's hours as its budget
    const est = t.db.select().from(estimates).where(eq(estimates.id, estimateId)).get()!;
    jobId = randomUUID();
    t.db
      .insert(jobs)
      .values({ id: jobId, projectId: est.projectId, stageKey: 'material', hoursBudget: est.hoursByStage })
      .run();
    const builder = await t.signIn('idris@fernhill.example');
    const paper = (await builder.get(`/api/jobs/${jobId}/traveller`)).body.traveller;
    travellerChoices = paper.pieces[0].choices;
    expect(travellerChoices?.find((c) => c.label === 'Trim')?.value).toBe(trimOnRevision);
    const pdf = await binary(builder.get(`/api/jobs/${jobId}/traveller.pdf`));
    expect(pdf.status).toBe(200);
    expect(pdfText(pdf.body as Buffer).replace(/\s+/g, ' ')).toContain('Black walnut, 3 1/2 in wide');
  }, 120_000);

  it('after the price book renames and reprices the walnut, the sent revision’s choices are unchanged', async () => {
    const before = contract(EstimateResponse, await client.get(`/api/estimates/${estimateId}`)).estimate.choices;
    const edit = await owner
      .patch('/api/price-book/lumber/walnut-4-4')
      .send({ item: { name: 'Claro walnut, 4/4', species: 'claro walnut', pricePerBoardFootCents: 2900 } });
    expect(edit.status).toBe(200);
    const after = contract(EstimateResponse, await client.get(`/api/estimates/${estimateId}`)).estimate.choices;
    expect(after).toEqual(before);
    expect(after[0]!.find((c) => c.label === 'Trim')?.value).toBe(trimOnRevision);
    const builder = await t.signIn('idris@fernhill.example');
    expect((await builder.get(`/api/jobs/${jobId}/traveller`)).body.traveller.pieces[0].choices).toEqual(
      travellerChoices,
    );
    // a preview today speaks of the renamed wood, so the book did change
    const preview = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec: walnutBench, quantity: 1 }] });
    expect(preview.status).toBe(200);
  });

  it('a revision recorded before choices were kept shows none', async () => {
    const rec = storedRecord(t.db, estimateId)!;
    const { choices: _kept, ...older } = rec;
    t.db.update(revisionRecords).set({ record: older }).where(eq(revisionRecords.estimateId, estimateId)).run();
    // what migration 0013 fills the view's column with for such a record
    t.db.$client
      .prepare(
        `UPDATE revision_records SET choices = coalesce(json_extract(record, '$.choices'), '[]') WHERE estimate_id = ?`,
      )
      .run(estimateId);
    const est = contract(EstimateResponse, await client.get(`/api/estimates/${estimateId}`)).estimate;
    expect(est.choices).toEqual([]);
  });
});
