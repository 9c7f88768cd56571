import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { designs } from '@benchwright/pricing';
import { storedRecord } from '../src/lib/record';
import { testApp, type TestApp } from './helpers';

/** The shop's settings (issue 10, item 3): read and change them (owner only, optimistic locking), the logo. */
type Agent = Awaited<ReturnType<TestApp['signIn']>>;
const OWNER = 'maren@fernhill.example';
const item = () => ({ spec: { ...designs.bookcase.defaults }, quantity: 1 });
const bytesOf = (req: ReturnType<Agent['get']>) =>
  req.buffer(true).parse((res, cb) => {
    const chunks: Buffer[] = [];
    res.on('data', (b: Buffer) => chunks.push(b));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  });
const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47]);
const SVG = `<?xml version="1.0" encoding="UTF-8"?>
<!-- the shop's mark -->
<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="400" viewBox="0 0 1200 400">
  <rect width="1200" height="400" fill="#7a4a24"/><circle cx="200" cy="200" r="150" fill="#f6f1e7"/>
</svg>`;

async function app(): Promise<TestApp> {
  return testApp({ PDF_DIR: mkdtempSync(join(tmpdir(), 'bw-settings-')) });
}

describe('GET and PATCH /api/settings', () => {
  let t: TestApp;
  let owner: Agent;
  beforeAll(async () => {
    t = await app();
    owner = await t.signIn(OWNER);
  });

  it('gives the owner the profile, every engine setting, the stages and a version; builders and clients 403', async () => {
    const r = await owner.get('/api/settings');
    expect(r.status).toBe(200);
    expect(r.body.settings).toMatchObject({
      version: 1,
      profile: { shopName: 'Fernhill Joinery', email: 'shop@fernhill.example' },
      values: { taxRate: 0.0825, units: 'in', weeklyCapacityHours: 40 },
      logo: false,
    });
    expect(r.body.settings.stages.map((s: { key: string }) => s.key)).toEqual([
      'material',
      'cutting',
      'casework',
      'drawers_doors',
      'finish',
      'ready',
      'delivered',
    ]);
    for (const who of ['idris@fernhill.example', 'priya@example.com'])
      expect((await (await t.signIn(who)).get('/api/settings')).status).toBe(403);
    expect((await t.agent().get('/api/settings')).status).toBe(401);
  });

  it('saves a change read at the current version and moves the version on; a stale version is 409', async () => {
    const v = (await owner.get('/api/settings')).body.settings.version as number;
    const r = await owner.patch('/api/settings').send({
      version: v,
      profile: { phone: '555-0199', address: '2 Weir Road\nAlder Cross' },
      values: { depositRate: 0.4, weeklyCapacityHours: 50 },
    });
    expect(r.status).toBe(200);
    expect(r.body.settings).toMatchObject({
      version: v + 1,
      profile: { phone: '555-0199', address: '2 Weir Road\nAlder Cross', shopName: 'Fernhill Joinery' },
      values: { depositRate: 0.4, weeklyCapacityHours: 50, taxRate: 0.0825 },
    });
    // someone saved in between: the second save read version v
    const stale = await owner.patch('/api/settings').send({ version: v, values: { depositRate: 0.3 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect((await owner.get('/api/settings')).body.settings.values.depositRate).toBe(0.4);
  });

  it('a setting left out keeps its value (no default comes back)', async () => {
    const s = (await owner.get('/api/settings')).body.settings;
    const r = await owner.patch('/api/settings').send({ version: s.version, values: { revealMm: 2 } });
    expect(r.status).toBe(200);
    expect(r.body.settings.values).toEqual({ ...s.values, revealMm: 2 });
  });

  it('names each field that does not fit the engine’s rules, and saves nothing', async () => {
    const s = (await owner.get('/api/settings')).body.settings;
    const r = await owner.patch('/api/settings').send({
      version: s.version,
      values: { taxRate: 0.9, estimateValidityDays: 0, units: 'cubits' },
      profile: { email: 'not-an-address', shopName: '' },
    });
    expect(r.status).toBe(400);
    const paths = (r.body.error.issues as { path: string }[]).map((i) => i.path).sort();
    expect(paths).toEqual(
      ['profile.email', 'profile.shopName', 'values.estimateValidityDays', 'values.taxRate', 'values.units'].sort(),
    );
    expect((await owner.get('/api/settings')).body.settings).toEqual(s);
    expect((await owner.patch('/api/settings').send({ version: s.version, values: { colour: 'red' } })).status).toBe(
      400,
    );
    expect((await owner.patch('/api/settings').send({ values: { taxRate: 0.05 } })).status).toBe(400);
  });

  it('renames a stage; the key stays, and the board reads the new name', async () => {
    const s = (await owner.get('/api/settings')).body.settings;
    const r = await owner.patch('/api/settings').send({ version: s.version, stages: { casework: 'Carcass assembly' } });
    expect(r.status).toBe(200);
    const stages = (await owner.get('/api/jobs/stages')).body.stages as { key: string; label: string }[];
    expect(stages.find((x) => x.key === 'casework')?.label).toBe('Carcass assembly');
    expect(stages).toHaveLength(7);
    expect(
      (await owner.patch('/api/settings').send({ version: s.version + 1, stages: { sanding: 'Sanding' } })).status,
    ).toBe(400);
    expect(
      (await owner.patch('/api/settings').send({ version: s.version + 1, stages: { casework: '  ' } })).status,
    ).toBe(400);
  });
});

describe('a settings change and the estimates', () => {
  it('moves the next preview and the next revision, never a sent one (its record keeps the settings it used)', async () => {
    const t = await app();
    const owner = await t.signIn(OWNER);
    const priya = await t.signIn('priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id as string;
    const preview = async () => (await owner.post('/api/quotes/preview').send({ items: [item()] })).body.quote;
    const before = await preview();
    const r1 = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    expect((await owner.post(`/api/estimates/${r1.id}/send`)).status).toBe(200);
    const sent = (await owner.get(`/api/estimates/${r1.id}`)).body.estimate;
    // without a logo the estimate PDF holds no image (the logo test below looks for one)
    const pdf = (await bytesOf(owner.get(`/api/estimates/${r1.id}/pdf`))).body as Buffer;
    expect(pdf.toString('latin1')).not.toMatch(/\/Subtype\s*\/Image/);
    expect(sent.totals.taxCents).toBeGreaterThan(0);

    const v = (await owner.get('/api/settings')).body.settings.version;
    expect((await owner.patch('/api/settings').send({ version: v, values: { taxRate: 0.165 } })).status).toBe(200);

    const after = await preview();
    expect(after.totals.taxCents).toBeGreaterThan(before.totals.taxCents * 1.9);
    expect(after.budget.highCents).toBeGreaterThan(before.budget.highCents);
    // the sent revision: the same figures, and its record still says the rate it was priced with
    expect((await owner.get(`/api/estimates/${r1.id}`)).body.estimate.totals).toEqual(sent.totals);
    expect(storedRecord(t.db, r1.id)?.settings.taxRate).toBe(0.0825);
    // the next revision prices with today's rate
    const r2 = await owner.post(`/api/projects/${projectId}/estimates`).send({});
    expect(r2.status).toBe(201);
    expect(r2.body.estimate.revision).toBe(2);
    expect(r2.body.estimate.totals.taxCents).toBeGreaterThan(sent.totals.taxCents * 1.9);
  });
});

describe('a front-style change and the estimates', () => {
  it('hangs the next revision on inset hinges and leaves a sent one on the hinges it was priced with', async () => {
    const t = await app();
    const owner = await t.signIn(OWNER);
    const priya = await t.signIn('priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id as string;
    const hingeRefs = (e: { lines: { group: string; ref: string }[] }) =>
      e.lines.filter((l) => l.ref.startsWith('hinge')).map((l) => l.ref);
    const r1 = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    expect((await owner.post(`/api/estimates/${r1.id}/send`)).status).toBe(200);
    const sent = storedRecord(t.db, r1.id)!.estimate;
    expect(hingeRefs(sent).length).toBeGreaterThan(0);
    expect(hingeRefs(sent)).not.toContain('hinge-inset');

    const v = (await owner.get('/api/settings')).body.settings.version;
    const patch = await owner.patch('/api/settings').send({ version: v, values: { frontStyle: 'inset' } });
    expect(patch.status).toBe(200);
    expect(patch.body.settings.values.frontStyle).toBe('inset');
    expect((await owner.patch('/api/settings').send({ version: v + 1, values: { frontStyle: 'flush' } })).status).toBe(
      400,
    );

    // the sent revision: the same lines, its record still overlay
    expect(hingeRefs(storedRecord(t.db, r1.id)!.estimate)).toEqual(hingeRefs(sent));
    expect(storedRecord(t.db, r1.id)!.settings.frontStyle).toBe('overlay');
    // the next revision hangs its doors inset
    const r2 = await owner.post(`/api/projects/${projectId}/estimates`).send({});
    expect(r2.status).toBe(201);
    expect(hingeRefs(storedRecord(t.db, r2.body.estimate.id)!.estimate)).toEqual(['hinge-inset']);
  });
});

describe('the logo', () => {
  let t: TestApp;
  let owner: Agent;
  beforeAll(async () => {
    t = await app();
    owner = await t.signIn(OWNER);
  });

  it('has none at first: 404', async () => {
    expect((await t.agent().get('/api/settings/logo')).status).toBe(404);
  });

  it('refuses what is not an image (415), an SVG that is not well-formed XML (415), another XML root (415)', async () => {
    const cases: [Buffer, string][] = [
      [Buffer.from('just some words, not a picture'), 'notes.png'],
      [Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n'), 'logo.pdf'],
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><rect width="10" height="10"></svg>'), 'bad.svg'],
      [Buffer.from('<?xml version="1.0"?><html><body>hello</body></html>'), 'page.svg'],
      [
        Buffer.from(
          '<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "aaaaaaaaaa">]><svg xmlns="http://www.w3.org/2000/svg">&a;</svg>',
        ),
        'entities.svg',
      ],
    ];
    for (const [bytes, name] of cases) {
      const r = await owner.post('/api/settings/logo').attach('file', bytes, name);
      expect(r.status, name).toBe(415);
      expect(r.body.error.code).toBe('unsupported_media_type');
    }
    expect((await owner.get('/api/settings')).body.settings.logo).toBe(false);
  });

  it('refuses a file over 2 MB with 413, and the builder with 403', async () => {
    const big = Buffer.concat([PNG_MAGIC, Buffer.alloc(2 * 1024 * 1024 + 10)]);
    expect((await owner.post('/api/settings/logo').attach('file', big, 'big.png')).status).toBe(413);
    const builder = await t.signIn('idris@fernhill.example');
    const png = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#7a4a24' } })
      .png()
      .toBuffer();
    expect((await builder.post('/api/settings/logo').attach('file', png, 'logo.png')).status).toBe(403);
  });

  it('takes an SVG and serves it, to anyone, as a PNG at most 600 px wide, nosniff', async () => {
    const r = await owner.post('/api/settings/logo').attach('file', Buffer.from(SVG), 'mark.svg');
    expect(r.status).toBe(201);
    expect(r.body.settings.logo).toBe(true);
    const got = await bytesOf(t.agent().get('/api/settings/logo'));
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    const body = got.body as Buffer;
    expect(body.subarray(0, 4)).toEqual(PNG_MAGIC);
    const meta = await sharp(body).metadata();
    expect(meta.format).toBe('png');
    expect(meta.width).toBe(600);
    expect(meta.height).toBe(200);
  });

  it('takes a JPEG and keeps it as a PNG', async () => {
    const jpeg = await sharp({ create: { width: 300, height: 120, channels: 3, background: '#335577' } })
      .jpeg()
      .toBuffer();
    expect((await owner.post('/api/settings/logo').attach('file', jpeg, 'logo.jpg')).status).toBe(201);
    const meta = await sharp((await bytesOf(t.agent().get('/api/settings/logo'))).body as Buffer).metadata();
    expect(meta).toMatchObject({ format: 'png', width: 300, height: 120 });
  });

  // the traveller PDF draws it the same way (jobs.service.ts); a job needs a paid deposit, walked in jobs.routes.test.ts
  it('goes into the mail inline (the layout’s place for it), and onto the estimate PDF', async () => {
    const priya = await t.signIn('priya@example.com');
    const projectId = (await priya.get('/api/projects')).body.projects[0].id as string;
    await priya.post(`/api/projects/${projectId}/comments`).send({ message: 'Is oak possible?' });
    const mail = t.mails().at(-1)!;
    expect(mail.html).toContain('src="cid:shop-logo@benchwright"');
    expect(mail.html).not.toContain('<!--shop-logo-->');
    expect(mail.attachments).toEqual([
      expect.objectContaining({ cid: 'shop-logo@benchwright', contentType: 'image/png' }),
    ]);

    const e = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
    expect((await owner.post(`/api/estimates/${e.id}/send`)).status).toBe(200);
    const pdf = (await bytesOf(owner.get(`/api/estimates/${e.id}/pdf`))).body as Buffer;
    expect(pdf.toString('latin1')).toMatch(/\/Subtype\s*\/Image/);
  });
});
