import { describe, expect, it } from 'vitest';
import { demoPriceBook, demoSettings, designs, DESIGN_SLUGS, validateSpec } from '@benchwright/pricing';
import { projectItems } from '../src/db/schema';
import { testApp } from './helpers';

const bench = designs['assembly-bench'].defaults;

/** A bench as stored before arrangements: two equal cases side by side sharing one set of bays. */
function legacyBench() {
  const {
    cases: _cases,
    overhangBackMm: _b,
    overhangLeftMm: _l,
    overhangRightMm: _r,
    ...rest
  } = structuredClone(bench);
  return {
    ...rest,
    depthMm: 762,
    trim: null,
    top: { ...rest.top, edge: undefined },
    caseCount: 2,
    bays: [{ widthMm: null, compartments: [{ kind: 'drawer' }, { kind: 'drawer' }, { kind: 'drawer' }] }],
    overhangSidesMm: 76.2,
  };
}

describe('POST /api/quotes/preview with a bench', () => {
  it('draws the standard bench front, back and plan, and prices a bench stored before arrangements', async () => {
    const t = await testApp();
    const r = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec: bench, quantity: 1 }] });
    expect(r.status).toBe(200);
    const svg: string = r.body.quote.items[0].drawingSvg;
    for (const view of ['Front elevation', 'Back elevation', 'Plan of the cases under the top'])
      expect(svg).toContain(view);
    const old = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec: legacyBench(), quantity: 1 }] });
    expect(old.status).toBe(200);
    expect(old.body.quote.budget.lowCents).toBeGreaterThan(0);
  });

  it('answers 400 naming the case for an arrangement that does not fit under its top, never 500', async () => {
    const t = await testApp();
    const spec = structuredClone(bench);
    spec.cases[0]!.widthMm = 1900;
    const r = await t
      .agent()
      .post('/api/quotes/preview')
      .send({ items: [{ spec, quantity: 1 }] });
    expect(r.status).toBe(400);
    expect(r.body.error.issues.map((i: { path: string }) => i.path)).toContain('items[0].spec.cases[0].widthMm');
  });
});

describe('stored specs', () => {
  it('every design default and every spec the seed stores validates against the demo book', async () => {
    const t = await testApp();
    const stored = t.db.select().from(projectItems).all();
    expect(stored.some((i) => (i.spec as { design: string }).design === 'assembly-bench')).toBe(true);
    for (const spec of [...DESIGN_SLUGS.map((s) => designs[s].defaults), ...stored.map((i) => i.spec)]) {
      const v = validateSpec(spec, demoPriceBook, demoSettings);
      expect(v.ok ? [] : v.issues).toEqual([]);
    }
  });
});
