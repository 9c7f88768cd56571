/**
 * What the shop's PDFs share: the shipped Source Sans 3 fonts, the ink and
 * wood colours, and the engine's drawing data drawn with react-pdf's SVG.
 */
import { createRequire } from 'node:module';
import { Circle, Font, G, Line, Rect, Svg, Text, View } from '@react-pdf/renderer';
import type { Drawing, ShapeStyle } from '@benchwright/pricing';

const require = createRequire(import.meta.url);
const font = (w: number) => require.resolve(`@fontsource/source-sans-3/files/source-sans-3-latin-${w}-normal.woff`);
// the .woff files (fontkit cannot read woff2), shipped with the app: no font service
Font.register({
  family: 'Source Sans 3',
  fonts: [{ src: font(400) }, { src: font(600), fontWeight: 600 }, { src: font(700), fontWeight: 700 }],
});
Font.registerHyphenationCallback((word) => [word]);

export const INK = '#231c15';
export const WOOD = '#7a4a24';
/** secondary text, and the hairline between table rows */
export const MUTED = '#5b5148';
export const RULE = '#d8ccb8';

// fills by style; offcuts are white and hatched, as the drawing's legend and the screen's SVG draw them
const FILL: Partial<Record<ShapeStyle, string>> = {
  top: '#e3d6c1',
  kick: '#d9d2c7',
  case: '#f1ebe0',
  part: '#f6f1e7',
  offcut: '#ffffff',
  trim: '#cdb79a',
};

/**
 * The 45-degree hatch of a rectangle as line segments clipped to it (react-pdf's SVG has no pattern fill), the
 * same hatch `toSvg` draws with a pattern: lines x + y = c every `gap`, each cut to the rectangle's edges.
 * @example hatchSegments(0, 0, 10, 10, 5) // three segments across the square
 */
export function hatchSegments(
  x: number,
  y: number,
  w: number,
  h: number,
  gap: number,
): [number, number, number, number][] {
  const out: [number, number, number, number][] = [];
  if (!(w > 0 && h > 0 && gap > 0)) return out;
  for (let c = x + y + gap; c < x + w + y + h; c += gap) {
    // enters along the left or top edge, leaves along the bottom or right edge
    const x1 = Math.max(x, c - (y + h));
    const x2 = Math.min(x + w, c - y);
    if (x2 - x1 <= 1e-9) continue;
    out.push([x1, c - x1, x2, c - x2]);
  }
  return out;
}

/** The engine's drawing data drawn with react-pdf's SVG primitives. */
export function PdfDrawing({ drawing, width }: { drawing: Drawing; width: number }) {
  const vb = drawing.viewBox;
  const k = vb.width / 500;
  const height = (width * vb.height) / vb.width;
  return (
    <Svg width={width} height={height} viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`}>
      {drawing.shapes.map((sh, i) => {
        switch (sh.type) {
          case 'rect':
            return (
              <G key={i}>
                <Rect
                  x={sh.x}
                  y={sh.y}
                  width={sh.width}
                  height={sh.height}
                  stroke={INK}
                  strokeWidth={1.2 * k}
                  fill={FILL[sh.style] ?? '#ffffff'}
                />
                {sh.style === 'offcut'
                  ? hatchSegments(sh.x, sh.y, sh.width, sh.height, 12 * k).map(([x1, y1, x2, y2], j) => (
                      <Line key={j} x1={x1} y1={y1} x2={x2} y2={y2} stroke={INK} strokeWidth={0.6 * k} />
                    ))
                  : null}
              </G>
            );
          case 'line':
          case 'arrow':
            return (
              <Line
                key={i}
                x1={sh.x1}
                y1={sh.y1}
                x2={sh.x2}
                y2={sh.y2}
                stroke={INK}
                strokeWidth={(sh.style === 'guide' ? 0.6 : 1) * k}
                strokeDasharray={sh.style === 'guide' ? `${6 * k} ${4 * k}` : undefined}
              />
            );
          case 'circle':
            return <Circle key={i} cx={sh.cx} cy={sh.cy} r={sh.r} stroke={INK} strokeWidth={1.2 * k} fill="#ffffff" />;
          case 'text':
            return (
              <Text
                key={i}
                x={sh.x}
                y={sh.y}
                style={{ fontSize: sh.size, fontFamily: 'Source Sans 3', fontWeight: sh.weight === 'bold' ? 700 : 400 }}
                textAnchor={sh.anchor}
              >
                {sh.text}
              </Text>
            );
          case 'dimension': {
            const horizontal = Math.abs(sh.y1 - sh.y2) < 1e-6;
            const [ax, ay, bx, by] = horizontal
              ? [sh.x1, sh.y1 + sh.offset, sh.x2, sh.y2 + sh.offset]
              : [sh.x1 + sh.offset, sh.y1, sh.x2 + sh.offset, sh.y2];
            return (
              <G key={i}>
                <Line x1={ax} y1={ay} x2={bx} y2={by} stroke={INK} strokeWidth={0.8 * k} />
                <Text
                  x={horizontal ? (ax + bx) / 2 : ax + sh.size * 0.6}
                  y={horizontal ? ay + sh.size * 1.2 : (ay + by) / 2}
                  style={{ fontSize: sh.size, fontFamily: 'Source Sans 3' }}
                  textAnchor={horizontal ? 'middle' : 'start'}
                >
                  {sh.text}
                </Text>
              </G>
            );
          }
        }
      })}
    </Svg>
  );
}

const footerStyle = {
  position: 'absolute',
  bottom: 22,
  left: 36,
  right: 36,
  flexDirection: 'row',
  justifyContent: 'space-between',
  fontSize: 8,
  color: MUTED,
} as const;

/** The running footer of every page: what the document is, and "Page n of m". */
export function PageFooter({ children }: { children: string }) {
  return (
    <View style={footerStyle} fixed>
      <Text>{children}</Text>
      <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
    </View>
  );
}
