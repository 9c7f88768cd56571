import { describe, expect, it } from 'vitest';
import { estimate } from './costing';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, parseSpec } from './designs';
import { traveller } from './traveller';
import { stageChecklist } from './checklist';
import { STAGE_KEYS } from './price-book';

const spec = (slug: keyof typeof designs) => {
  const r = parseSpec({ ...designs[slug].defaults, design: slug });
  if (!r.ok) throw new Error('defaults must parse');
  return r.spec;
};
const paperFor = (slug: keyof typeof designs) =>
  traveller(
    estimate([{ spec: spec(slug), quantity: 1 }], demoPriceBook, demoSettings, { effort: 'quick' }),
    demoPriceBook,
    demoSettings,
  );

describe('stageChecklist', () => {
  it('gives every board stage its steps, each key unique within the job', () => {
    const items = stageChecklist(paperFor('base-cabinet'));
    for (const stage of STAGE_KEYS) expect(items.some((i) => i.stage === stage)).toBe(true);
    expect(new Set(items.map((i) => i.key)).size).toBe(items.length);
  });
  it("words the steps from the job's own paper: its sheet and part counts", () => {
    const t = paperFor('base-cabinet');
    const sheets = t.materials.reduce((n, m) => n + m.sheetCount, 0);
    const parts = t.pieces[0]!.parts.reduce((n, p) => n + p.quantity, 0);
    const items = stageChecklist(t);
    expect(items.find((i) => i.key === 'cutting.breakdown')?.text).toContain(`${sheets} sheet`);
    expect(items.find((i) => i.key === 'cutting.parts')?.text).toContain(`${parts} parts`);
  });
  it('leaves out the steps that do not apply: no slides, no drawer steps; no casters, no caster check', () => {
    const shelves = stageChecklist(paperFor('bookcase'));
    const slides = paperFor('bookcase').pickList.some((h) => h.kind === 'slide');
    expect(shelves.some((i) => i.key === 'drawers_doors.slides')).toBe(slides);
    expect(shelves.some((i) => i.key === 'ready.mobility')).toBe(false);
    const bench = stageChecklist(paperFor('assembly-bench'));
    expect(bench.some((i) => i.key === 'ready.mobility')).toBe(true);
  });
});
