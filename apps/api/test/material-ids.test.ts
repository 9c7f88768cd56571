import { beforeAll, describe, expect, it } from 'vitest';
import * as z from 'zod';
import { ERROR_CODES } from '@benchwright/contracts';
import { designs } from '@benchwright/pricing';
import { contract, testApp, type TestApp } from './helpers';

/** The one error shape (DESIGN.md), strictly. */
const ApiError = z
  .object({
    error: z
      .object({
        code: z.enum(ERROR_CODES),
        message: z.string().min(1),
        issues: z.array(z.object({ path: z.string(), message: z.string().min(1) }).strict()).optional(),
      })
      .strict(),
  })
  .strict();

const cabinet = designs['base-cabinet'].defaults;
const bench = designs['assembly-bench'].defaults;

/** The spec with one field (a dotted path) set. */
function withField(spec: object, path: string, value: unknown): Record<string, unknown> {
  const copy = structuredClone(spec) as Record<string, unknown>;
  const keys = path.split('.');
  let at = copy;
  for (const k of keys.slice(0, -1)) at = at[k] as Record<string, unknown>;
  at[keys.at(-1)!] = value;
  return copy;
}

// [field, spec, an id of the wrong kind for it]
const FIELDS: [string, object, string][] = [
  ['carcassMaterialId', cabinet, 'hinge-concealed'],
  ['backMaterialId', cabinet, 'walnut-4-4'],
  ['frontMaterialId', cabinet, 'waterborne-poly'],
  ['drawerMaterialId', cabinet, 'birch-banding-22'],
  ['drawerBottomMaterialId', cabinet, 'pull-bar-128'],
  ['bandingId', cabinet, 'waterborne-poly'],
  ['pullId', cabinet, 'birch-ply-18'],
  ['finishId', cabinet, 'birch-banding-22'],
  ['trim.lumberId', bench, 'birch-ply-18'],
  ['casterId', bench, 'leveling-foot'],
  ['footId', bench, 'caster-locking-5in'],
  ['top.skinMaterialId', bench, 'hard-maple-4-4'],
  ['top.coreMaterialId', bench, 'hinge-inset'],
];

describe('a material or hardware id not in the price book, or of the wrong kind: 400 with the field path', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp();
  });

  it.each(FIELDS)('%s, on the preview and on a new request', async (field, spec, wrongKind) => {
    const client = await t.signIn('guild@example.com');
    for (const id of ['no-such-item', wrongKind]) {
      const items = [{ spec: withField(spec, field, id), quantity: 1 }];
      for (const r of [
        await t.agent().post('/api/quotes/preview').send({ items }),
        await client.post('/api/projects').send({ items }),
      ]) {
        expect(r.status, `${field} = ${id}: ${JSON.stringify(r.body)}`).toBe(400);
        const body = contract(ApiError, r);
        const issue = body.error.issues?.find((i) => i.path === `items[0].spec.${field}`);
        expect(issue?.message, JSON.stringify(body.error.issues)).toMatch(/choose|must be/);
        if (id !== 'no-such-item') expect(issue?.message).toMatch(/must be/);
      }
    }
  });

  it('refuses an item the shop has retired on the preview and a new request, and prices it again once restored', async () => {
    const owner = await t.signIn('maren@fernhill.example');
    const client = await t.signIn('guild@example.com');
    const items = [{ spec: withField(bench, 'trim.lumberId', 'walnut-4-4'), quantity: 1 }];
    expect((await t.agent().post('/api/quotes/preview').send({ items })).status).toBe(200);
    expect((await owner.patch('/api/price-book/lumber/walnut-4-4').send({ retired: true })).status).toBe(200);
    try {
      for (const r of [
        await t.agent().post('/api/quotes/preview').send({ items }),
        await client.post('/api/projects').send({ items }),
      ]) {
        expect(r.status).toBe(400);
        expect(r.body.error.issues).toContainEqual({
          path: 'items[0].spec.trim.lumberId',
          message: expect.stringMatching(/no longer offered/),
        });
      }
    } finally {
      expect((await owner.patch('/api/price-book/lumber/walnut-4-4').send({ retired: false })).status).toBe(200);
    }
    expect((await t.agent().post('/api/quotes/preview').send({ items })).status).toBe(200);
  });
});
