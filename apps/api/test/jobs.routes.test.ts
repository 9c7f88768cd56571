import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import jsQR from 'jsqr';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EMAILS, seededWorld, type World } from './world';

/**
 * The board's routes one by one, each describe on a fresh demo (seeded through the real services: Tomasz's
 * bookcase paid and its job in Casework with Idris): the happy path, then the refusals. The whole scenario runs
 * in flow.test.ts.
 */
type Agent = Awaited<ReturnType<World['signIn']>>;
interface Ctx {
  w: World;
  owner: Agent;
  builder: Agent;
  tomasz: Agent;
}
function world() {
  const box = {} as { c: Ctx };
  beforeAll(async () => {
    const w = await seededWorld();
    box.c = {
      w,
      owner: await w.signIn(EMAILS.owner),
      builder: await w.signIn(EMAILS.builder),
      tomasz: await w.signIn(EMAILS.tomasz),
    };
  }, 120_000);
  afterAll(async () => {
    await box.c?.w.close();
  });
  return box;
}
const bytes = (req: ReturnType<Agent['get']>) =>
  req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (b: Buffer) => chunks.push(b));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });

describe('GET /api/jobs', () => {
  const box = world();
  it('gives the builder the board: the job with its stage, builder and hours', async () => {
    const { w, builder } = box.c;
    const r = await builder.get('/api/jobs');
    expect(r.status).toBe(200);
    expect(r.body.jobs).toEqual([
      expect.objectContaining({
        id: w.ids.tomaszJob,
        stage: 'casework',
        clientName: 'Tomasz Wierzbicki',
        builder: { id: w.ids.builderId, name: 'Idris Kane' },
      }),
    ]);
    expect(r.body.jobs[0].hoursBudgeted.total).toBeGreaterThan(0);
  });
  it('refuses a client with 403 and no session with 401', async () => {
    expect((await box.c.tomasz.get('/api/jobs')).status).toBe(403);
    expect((await fetch(`${box.c.w.api}/api/jobs`)).status).toBe(401);
  });
});

describe('GET /api/jobs/stages', () => {
  const box = world();
  it('gives the seven stages of the board in order', async () => {
    const r = await box.c.builder.get('/api/jobs/stages');
    expect(r.status).toBe(200);
    expect(r.body.stages.map((s: { key: string }) => s.key)).toEqual([
      'material',
      'cutting',
      'casework',
      'drawers_doors',
      'finish',
      'ready',
      'delivered',
    ]);
  });
  it('refuses a client with 403', async () => {
    expect((await box.c.tomasz.get('/api/jobs/stages')).status).toBe(403);
  });
});

describe('GET /api/jobs/:id', () => {
  const box = world();
  it('gives the owner and the builder the job', async () => {
    const { w, owner, builder } = box.c;
    for (const a of [owner, builder]) {
      const r = await a.get(`/api/jobs/${w.ids.tomaszJob}`);
      expect(r.status).toBe(200);
      expect(r.body.job).toMatchObject({ id: w.ids.tomaszJob, project: { id: w.ids.tomaszProject } });
    }
  });
  it('answers 404 for a job that does not exist and refuses a client with 403', async () => {
    const { w, owner, tomasz } = box.c;
    expect((await owner.get('/api/jobs/no-such-job')).status).toBe(404);
    expect((await tomasz.get(`/api/jobs/${w.ids.tomaszJob}`)).status).toBe(403);
  });
});

describe('GET /api/jobs/:id/traveller', () => {
  const box = world();
  it('gives the builder the cut list, sheets and pick list, with no prices', async () => {
    const { w, builder } = box.c;
    const r = await builder.get(`/api/jobs/${w.ids.tomaszJob}/traveller`);
    expect(r.status).toBe(200);
    expect(r.body.traveller.job.id).toBe(w.ids.tomaszJob);
    expect(r.body.traveller.pieces[0].parts.length).toBeGreaterThan(0);
    expect(JSON.stringify(r.body)).not.toMatch(/Cents"|\$\d/);
  });
  it('answers 404 for a job that does not exist and refuses a client with 403', async () => {
    const { w, builder, tomasz } = box.c;
    expect((await builder.get('/api/jobs/no-such-job/traveller')).status).toBe(404);
    expect((await tomasz.get(`/api/jobs/${w.ids.tomaszJob}/traveller`)).status).toBe(403);
  });
});

describe('GET /api/jobs/:id/traveller.pdf', () => {
  const box = world();
  it('gives the builder the traveller as a PDF', async () => {
    const { w, builder } = box.c;
    const r = await bytes(builder.get(`/api/jobs/${w.ids.tomaszJob}/traveller.pdf`));
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/application\/pdf/);
    expect((r.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });
  it('draws the shop’s logo once it has one', async () => {
    const { w, owner, builder } = box.c;
    const image = /\/Subtype\s*\/Image/;
    const pdf = async () =>
      ((await bytes(builder.get(`/api/jobs/${w.ids.tomaszJob}/traveller.pdf`))).body as Buffer).toString('latin1');
    expect(await pdf()).not.toMatch(image);
    const svg =
      '<svg xmlns="http://www.w3.org/2000/svg" width="300" height="100"><rect width="300" height="100" fill="#7a4a24"/></svg>';
    expect((await owner.post('/api/settings/logo').attach('file', Buffer.from(svg), 'mark.svg')).status).toBe(201);
    expect(await pdf()).toMatch(image);
  });
  it('answers 404 for a job that does not exist and refuses a client with 403', async () => {
    const { w, builder, tomasz } = box.c;
    expect((await bytes(builder.get('/api/jobs/no-such-job/traveller.pdf'))).status).toBe(404);
    expect((await bytes(tomasz.get(`/api/jobs/${w.ids.tomaszJob}/traveller.pdf`))).status).toBe(403);
  });
});

describe('GET /api/jobs/:id/labels.pdf', () => {
  const box = world();
  it('prints one label per part to cut, 30 to a Letter page, each with a QR code that opens the job', async () => {
    const { w, builder } = box.c;
    const traveller = (await builder.get(`/api/jobs/${w.ids.tomaszJob}/traveller`)).body.traveller as {
      pieces: { parts: { name: string; quantity: number }[] }[];
    };
    const units = traveller.pieces.flatMap((p) => p.parts).reduce((n, p) => n + p.quantity, 0);
    const r = await bytes(builder.get(`/api/jobs/${w.ids.tomaszJob}/labels.pdf`));
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toMatch(/application\/pdf/);
    const dir = mkdtempSync(join(tmpdir(), 'bw-labels-'));
    const file = join(dir, 'labels.pdf');
    writeFileSync(file, r.body as Buffer);
    const info = execFileSync('pdfinfo', [file]).toString();
    expect(info).toMatch(/Page size:\s+612 x 792 pts/); // US Letter
    expect(Number(/Pages:\s+(\d+)/.exec(info)?.[1])).toBe(Math.ceil(units / 30));
    const text = execFileSync('pdftotext', ['-layout', file, '-']).toString();
    const first = traveller.pieces[0]!.parts[0]!;
    expect(text).toContain(`${first.name} 1/${first.quantity}`);
    expect(text).toContain(`${first.name} ${first.quantity}/${first.quantity}`);
    // the QR code, read back from the PDF's first image, opens the job's page in the shop app
    execFileSync('pdfimages', ['-f', '1', '-l', '1', '-png', file, join(dir, 'img')]);
    const png = readdirSync(dir).find((f) => f.startsWith('img') && f.endsWith('.png'))!;
    const { data, info: px } = await sharp(readFileSync(join(dir, png)))
      .extend({ top: 8, bottom: 8, left: 8, right: 8, background: '#ffffff' })
      .ensureAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    const code = jsQR(new Uint8ClampedArray(data), px.width, px.height);
    expect(code?.data).toMatch(new RegExp(`/jobs/${w.ids.tomaszJob}$`));
  });
  it('answers 404 for a job that does not exist and refuses a client with 403', async () => {
    const { w, builder, tomasz } = box.c;
    expect((await bytes(builder.get('/api/jobs/no-such-job/labels.pdf'))).status).toBe(404);
    expect((await bytes(tomasz.get(`/api/jobs/${w.ids.tomaszJob}/labels.pdf`))).status).toBe(403);
  });
});

describe('PUT /api/jobs/:id/checks/:key', () => {
  const box = world();
  type Step = { key: string; stage: string; text: string; done: { by: string; at: string } | null };
  it('ticks a step of the checklist with who and when, shows it on the traveller, and unticks it', async () => {
    const { w, builder, owner } = box.c;
    const builderName = (await builder.get('/api/auth/me')).body.user.name as string;
    const before = (await builder.get(`/api/jobs/${w.ids.tomaszJob}/traveller`)).body.traveller.checklist as Step[];
    expect(before.find((i) => i.key === 'cutting.parts')?.done).toBeNull();
    const r = await builder.put(`/api/jobs/${w.ids.tomaszJob}/checks/cutting.parts`).send({ done: true });
    expect(r.status).toBe(200);
    const ticked = (r.body.checklist as Step[]).find((i) => i.key === 'cutting.parts')!;
    expect(ticked.done?.by).toBe(builderName);
    expect(Date.now() - Date.parse(ticked.done!.at)).toBeLessThan(60_000);
    const seen = (await owner.get(`/api/jobs/${w.ids.tomaszJob}/traveller`)).body.traveller.checklist as Step[];
    expect(seen.find((i) => i.key === 'cutting.parts')?.done?.by).toBe(builderName);
    const off = await owner.put(`/api/jobs/${w.ids.tomaszJob}/checks/cutting.parts`).send({ done: false });
    expect((off.body.checklist as Step[]).find((i) => i.key === 'cutting.parts')?.done).toBeNull();
  });
  it('refuses a step the job does not have (404), a malformed step or body (400), and a client (403)', async () => {
    const { w, builder, tomasz } = box.c;
    const url = `/api/jobs/${w.ids.tomaszJob}/checks`;
    expect((await builder.put(`${url}/cutting.no-such-step`).send({ done: true })).status).toBe(404);
    expect((await builder.put(`${url}/DROP TABLE`).send({ done: true })).status).toBe(400);
    expect((await builder.put(`${url}/cutting.parts`).send({ done: 'yes' })).status).toBe(400);
    expect((await tomasz.put(`${url}/cutting.parts`).send({ done: true })).status).toBe(403);
  });
});

describe('PATCH /api/jobs/:id', () => {
  const box = world();
  it('when the builder moves the job to the next stage, moves it and notes it on the timeline', async () => {
    const { w, builder, owner } = box.c;
    const r = await builder.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ stageKey: 'drawers_doors' });
    expect(r.status).toBe(200);
    expect(r.body.job.stage).toBe('drawers_doors');
    const timeline = (await owner.get(`/api/projects/${w.ids.tomaszProject}`)).body.project.timeline;
    expect(timeline.at(-1)).toMatchObject({ kind: 'stage' });
  });
  it('when the owner assigns the builder and the due date, records both', async () => {
    const { w, owner } = box.c;
    const r = await owner
      .patch(`/api/jobs/${w.ids.tomaszJob}`)
      .send({ builderId: w.ids.builderId, dueDate: '2027-02-15' });
    expect(r.status).toBe(200);
    expect(r.body.job).toMatchObject({ builder: { id: w.ids.builderId }, dueDate: '2027-02-15' });
  });
  it('refuses the builder assigning the builder or the due date with 403 (the owner assigns)', async () => {
    // issue 13, defect 4
    const { w, builder } = box.c;
    expect((await builder.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ builderId: null })).status).toBe(403);
    expect((await builder.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ dueDate: '2030-01-01' })).status).toBe(403);
  });
  it('refuses a client as the builder with 400', async () => {
    const { w, owner } = box.c;
    const r = await owner.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ builderId: w.ids.tomaszId });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe('builderId');
  });
  it('refuses an unknown stage, a bad date or an empty change with 400', async () => {
    const { w, owner } = box.c;
    for (const body of [{ stageKey: 'sanding' }, { dueDate: '15/02/2027' }, {}])
      expect((await owner.patch(`/api/jobs/${w.ids.tomaszJob}`).send(body)).status).toBe(400);
  });
  it('when the job reaches Ready, marks the project ready and asks the client for the balance', async () => {
    const { w, owner } = box.c;
    const before = w.db.$client.prepare('select count(*) as n from outbox').get() as { n: number };
    expect((await owner.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ stageKey: 'ready' })).status).toBe(200);
    expect((await owner.get(`/api/projects/${w.ids.tomaszProject}`)).body.project.status).toBe('ready');
    const after = w.db.$client
      .prepare('select count(*) as n from outbox where "to" = \'tomasz@example.com\'')
      .get() as {
      n: number;
    };
    expect(after.n).toBeGreaterThan(0);
    expect((w.db.$client.prepare('select count(*) as n from outbox').get() as { n: number }).n).toBe(before.n + 1);
  });
  it('refuses a client with 403 and answers 404 for a job that does not exist', async () => {
    const { w, owner, tomasz } = box.c;
    expect((await tomasz.patch(`/api/jobs/${w.ids.tomaszJob}`).send({ stageKey: 'finish' })).status).toBe(403);
    expect((await owner.patch('/api/jobs/no-such-job').send({ stageKey: 'finish' })).status).toBe(404);
  });
});

describe('POST /api/jobs/:id/time', () => {
  const box = world();
  it('when the builder logs hours on a stage, adds them to the hours logged', async () => {
    const { w, builder } = box.c;
    const r = await builder
      .post(`/api/jobs/${w.ids.tomaszJob}/time`)
      .send({ stageKey: 'casework', hours: 2.5, note: 'carcass glued up' });
    expect(r.status).toBe(201);
    expect(r.body.job.hoursLogged).toMatchObject({ casework: 2.5, total: 2.5 });
  });
  it('refuses no hours, more than a day or an unknown stage with 400', async () => {
    const { w, builder } = box.c;
    for (const body of [
      { stageKey: 'casework', hours: 0 },
      { stageKey: 'casework', hours: 25 },
      { stageKey: 'sanding', hours: 1 },
    ])
      expect((await builder.post(`/api/jobs/${w.ids.tomaszJob}/time`).send(body)).status).toBe(400);
  });
  it('refuses a client with 403 and answers 404 for a job that does not exist', async () => {
    const { w, builder, tomasz } = box.c;
    expect(
      (await tomasz.post(`/api/jobs/${w.ids.tomaszJob}/time`).send({ stageKey: 'casework', hours: 1 })).status,
    ).toBe(403);
    expect((await builder.post('/api/jobs/no-such-job/time').send({ stageKey: 'casework', hours: 1 })).status).toBe(
      404,
    );
  });
});
