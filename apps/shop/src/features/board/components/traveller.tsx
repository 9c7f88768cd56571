import { Link } from 'react-router-dom';
import { Button, Drawing, Length, Notice, Panel } from '@benchwright/ui';
import { paths } from '../../../config/paths';
import { useStages, useTraveller } from '../api/jobs';

const pct = (r: number) => `${Math.round(r * 100)} %`;

/**
 * The builder's shop paper for one job, on screen and printed: hours against
 * the budget, the cut list by piece, every sheet drawn with its cut order, the
 * hardware pick list, the banding to have on hand and the cautions.
 */
export function TravellerPage({ id }: { id: string }) {
  const q = useTraveller(id);
  const stages = useStages();
  if (q.isPending) return <p>Laying out the sheets for this job…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const t = q.data;
  const u = t.units;
  const stageLabel = (key: string) => stages.data?.find((s) => s.key === key)?.label ?? key.replace(/_/g, ' ');
  return (
    <article aria-label={`Traveller for ${t.job.clientName}`}>
      <p className="mb-2 print:hidden">
        <Link to={paths.board.getHref()} className="text-wood underline">
          ← Production board
        </Link>
      </p>
      <header className="mb-4 flex flex-wrap items-baseline justify-between gap-3">
        <h1 className="text-2xl font-bold">Traveller: {t.job.clientName}</h1>
        <Button variant="quiet" className="print:hidden" onClick={() => window.print()}>
          Print
        </Button>
      </header>
      <p className="mb-4">
        {t.job.project.notes ? `“${t.job.project.notes}” · ` : ''}now in {stageLabel(t.job.stage)} · builder {t.job.builder?.name ?? 'not set'}
        {t.job.dueDate ? ` · due ${t.job.dueDate}` : ''} · about {Math.round(t.massKg)} kg finished
      </p>

      <Panel title="Hours">
        <table className="w-full text-left tabular-nums">
          <thead>
            <tr className="border-b border-rule">
              <th className="py-1">Stage</th>
              <th>Budget (h)</th>
              <th>Logged (h)</th>
            </tr>
          </thead>
          <tbody>
            {Object.entries(t.hoursByStage)
              .filter(([, h]) => h > 0)
              .map(([k, h]) => {
                const logged = t.job.hoursLogged[k as keyof typeof t.job.hoursLogged] ?? 0;
                return (
                  <tr key={k} className="border-b border-rule/50">
                    <td className="py-1">{stageLabel(k)}</td>
                    <td>{h.toFixed(1)}</td>
                    <td className={logged > h ? 'font-semibold text-alert' : ''}>{logged.toFixed(1)}</td>
                  </tr>
                );
              })}
          </tbody>
        </table>
      </Panel>

      <Panel title="Cut list">
        {t.pieces.map((p, i) => (
          <div key={i} className="mb-4">
            <h3 className="mb-1 font-semibold">
              {p.title} × {p.quantity}
            </h3>
            <table className="w-full text-left text-sm" aria-label={`Cut list: ${p.title}`}>
              <thead>
                <tr className="border-b border-rule">
                  <th className="py-1">Part</th>
                  <th>Qty</th>
                  <th>Length</th>
                  <th>Width</th>
                  <th>Thick</th>
                  <th>Material</th>
                  <th>Grain</th>
                  <th>Band</th>
                </tr>
              </thead>
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
                    <td>
                      <Length mm={part.thicknessMm} unit={u} />
                    </td>
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

      <Panel title="Sheet layouts">
        {t.materials.map((m) => (
          <section key={m.materialName} className="mb-6">
            <h3 className="mb-2 font-semibold">
              {m.materialName}: {m.sheetCount} {m.sheetCount === 1 ? 'sheet' : 'sheets'}, {pct(m.yieldRatio)} used (at least {m.lowerBound} needed)
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

      <Panel title="Pick list">
        <table className="w-full text-left" aria-label="Pick list">
          <thead>
            <tr className="border-b border-rule">
              <th className="py-1">Hardware</th>
              <th>Kind</th>
              <th>Pieces</th>
            </tr>
          </thead>
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
                {b.name}: {b.metres.toFixed(1)} m of edges to band (before waste)
              </li>
            ))}
          </ul>
        ) : null}
      </Panel>

      <Panel title="Cautions">
        <ul className="list-disc pl-6">
          {t.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </Panel>
    </article>
  );
}
