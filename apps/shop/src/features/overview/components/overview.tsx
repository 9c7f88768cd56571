import { SHOP_PROJECT_STATUS_LABELS, type ProjectStatus } from '@benchwright/contracts';
import { formatMoney, Notice, Panel } from '@benchwright/ui';
import { useOverview } from '../api/overview';

function Tile({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="rounded border border-rule bg-white p-4" role="group" aria-label={label}>
      <p className="text-sm text-ink-soft">{label}</p>
      <p className="text-2xl font-bold tabular-nums">{value}</p>
      {note ? <p className="text-sm text-ink-soft">{note}</p> : null}
    </div>
  );
}

/** A bar to scale: the share of `max` that `value` is, drawn as a plain rule (prints in black and white). */
function Bar({ value, max, tone }: { value: number; max: number; tone: 'budget' | 'used' | 'over' }) {
  const colour = tone === 'budget' ? 'bg-rule' : tone === 'over' ? 'bg-alert' : 'bg-wood';
  return (
    <div
      className={`h-3 rounded-sm ${colour}`}
      style={{ width: `${max > 0 ? Math.max(1, (value / max) * 100) : 0}%` }}
    />
  );
}

/** The owner's overview: work by status, this month's money, the share of estimates accepted, and hours estimated against hours used. */
export function OverviewPage() {
  const q = useOverview();
  if (q.isPending) return <p>Loading the overview…</p>;
  if (q.isError) return <Notice tone="error">{q.error.message}</Notice>;
  const o = q.data;
  const month = new Date(`${o.month}-01T12:00:00`).toLocaleDateString('en-US', { month: 'long', year: 'numeric' });
  const max = Math.max(1, ...o.hours.flatMap((h) => [h.budgetHours, h.usedHours]));
  const rate = o.winRate.quoted ? `${Math.round((o.winRate.won / o.winRate.quoted) * 100)}%` : '–';
  const maxCount = Math.max(1, ...Object.values(o.pipeline));
  return (
    <>
      <div className="mb-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <Tile
          label={`Accepted in ${month}`}
          value={formatMoney(o.acceptedThisMonth.totalCents)}
          note={`${o.acceptedThisMonth.count} ${o.acceptedThisMonth.count === 1 ? 'estimate' : 'estimates'}`}
        />
        <Tile
          label={`Deposits collected in ${month}`}
          value={formatMoney(o.collectedThisMonth.depositsCents)}
          note="after refunds"
        />
        <Tile
          label={`Balances collected in ${month}`}
          value={formatMoney(o.collectedThisMonth.balancesCents)}
          note="after refunds"
        />
        <Tile
          label="Estimates accepted"
          value={rate}
          note={`${o.winRate.won} of ${o.winRate.quoted} quoted projects accepted`}
        />
      </div>
      <Panel title="Work by status">
        <table className="w-full text-left" aria-label="Work by status">
          <tbody>
            {Object.entries(o.pipeline)
              .filter(([, n]) => n > 0)
              .map(([status, n]) => (
                <tr key={status} className="border-b border-rule/50">
                  <td className="w-48 py-1">{SHOP_PROJECT_STATUS_LABELS[status as ProjectStatus] ?? status}</td>
                  <td className="w-10 tabular-nums">{n}</td>
                  <td>
                    <Bar value={n} max={maxCount} tone="used" />
                  </td>
                </tr>
              ))}
          </tbody>
        </table>
      </Panel>
      <Panel title="Hours: estimated and used, by job">
        {o.hours.length ? (
          <table className="w-full text-left" aria-label="Hours by job">
            <tbody>
              {o.hours.map((h) => (
                <tr key={h.jobId} className="border-b border-rule/50">
                  <td className="w-48 py-2">{h.clientName}</td>
                  <td className="w-44 text-sm tabular-nums">
                    {h.usedHours.toFixed(1)} of {h.budgetHours.toFixed(1)} h
                  </td>
                  <td>
                    <Bar value={h.budgetHours} max={max} tone="budget" />
                    <div className="mt-1">
                      <Bar value={h.usedHours} max={max} tone={h.usedHours > h.budgetHours ? 'over' : 'used'} />
                    </div>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="text-ink-soft">No jobs in the shop yet.</p>
        )}
        <p className="mt-2 text-sm text-ink-soft">
          Upper bar: hours in the estimate; lower bar: hours logged (red once over).
        </p>
      </Panel>
    </>
  );
}
