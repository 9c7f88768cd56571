import { Document, Image, Page, renderToBuffer, StyleSheet, Text, View } from '@react-pdf/renderer';
import { formatDate } from '@benchwright/contracts';
import {
  formatLength,
  formatLineal,
  formatThickness,
  formatWeight,
  pieceSummary,
  type LengthUnit,
  type Traveller,
} from '@benchwright/pricing';
import { INK, MUTED, PageFooter, PdfDrawing, RULE, WOOD } from './pdf-drawing';
import { MachiningPages } from './traveller-machining-pdf';

const s = StyleSheet.create({
  page: { fontFamily: 'Source Sans 3', fontSize: 9, color: INK, padding: 36, paddingBottom: 52 },
  head: {
    flexDirection: 'row',
    justifyContent: 'space-between',
    borderBottomWidth: 2,
    borderBottomColor: WOOD,
    paddingBottom: 6,
    marginBottom: 10,
  },
  title: { fontSize: 15, fontWeight: 700 },
  muted: { color: MUTED },
  h2: { fontSize: 12, fontWeight: 700, marginTop: 10, marginBottom: 4 },
  h3: { fontSize: 10, fontWeight: 700, marginTop: 6, marginBottom: 2 },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 2 },
  th: { fontWeight: 700 },
});

export interface TravellerPdfInput {
  shopName: string;
  /** the shop's logo as PNG bytes (lib/shop-logo.ts) */
  logo?: Buffer | null;
  clientName: string;
  notes: string;
  stageLabel: string;
  builderName: string | null;
  dueDate: string | null;
  units: LengthUnit;
  stageLabels: Record<string, string>;
  hoursLogged: Record<string, number | undefined>;
  /** where the sheets come from: the accepted revision's layout, or a later one (lay out again) */
  layoutNote?: string;
  traveller: Traveller;
}

const COLS = [
  { key: 'name', label: 'Part', flex: 2.2 },
  { key: 'quantity', label: 'Qty', flex: 0.5 },
  { key: 'length', label: 'Length', flex: 1 },
  { key: 'width', label: 'Width', flex: 1 },
  { key: 'thick', label: 'Thick', flex: 0.7 },
  { key: 'material', label: 'Material', flex: 1.8 },
  { key: 'grain', label: 'Grain', flex: 0.6 },
  { key: 'band', label: 'Band', flex: 0.9 },
] as const;

/** The pieces in groups of about a page of cut-list rows (a piece of more rows alone, flowing on). */
function cutListGroups(pieces: Traveller['pieces']): { p: Traveller['pieces'][number]; i: number }[][] {
  const groups: { p: Traveller['pieces'][number]; i: number }[][] = [];
  let rows = Infinity;
  pieces.forEach((p, i) => {
    const n = p.parts.length + 3;
    if (rows + n > 44) {
      groups.push([]);
      rows = 0;
    }
    groups[groups.length - 1]!.push({ p, i });
    rows += n;
  });
  return groups;
}

function TravellerDocument({ d }: { d: TravellerPdfInput }) {
  const t = d.traveller;
  const len = (mm: number) => formatLength(mm, { unit: d.units });
  return (
    <Document title={`Traveler: ${d.clientName}`} author={d.shopName}>
      <Page size="LETTER" style={s.page}>
        <View style={s.head}>
          <View>
            <Text style={s.title}>Traveler: {d.clientName}</Text>
            {d.notes ? <Text style={s.muted}>“{d.notes}”</Text> : null}
          </View>
          <View style={{ alignItems: 'flex-end' }}>
            {d.logo ? (
              <Image src={{ data: d.logo, format: 'png' }} style={{ maxHeight: 32, maxWidth: 120, marginBottom: 2 }} />
            ) : null}
            <Text>{d.shopName}</Text>
            <Text>Now in {d.stageLabel}</Text>
            <Text>Builder: {d.builderName ?? 'not set'}</Text>
            <Text>Due: {d.dueDate ? formatDate(d.dueDate) : 'not set'}</Text>
            <Text>About {formatWeight(t.massKg, d.units)} finished</Text>
          </View>
        </View>
        {d.layoutNote ? <Text style={s.muted}>{d.layoutNote}</Text> : null}

        <Text style={s.h2}>Hours</Text>
        <View style={[s.row, s.th]}>
          <Text style={{ flex: 2 }}>Stage</Text>
          <Text style={{ flex: 1, textAlign: 'right' }}>Budget (h)</Text>
          <Text style={{ flex: 1, textAlign: 'right' }}>Logged (h)</Text>
        </View>
        {Object.entries(t.hoursByStage)
          .filter(([, h]) => h > 0)
          .map(([k, h]) => (
            <View key={k} style={s.row}>
              <Text style={{ flex: 2 }}>{d.stageLabels[k] ?? k}</Text>
              <Text style={{ flex: 1, textAlign: 'right' }}>{h.toFixed(1)}</Text>
              <Text style={{ flex: 1, textAlign: 'right' }}>{(d.hoursLogged[k] ?? 0).toFixed(1)}</Text>
            </View>
          ))}

        <Text style={s.h2}>Piece</Text>
        {t.pieces.map((p, i) => (
          <View key={i} wrap={false}>
            <Text style={s.h3}>
              {p.title} x {p.quantity}
            </Text>
            {pieceSummary(p, d.units).map(([k, v]) => (
              <View key={k} style={{ flexDirection: 'row' }}>
                <Text style={{ width: 70, color: MUTED }}>{k}</Text>
                <Text style={{ flex: 1 }}>{v}</Text>
              </View>
            ))}
          </View>
        ))}

        <Text style={s.h2}>Pick list</Text>
        <View style={[s.row, s.th]}>
          <Text style={{ flex: 3 }}>Hardware</Text>
          <Text style={{ flex: 1 }}>Kind</Text>
          <Text style={{ flex: 1, textAlign: 'right' }}>Qty</Text>
        </View>
        {t.pickList.map((h) => (
          <View key={h.name} style={s.row}>
            <Text style={{ flex: 3 }}>{h.name}</Text>
            <Text style={{ flex: 1 }}>{h.kind.replace(/_/g, ' ')}</Text>
            <Text style={{ flex: 1, textAlign: 'right' }}>{h.pieces}</Text>
          </View>
        ))}
        {t.bandingMetres.map((b) => (
          <Text key={b.name} style={{ marginTop: 3 }}>
            {b.name}: {formatLineal(b.metres, d.units)} of edges to band (before waste)
          </Text>
        ))}

        <Text style={s.h2}>Cautions</Text>
        {t.cautions.map((c) => (
          <Text key={c} style={{ marginBottom: 2 }}>
            · {c}
          </Text>
        ))}

        <PageFooter>{`${d.shopName} · traveler for ${d.clientName}`}</PageFooter>
      </Page>
      {/* the cut list on pages of its own, a few pieces to a page element: one long flowing page costs the
          renderer far more than the same rows over several */}
      {cutListGroups(t.pieces).map((group, g) => (
        <Page key={`cut-list-${g}`} size="LETTER" style={s.page}>
          {g === 0 ? <Text style={s.h2}>Cut list</Text> : null}
          {group.map(({ p, i }) => (
            <View key={i}>
              <Text style={s.h3}>
                {p.title} x {p.quantity}
              </Text>
              <View style={[s.row, s.th]}>
                {COLS.map((c) => (
                  <Text key={c.key} style={{ flex: c.flex }}>
                    {c.label}
                  </Text>
                ))}
              </View>
              {p.parts.map((part, j) => {
                const cells: Record<(typeof COLS)[number]['key'], string> = {
                  name: part.name,
                  quantity: String(part.quantity),
                  length: len(part.lengthMm),
                  width: len(part.widthMm),
                  thick: formatThickness(part.thicknessMm, d.units),
                  material: part.materialName,
                  grain: part.grain,
                  band: part.banding || '-',
                };
                return (
                  <View key={j} style={s.row} wrap={false}>
                    {COLS.map((c) => (
                      <Text key={c.key} style={{ flex: c.flex }}>
                        {cells[c.key]}
                      </Text>
                    ))}
                  </View>
                );
              })}
            </View>
          ))}
          <PageFooter>{`${d.shopName} · traveler for ${d.clientName}`}</PageFooter>
        </Page>
      ))}
      {/* a page of its own for each sheet: one long flowing page costs the renderer far more than its parts */}
      {t.materials.flatMap((m) =>
        m.sheets.map((sh) => (
          <Page key={`${m.materialName}-${sh.number}`} size="LETTER" style={s.page}>
            <Text style={s.h2}>
              {m.materialName}: sheet {sh.number} of {m.sheetCount}, {Math.round(sh.yieldRatio * 100)}% used,{' '}
              {sh.cuts.length} cuts
            </Text>
            <PdfDrawing drawing={sh.drawing} width={540} />
            <PageFooter>{`${d.shopName} · traveler for ${d.clientName}`}</PageFooter>
          </Page>
        )),
      )}
      <MachiningPages traveller={t} units={d.units} footer={`${d.shopName} · traveler for ${d.clientName}`} />
    </Document>
  );
}

/** Renders a job's traveller as a PDF: cut list, pick list, cautions, then one page per sheet. */
export function renderTravellerPdf(input: TravellerPdfInput): Promise<Buffer> {
  return renderToBuffer(<TravellerDocument d={input} />);
}
