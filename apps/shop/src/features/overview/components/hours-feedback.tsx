import { useState } from 'react';
import { standardIn } from '@benchwright/pricing/geometry';
import type { StageKey } from '@benchwright/contracts';
import { Button, Notice, Panel, TableHead } from '@benchwright/ui';
import { useApplyHours, useDismissHours, useHoursFeedback, type StageHours } from '../api/hours';

const pct = (r: number) => `${Math.round(r * 100)}%`;
/** Minutes as a standard reads: "72 min", "0.6 min". */
const min = (m: number) => `${Number(m.toFixed(2))} min`;
/** A standard in the shop's units: "3.05 min per foot banded". */
const standard = (minutes: number, driver: string, units: 'in' | 'mm') => {
  const s = standardIn(minutes, driver, units);
  return `${min(s.minutes)} per ${s.per}`;
};
/** A suggestion within 5 % of the standards says they hold: nothing to apply or set aside. */
const actionable = (s: StageHours) => s.suggestedFactor !== null && Math.abs(s.suggestedFactor - 1) >= 0.05;

/** What applying a stage's suggestion would change, each standard old → new, and the owner's yes or no. */
function ConfirmApply({
  stage,
  units,
  pending,
  onConfirm,
  onCancel,
}: {
  stage: StageHours;
  units: 'in' | 'mm';
  pending: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const f = stage.suggestedFactor ?? 1;
  return (
    <section
      role="dialog"
      aria-label={`Apply the ${stage.label} suggestion`}
      className="mt-4 rounded border border-rule bg-white p-4"
    >
      <h3 className="mb-1 font-semibold">
        {stage.label}: time standards × {Number(f.toFixed(2))}
      </h3>
      <p className="mb-2 text-sm text-ink-soft">
        From {stage.jobs} delivered {stage.jobs === 1 ? 'job' : 'jobs'}. This saves a new version of the price book;
        estimates already sent keep their prices, and the next estimate uses the new standards.
      </p>
      <table className="mb-3 w-full text-left tabular-nums">
        <TableHead columns={['Operation', 'Now', 'After']} />
        <tbody>
          {stage.standards.map((c) => (
            <tr key={c.key} className="border-b border-rule/50">
              <td className="py-1">{c.name}</td>
              <td>{standard(c.minutes, c.driver, units)}</td>
              <td>→ {standard(c.newMinutes, c.driver, units)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex gap-2">
        <Button disabled={pending} onClick={onConfirm}>
          Apply to the price book
        </Button>
        <Button variant="quiet" disabled={pending} onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </section>
  );
}

/**
 * Hours against the budget, stage by stage, over the last delivered jobs: where
 * the shop keeps taking longer (or shorter) than the time standards say, a
 * suggested change to the standards behind that stage, which the owner can
 * apply (after seeing each standard's change) or set aside until more jobs are
 * delivered.
 */
export function HoursFeedback() {
  const q = useHoursFeedback();
  const dismiss = useDismissHours();
  const apply = useApplyHours();
  const [confirming, setConfirming] = useState<StageKey | null>(null);
  const [applied, setApplied] = useState<string | null>(null);
  if (q.isPending) return null;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const rows = q.data.stages.filter((s) => s.stage !== 'delivered');
  const open = rows.find((s) => s.stage === confirming && actionable(s) && s.standards.length > 0);
  return (
    <Panel title="Hours against the budget, last 10 delivered jobs">
      {dismiss.isError ? <Notice tone="error">{dismiss.error.message}</Notice> : null}
      {apply.isError ? <Notice tone="error">{apply.error.message}</Notice> : null}
      {applied ? <Notice tone="ok">{applied}</Notice> : null}
      <table className="w-full text-left tabular-nums">
        <TableHead columns={['Stage', 'Jobs compared', 'Actual / estimated (median)', 'Suggestion', '']} />
        <tbody>
          {rows.map((s) => (
            <tr key={s.stage} className="border-b border-rule/50">
              <td className="py-1">{s.label}</td>
              <td>{s.jobs}</td>
              <td>{s.medianRatio === null ? '–' : pct(s.medianRatio)}</td>
              <td>
                {s.suggestedFactor === null
                  ? s.jobs < 3
                    ? `Shown after 3 jobs (${s.jobs} so far)`
                    : '–'
                  : !actionable(s)
                    ? 'The standards hold'
                    : `${s.suggestedFactor > 1 ? 'Raise' : 'Lower'} the ${s.label} time standards by ${pct(
                        Math.abs(s.suggestedFactor - 1),
                      )}`}
              </td>
              <td className="whitespace-nowrap">
                {actionable(s) ? (
                  <>
                    {s.standards.length ? (
                      <Button
                        variant="quiet"
                        aria-label={`Apply the ${s.label} suggestion`}
                        disabled={apply.isPending}
                        onClick={() => {
                          apply.reset();
                          setApplied(null);
                          setConfirming(s.stage);
                        }}
                      >
                        Apply…
                      </Button>
                    ) : null}
                    <Button
                      variant="quiet"
                      aria-label={`Set the ${s.label} suggestion aside`}
                      disabled={dismiss.isPending}
                      onClick={() => dismiss.mutate(s.stage)}
                    >
                      Set aside
                    </Button>
                  </>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {open ? (
        <ConfirmApply
          stage={open}
          units={q.data.units}
          pending={apply.isPending}
          onCancel={() => setConfirming(null)}
          onConfirm={() =>
            apply.mutate(
              { stage: open.stage, version: q.data.priceBookVersion },
              {
                onSuccess: (r) => {
                  setConfirming(null);
                  setApplied(
                    `The ${open.label} time standards are changed in price-book version ${r.priceBookVersion}.`,
                  );
                },
                onError: () => setConfirming(null),
              },
            )
          }
        />
      ) : null}
    </Panel>
  );
}
