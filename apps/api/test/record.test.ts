import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { ShopSettings, type LabourOperation, type SheetGood } from '@benchwright/pricing';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { estimates, jobs, revisionRecords, shopSettings } from '../src/db/schema';
import { readRows, saveChange } from '../src/lib/price-book';
import { loadPricing, projectSpecs } from '../src/lib/engine';
import { backfillRecords } from '../src/lib/record';
import { binary, pdfText, testApp, type TestApp } from './helpers';

/** Today's price book and settings change: dearer sheets of another size, renamed, other labour rates, metric units. */
function changeThePriceBook(t: TestApp) {
  const rows = readRows(t.db);
  for (const { item } of rows['sheet-goods']) {
    const s = item as SheetGood;
    s.name = `${s.name} (new supplier)`;
    s.priceCents = s.priceCents * 2;
    s.sheetLengthMm = Math.round(s.sheetLengthMm * 0.9);
    s.sheetWidthMm = Math.round(s.sheetWidthMm * 0.8);
  }
  for (const { item } of rows.labour) (item as LabourOperation).minutes = (item as LabourOperation).minutes * 1.5;
  const changed = [...rows['sheet-goods'], ...rows.labour].map((r) => ({
    kind: rows.labour.includes(r) ? ('labour' as const) : ('sheet-goods' as const),
    id: r.id,
  }));
  t.db.transaction((tx) =>
    saveChange(tx, rows, changed, { currency: 'USD', note: '' }, { userId: null, summary: 'test: new supplier' }),
  );
  const s = t.db.select().from(shopSettings).where(eq(shopSettings.id, 1)).get()!;
  const settings = { ...s.settings, units: s.settings.units === 'in' ? 'mm' : 'in', depositRate: 0.3 };
  t.db
    .update(shopSettings)
    .set({ settings: ShopSettings.parse(settings) })
    .where(eq(shopSettings.id, 1))
    .run();
}

describe('the revision of record', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp({ PDF_DIR: join(mkdtempSync(join(tmpdir(), 'bw-record-')), 'pdf') });
    await t.app.pool.warm();
  }, 120_000);
  afterAll(() => t.app.pool.close());

  it(
    'keeps a sent revision’s PDF, its traveller and its layouts as priced, whatever the price book says later; the traveller’s hours are the job’s budget',
    { timeout: 120_000 },
    async () => {
      const owner = await t.signIn('maren@fernhill.example');
      const priya = await t.signIn('priya@example.com');
      const idris = await t.signIn('idris@fernhill.example');
      const projectId = (await priya.get('/api/projects')).body.projects[0].id;
      const created = await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'engine' });
      expect(created.status).toBe(201);
      const id = created.body.estimate.id;
      expect((await owner.post(`/api/estimates/${id}/send`)).status).toBe(200);
      expect((await priya.post(`/api/estimates/${id}/accept`).send({ acceptedName: 'Priya Natarajan' })).status).toBe(
        200,
      );
      // the job the paid deposit makes (modules/payments), with the revision's hours as its budget
      const est = t.db.select().from(estimates).where(eq(estimates.id, id)).get()!;
      const { record } = t.db.select().from(revisionRecords).where(eq(revisionRecords.estimateId, id)).get()!;
      expect(record.estimate.layouts[0]?.sheets[0]?.placements.length).toBeGreaterThan(0);
      expect(record.estimate.layouts[0]?.sheets[0]?.cuts.length).toBeGreaterThan(0);
      expect(record.traveller.hoursByStage).toEqual(est.hoursByStage);
      const jobId = randomUUID();
      t.db.insert(jobs).values({ id: jobId, projectId, stageKey: 'material', hoursBudget: est.hoursByStage }).run();

      const read = async () => ({
        estimate: (await owner.get(`/api/estimates/${id}`)).body.estimate,
        estimatePdf: (await binary(priya.get(`/api/estimates/${id}/pdf`))).body as Buffer,
        layouts: (await owner.get(`/api/projects/${projectId}/layouts`)).body.layouts,
        traveller: (await idris.get(`/api/jobs/${jobId}/traveller`)).body.traveller,
        travellerPdf: pdfText((await binary(idris.get(`/api/jobs/${jobId}/traveller.pdf`))).body as Buffer),
        overview: (await owner.get('/api/overview')).body.overview,
      });
      const before = await read();
      const tasks = t.app.pool.stats().completed;
      changeThePriceBook(t);
      const after = await read();

      expect(Buffer.compare(after.estimatePdf, before.estimatePdf)).toBe(0);
      expect(after.estimate).toEqual(before.estimate);
      expect(after.layouts).toEqual(before.layouts);
      expect(after.traveller).toEqual(before.traveller);
      expect(after.travellerPdf).toBe(before.travellerPdf);
      expect(after.overview.hours).toEqual(before.overview.hours);
      // nothing was priced or laid out again to answer
      expect(t.app.pool.stats().completed).toBe(tasks);

      // the traveller's hours are the job's budget
      const { total, ...budget } = after.traveller.job.hoursBudgeted;
      expect(after.traveller.hoursByStage).toEqual(budget);
      expect(after.traveller.totalHours).toBe(total);
      expect(after.travellerPdf).toContain('Sheets as laid out for revision 1');
      expect(after.traveller.layout).toMatchObject({ source: 'revision', revision: 1 });
    },
  );

  it(
    'lays a job out again with today’s stock only when the owner asks, keeps the revision’s layout, and says so',
    { timeout: 120_000 },
    async () => {
      const owner = await t.signIn('maren@fernhill.example');
      const idris = await t.signIn('idris@fernhill.example');
      const job = (await owner.get('/api/jobs')).body.jobs.find(
        (j: { clientName: string }) => j.clientName === 'Priya Natarajan',
      );
      const before = (await idris.get(`/api/jobs/${job.id}/traveller`)).body.traveller;
      expect((await idris.post(`/api/jobs/${job.id}/relayout`)).status).toBe(403);
      const r = await owner.post(`/api/jobs/${job.id}/relayout`);
      expect(r.status).toBe(201);
      const again = (await idris.get(`/api/jobs/${job.id}/traveller`)).body.traveller;
      expect(again).toEqual(r.body.traveller);
      expect(again.layout).toMatchObject({ source: 'relayout', revision: 1 });
      expect(again.layout.note).toMatch(/^Laid out again on .* with the stock of that day/);
      // the new sheets are the smaller ones of today's book, in today's units
      expect(again.materials[0].materialName).toContain('(new supplier)');
      expect(again.units).not.toBe(before.units);
      // hours stay the job's budget
      expect(again.hoursByStage).toEqual(before.hoursByStage);
      // the piece section keeps what the client chose, in the words of the book they accepted
      expect(before.pieces[0].choices.find((c: { label: string }) => c.label === 'Case').value).not.toContain(
        '(new supplier)',
      );
      expect(again.pieces.map((p: { choices: unknown }) => p.choices)).toEqual(
        before.pieces.map((p: { choices: unknown }) => p.choices),
      );
      const pdf = pdfText((await binary(idris.get(`/api/jobs/${job.id}/traveller.pdf`))).body as Buffer);
      expect(pdf).toContain('Laid out again on');
      // the revision's own record is kept as it was
      const est = t.db.select().from(estimates).where(eq(estimates.projectId, job.project.id)).get()!;
      const { record } = t.db.select().from(revisionRecords).where(eq(revisionRecords.estimateId, est.id)).get()!;
      expect(record.traveller.materials[0]?.materialName).not.toContain('(new supplier)');
      expect((await owner.post('/api/jobs/no-such-job/relayout')).status).toBe(404);
    },
  );

  it(
    'gives a revision priced before records were kept its record once, marked as filled in later',
    { timeout: 120_000 },
    async () => {
      const owner = await t.signIn('maren@fernhill.example');
      const guild = (await owner.get('/api/projects')).body.projects.find((p: { client: { name: string } }) =>
        p.client.name.includes('Guild'),
      );
      const created = await owner.post(`/api/projects/${guild.id}/estimates`).send({ source: 'engine' });
      expect(created.status).toBe(201);
      const id = created.body.estimate.id;
      t.db.delete(revisionRecords).where(eq(revisionRecords.estimateId, id)).run();
      const load = (projectId: string) => ({ ...loadPricing(t.db), items: projectSpecs(t.db, projectId) });
      expect(await backfillRecords(t.db, t.app.pool, load)).toBe(1);
      const row = t.db.select().from(revisionRecords).where(eq(revisionRecords.estimateId, id)).get()!;
      expect(row.record.backfilled).toBe(true);
      expect(await backfillRecords(t.db, t.app.pool, load)).toBe(0);
    },
  );
});
