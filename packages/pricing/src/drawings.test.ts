import { describe, expect, it } from 'vitest';
import { demoPriceBook, demoSettings } from './demo-data';
import { designs, DESIGN_SLUGS } from './designs';
import { elevationDrawing, sheetLayoutDrawing, toSvg } from './drawings';
import { nest, type NestPart } from './nesting';
import { at } from './_lib/at';

describe('elevationDrawing', () => {
  it.each(DESIGN_SLUGS)('draws the %s defaults to scale with its fronts and overall sizes', (slug) => {
    const d = elevationDrawing(designs[slug].defaults);
    const rects = d.shapes.filter((s) => s.type === 'rect');
    expect(rects.some((r) => r.type === 'rect' && r.style === 'case')).toBe(true);
    const dims = d.shapes.filter((s) => s.type === 'dimension').map((s) => (s.type === 'dimension' ? s.text : ''));
    // the bench's plan adds its depth
    expect(dims).toHaveLength(slug === 'assembly-bench' ? 3 : 2);
    expect(dims[0]).toMatch(/"$/);
  });
  it('gives the base cabinet one door and one drawer front, a toe kick, and 24" x 34 1/2"', () => {
    const d = elevationDrawing(designs['base-cabinet'].defaults, { book: demoPriceBook, settings: demoSettings });
    expect(d.shapes.filter((s) => s.type === 'rect' && s.style === 'front')).toHaveLength(2);
    expect(d.shapes.filter((s) => s.type === 'rect' && s.style === 'kick')).toHaveLength(1);
    expect(d.shapes.filter((s) => s.type === 'dimension').map((s) => (s.type === 'dimension' ? s.text : ''))).toEqual([
      '24"',
      '34 1/2"',
    ]);
  });
  it('draws the bench casters on each elevation (its half) and all six on the plan', () => {
    const d = elevationDrawing(designs['assembly-bench'].defaults);
    expect(d.shapes.filter((s) => s.type === 'circle')).toHaveLength(3 + 3 + 6);
  });
});

describe('sheetLayoutDrawing', () => {
  const parts: NestPart[] = [
    { id: 'side', name: 'side', lengthMm: 1800, widthMm: 300, quantity: 2, canRotate: false },
    { id: 'shelf', name: 'shelf', lengthMm: 760, widthMm: 280, quantity: 3, canRotate: true },
  ];
  const sheet = { lengthMm: 2438.4, widthMm: 1219.2 };
  const r = nest(parts, sheet, { kerfMm: 3.2, trimMm: 6, effort: 'quick' });
  const sheet0 = at(r.sheets, 0);
  const d = sheetLayoutDrawing(sheet0, parts, { title: 'Test sheet' });
  it('labels each part with its name and size, and marks grain on grain-bound parts only', () => {
    const texts = d.shapes.flatMap((s) => (s.type === 'text' ? [s.text] : []));
    expect(texts.filter((t) => t === 'side')).toHaveLength(2);
    expect(texts).toContain('70 7/8" x 11 13/16"');
    expect(d.shapes.filter((s) => s.type === 'arrow')).toHaveLength(2);
  });
  it('numbers every cut, hatches the offcuts and states the sheet size and yield', () => {
    const texts = d.shapes.flatMap((s) => (s.type === 'text' ? [s.text] : []));
    for (const c of sheet0.cuts) expect(texts).toContain(String(c.order));
    expect(d.shapes.filter((s) => s.type === 'rect' && s.style === 'offcut')).toHaveLength(sheet0.offcuts.length);
    expect(texts[texts.length - 2]).toMatch(/^Test sheet: 96" x 48", yield \d+%$/);
  });
});

describe('toSvg', () => {
  it('returns a standalone SVG with a title, hatching for offcuts and escaped text', () => {
    const svg = toSvg({
      title: 'A & B',
      viewBox: { x: 0, y: 0, width: 100, height: 50 },
      shapes: [
        { type: 'text', x: 1, y: 1, text: '<shelf>', size: 5, anchor: 'start' },
        { type: 'rect', x: 0, y: 0, width: 10, height: 10, style: 'offcut' },
      ],
    });
    expect(svg.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    expect(svg).toContain('<title>A &amp; B</title>');
    expect(svg).toContain('&lt;shelf&gt;');
    expect(svg).toContain('fill="url(#bw-hatch)"');
  });
});
