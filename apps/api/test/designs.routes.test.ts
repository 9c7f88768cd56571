import { designs, DESIGN_SLUGS } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { contract, testApp } from './helpers';
import * as contracts from '@benchwright/contracts';

/** Every key anywhere in a JSON value. */
function keysOf(v: unknown, out: string[] = []): string[] {
  if (Array.isArray(v)) v.forEach((x) => keysOf(x, out));
  else if (v && typeof v === 'object')
    for (const [k, x] of Object.entries(v)) {
      out.push(k);
      keysOf(x, out);
    }
  return out;
}

/** The value at a dotted path of a spec (`top.skinMaterialId`). */
const at = (spec: unknown, path: string) =>
  path.split('.').reduce<unknown>((o, k) => (o as Record<string, unknown> | null)?.[k], spec);

describe('GET /api/designs: the choices a client may make', () => {
  it('gives each design the options of its own fields, from the active book, with every default offered', async () => {
    const t = await testApp();
    const anon = t.agent();
    for (const slug of DESIGN_SLUGS) {
      const { design } = contract(contracts.DesignResponse, await anon.get(`/api/designs/${slug}`));
      const fields = Object.keys(design.options);
      expect(fields).toEqual(
        expect.arrayContaining([
          'carcassMaterialId',
          'backMaterialId',
          'frontMaterialId',
          'drawerMaterialId',
          'drawerBottomMaterialId',
          'bandingId',
          'pullId',
          'finishId',
          'trim.lumberId',
        ]),
      );
      const bench = slug === 'assembly-bench';
      for (const f of ['top.skinMaterialId', 'top.coreMaterialId', 'casterId', 'footId'])
        expect(fields.includes(f), `${slug} ${f}`).toBe(bench);
      for (const f of fields) {
        // each field is a real path of the design's spec, and the design's own choice is among the options
        const dflt = at(designs[slug].defaults, f);
        expect(Object.hasOwn(designs[slug].defaults, f.split('.')[0]!), `${slug} ${f}`).toBe(true);
        if (typeof dflt === 'string')
          expect(
            design.options[f]!.map((o) => o.id),
            `${slug} ${f}`,
          ).toContain(dflt);
        expect(design.options[f]!.length, `${slug} ${f}`).toBeGreaterThan(0);
      }
    }
    const bench = contract(contracts.DesignResponse, await anon.get('/api/designs/assembly-bench')).design.options;
    expect(bench['trim.lumberId']!.map((o) => o.name)).toContain('Black walnut, 4/4');
    expect(bench.carcassMaterialId!.find((o) => o.id === 'mdf-18')).toMatchObject({
      note: expect.stringMatching(/paint-grade/),
    });
    expect(bench.backMaterialId!.find((o) => o.id === 'hardboard-6')).toMatchObject({
      note: expect.stringMatching(/no grain/),
    });
    // a case is not offered in 1/4 in stock, nor a back in 3/4 in
    expect(bench.carcassMaterialId!.map((o) => o.id)).not.toContain('birch-ply-6');
    expect(bench.backMaterialId!.map((o) => o.id)).not.toContain('birch-ply-18');
  });

  it('never names a cost or a price, in the list or a design', async () => {
    const t = await testApp();
    const anon = t.agent();
    const list = contract(contracts.DesignsResponse, await anon.get('/api/designs'));
    expect(list.designs.every((d) => Object.keys(d.options).length > 0)).toBe(true);
    const one = (await anon.get('/api/designs/assembly-bench')).body;
    for (const body of [list, one]) {
      const keys = keysOf(body);
      expect(keys.filter((k) => /cost|price|cents|margin|markup/i.test(k))).toEqual([]);
      expect(JSON.stringify(body)).not.toMatch(/cents|\$\d/i);
    }
  });

  it('gives the shop’s units, which the configurator starts in, and follows a change of them', async () => {
    const t = await testApp();
    const anon = t.agent();
    expect(contract(contracts.DesignResponse, await anon.get('/api/designs/assembly-bench')).design.units).toBe('in');
    const owner = await t.signIn('maren@fernhill.example');
    const version = (await owner.get('/api/settings')).body.settings.version as number;
    expect((await owner.patch('/api/settings').send({ version, values: { units: 'mm' } })).status).toBe(200);
    const { design } = contract(contracts.DesignResponse, await anon.get('/api/designs/assembly-bench'));
    expect(design.units).toBe('mm');
    // the caster's note speaks the same units
    expect(design.options.casterId!.every((o) => / kg each$/.test(o.note ?? ''))).toBe(true);
    const list = contract(contracts.DesignsResponse, await anon.get('/api/designs'));
    expect(list.designs.map((d) => d.units)).toEqual(DESIGN_SLUGS.map(() => 'mm'));
  });

  it('leaves a retired item out of the choices', async () => {
    const t = await testApp();
    const owner = await t.signIn('maren@fernhill.example');
    const before = (await t.agent().get('/api/designs/bookcase')).body.design.options['trim.lumberId'];
    expect(before.map((o: { id: string }) => o.id)).toContain('white-oak-4-4');
    expect((await owner.patch('/api/price-book/lumber/white-oak-4-4').send({ retired: true })).status).toBe(200);
    for (const path of ['/api/designs/bookcase', '/api/designs/assembly-bench']) {
      const after = (await t.agent().get(path)).body.design.options['trim.lumberId'];
      expect(after.map((o: { id: string }) => o.id)).not.toContain('white-oak-4-4');
      expect(after.map((o: { id: string }) => o.id)).toContain('walnut-4-4');
    }
  });
});
