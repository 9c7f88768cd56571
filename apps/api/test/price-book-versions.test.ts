import { eq } from 'drizzle-orm';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PriceBookVersionsResponse } from '@benchwright/contracts';
import { priceSheetGoods } from '../src/db/schema';
import { contract, testApp, type TestApp } from './helpers';

type Agent = ReturnType<typeof request.agent>;

/** `GET /api/price-book/versions` (issue 10 item 1): the book's history, the latest first, a page at a time. */
describe('GET /api/price-book/versions', () => {
  let t: TestApp;
  let owner: Agent;
  beforeAll(async () => {
    t = await testApp();
    owner = await t.signIn('maren@fernhill.example');
  }, 60_000);
  afterAll(() => t.app.pool.close());

  it('lists every change with who made it and what it was, the latest first, paged by a cursor', async () => {
    const ply = t.db.select().from(priceSheetGoods).where(eq(priceSheetGoods.id, 'birch-ply-18')).get()!;
    const price = ply.item.priceCents as number;
    for (const p of [price + 100, price + 200, price + 300])
      expect(
        (await owner.patch('/api/price-book/sheet-goods/birch-ply-18').send({ item: { priceCents: p } })).status,
      ).toBe(200);
    const latest = (await owner.get('/api/price-book')).body.priceBook.version as number;

    const first = contract(PriceBookVersionsResponse, await owner.get('/api/price-book/versions?limit=2'));
    expect(first.versions.map((v) => v.version)).toEqual([latest, latest - 1]);
    expect(first.versions[0]).toMatchObject({
      by: { name: 'Maren Holt' },
      summary: expect.stringContaining('birch-ply-18'),
    });
    expect(first.nextCursor).toEqual(expect.any(String));

    const seen = [...first.versions];
    let cursor = first.nextCursor;
    while (cursor) {
      const page = contract(
        PriceBookVersionsResponse,
        await owner.get(`/api/price-book/versions?limit=2&cursor=${encodeURIComponent(cursor)}`),
      );
      seen.push(...page.versions);
      cursor = page.nextCursor;
    }
    expect(seen.map((v) => v.version)).toEqual(Array.from({ length: latest }, (_, i) => latest - i));
    // the seed made the first version: no one's change
    expect(seen.at(-1)!.by).toBeNull();
  });

  it('refuses a cursor it did not give out and a page size over 200 (400), and anyone but the owner', async () => {
    expect((await owner.get('/api/price-book/versions?cursor=bm90LWEtY3Vyc29y')).status).toBe(400);
    expect((await owner.get('/api/price-book/versions?limit=500')).status).toBe(400);
    const builder = await t.signIn('idris@fernhill.example');
    expect((await builder.get('/api/price-book/versions')).status).toBe(403);
    expect((await t.agent().get('/api/price-book/versions')).status).toBe(401);
  });
});
