/**
 * The traveller PDF's machining drawings: the engine's drawing model (the
 * shop app draws the same one) in react-pdf's SVG, two columns to a Letter
 * page, a drawing never split over a page. The pages are bounded: parts that
 * are only banded are listed in a table (their one note says it all), and
 * past MAX_PDF_DRAWINGS drawings the remaining parts are listed with their
 * notes (every position in words); the job's page in the app draws them all.
 */
import { Circle, G, Line, Page, Path, Polygon, Rect, StyleSheet, Svg, Text, View } from '@react-pdf/renderer';
import type { ReactNode } from 'react';
import { partDrawings, type LengthUnit, type PartDrawing, type PartShape, type Traveller } from '@benchwright/pricing';
import { hatchSegments, INK, MUTED, PageFooter, RULE } from './pdf-drawing';

/**
 * The most drawings the PDF draws (six to a page): the mixed job of seven pieces has 42 different parts machined
 * beyond banding. Measured here (bench/traveller-pdf.ts), a drawing with its notes costs 40 to 70 ms of CPU.
 */
export const MAX_PDF_DRAWINGS = 48;

const COLUMN = 264;
const MAX_DRAWING_HEIGHT = 180;

const s = StyleSheet.create({
  page: { fontFamily: 'Source Sans 3', fontSize: 9, color: INK, padding: 36, paddingBottom: 52 },
  h2: { fontSize: 12, fontWeight: 700, marginBottom: 4 },
  intro: { color: MUTED, marginBottom: 6 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between' },
  cell: { width: COLUMN, marginBottom: 10, borderWidth: 0.5, borderColor: RULE, padding: 4 },
  name: { fontSize: 9.5, fontWeight: 700 },
  muted: { color: MUTED, fontSize: 8 },
  note: { fontSize: 7.5, marginTop: 1 },
  rest: { borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 3 },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 2, fontSize: 8 },
});

const f = (v: number) => Math.round(v * 100) / 100;
const hatchPath = (x: number, y: number, w: number, h: number, gap: number) =>
  hatchSegments(x, y, w, h, gap)
    .map(([x1, y1, x2, y2]) => `M${f(x1)} ${f(y1)}L${f(x2)} ${f(y2)}`)
    .join('');

/** One part drawn with react-pdf's SVG primitives at `width` points. */
export function PdfPartDrawing({ d, width }: { d: PartDrawing; width: number }) {
  const vb = d.viewBox;
  let w = width;
  let h = (w * vb.height) / vb.width;
  if (h > MAX_DRAWING_HEIGHT) {
    w = (w * MAX_DRAWING_HEIGHT) / h;
    h = MAX_DRAWING_HEIGHT;
  }
  const t = d.textSize;
  const el = (sh: PartShape, i: number) => {
    switch (sh.type) {
      case 'outline':
        return (
          <Polygon
            key={i}
            points={sh.points.map((p) => p.join(',')).join(' ')}
            stroke={INK}
            strokeWidth={t * 0.08}
            fill="#f6f1e7"
          />
        );
      case 'cut':
        return (
          <G key={i}>
            <Rect
              x={sh.x}
              y={sh.y}
              width={sh.width}
              height={sh.height}
              stroke={INK}
              strokeWidth={t * 0.04}
              fill="#ffffff"
            />
            {/* the hatch as one path: a line element each costs the renderer as much as a whole drawing's text */}
            <Path d={hatchPath(sh.x, sh.y, sh.width, sh.height, t * 0.35)} stroke={INK} strokeWidth={t * 0.04} />
          </G>
        );
      case 'band':
        return <Line key={i} x1={sh.x1} y1={sh.y1} x2={sh.x2} y2={sh.y2} stroke={INK} strokeWidth={t * 0.3} />;
      case 'hole':
        return <Circle key={i} cx={sh.cx} cy={sh.cy} r={sh.r} stroke={INK} strokeWidth={t * 0.05} fill="#ffffff" />;
      case 'pocket':
        return (
          <Rect
            key={i}
            x={sh.x}
            y={sh.y}
            width={sh.width}
            height={sh.height}
            rx={Math.min(sh.width, sh.height) / 2}
            stroke={INK}
            strokeWidth={t * 0.05}
            fill="#ffffff"
          />
        );
      case 'line':
        return (
          <Line
            key={i}
            x1={sh.x1}
            y1={sh.y1}
            x2={sh.x2}
            y2={sh.y2}
            stroke={INK}
            strokeWidth={t * (sh.style === 'dim' ? 0.04 : 0.025)}
            strokeDasharray={sh.style === 'centre' ? `${t * 0.5} ${t * 0.2}` : undefined}
          />
        );
      case 'tag':
        return (
          <G key={i}>
            <Circle cx={sh.cx} cy={sh.cy} r={sh.r} stroke={INK} strokeWidth={t * 0.05} fill="#ffffff" />
            <Text
              x={sh.cx}
              y={sh.cy + sh.r * 0.42}
              textAnchor="middle"
              style={{ fontSize: sh.r * 1.2, fontFamily: 'Source Sans 3', fontWeight: 700 }}
            >
              {sh.text}
            </Text>
          </G>
        );
      case 'text': {
        const text = (
          <Text
            x={sh.x}
            y={sh.y}
            textAnchor={sh.anchor}
            fill={sh.role === 'edge' ? MUTED : INK}
            style={{ fontSize: sh.size, fontFamily: 'Source Sans 3' }}
          >
            {sh.text}
          </Text>
        );
        return sh.vertical ? (
          <G key={i} transform={`rotate(-90, ${sh.x}, ${sh.y})`}>
            {text}
          </G>
        ) : (
          <G key={i}>{text}</G>
        );
      }
    }
  };
  return (
    <Svg width={w} height={h} viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`}>
      {d.shapes.map(el)}
    </Svg>
  );
}

/** A drawing's notes, numbered as its tags: one text block (each text element costs the renderer). */
function Notes({ d }: { d: PartDrawing }) {
  return <Text style={s.note}>{d.notes.map((n, i) => `${i + 1}. ${n}`).join('\n')}</Text>;
}

function Heading({ d }: { d: PartDrawing }) {
  return (
    <>
      <Text style={s.name}>
        {d.name} x {d.quantity} <Text style={{ fontWeight: 400 }}>{d.size}</Text>
      </Text>
      <Text style={s.muted}>
        {d.where.join(' · ')} · {d.materialName}
      </Text>
    </>
  );
}

/**
 * The traveller's machining pages: each machined or banded part drawn once
 * (identical parts with their count), then, past the cap, the rest in words.
 */
export function MachiningPages({
  traveller,
  units,
  footer,
}: {
  traveller: Pick<Traveller, 'pieces'>;
  units: LengthUnit;
  footer: string;
}) {
  const all = partDrawings(traveller, units);
  if (!all.length) return null;
  const bandedOnly = (d: PartDrawing) => d.notes.length === 1 && d.notes[0]!.startsWith('Band ');
  const machined = all.filter((d) => !bandedOnly(d));
  const banded = all.filter(bandedOnly);
  const drawn = machined.slice(0, MAX_PDF_DRAWINGS);
  const rest = machined.slice(MAX_PDF_DRAWINGS);
  // a Page element for each page's worth (laid out ahead from the drawings' heights): one long flowing page
  // costs the renderer far more than the same content in short ones. Each may still flow on if a guess is short.
  const pages = pack(drawn);
  const page = (key: string, children: ReactNode) => (
    <Page key={key} size="LETTER" style={s.page}>
      {children}
      <PageFooter>{footer}</PageFooter>
    </Page>
  );
  return (
    <>
      {pages.map((ds, i) =>
        page(
          `drawings-${i}`,
          <>
            {i === 0 ? (
              <>
                <Text style={s.h2}>Machining</Text>
                <Text style={s.intro}>{INTRO}</Text>
              </>
            ) : null}
            <View style={s.grid}>
              {ds.map((d) => (
                <View key={d.key} style={s.cell} wrap={false}>
                  <Heading d={d} />
                  <View style={{ alignItems: 'center', marginVertical: 3 }}>
                    <PdfPartDrawing d={d} width={COLUMN - 8} />
                  </View>
                  <Notes d={d} />
                </View>
              ))}
            </View>
          </>,
        ),
      )}
      {chunks(rest, 14).map((ds, i) =>
        page(
          `rest-${i}`,
          <>
            {i === 0 ? (
              <Text style={s.h2}>
                {rest.length} more machined {rest.length === 1 ? 'part' : 'parts'}, in words (drawn on the job’s page)
              </Text>
            ) : null}
            {ds.map((d) => (
              <View key={d.key} style={s.rest} wrap={false}>
                <Heading d={d} />
                <Notes d={d} />
              </View>
            ))}
          </>,
        ),
      )}
      {chunks(banded, 36).map((ds, i) =>
        page(
          `banded-${i}`,
          <>
            {i === 0 ? <Text style={s.h2}>Banded only</Text> : null}
            <View style={[s.row, { fontWeight: 700 }]}>
              <Text style={{ flex: 2 }}>Part</Text>
              <Text style={{ flex: 0.5 }}>Qty</Text>
              <Text style={{ flex: 2 }}>Size</Text>
              <Text style={{ flex: 2.5 }}>Edges to band</Text>
              <Text style={{ flex: 3 }}>For</Text>
            </View>
            {ds.map((d) => (
              <View key={d.key} style={s.row} wrap={false}>
                <Text style={{ flex: 2 }}>{d.name}</Text>
                <Text style={{ flex: 0.5 }}>{d.quantity}</Text>
                <Text style={{ flex: 2 }}>{d.size}</Text>
                <Text style={{ flex: 2.5 }}>{d.notes[0]!.replace(/^Band the (.*) \(thick line\)\.$/, '$1')}</Text>
                <Text style={{ flex: 3 }}>{d.where.join(' · ')}</Text>
              </View>
            ))}
          </>,
        ),
      )}
    </>
  );
}

const INTRO =
  'Each part is drawn flat with its length across; its edges and ends are named beside it. Hatched bands are ' +
  'dados, rabbets and grooves; circles are bores; thick lines are banded edges; slots are pocket holes. Numbers ' +
  'match the notes under each drawing.';

function chunks<T>(xs: readonly T[], n: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < xs.length; i += n) out.push(xs.slice(i, i + n));
  return out;
}

/** Lines a text takes in a column of `width` points at `size` (about half an em a character). */
const lines = (text: string, size: number, width: number) => Math.max(1, Math.ceil((text.length * size * 0.5) / width));

/** A drawing's cell height in points, as laid out above (heading, drawing, notes, padding). */
function cellHeight(d: PartDrawing): number {
  const inner = COLUMN - 8;
  const drawing = Math.min(MAX_DRAWING_HEIGHT, (inner * d.viewBox.height) / d.viewBox.width);
  const notes = d.notes.reduce((n, x) => n + lines(`${n}. ${x}`, 7.5, inner), 0);
  return 8 + 13 + lines(`${d.where.join(' · ')} · ${d.materialName}`, 8, inner) * 10 + 6 + drawing + notes * 9.2 + 10;
}

/** The drawings two to a row, rows to a Letter page (the first page also holds the heading and the key). */
function pack(ds: readonly PartDrawing[]): PartDrawing[][] {
  const pages: PartDrawing[][] = [];
  let cur: PartDrawing[] = [];
  let used = 60;
  for (let i = 0; i < ds.length; i += 2) {
    const row = ds.slice(i, i + 2);
    const h = Math.max(...row.map(cellHeight));
    if (cur.length && used + h > 704) {
      pages.push(cur);
      cur = [];
      used = 0;
    }
    cur.push(...row);
    used += h;
  }
  if (cur.length) pages.push(cur);
  return pages;
}
