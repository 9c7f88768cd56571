import { Document, Image, Page, renderToBuffer, StyleSheet, Text, View } from '@react-pdf/renderer';
import QRCode from 'qrcode';
import { formatLength, type LengthUnit, type Traveller } from '@benchwright/pricing';
import { INK, MUTED } from './pdf-drawing';

/**
 * The part-label sheet: US Letter, 30 labels of 2 5/8 x 1 in in 3 columns of
 * 10 (the common address-label size; the margins and pitches below are from
 * memory of that sheet and are checked against a printed sheet by the shop:
 * top and bottom 1/2 in, sides 3/16 in, 1/8 in between columns, no gap between rows).
 */
export const LABEL_SHEET = {
  pageWidthPt: 612,
  pageHeightPt: 792,
  columns: 3,
  rows: 10,
  labelWidthPt: 2.625 * 72,
  labelHeightPt: 72,
  topPt: 0.5 * 72,
  leftPt: 0.1875 * 72,
  columnPitchPt: 2.75 * 72,
} as const;
export const LABELS_PER_SHEET = LABEL_SHEET.columns * LABEL_SHEET.rows;

export interface PartLabel {
  /** "1/4": this unit of the part among all its units in the job */
  count: string;
  partName: string;
  size: string;
  pieceTitle: string;
  banding: string;
}

export interface LabelsPdfInput {
  shopName: string;
  clientName: string;
  jobUrl: string;
  units: LengthUnit;
  traveller: Pick<Traveller, 'pieces'>;
}

/** One label per unit to cut, in the traveller's order (piece by piece, part by part). */
export function partLabels(t: Pick<Traveller, 'pieces'>, units: LengthUnit): PartLabel[] {
  const len = (mm: number) => formatLength(mm, { unit: units });
  const out: PartLabel[] = [];
  t.pieces.forEach((piece, p) => {
    const pieceTitle = t.pieces.length > 1 ? `${piece.title} (piece ${p + 1})` : piece.title;
    for (const part of piece.parts) {
      const size = `${len(part.lengthMm)} x ${len(part.widthMm)} x ${len(part.thicknessMm)}`;
      for (let i = 1; i <= part.quantity; i++)
        out.push({ count: `${i}/${part.quantity}`, partName: part.name, size, pieceTitle, banding: part.banding });
    }
  });
  return out;
}

const s = StyleSheet.create({
  page: { fontFamily: 'Source Sans 3', fontSize: 7, color: INK },
  label: {
    position: 'absolute',
    width: LABEL_SHEET.labelWidthPt,
    height: LABEL_SHEET.labelHeightPt,
    padding: 6,
    flexDirection: 'row',
  },
  text: { flex: 1, paddingRight: 4 },
  part: { fontSize: 8.5, fontWeight: 700 },
  muted: { color: MUTED },
});

function LabelsDocument({ d, labels, qr }: { d: LabelsPdfInput; labels: PartLabel[]; qr: string }) {
  const pages: PartLabel[][] = [];
  for (let i = 0; i < labels.length; i += LABELS_PER_SHEET) pages.push(labels.slice(i, i + LABELS_PER_SHEET));
  if (pages.length === 0) pages.push([]);
  return (
    <Document title={`Part labels: ${d.clientName}`} author={d.shopName}>
      {pages.map((page, pi) => (
        <Page key={pi} size="LETTER" style={s.page}>
          {page.map((l, i) => {
            const col = i % LABEL_SHEET.columns;
            const row = Math.floor(i / LABEL_SHEET.columns);
            return (
              <View
                key={i}
                style={[
                  s.label,
                  {
                    left: LABEL_SHEET.leftPt + col * LABEL_SHEET.columnPitchPt,
                    top: LABEL_SHEET.topPt + row * LABEL_SHEET.labelHeightPt,
                  },
                ]}
              >
                <View style={s.text}>
                  <Text style={s.part}>
                    {l.partName} {l.count}
                  </Text>
                  <Text>{l.size}</Text>
                  <Text style={s.muted}>{l.pieceTitle}</Text>
                  <Text style={s.muted}>{l.banding ? `Band: ${l.banding}` : 'No banding'}</Text>
                  <Text style={s.muted}>Job: {d.clientName}</Text>
                </View>
                <Image src={qr} style={{ width: 54, height: 54 }} />
              </View>
            );
          })}
        </Page>
      ))}
    </Document>
  );
}

/** The label sheets as a PDF; the QR code on each label opens the job's page in the shop app. */
export async function renderLabelsPdf(d: LabelsPdfInput): Promise<Buffer> {
  const labels = partLabels(d.traveller, d.units);
  const qr = await QRCode.toDataURL(d.jobUrl, { errorCorrectionLevel: 'M', margin: 0, width: 160 });
  return renderToBuffer(<LabelsDocument d={d} labels={labels} qr={qr} />);
}
