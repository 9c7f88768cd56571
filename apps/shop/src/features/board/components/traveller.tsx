import { Link } from 'react-router-dom';
import { formatDate } from '@benchwright/contracts';
import { formatWeight, pieceSummary } from '@benchwright/pricing/geometry';
import { Button, Notice, Panel, TableHead } from '@benchwright/ui';
import { CutListPanel, PickListPanel, SheetLayoutsPanel } from '../../../components/shop-paper';
import { paths } from '../../../config/paths';
import type { ReactNode } from 'react';
import { useRelayout, useStages, useTraveller, type JobTraveller } from '../api/jobs';
import { MachiningPanel } from './machining-drawings';
import { StageChecklist } from './stage-checklist';

/**
 * The builder's shop paper for one job, on screen and printed: hours against
 * the budget, the cut list by piece, every sheet drawn with its cut order, the
 * hardware pick list, the banding to have on hand and the cautions.
 */
export function TravellerPage({
  id,
  assignment,
  canRelayout = false,
  photos,
}: {
  id: string;
  assignment?: (job: JobTraveller['job']) => ReactNode;
  /** the owner may lay the sheets out again with today's stock */
  canRelayout?: boolean;
  /** the job's photos, composed by the route (features do not import each other) */
  photos?: (job: JobTraveller['job'], stageLabel: (key: string) => string) => ReactNode;
}) {
  const q = useTraveller(id);
  const stages = useStages();
  const relayout = useRelayout();
  if (q.isPending) return <p>Opening the job’s paper…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const t = q.data;
  const stageLabel = (key: string) => stages.data?.find((s) => s.key === key)?.label ?? key.replace(/_/g, ' ');
  return (
    <article aria-label={`Traveler for ${t.job.clientName}`}>
      <p className="mb-2 print:hidden">
        <Link to={paths.board.getHref()} className="text-wood underline">
          ← Production board
        </Link>
      </p>
      <header className="mb-4 flex flex-wrap items-baseline justify-between gap-3">
        <h1 className="text-2xl font-bold">Traveler: {t.job.clientName}</h1>
        <span className="flex gap-3 print:hidden">
          <a href={paths.travellerPdf.getHref(t.job.id)} className="px-4 py-2 font-semibold text-wood underline">
            Download PDF
          </a>
          <a href={paths.labelsPdf.getHref(t.job.id)} className="px-4 py-2 font-semibold text-wood underline">
            Part labels (PDF)
          </a>
          <Button variant="quiet" onClick={() => window.print()}>
            Print
          </Button>
        </span>
      </header>
      <p className="mb-4">
        {t.job.project.notes ? `“${t.job.project.notes}” · ` : ''}now in {stageLabel(t.job.stage)} · builder{' '}
        {t.job.builder?.name ?? 'not set'}
        {t.job.dueDate ? ` · due ${formatDate(t.job.dueDate)}` : ''} · about {formatWeight(t.massKg, t.units)} finished
      </p>
      {t.layout ? (
        <p className="mb-4 text-sm text-ink-soft">
          {t.layout.note}{' '}
          {canRelayout ? (
            <Button
              variant="quiet"
              className="print:hidden"
              disabled={relayout.isPending}
              onClick={() => {
                if (
                  window.confirm(
                    'Lay the sheets out again with the stock in today’s price book? The layout of the accepted estimate is kept.',
                  )
                )
                  relayout.mutate(t.job.id);
              }}
            >
              {relayout.isPending ? 'Laying out…' : 'Lay out again with today’s stock'}
            </Button>
          ) : null}
        </p>
      ) : null}
      {relayout.isError ? <Notice tone="error">{relayout.error.message}</Notice> : null}
      {assignment?.(t.job)}
      {photos?.(t.job, stageLabel)}

      <Panel title="Hours">
        <table className="w-full text-left tabular-nums">
          <TableHead columns={['Stage', 'Budget (h)', 'Logged (h)']} />
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

      <StageChecklist t={t} stageLabel={stageLabel} order={stages.data?.map((s) => s.key) ?? []} />
      <Panel title="Piece">
        {t.pieces.map((p, i) => {
          const rows = pieceSummary(p, t.units);
          return (
            <section key={i} className="mb-3" aria-label={`Piece: ${p.title}`}>
              <h3 className="mb-1 font-semibold">
                {p.title} × {p.quantity}
              </h3>
              {rows.length ? (
                <dl className="grid grid-cols-[8rem_1fr] gap-x-3 text-sm">
                  {rows.map(([k, v]) => (
                    <div key={k} className="contents">
                      <dt className="text-ink-soft">{k}</dt>
                      <dd>{v}</dd>
                    </div>
                  ))}
                </dl>
              ) : (
                <p className="text-sm text-ink-soft">The estimate this job was priced from predates this section.</p>
              )}
            </section>
          );
        })}
      </Panel>
      <CutListPanel layouts={t} />
      <MachiningPanel pieces={t.pieces} units={t.units} />
      <SheetLayoutsPanel layouts={t} />
      <PickListPanel layouts={t} />
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
