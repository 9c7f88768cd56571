/**
 * The shop paper's panels, shared by the job's traveller (board) and the
 * owner's estimate editor: cut list, sheet layouts, pick list.
 */
import { Drawing, Length, Panel, TableHead } from '@benchwright/ui';
import { formatLineal, formatThickness, type LengthUnit, type Traveller } from '@benchwright/pricing/geometry';

const pct = (r: number) => `${Math.round(r * 100)}%`;

/** What the panels need: the engine's traveller, without the hours and cautions, and the shop's units. */
export type Layouts = Pick<Traveller, 'pieces' | 'materials' | 'pickList' | 'bandingMetres'> & { units: LengthUnit };

/** The cut list, one table per piece, in the shop's units. */
export function CutListPanel({ layouts: t }: { layouts: Layouts }) {
  const u = t.units;
  return (
    <Panel title="Cut list">
      {t.pieces.map((p, i) => (
        <div key={i} className="mb-4">
          <h3 className="mb-1 font-semibold">
            {p.title} × {p.quantity}
          </h3>
          <table className="w-full text-left text-sm" aria-label={`Cut list: ${p.title}`}>
            <TableHead columns={['Part', 'Qty', 'Length', 'Width', 'Thick', 'Material', 'Grain', 'Band']} />
            <tbody>
              {p.parts.map((part, j) => (
                <tr key={j} className="border-b border-rule/50">
                  <td className="py-1">{part.name}</td>
                  <td className="tabular-nums">{part.quantity}</td>
                  <td>
                    <Length mm={part.lengthMm} unit={u} />
                  </td>
                  <td>
                    <Length mm={part.widthMm} unit={u} />
                  </td>
                  <td className="tabular-nums">{formatThickness(part.thicknessMm, u)}</td>
                  <td>{part.materialName}</td>
                  <td>{part.grain}</td>
                  <td>{part.banding || '–'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ))}
    </Panel>
  );
}

/** Every sheet of every material drawn to scale, with its yield and cut count. */
export function SheetLayoutsPanel({ layouts: t }: { layouts: Layouts }) {
  return (
    <Panel title="Sheet layouts">
      {t.materials.map((m) => (
        <section key={m.materialName} className="mb-6">
          <h3 className="mb-2 font-semibold">
            {m.materialName}: {m.sheetCount} {m.sheetCount === 1 ? 'sheet' : 'sheets'}, {pct(m.yieldRatio)} used (at
            least {m.lowerBound} needed)
          </h3>
          {m.sheets.map((s) => (
            <div key={s.number} className="mb-4 break-inside-avoid">
              <Drawing drawing={s.drawing} label={`${m.materialName}, sheet ${s.number}`} maxHeight="30rem" />
              <p className="text-sm text-ink-soft">
                Sheet {s.number}: {pct(s.yieldRatio)} used, {s.cuts.length} cuts in the order numbered on the drawing.
              </p>
            </div>
          ))}
        </section>
      ))}
    </Panel>
  );
}

/** The hardware to pick for the job, and the banding to have on hand. */
export function PickListPanel({ layouts: t }: { layouts: Layouts }) {
  return (
    <Panel title="Pick list">
      <table className="w-full text-left" aria-label="Pick list">
        <TableHead columns={['Hardware', 'Kind', 'Qty']} />
        <tbody>
          {t.pickList.map((h) => (
            <tr key={h.name} className="border-b border-rule/50">
              <td className="py-1">{h.name}</td>
              <td>{h.kind.replace(/_/g, ' ')}</td>
              <td className="tabular-nums">{h.pieces}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {t.bandingMetres.length ? (
        <ul className="mt-3 list-disc pl-6">
          {t.bandingMetres.map((b) => (
            <li key={b.name}>
              {b.name}: {formatLineal(b.metres, t.units)} of edges to band (before waste)
            </li>
          ))}
        </ul>
      ) : null}
    </Panel>
  );
}
