import {
  DndContext,
  PointerSensor,
  useDraggable,
  useDroppable,
  useSensor,
  useSensors,
  type DragEndEvent,
} from '@dnd-kit/core';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button, Notice } from '@benchwright/ui';
import { paths } from '../../../config/paths';
import { useJobs, useLogTime, useMoveJob, useStages, type Job, type Stage, type StageKey } from '../api/jobs';

const h = (v: number | undefined) => (v ?? 0).toFixed(1);

function StageSelect({
  stages,
  value,
  onChange,
  label,
}: {
  stages: Stage[];
  value: StageKey;
  onChange: (k: StageKey) => void;
  label?: string;
}) {
  return (
    <select
      aria-label={label}
      className="ml-1 rounded border border-rule bg-white"
      value={value}
      onChange={(e) => onChange(e.target.value as StageKey)}
    >
      {stages.map((s) => (
        <option key={s.key} value={s.key}>
          {s.label}
        </option>
      ))}
    </select>
  );
}

function LogHours({ job, stages }: { job: Job; stages: Stage[] }) {
  const log = useLogTime();
  const [hours, setHours] = useState('');
  const [stage, setStage] = useState<StageKey>(job.stage);
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      className="mt-2 flex flex-wrap items-end gap-2"
      aria-label={`Log hours for ${job.clientName}`}
      onSubmit={(e) => {
        e.preventDefault();
        setError(null);
        const n = Number(hours);
        if (!(n > 0 && n <= 24)) return setError('enter between 0.1 and 24 hours');
        log.mutate(
          { id: job.id, stageKey: stage, hours: n, note: '' },
          { onSuccess: () => setHours(''), onError: (err) => setError(err.message) },
        );
      }}
    >
      <label className="text-sm">
        Hours
        <input
          className="ml-1 w-16 rounded border border-rule bg-white px-1"
          inputMode="decimal"
          value={hours}
          onChange={(e) => setHours(e.target.value)}
        />
      </label>
      <label className="text-sm">
        on
        <StageSelect stages={stages} value={stage} onChange={setStage} />
      </label>
      <Button type="submit" variant="quiet" className="px-1 py-0 text-sm">
        Log
      </Button>
      {error ? (
        <p role="alert" className="w-full text-sm text-alert">
          {error}
        </p>
      ) : null}
    </form>
  );
}

function Card({ job, stages }: { job: Job; stages: Stage[] }) {
  const { attributes, listeners, setNodeRef, transform, isDragging } = useDraggable({ id: job.id });
  const move = useMoveJob();
  const over = job.hoursLogged.total > job.hoursBudgeted.total;
  return (
    <article
      ref={setNodeRef}
      aria-label={`Job for ${job.clientName}`}
      className={`mb-3 rounded border border-rule bg-white p-3 shadow-sm ${isDragging ? 'opacity-70' : ''}`}
      style={transform ? { transform: `translate(${transform.x}px, ${transform.y}px)` } : undefined}
    >
      <div className="cursor-grab" {...listeners} {...attributes} aria-roledescription="draggable job">
        <h3 className="font-semibold">{job.clientName}</h3>
        <p className="text-sm text-ink-soft">{job.project.notes}</p>
      </div>
      <p className="mt-1 text-sm">
        Builder: {job.builder?.name ?? 'not set'}
        {job.dueDate ? ` · due ${job.dueDate}` : ''}
      </p>
      <p className={`text-sm ${over ? 'font-semibold text-alert' : ''}`} aria-label="Hours used">
        {h(job.hoursLogged.total)} of {h(job.hoursBudgeted.total)} h used; this stage {h(job.hoursLogged[job.stage])} of{' '}
        {h(job.hoursBudgeted[job.stage])} h
      </p>
      <p className="mt-1 text-sm">
        <Link to={paths.job.getHref(job.id)} className="text-wood underline">
          Traveller: cut list, sheets, pick list
        </Link>
      </p>
      <label className="mt-2 block text-sm">
        Move to{' '}
        <StageSelect
          stages={stages}
          label={`Move ${job.clientName} to`}
          value={job.stage}
          onChange={(stageKey) => move.mutate({ id: job.id, stageKey })}
        />
      </label>
      <LogHours job={job} stages={stages} />
    </article>
  );
}

function Column({ stage, jobs, stages }: { stage: Stage; jobs: Job[]; stages: Stage[] }) {
  const { setNodeRef, isOver } = useDroppable({ id: stage.key });
  return (
    <section
      ref={setNodeRef}
      aria-label={stage.label}
      className={`min-h-40 w-64 shrink-0 rounded border-t-4 border-wood bg-paper-deep p-2 ${isOver ? 'outline-2 outline-sage' : ''}`}
    >
      <h2 className="mb-2 flex justify-between font-semibold">
        {stage.label} <span className="text-ink-soft">{jobs.length}</span>
      </h2>
      {jobs.map((j) => (
        <Card key={j.id} job={j} stages={stages} />
      ))}
    </section>
  );
}

/** The production board: a column per stage; drag a card, or use its "Move to" list, to move a job. */
export function Board() {
  const jobs = useJobs();
  const stages = useStages();
  const move = useMoveJob();
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }));
  if (jobs.isPending || stages.isPending) return <p>Loading the board…</p>;
  if (jobs.isError) return <Notice tone="error">{jobs.error.message}</Notice>;
  if (stages.isError) return <Notice tone="error">{stages.error.message}</Notice>;
  const onDragEnd = (e: DragEndEvent) => {
    const to = e.over?.id as StageKey | undefined;
    const job = jobs.data.find((j) => j.id === e.active.id);
    if (job && to && to !== job.stage) move.mutate({ id: job.id, stageKey: to });
  };
  return (
    <>
      {move.isError ? <Notice tone="error">{move.error.message}</Notice> : null}
      {!jobs.data.length ? (
        <p className="mb-3 text-ink-soft">
          No jobs in the shop yet. A job arrives here once its client has paid the deposit.
        </p>
      ) : null}
      <DndContext sensors={sensors} onDragEnd={onDragEnd}>
        <div className="flex gap-3 overflow-x-auto pb-4">
          {stages.data.map((s) => (
            <Column key={s.key} stage={s} stages={stages.data} jobs={jobs.data.filter((j) => j.stage === s.key)} />
          ))}
        </div>
      </DndContext>
    </>
  );
}
