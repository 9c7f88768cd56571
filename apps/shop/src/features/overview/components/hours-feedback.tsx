import { Button, Notice, Panel, TableHead } from '@benchwright/ui';
import { useDismissHours, useHoursFeedback } from '../api/hours';

const pct = (r: number) => `${Math.round(r * 100)}%`;

/**
 * Hours against the budget, stage by stage, over the last delivered jobs: where
 * the shop keeps taking longer (or shorter) than the time standards say, a
 * suggested change to the standards behind that stage, which the owner can set
 * aside until more jobs are delivered.
 */
export function HoursFeedback() {
  const q = useHoursFeedback();
  const dismiss = useDismissHours();
  if (q.isPending) return null;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const rows = q.data.filter((s) => s.stage !== 'delivered');
  return (
    <Panel title="Hours against the budget, last 10 delivered jobs">
      {dismiss.isError ? <Notice tone="error">{dismiss.error.message}</Notice> : null}
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
                  : Math.abs(s.suggestedFactor - 1) < 0.05
                    ? 'The standards hold'
                    : `${s.suggestedFactor > 1 ? 'Raise' : 'Lower'} the ${s.label} time standards by ${pct(
                        Math.abs(s.suggestedFactor - 1),
                      )}`}
              </td>
              <td>
                {s.suggestedFactor !== null && Math.abs(s.suggestedFactor - 1) >= 0.05 ? (
                  <Button variant="quiet" disabled={dismiss.isPending} onClick={() => dismiss.mutate(s.stage)}>
                    Set aside
                  </Button>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </Panel>
  );
}
