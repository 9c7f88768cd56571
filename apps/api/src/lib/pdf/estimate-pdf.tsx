import { Document, Image, Page, renderToBuffer, StyleSheet, Text, View } from '@react-pdf/renderer';
import {
  designs,
  displayUnit,
  formatLength,
  formatQuantity,
  LINE_GROUP_LABELS,
  LINE_GROUPS,
  unitPriceFactor,
  type Drawing,
  type LengthUnit,
  type LineGroup,
} from '@benchwright/pricing';
import { formatDate } from '@benchwright/contracts';
import { dollars } from '../mail-templates';
import { INK, MUTED, PageFooter, PdfDrawing, RULE, WOOD } from './pdf-drawing';

const s = StyleSheet.create({
  page: { fontFamily: 'Source Sans 3', fontSize: 10, color: INK, padding: 40, paddingBottom: 56 },
  head: {
    flexDirection: 'row',
    justifyContent: 'space-between',
    borderBottomWidth: 2,
    borderBottomColor: WOOD,
    paddingBottom: 8,
    marginBottom: 14,
  },
  shop: { fontSize: 16, fontWeight: 700 },
  muted: { color: MUTED },
  h2: { fontSize: 12, fontWeight: 700, marginTop: 12, marginBottom: 6 },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: RULE, paddingVertical: 3 },
  groupRow: { flexDirection: 'row', paddingTop: 7, paddingBottom: 2 },
  cDesc: { flex: 1 },
  cQty: { width: 70, textAlign: 'right' },
  cUnit: { width: 70, textAlign: 'right' },
  cAmt: { width: 80, textAlign: 'right' },
  totals: { marginTop: 10, marginLeft: 'auto', width: 240 },
  totalRow: { flexDirection: 'row', justifyContent: 'space-between', paddingVertical: 2 },
  grand: { fontWeight: 700, fontSize: 12, borderTopWidth: 1, borderTopColor: INK, marginTop: 3, paddingTop: 4 },
  caution: { marginBottom: 3 },
});

export interface EstimatePdfInput {
  /** `logo`: the shop's PNG (lib/shop-logo.ts), drawn above its name */
  shop: { name: string; address: string; email: string; phone: string; logo?: Buffer | null };
  client: { name: string; email: string };
  number: string;
  revision: number;
  date: Date;
  validUntil: Date;
  items: {
    spec: { design: string; widthMm: number; heightMm: number; depthMm: number };
    quantity: number;
    materials: string[];
    finish: string | null;
    /** the client's choices as the revision was priced; when given they replace the materials and finish lines */
    choices?: { label: string; value: string }[];
    drawing: Drawing;
  }[];
  lines: {
    group: LineGroup;
    description: string;
    quantity: number;
    unit: string;
    unitPriceCents: number;
    amountCents: number;
  }[];
  totals: {
    subtotalCents: number;
    discountCents: number;
    taxCents: number;
    totalCents: number;
    depositCents: number;
    balanceCents: number;
  };
  depositRate: number;
  /** the shop's units: sizes and quantities are written in them */
  units: LengthUnit;
  safety: EstimateSafety;
}

/** The safety block: what this work is built to carry and what comes with it, from its own checks. */
export interface EstimateSafety {
  /** the rated shelf load, e.g. "40 lb/ft²", when the work has shelves */
  shelfLoad: string | null;
  /** the pieces' own checks (caster load, tip-over, anchoring, built-in...), in the client's words */
  checks: string[];
  /** safety hardware on the estimate's lines, e.g. "Anti-tip wall anchor kit: 1 set" */
  included: string[];
}

// a price per converted unit (per foot from per metre) keeps a tenth of a cent, so quantity x price still reads true
const perUnitUsd = new Intl.NumberFormat('en-US', {
  style: 'currency',
  currency: 'USD',
  minimumFractionDigits: 2,
  maximumFractionDigits: 3,
});
const perUnit = (cents: number) => perUnitUsd.format(cents / 100);

/** Said of all furniture, after the work's own checks. */
export const GENERAL_CAUTIONS = ['Do not stand on benches or cabinets, and do not let children climb furniture.'];

function EstimateDocument({ d }: { d: EstimatePdfInput }) {
  const fmtDate = (x: Date) => formatDate(x);
  const groups = LINE_GROUPS.filter((g) => d.lines.some((l) => l.group === g));
  return (
    <Document title={`Estimate ${d.number} revision ${d.revision}`} author={d.shop.name}>
      <Page size="LETTER" style={s.page}>
        <View style={s.head}>
          <View>
            {d.shop.logo ? (
              <Image
                src={{ data: d.shop.logo, format: 'png' }}
                style={{ maxHeight: 48, maxWidth: 180, marginBottom: 4 }}
              />
            ) : null}
            <Text style={s.shop}>{d.shop.name}</Text>
            <Text style={s.muted}>{d.shop.address}</Text>
            <Text style={s.muted}>
              {d.shop.email} · {d.shop.phone}
            </Text>
          </View>
          <View style={{ alignItems: 'flex-end' }}>
            <Text style={{ fontSize: 14, fontWeight: 700 }}>Estimate {d.number}</Text>
            <Text>Revision {d.revision}</Text>
            <Text>Dated {fmtDate(d.date)}</Text>
            <Text>Valid until {fmtDate(d.validUntil)}</Text>
          </View>
        </View>
        <Text style={{ fontWeight: 600 }}>For {d.client.name}</Text>
        <Text style={s.muted}>{d.client.email}</Text>

        <Text style={s.h2}>The work</Text>
        {d.items.map((it, i) => {
          const name = (designs as Record<string, { name: string }>)[it.spec.design]?.name ?? it.spec.design;
          const len = (mm: number) => formatLength(mm, { unit: d.units });
          const size = `${len(it.spec.widthMm)} W x ${len(it.spec.heightMm)} H x ${len(it.spec.depthMm)} D`;
          return (
            <View key={i} wrap={false} style={{ flexDirection: 'row', marginBottom: 8 }}>
              <View style={{ width: 250 }}>
                <PdfDrawing drawing={it.drawing} width={240} />
              </View>
              <View style={{ flex: 1, paddingLeft: 10 }}>
                <Text style={{ fontWeight: 700 }}>
                  {it.quantity > 1 ? `${it.quantity} x ` : ''}
                  {name}
                </Text>
                <Text>{size}</Text>
                {it.choices?.length ? (
                  it.choices
                    .filter((c) => c.label !== 'Size')
                    .map((c) => (
                      <Text key={c.label}>
                        {c.label}: {c.value}
                      </Text>
                    ))
                ) : (
                  <>
                    <Text>Materials: {it.materials.join(', ')}</Text>
                    <Text>Finish: {it.finish ?? 'none (unfinished)'}</Text>
                  </>
                )}
              </View>
            </View>
          );
        })}

        <Text style={s.h2}>Priced items</Text>
        <View style={[s.row, { borderBottomColor: INK }]}>
          <Text style={[s.cDesc, { fontWeight: 700 }]}>Item</Text>
          <Text style={[s.cQty, { fontWeight: 700 }]}>Quantity</Text>
          <Text style={[s.cUnit, { fontWeight: 700 }]}>Unit price</Text>
          <Text style={[s.cAmt, { fontWeight: 700 }]}>Amount</Text>
        </View>
        {groups.map((g) => {
          const lines = d.lines.filter((l) => l.group === g);
          const sub = lines.reduce((a, l) => a + l.amountCents, 0);
          return (
            <View key={g}>
              <View style={s.groupRow} wrap={false}>
                <Text style={[s.cDesc, { fontWeight: 700 }]}>{LINE_GROUP_LABELS[g]}</Text>
                <Text style={[s.cAmt, { fontWeight: 600 }]}>{dollars(sub)}</Text>
              </View>
              {lines.map((l, i) => (
                <View key={i} style={s.row} wrap={false}>
                  <Text style={s.cDesc}>{l.description}</Text>
                  <Text style={s.cQty}>{formatQuantity(l.quantity, l.unit, d.units)}</Text>
                  <Text style={s.cUnit}>
                    {perUnit(l.unitPriceCents * unitPriceFactor(l.unit, d.units))}
                    {['m', 'gal', 'kg'].includes(l.unit) ? `/${displayUnit(l.unit, d.units)}` : ''}
                  </Text>
                  <Text style={s.cAmt}>{dollars(l.amountCents)}</Text>
                </View>
              ))}
            </View>
          );
        })}
        <View style={s.totals} wrap={false}>
          <View style={s.totalRow}>
            <Text>Subtotal</Text>
            <Text>{dollars(d.totals.subtotalCents)}</Text>
          </View>
          {d.totals.discountCents ? (
            <View style={s.totalRow}>
              <Text>Discount</Text>
              <Text>-{dollars(d.totals.discountCents)}</Text>
            </View>
          ) : null}
          <View style={s.totalRow}>
            <Text>Tax</Text>
            <Text>{dollars(d.totals.taxCents)}</Text>
          </View>
          <View style={[s.totalRow, s.grand]}>
            <Text>Total</Text>
            <Text>{dollars(d.totals.totalCents)}</Text>
          </View>
          <View style={s.totalRow}>
            <Text>Deposit ({Math.round(d.depositRate * 100)}%)</Text>
            <Text>{dollars(d.totals.depositCents)}</Text>
          </View>
          <View style={s.totalRow}>
            <Text>Balance on completion</Text>
            <Text>{dollars(d.totals.balanceCents)}</Text>
          </View>
        </View>

        <View wrap={false}>
          <Text style={s.h2}>Payment terms</Text>
          <Text>
            Accept this estimate in the client portal before {fmtDate(d.validUntil)}. The deposit of{' '}
            {dollars(d.totals.depositCents)} is paid online when you accept, and we order material once it arrives. The
            balance of {dollars(d.totals.balanceCents)} is due when the piece is ready, before delivery.
          </Text>
        </View>
        <View wrap={false}>
          <Text style={s.h2}>Safety</Text>
          {d.safety.shelfLoad ? (
            <Text style={s.caution}>
              · Shelves are built to carry {d.safety.shelfLoad} spread evenly (about what a shelf of books weighs); put
              the heaviest things on the lowest shelves.
            </Text>
          ) : null}
          {d.safety.checks.map((c) => (
            <Text key={c} style={s.caution}>
              · {c}
            </Text>
          ))}
          {GENERAL_CAUTIONS.map((c) => (
            <Text key={c} style={s.caution}>
              · {c}
            </Text>
          ))}
          <Text style={[s.caution, { marginTop: 4, fontWeight: 600 }]}>Included for safety</Text>
          {d.safety.included.length ? (
            d.safety.included.map((c) => (
              <Text key={c} style={s.caution}>
                · {c}
              </Text>
            ))
          ) : (
            <Text style={s.caution}>· No safety hardware is on this estimate.</Text>
          )}
        </View>
        <PageFooter>{`${d.shop.name} · Estimate ${d.number}, revision ${d.revision}`}</PageFooter>
      </Page>
    </Document>
  );
}

/** Renders the estimate's PDF. */
export function renderEstimatePdf(input: EstimatePdfInput): Promise<Buffer> {
  return renderToBuffer(<EstimateDocument d={input} />);
}
