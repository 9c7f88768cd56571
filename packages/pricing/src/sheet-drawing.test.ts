import { describe, expect, it } from 'vitest';
import { sheetLayoutDrawing, type Shape } from './drawings';
import { nest, type NestPart } from './nesting';

/** A sheet of big and small parts: the drawer sides, backs and the cleats are too small to letter. */
const parts: NestPart[] = [
  { id: 'side', name: 'Side', lengthMm: 1800, widthMm: 300, quantity: 2, canRotate: false },
  { id: 'shelf', name: 'Adjustable shelf', lengthMm: 760, widthMm: 280, quantity: 3, canRotate: true },
  { id: 'dside', name: 'Drawer side', lengthMm: 450, widthMm: 90, quantity: 8, canRotate: true },
  { id: 'cleat', name: 'Hanging cleat', lengthMm: 300, widthMm: 40, quantity: 6, canRotate: true },
  { id: 'block', name: 'Caster block', lengthMm: 100, widthMm: 100, quantity: 4, canRotate: true },
];
const r = nest(parts, { lengthMm: 2438.4, widthMm: 1219.2 }, { kerfMm: 3.2, trimMm: 6, effort: 'quick' });
const drawings = r.sheets.map((s) => sheetLayoutDrawing(s, parts, { title: 'Test sheet' }));

type Circle = Extract<Shape, { type: 'circle' }>;
type Text = Extract<Shape, { type: 'text' }>;
/** A text's box as drawn: about 0.55 em a character, one em tall above its baseline. */
const box = (t: Text) => {
  const w = t.text.length * 0.55 * t.size;
  const x = t.anchor === 'middle' ? t.x - w / 2 : t.anchor === 'end' ? t.x - w : t.x;
  return { x, y: t.y - t.size * 0.8, width: w, height: t.size };
};
const hits = (c: Circle, b: ReturnType<typeof box>) => {
  const nx = Math.max(b.x, Math.min(c.cx, b.x + b.width));
  const ny = Math.max(b.y, Math.min(c.cy, b.y + b.height));
  return (c.cx - nx) ** 2 + (c.cy - ny) ** 2 < c.r * c.r * 0.9;
};

describe('sheet drawings a builder can read', () => {
  it('numbers the parts too small to letter and lists them in a key under the sheet', () => {
    const d = drawings[0]!;
    const texts = d.shapes.filter((s): s is Text => s.type === 'text');
    const key = texts.filter((t) => /^Part \d+: /.test(t.text));
    expect(key.length).toBeGreaterThan(0);
    for (const k of key) {
      const n = k.text.slice('Part '.length).split(':')[0]!;
      expect(texts.some((t) => t.text === n && t.weight === 'bold')).toBe(true);
      expect(k.y).toBeGreaterThan(1219.2); // under the sheet
      expect(k.y).toBeLessThan(d.viewBox.y + d.viewBox.height); // and inside the drawing
    }
    expect(key.map((k) => k.text)).toContainEqual(expect.stringMatching(/^Part \d+: Caster block, /));
  });
  it('places no cut number over another cut number or over a part’s name or size', () => {
    for (const d of drawings) {
      const circles = d.shapes.filter((s): s is Circle => s.type === 'circle');
      expect(circles.length).toBeGreaterThan(3);
      for (let i = 0; i < circles.length; i++)
        for (let j = i + 1; j < circles.length; j++) {
          const a = circles[i]!;
          const b = circles[j]!;
          expect(Math.hypot(a.cx - b.cx, a.cy - b.cy)).toBeGreaterThanOrEqual(a.r + b.r - 1e-6);
        }
      const labels = d.shapes.filter(
        (s): s is Text => s.type === 'text' && !/^\d+$/.test(s.text) && s.y > 0 && s.y < 1219.2,
      );
      for (const c of circles) for (const t of labels) expect(hits(c, box(t)), `${t.text}`).toBe(false);
    }
  });
});
