import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useDraggable,
  useDroppable,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
  type KeyboardCoordinateGetter,
} from '@dnd-kit/core';
import { useCallback, useEffect, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { formatDate } from '@benchwright/contracts';
import { Button, Notice, useAttachUpload } from '@benchwright/ui';
import { paths } from '../../../config/paths';
import { useJobs, useLogTime, useMoveJob, useStages, type Job, type Stage, type StageKey } from '../api/jobs';
import { CONFIRMED_STAGES, ConfirmMove } from './confirm-move';

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

/**
 * A progress photo from the card, on a phone: the camera opens (`capture`), and the photo goes to the job's current
 * stage; the client hears of it in the one mail sent when the job moves on.
 */
function CardPhoto({ job, stageLabel }: { job: Job; stageLabel: string }) {
  const attach = useAttachUpload(job.project.id);
  const [added, setAdded] = useState(0);
  return (
    <div className="mt-2 text-sm">
      <label className="block font-semibold">
        Add a photo to {stageLabel}
        <input
          type="file"
          accept="image/*"
          capture="environment"
          disabled={attach.isPending}
          aria-describedby={`photo-status-${job.id}`}
          className="mt-1 block w-full max-w-full text-sm font-normal"
          onChange={(e) => {
            const input = e.currentTarget;
            const file = input.files?.[0];
            if (file) attach.mutate({ file, progress: true }, { onSuccess: () => setAdded((n) => n + 1) });
            input.value = '';
          }}
        />
      </label>
      <p id={`photo-status-${job.id}`} role="status" className="text-ink-soft">
        {attach.isPending
          ? 'Sending the photo…'
          : attach.isError
            ? attach.error.message
            : added
              ? `${added === 1 ? 'A photo' : `${added} photos`} added; the client sees ${added === 1 ? 'it' : 'them'} now and is mailed when the job moves on.`
              : ''}
      </p>
    </div>
  );
}

function Card({ job, stages, onMove }: { job: Job; stages: Stage[]; onMove: (to: StageKey) => void }) {
  const { attributes, listeners, setNodeRef, transform, isDragging } = useDraggable({ id: job.id });
  const over = job.hoursLogged.total > job.hoursBudgeted.total;
  return (
    <article
      ref={setNodeRef}
      aria-label={`Job for ${job.clientName}`}
      data-dragging={isDragging || undefined}
      className={`mb-3 rounded border border-rule bg-white p-3 shadow-sm ${isDragging ? 'opacity-70' : ''}`}
      style={transform ? { transform: `translate(${transform.x}px, ${transform.y}px)` } : undefined}
    >
      <div
        className="cursor-grab rounded focus:outline-2 focus:outline-sage"
        {...listeners}
        {...attributes}
        aria-roledescription="draggable job"
      >
        <h3 className="font-semibold">{job.clientName}</h3>
        <p className="text-sm text-ink-soft">{job.project.notes}</p>
      </div>
      <p className="mt-1 text-sm">
        Builder: {job.builder?.name ?? 'not set'}
        {job.dueDate ? ` · due ${formatDate(job.dueDate)}` : ''}
      </p>
      <p className={`text-sm ${over ? 'font-semibold text-alert' : ''}`} aria-label="Hours used">
        {h(job.hoursLogged.total)} of {h(job.hoursBudgeted.total)} h used; this stage {h(job.hoursLogged[job.stage])} of{' '}
        {h(job.hoursBudgeted[job.stage])} h
      </p>
      <p className="mt-1 text-sm">
        <Link to={paths.job.getHref(job.id)} className="text-wood underline">
          Traveler: cut list, sheets, pick list
        </Link>
      </p>
      <label className="mt-2 block text-sm">
        Move to <StageSelect stages={stages} label={`Move ${job.clientName} to`} value={job.stage} onChange={onMove} />
      </label>
      <CardPhoto job={job} stageLabel={stages.find((x) => x.key === job.stage)?.label ?? job.stage} />
      <LogHours job={job} stages={stages} />
    </article>
  );
}

function Column({
  stage,
  jobs,
  stages,
  onMove,
}: {
  stage: Stage;
  jobs: Job[];
  stages: Stage[];
  onMove: (job: Job, to: StageKey) => void;
}) {
  const { setNodeRef, isOver } = useDroppable({ id: stage.key });
  return (
    <section
      ref={setNodeRef}
      aria-label={stage.label}
      data-over={isOver || undefined}
      className={`min-h-40 w-60 shrink-0 rounded border-t-4 border-wood bg-paper-deep p-2 ${isOver ? 'outline-2 outline-sage' : ''}`}
    >
      <h2 className="mb-2 flex justify-between font-semibold">
        {stage.label} <span className="text-ink-soft">{jobs.length}</span>
      </h2>
      {jobs.map((j) => (
        <Card key={j.id} job={j} stages={stages} onMove={(to) => onMove(j, to)} />
      ))}
    </section>
  );
}

/**
 * Arrow keys move a picked-up card a whole column left or right (dnd-kit's default moves it 25 px a press);
 * up and down do nothing, since a column has no order.
 */
export const columnCoordinates: KeyboardCoordinateGetter = (event, { context, currentCoordinates }) => {
  const { collisionRect, droppableRects, droppableContainers } = context;
  const right = event.code === 'ArrowRight';
  if (!collisionRect || (!right && event.code !== 'ArrowLeft')) return undefined;
  event.preventDefault();
  const centre = collisionRect.left + collisionRect.width / 2;
  const next = droppableContainers
    .getEnabled()
    .map((c) => droppableRects.get(c.id))
    .filter((r) => r !== undefined)
    .filter((r) => (right ? r.left + r.width / 2 > centre + 1 : r.left + r.width / 2 < centre - 1))
    .sort((a, b) => (right ? a.left - b.left : b.left - a.left))[0];
  if (!next) return undefined;
  return { x: next.left + (next.width - collisionRect.width) / 2, y: currentCoordinates.y };
};

const screenReaderInstructions = {
  draggable:
    'Press Space to pick up the job, the left and right arrow keys to choose a column, Space to drop it there, Escape to put it back.',
};

/** Tells whether the row of columns can scroll further left or right, to show the cue. */
function useScrollCue() {
  const ref = useRef<HTMLDivElement>(null);
  const [more, setMore] = useState({ left: false, right: false });
  const update = useCallback(() => {
    const el = ref.current;
    if (!el) return;
    const left = el.scrollLeft > 1;
    const right = el.scrollLeft + el.clientWidth < el.scrollWidth - 1;
    setMore((m) => (m.left === left && m.right === right ? m : { left, right }));
  }, []);
  useEffect(() => {
    update();
    window.addEventListener('resize', update);
    return () => window.removeEventListener('resize', update);
  });
  return { ref, more, update };
}

/**
 * The production board: a column per stage; drag a card (pointer, or Space then the arrow keys), or use its
 * "Move to" list, to move a job. A move to Ready or Delivered is asked about first, however it is made.
 */
export function Board() {
  const jobs = useJobs();
  const stages = useStages();
  const move = useMoveJob();
  const cue = useScrollCue();
  const [pending, setPending] = useState<{ job: Job; to: Stage } | null>(null);
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 6 } }),
    useSensor(KeyboardSensor, { coordinateGetter: columnCoordinates }),
  );
  if (jobs.isPending || stages.isPending) return <p>Loading the board…</p>;
  if (jobs.isError) return <Notice tone="error">{jobs.error.message}</Notice>;
  if (stages.isError) return <Notice tone="error">{stages.error.message}</Notice>;
  const stageOf = (key: unknown) => stages.data.find((s) => s.key === key);
  const jobOf = (id: unknown) => jobs.data.find((j) => j.id === id);
  const requestMove = (job: Job, key: StageKey) => {
    const to = stageOf(key);
    if (!to || key === job.stage) return;
    if (CONFIRMED_STAGES.has(key)) setPending({ job, to });
    else move.mutate({ id: job.id, stageKey: key });
  };
  const onDragEnd = (e: DragEndEvent) => {
    const job = jobOf(e.active.id);
    if (job && e.over) requestMove(job, e.over.id as StageKey);
  };
  const name = (id: unknown) => jobOf(id)?.clientName ?? 'the job';
  const column = (id: unknown) => stageOf(id)?.label ?? 'no column';
  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up the job for ${name(active.id)}.`,
    onDragOver: ({ active, over }) => `The job for ${name(active.id)} is over ${column(over?.id)}.`,
    onDragEnd: ({ active, over }) =>
      over ? `The job for ${name(active.id)} was dropped on ${column(over.id)}.` : `The job was not moved.`,
    onDragCancel: ({ active }) => `Moving the job for ${name(active.id)} was cancelled.`,
  };
  return (
    <>
      {move.isError ? <Notice tone="error">{move.error.message}</Notice> : null}
      {!jobs.data.length ? (
        <p className="mb-3 text-ink-soft">
          No jobs in the shop yet. A job arrives here once its client has paid the deposit.
        </p>
      ) : null}
      <p className={`mb-2 text-sm text-ink-soft ${cue.more.left || cue.more.right ? '' : 'invisible'}`} aria-hidden>
        {cue.more.right
          ? 'More columns to the right: scroll sideways →'
          : '← More columns to the left: scroll sideways'}
      </p>
      <DndContext sensors={sensors} onDragEnd={onDragEnd} accessibility={{ announcements, screenReaderInstructions }}>
        <div className="relative">
          <div
            ref={cue.ref}
            onScroll={cue.update}
            className="flex gap-3 overflow-x-auto pb-4"
            data-scroll-right={cue.more.right || undefined}
          >
            {stages.data.map((s) => (
              <Column
                key={s.key}
                stage={s}
                stages={stages.data}
                jobs={jobs.data.filter((j) => j.stage === s.key)}
                onMove={requestMove}
              />
            ))}
          </div>
          {cue.more.left ? (
            <div className="pointer-events-none absolute inset-y-0 left-0 w-10 bg-linear-to-r from-ink/25 to-transparent" />
          ) : null}
          {cue.more.right ? (
            <div className="pointer-events-none absolute inset-y-0 right-0 w-10 bg-linear-to-l from-ink/25 to-transparent" />
          ) : null}
        </div>
      </DndContext>
      {pending ? (
        <ConfirmMove
          job={pending.job}
          to={pending.to}
          onCancel={() => setPending(null)}
          onConfirm={() => {
            move.mutate({ id: pending.job.id, stageKey: pending.to.key });
            setPending(null);
          }}
        />
      ) : null}
    </>
  );
}
