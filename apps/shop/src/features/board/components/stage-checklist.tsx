import { Notice, Panel } from '@benchwright/ui';
import { useCheckStep, type ChecklistStep, type JobTraveller } from '../api/jobs';

const when = (iso: string) => new Date(iso).toLocaleDateString('en-US', { dateStyle: 'medium' });

/**
 * The job's checklist, stage by stage in the board's order: the builder ticks
 * each step as it is done, and the page shows who ticked it and when. The
 * current stage opens first; the others stay one click away.
 */
export function StageChecklist({
  t,
  stageLabel,
  order,
}: {
  t: JobTraveller;
  stageLabel: (key: string) => string;
  order: readonly string[];
}) {
  const check = useCheckStep();
  const byStage = new Map<string, ChecklistStep[]>();
  for (const step of t.checklist ?? []) byStage.set(step.stage, [...(byStage.get(step.stage) ?? []), step]);
  const stages = [...byStage.keys()].sort((a, b) => order.indexOf(a) - order.indexOf(b));
  return (
    <Panel title="Checklist">
      {check.isError ? <Notice tone="error">{check.error.message}</Notice> : null}
      {stages.map((stage) => {
        const steps = byStage.get(stage) ?? [];
        const done = steps.filter((s) => s.done).length;
        return (
          <details key={stage} open={stage === t.job.stage} className="mb-2">
            <summary className="cursor-pointer font-semibold">
              {stageLabel(stage)}{' '}
              <span className="font-normal text-ink-soft">
                {done} of {steps.length} done
              </span>
            </summary>
            <ul className="mt-1 space-y-1 pl-1">
              {steps.map((s) => (
                <li key={s.key}>
                  <label className="flex items-start gap-2">
                    <input
                      type="checkbox"
                      className="mt-1 h-5 w-5 shrink-0"
                      checked={s.done !== null}
                      disabled={check.isPending}
                      onChange={(e) => check.mutate({ id: t.job.id, key: s.key, done: e.target.checked })}
                    />
                    <span>
                      {s.text}
                      {s.done ? (
                        <span className="block text-sm text-ink-soft">
                          Done by {s.done.by}, {when(s.done.at)}
                        </span>
                      ) : null}
                    </span>
                  </label>
                </li>
              ))}
            </ul>
          </details>
        );
      })}
    </Panel>
  );
}
