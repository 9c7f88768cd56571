import { describe, expect, it } from 'vitest';
import { estimate } from './costing';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, parseSpec, type BuildSpec } from './designs';
import { SHOP_CAUTIONS, traveller } from './traveller';
import { pieceSummary } from './piece-summary';
import { toSvg } from './drawings';
import { at } from './_lib/at';

const spec = (slug: keyof typeof designs) => {
  const r = parseSpec({ ...designs[slug].defaults, design: slug });
  if (!r.ok) throw new Error('defaults must parse');
  return r.spec;
};

describe('traveller', () => {
  const items = [
    { spec: spec('base-cabinet'), quantity: 2 },
    { spec: spec('bookcase'), quantity: 1 },
  ];
  const e = estimate(items, demoPriceBook, demoSettings, { effort: 'quick' });
  const t = traveller(e, demoPriceBook, demoSettings);

  it('carries the machining of each part as data, positions included', () => {
    const side = at(t.pieces, 0).parts.find((p) => p.name === 'side')!;
    expect(side.machining).toContainEqual(
      expect.objectContaining({ kind: 'dado', for: 'bottom', fromEdge: 'bottom', distanceMm: 101.6 }),
    );
    const door = at(t.pieces, 0).parts.find((p) => p.name === 'door')!;
    expect(door.machining).toContainEqual(expect.objectContaining({ kind: 'hinge_cup', centresMm: [100, 491.7] }));
    // plain data: it survives a trip through JSON unchanged
    expect(JSON.parse(JSON.stringify(side.machining))).toEqual(side.machining);
  });

  it('lists every part of every piece, counted for the quantity ordered', () => {
    expect(t.pieces.map((p) => [p.title, p.quantity])).toEqual([
      ['Base cabinet', 2],
      ['Bookcase', 1],
    ]);
    const cabinetSides = at(e.pieces, 0).parts.filter((p) => /side/i.test(p.name));
    expect(cabinetSides.length).toBeGreaterThan(0);
    const side = at(cabinetSides, 0);
    const row = at(t.pieces, 0).parts.find((p) => p.name === side.name)!;
    expect(row.quantity).toBe(side.quantity * 2);
    expect(row.materialName).toBe(demoPriceBook.sheetGoods.find((s) => s.id === side.materialId)!.name);
    // the sheet parts on the cut list are exactly the units the layouts place
    const listed = t.pieces
      .flatMap((p) => p.parts)
      .filter((p) => p.stock === 'sheet')
      .reduce((s, p) => s + p.quantity, 0);
    const placed = e.layouts.reduce((s, l) => s + l.sheets.reduce((n, sh) => n + sh.placements.length, 0), 0);
    expect(listed).toBe(placed);
  });

  it('draws every sheet of every material, numbered, with its cut order', () => {
    expect(t.materials.map((m) => m.sheets.length)).toEqual(e.layouts.map((l) => l.sheetCount));
    const material = at(t.materials, 0);
    const first = at(material.sheets, 0);
    expect(first.number).toBe(1);
    expect(first.cuts.length).toBeGreaterThan(0);
    expect(first.drawing.title).toBe(`${material.materialName}: sheet 1 of ${material.sheetCount}`);
    expect(toSvg(first.drawing)).toMatch(/^<svg[\s\S]*<\/svg>$/);
  });

  it('sums the hardware into one pick list for the job', () => {
    const hinge = at(e.pieces, 0).hardware.find((h) => h.kind === 'hinge');
    expect(hinge).toBeDefined();
    const line = t.pickList.find((p) => p.name === hinge!.name)!;
    const expected = e.pieces.reduce(
      (s, p) => s + p.quantity * p.hardware.filter((h) => h.itemId === hinge!.itemId).reduce((a, h) => a + h.pieces, 0),
      0,
    );
    expect(line.pieces).toBe(expected);
  });

  it('carries the shop cautions and the pieces’ own, and no prices', () => {
    expect(t.cautions).toEqual(expect.arrayContaining([...SHOP_CAUTIONS]));
    expect(t.cautions.some((c) => /anchor/i.test(c))).toBe(true);
    expect(JSON.stringify(t)).not.toMatch(/cents|price/i);
  });
});

describe('traveller cautions and the piece section', () => {
  const items = [{ spec: spec('bookcase'), quantity: 1 }];
  const e = estimate(items, demoPriceBook, demoSettings, { effort: 'quick' });
  const t = traveller(e, demoPriceBook, demoSettings);
  it('cautions about full sheets, narrow rips, pocket holes and the bander’s hot glue, and defers to the manuals last', () => {
    const all = t.cautions.join('\n');
    expect(all).toMatch(/4 x 8 sheets: carry them with two people or on a sheet cart.*infeed and outfeed support/);
    expect(all).toMatch(/Never rip a piece narrower than the blade guard/);
    expect(all).toMatch(/Pocket holes/);
    expect(all).toMatch(/glue pot .* hot enough to burn/);
    expect(t.cautions.at(-1)).toMatch(/machine’s manual and your local workplace safety rules/);
  });
  it('returns each piece’s overall size, finish and coats, reveal and overlay, and joinery', () => {
    const p = t.pieces[0];
    expect(p).toMatchObject({
      widthMm: designs.bookcase.defaults.widthMm,
      heightMm: designs.bookcase.defaults.heightMm,
      depthMm: designs.bookcase.defaults.depthMm,
      revealMm: demoSettings.revealMm,
      overlayMm: demoSettings.overlayMm,
    });
    expect(p?.finish?.name).toMatch(/satin/);
    expect(p?.finish?.coats).toBeGreaterThan(0);
    expect(p?.joinery?.join(' ')).toMatch(/Dadoes and grooves: \d+, 1\/4 in deep/);
  });
  it('writes the piece section in the shop’s units', () => {
    const rows = Object.fromEntries(pieceSummary(at(t.pieces, 0), 'in'));
    expect(rows.Overall).toMatch(/^\d+[^x]*" W x \d+[^x]*" H x \d+[^x]*" D$/);
    expect(rows.Finish).toMatch(/satin, \d coats$/);
    expect(rows.Fronts).toBe('1/8" reveal, 23/32" overlay');
    expect(rows.Joinery).toMatch(/Dadoes/);
  });
  it('carries the client’s choices in the piece section, once each', () => {
    const rows = pieceSummary(at(t.pieces, 0), 'in');
    expect(Object.fromEntries(rows)).toMatchObject({
      Case: '3/4 in birch plywood',
      'Edge banding': 'Birch veneer banding, 7/8 in',
      Sections: 'open, 4 adjustable shelves and 1 fixed shelf',
    });
    expect(rows.filter(([k]) => k === 'Finish')).toHaveLength(1);
    expect(rows.map(([k]) => k)).not.toContain('Size');
  });
  it('says inset fronts are inset, with their reveal all round', () => {
    const e = estimate(
      [{ spec: { ...spec('bookcase'), frontStyle: 'inset' } as BuildSpec, quantity: 1 }],
      demoPriceBook,
      demoSettings,
      { effort: 'quick' },
    );
    const piece = at(traveller(e, demoPriceBook, demoSettings).pieces, 0);
    expect(piece.frontStyle).toBe('inset');
    expect(Object.fromEntries(pieceSummary(piece, 'in')).Fronts).toBe('Inset, 1/8" reveal all round');
  });
});

describe('a built-in base cabinet', () => {
  it('carries the built-in caution: fasten to studs, plumbing and electrical by licensed trades', () => {
    const e = estimate([{ spec: spec('base-cabinet'), quantity: 1 }], demoPriceBook, demoSettings, { effort: 'quick' });
    const c = e.checks.find((x) => x.code === 'built_in');
    expect(c?.message).toMatch(/fasten it to the wall studs/);
    expect(c?.message).toMatch(/plumbing and electrical work .* licensed trades under local code/);
    expect(traveller(e, demoPriceBook, demoSettings).cautions).toContain(c?.message);
  });
});
