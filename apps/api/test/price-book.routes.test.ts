import { eq } from 'drizzle-orm';
import { demoPriceBook, demoSettings, designs } from '@benchwright/pricing';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { applyMigrations, openDb } from '../src/db/client';
import { seedShop } from '../src/db/seed';
import { priceBooks, priceBookVersions, priceSheetGoods, shopSettings } from '../src/db/schema';
import { loadBook, readRows } from '../src/lib/price-book';
import { testApp, type TestApp } from './helpers';

const OWNER = 'maren@fernhill.example';
type Agent = ReturnType<typeof request.agent>;

/** A CSV body as the shop app sends it. */
const csv = (a: Agent, kind: string, text: string | Buffer, dryRun = true, type = 'text/csv') =>
  a
    .post(`/api/price-book/${kind}/import${dryRun ? '?dryRun=1' : ''}`)
    .set('Content-Type', type)
    .send(text);
const version = async (a: Agent) => (await a.get('/api/price-book')).body.priceBook.version as number;
/** A CSV line's cells split naively (the demo book has no commas inside cells). */
const cells = (line: string) => line.split(',');

describe('the price book', () => {
  let t: TestApp;
  let owner: Agent;
  beforeAll(async () => {
    t = await testApp();
    owner = await t.signIn(OWNER);
  }, 60_000);
  afterAll(() => t.app.pool.close());

  it('is the owner’s alone: builders and clients get 403 on every route, anonymous 401', async () => {
    const calls: ((a: Agent) => request.Test)[] = [
      (a) => a.get('/api/price-book'),
      (a) => a.get('/api/price-book/lumber.csv'),
      (a) => a.post('/api/price-book/lumber').send({ item: {} }),
      (a) => a.patch('/api/price-book/lumber/white-oak-4-4').send({ retired: true }),
      (a) => a.post('/api/price-book/lumber/import?dryRun=1').set('Content-Type', 'text/csv').send('id\n'),
    ];
    for (const email of ['idris@fernhill.example', 'priya@example.com']) {
      const a = await t.signIn(email);
      for (const call of calls) expect((await call(a)).status).toBe(403);
    }
    for (const call of calls) expect((await call(t.agent())).status).toBe(401);
  });

  it('lists each kind as rows with the version', async () => {
    const r = await owner.get('/api/price-book');
    expect(r.status).toBe(200);
    const b = r.body.priceBook;
    expect(b.version).toBeGreaterThanOrEqual(1);
    expect(Object.keys(b)).toEqual(
      expect.arrayContaining(['sheetGoods', 'lumber', 'edgeBanding', 'hardware', 'finishes', 'labourOperations']),
    );
    expect(b.sheetGoods).toHaveLength(demoPriceBook.sheetGoods.length);
    expect(b.labourOperations).toHaveLength(demoPriceBook.labour.length);
    expect(b.sheetGoods[0]).toMatchObject({
      id: 'birch-ply-18',
      retiredAt: null,
      item: { name: '3/4 in birch plywood' },
    });
    // the four fields that were not items are settings now
    expect(b).not.toHaveProperty('shopRateCents');
  });

  it('adds, edits and retires items, each a new version; refuses bad items with field errors', async () => {
    const v0 = await version(owner);
    const item = { id: 'ash-banding-22', name: 'Ash banding 22 mm', widthMm: 22, pricePerMetreCents: 65 };
    const add = await owner.post('/api/price-book/banding').send({ item });
    expect(add.status).toBe(201);
    expect(add.body).toMatchObject({ entry: { id: 'ash-banding-22', retiredAt: null }, version: v0 + 1 });

    const dup = await owner.post('/api/price-book/banding').send({ item });
    expect(dup.status).toBe(400);
    expect(dup.body.error.issues).toEqual([{ path: 'item.id', message: expect.stringContaining('already in') }]);
    const elsewhere = await owner.post('/api/price-book/banding').send({ item: { ...item, id: 'birch-ply-18' } });
    expect(elsewhere.status).toBe(400);
    expect(elsewhere.body.error.issues[0].message).toContain('sheet goods');

    const negative = await owner
      .post('/api/price-book/banding')
      .send({ item: { ...item, id: 'x-1', pricePerMetreCents: -100 } });
    expect(negative.status).toBe(400);
    expect(negative.body.error.issues).toEqual([{ path: 'item.pricePerMetreCents', message: expect.any(String) }]);
    const sheet = { ...demoPriceBook.sheetGoods[0]!, id: 'thin-ply', thicknessMm: 0 };
    const zero = await owner.post('/api/price-book/sheet-goods').send({ item: sheet });
    expect(zero.status).toBe(400);
    expect(zero.body.error.issues).toEqual([{ path: 'item.thicknessMm', message: expect.any(String) }]);
    expect((await owner.post('/api/price-book/pencils').send({ item })).status).toBe(404);

    const edit = await owner.patch('/api/price-book/banding/ash-banding-22').send({ item: { pricePerMetreCents: 70 } });
    expect(edit.status).toBe(200);
    expect(edit.body).toMatchObject({ entry: { item: { pricePerMetreCents: 70 } }, version: v0 + 2 });
    const rename = await owner.patch('/api/price-book/banding/ash-banding-22').send({ item: { id: 'other' } });
    expect(rename.status).toBe(400);
    expect((await owner.patch('/api/price-book/banding/nothing-here').send({ retired: true })).status).toBe(404);

    const retire = await owner.patch('/api/price-book/banding/ash-banding-22').send({ retired: true });
    expect(retire.status).toBe(200);
    expect(retire.body.entry.retiredAt).toEqual(expect.any(String));
    expect(retire.body.version).toBe(v0 + 3);
    // retired: still listed (estimates name it), hidden from new choices, and every version reads back
    const listed = (await owner.get('/api/price-book')).body.priceBook.edgeBanding;
    expect(listed.find((e: { id: string }) => e.id === 'ash-banding-22').retiredAt).toEqual(expect.any(String));
    expect(loadBook(t.db, 'active').book.edgeBanding.some((e) => e.id === 'ash-banding-22')).toBe(false);
    expect(loadBook(t.db, 'all').book.edgeBanding.some((e) => e.id === 'ash-banding-22')).toBe(true);
    const spec = { ...designs.bookcase.defaults, bandingId: 'ash-banding-22' };
    const preview = await owner.post('/api/quotes/preview').send({ items: [{ spec, quantity: 1 }] });
    expect(preview.status).toBe(400);
    const versions = t.db.select().from(priceBookVersions).all();
    expect(versions.map((v) => v.number)).toEqual(expect.arrayContaining([v0, v0 + 1, v0 + 2, v0 + 3]));
    expect(versions.find((v) => v.number === v0 + 2)?.summary).toContain('ash-banding-22');
  });

  it('refuses to retire or change an item so that a design’s starting point no longer validates', async () => {
    const v0 = await version(owner);
    const r = await owner.patch('/api/price-book/sheet-goods/birch-ply-18').send({ retired: true });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].message).toContain('starting point');
    // the last drawer slide cannot go either (the engine's rule for a whole book)
    const slides = demoPriceBook.hardware.filter((h) => h.kind === 'slide');
    for (const s of slides.slice(0, -1))
      expect((await owner.patch(`/api/price-book/hardware/${s.id}`).send({ retired: true })).status).toBe(200);
    const last = await owner.patch(`/api/price-book/hardware/${slides.at(-1)!.id}`).send({ retired: true });
    expect(last.status).toBe(400);
    for (const s of slides.slice(0, -1))
      expect((await owner.patch(`/api/price-book/hardware/${s.id}`).send({ retired: false })).status).toBe(200);
    expect(await version(owner)).toBe(v0 + 2 * (slides.length - 1));
  });

  it('round-trips CSV: export, change one price, import; every other row stays equal', async () => {
    const out = await owner.get('/api/price-book/sheet-goods.csv');
    expect(out.status).toBe(200);
    expect(out.headers['content-type']).toContain('text/csv');
    expect(out.headers['content-disposition']).toContain('sheet-goods.csv');
    const lines = out.text.split('\r\n');
    const header = cells(lines[0]!);
    expect(header).toEqual([
      'id', 'name', 'kind', 'nominal_thickness_in', 'thickness_mm', 'sheet_length_mm', 'sheet_width_mm', 'grain',
      'density_kg_m3', 'modulus_mpa', 'price_usd', 'retired',
    ]); // prettier-ignore
    const price = header.indexOf('price_usd');
    const row = lines.findIndex((l) => l.startsWith('birch-ply-18,'));
    const c = cells(lines[row]!);
    c[price] = '99.95';
    const edited = [...lines.slice(0, row), c.join(','), ...lines.slice(row + 1)].join('\r\n');

    const v0 = await version(owner);
    const dry = await csv(owner, 'sheet-goods', edited);
    expect(dry.status).toBe(200);
    expect(dry.body.preview).toEqual({
      added: [],
      changed: [
        {
          id: 'birch-ply-18',
          before: expect.objectContaining({ priceCents: demoPriceBook.sheetGoods[0]!.priceCents }),
          after: expect.objectContaining({ priceCents: 9995 }),
        },
      ],
      errors: [],
    });
    expect(await version(owner)).toBe(v0);

    const done = await csv(owner, 'sheet-goods', edited, false);
    expect(done.status).toBe(200);
    expect(done.body.version).toBe(v0 + 1);
    const again = (await owner.get('/api/price-book/sheet-goods.csv')).text.split('\r\n');
    expect(again).toHaveLength(lines.length);
    again.forEach((l, i) => expect(l).toBe(i === row ? c.join(',') : lines[i]));
    // the same file again changes nothing and makes no version
    expect((await csv(owner, 'sheet-goods', edited, false)).body.version).toBe(v0 + 1);
  });

  it('exports every kind so that importing the file unchanged previews no change and no error', async () => {
    for (const kind of ['sheet-goods', 'lumber', 'banding', 'hardware', 'finishes', 'labour']) {
      const out = await owner.get(`/api/price-book/${kind}.csv`);
      expect(out.status).toBe(200);
      const r = await csv(owner, kind, out.text);
      expect(r.status, kind).toBe(200);
      expect(r.body.preview, kind).toEqual({ added: [], changed: [], errors: [] });
    }
  });

  it('writes a cell a spreadsheet would run as a formula with a leading quote, and reads it back as it was', async () => {
    const item = { id: 'formula-banding', name: '=HYPERLINK("x")', widthMm: 19, pricePerMetreCents: 40 };
    expect((await owner.post('/api/price-book/banding').send({ item })).status).toBe(201);
    const out = (await owner.get('/api/price-book/banding.csv')).text;
    expect(out).toContain(`"'=HYPERLINK(""x"")"`);
    expect((await csv(owner, 'banding', out)).body.preview).toEqual({ added: [], changed: [], errors: [] });
  });

  it('edits a labour operation, named by its key, and retires one (the list of operations is open)', async () => {
    const v0 = await version(owner);
    const r = await owner.patch('/api/price-book/labour/part-cut').send({ item: { minutes: 3 } });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({
      entry: { id: 'part-cut', item: { key: 'part-cut', minutes: 3 } },
      version: v0 + 1,
    });
    expect(loadBook(t.db).book.labour.find((o) => o.key === 'part-cut')?.minutes).toBe(3);
    const retire = await owner.patch('/api/price-book/labour/part-cut').send({ retired: true });
    expect(retire.status).toBe(200);
    expect(loadBook(t.db).book.labour.some((o) => o.key === 'part-cut')).toBe(false);
    expect((await owner.patch('/api/price-book/labour/part-cut').send({ retired: false })).status).toBe(200);
  });

  describe('refuses bad CSV with per-row errors and saves nothing', () => {
    let base: string[];
    let v0: number;
    beforeAll(async () => {
      base = (await owner.get('/api/price-book/sheet-goods.csv')).text.split('\r\n');
      v0 = await version(owner);
    });
    const withRow = (i: number, f: (c: string[]) => void) => {
      const c = cells(base[i]!);
      f(c);
      return [...base.slice(0, i), c.join(','), ...base.slice(i + 1)].join('\r\n');
    };
    const col = (name: string) => cells(base[0]!).indexOf(name);
    const confirmedIsRefused = async (text: string) => {
      const r = await csv(owner, 'sheet-goods', text, false);
      expect(r.status).toBe(400);
      expect(r.body.error).toMatchObject({ code: 'invalid_input', issues: expect.any(Array) });
      expect(await version(owner)).toBe(v0);
      return r.body.error.issues as { path: string; message: string }[];
    };

    it('a price of -1 and a thickness of 0', async () => {
      let text = withRow(2, (c) => (c[col('price_usd')] = '-1'));
      text = text.split('\r\n').map((l, i) => (i === 3 ? withRow(3, (c) => (c[col('thickness_mm')] = '0')).split('\r\n')[3] : l)).join('\r\n'); // prettier-ignore
      const dry = await csv(owner, 'sheet-goods', text);
      expect(dry.body.preview.errors).toEqual([
        { row: 3, column: 'price_usd', message: expect.any(String) },
        { row: 4, column: 'thickness_mm', message: expect.any(String) },
      ]);
      const issues = await confirmedIsRefused(text);
      expect(issues.map((i) => i.path)).toEqual(['rows.3.price_usd', 'rows.4.thickness_mm']);
    });

    it('a missing column and a wrong delimiter', async () => {
      const missing = base.map((l) => cells(l).slice(0, -2).concat(cells(l).slice(-1)).join(',')).join('\r\n');
      const r = await csv(owner, 'sheet-goods', missing);
      expect(r.body.preview.errors).toEqual([{ row: 1, column: 'price_usd', message: 'this column is missing' }]);
      await confirmedIsRefused(missing);
      const semi = base.map((l) => l.replaceAll(',', ';')).join('\r\n');
      const s = await csv(owner, 'sheet-goods', semi);
      expect(s.body.preview.errors).toEqual([{ row: 1, column: '', message: expect.stringContaining('comma') }]);
      await confirmedIsRefused(semi);
    });

    it('duplicate ids, an unknown choice, and a row that breaks a design’s defaults', async () => {
      const dup = [...base.slice(0, 3), base[2]!, ...base.slice(3)].join('\r\n');
      expect((await csv(owner, 'sheet-goods', dup)).body.preview.errors).toEqual([
        { row: 4, column: 'id', message: expect.stringContaining('also on row 3') },
      ]);
      await confirmedIsRefused(dup);
      const grain = withRow(2, (c) => (c[col('grain')] = 'diagonal'));
      expect((await csv(owner, 'sheet-goods', grain)).body.preview.errors).toEqual([
        { row: 3, column: 'grain', message: expect.any(String) },
      ]);
      const row = base.findIndex((l) => l.startsWith('birch-ply-18,'));
      const retire = withRow(row, (c) => (c[col('retired')] = 'yes'));
      const r = await csv(owner, 'sheet-goods', retire);
      expect(r.body.preview.errors.length).toBeGreaterThan(0);
      for (const e of r.body.preview.errors)
        expect(e).toEqual({ row: row + 1, column: '', message: expect.stringContaining('starting point') });
      await confirmedIsRefused(retire);
    });

    it('a 5 MB file is 413; a binary file, invalid UTF-8 or another content type is 415; never a 500', async () => {
      const big = base.join('\r\n') + '\r\n' + 'x'.repeat(5 * 1024 * 1024);
      const r = await csv(owner, 'sheet-goods', big).catch((e: { response?: { status: number } }) => e.response);
      expect(r?.status).toBe(413);
      const binary = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00, 0x08, 0x00]);
      expect((await csv(owner, 'sheet-goods', binary)).status).toBe(415);
      expect((await csv(owner, 'sheet-goods', Buffer.from([0x69, 0x64, 0xff, 0xfe, 0x0a]))).status).toBe(415);
      const json = await owner.post('/api/price-book/sheet-goods/import').send({ rows: [] });
      expect(json.status).toBe(415);
      expect(json.body.error.code).toBe('unsupported_media_type');
      expect((await csv(owner, 'sheet-goods', base.join('\n'), true, 'text/plain')).status).toBe(415);
      expect((await csv(owner, 'sheet-goods', '')).body.preview.errors).toHaveLength(1);
      expect(await version(owner)).toBe(v0);
    });
  });
});

describe('estimates and the price book', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp();
    await t.app.pool.warm();
  }, 120_000);
  afterAll(() => t.app.pool.close());

  it(
    'the preview’s budget moves after a price change; a sent estimate does not; a new revision has the new price and its version',
    { timeout: 120_000 },
    async () => {
      const owner = await t.signIn(OWNER);
      const priya = await t.signIn('priya@example.com');
      const items = [{ spec: designs.bookcase.defaults, quantity: 1 }];
      const budget0 = (await owner.post('/api/quotes/preview').send({ items })).body.quote;

      const projectId = (await priya.get('/api/projects')).body.projects[0].id;
      const created = await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'engine' });
      expect(created.status).toBe(201);
      const first = created.body.estimate;
      const v0 = (await owner.get('/api/price-book')).body.priceBook.version;
      expect(first.priceBookVersion).toBe(v0);
      expect((await owner.post(`/api/estimates/${first.id}/send`)).status).toBe(200);
      const sent = (await owner.get(`/api/estimates/${first.id}`)).body.estimate;

      const ply = t.db.select().from(priceSheetGoods).where(eq(priceSheetGoods.id, 'birch-ply-18')).get()!;
      const oldPrice = ply.item.priceCents as number;
      const edit = await owner
        .patch('/api/price-book/sheet-goods/birch-ply-18')
        .send({ item: { priceCents: oldPrice * 3 } });
      expect(edit.status).toBe(200);

      const budget1 = (await owner.post('/api/quotes/preview').send({ items })).body.quote;
      expect(budget1.budget.lowCents).toBeGreaterThan(budget0.budget.lowCents);
      expect(budget1.budget.highCents).toBeGreaterThan(budget0.budget.highCents);

      expect((await owner.get(`/api/estimates/${first.id}`)).body.estimate).toEqual(sent);

      const next = await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'engine' });
      expect(next.status).toBe(201);
      expect(next.body.estimate.priceBookVersion).toBe(edit.body.version);
      expect(next.body.estimate.totals.totalCents).toBeGreaterThan(sent.totals.totalCents);
      const plyLine = (e: { lines: { description: string; unitPriceCents: number }[] }) =>
        e.lines.find((l) => l.description.includes('3/4 in birch plywood'));
      expect(plyLine(sent)).toBeDefined();
      expect(plyLine(next.body.estimate)!.unitPriceCents).toBeGreaterThan(2.9 * plyLine(sent)!.unitPriceCents);
    },
  );
});

describe('moving the single price-book document', () => {
  it('makes rows and version 1 of its items, moves the four non-item fields into settings, and runs once', () => {
    const db = openDb(':memory:');
    applyMigrations(db);
    const { shopRateCents: _a, labourCostPerHourCents: _b, kerfMm: _c, sheetTrimMm: _d, ...oldSettings } = demoSettings;
    db.insert(shopSettings)
      .values({ id: 1, shopName: 'Fernhill Joinery', settings: oldSettings as typeof demoSettings })
      .run();
    const doc = {
      ...structuredClone(demoPriceBook),
      shopRateCents: 9100,
      labourCostPerHourCents: 4100,
      kerfMm: 3.0,
      sheetTrimMm: 8,
    };
    doc.sheetGoods[0]!.priceCents = 12345;
    db.insert(priceBooks).values({ id: 1, book: doc }).run();

    seedShop(db);
    const rows = readRows(db);
    expect(rows['sheet-goods'].map((r) => r.item)).toEqual(doc.sheetGoods);
    expect(rows.labour.map((r) => r.item)).toEqual(doc.labour);
    expect(rows.hardware.map((r) => r.item)).toEqual(doc.hardware);
    expect(loadBook(db).book).toEqual({ ...demoPriceBook, sheetGoods: doc.sheetGoods });
    const settings = db.select().from(shopSettings).get()!.settings;
    expect(settings).toMatchObject({ shopRateCents: 9100, labourCostPerHourCents: 4100, kerfMm: 3.0, sheetTrimMm: 8 });
    expect(db.select().from(priceBooks).all()).toEqual([]);
    expect(
      db
        .select()
        .from(priceBookVersions)
        .all()
        .map((v) => v.number),
    ).toEqual([1]);

    seedShop(db);
    expect(
      db
        .select()
        .from(priceBookVersions)
        .all()
        .map((v) => v.number),
    ).toEqual([1]);
    db.$client.close();
  });
});
