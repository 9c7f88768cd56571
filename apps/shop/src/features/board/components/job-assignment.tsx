import { useState } from 'react';
import { Button, Notice } from '@benchwright/ui';
import { useUpdateJob, type Job } from '../api/jobs';

/** The owner's form on the job page: who builds it, and by when. */
export function JobAssignment({ job, staff }: { job: Job; staff: { id: string; name: string }[] }) {
  const update = useUpdateJob();
  const [builderId, setBuilderId] = useState(job.builder?.id ?? '');
  const [dueDate, setDueDate] = useState(job.dueDate ?? '');
  const [saved, setSaved] = useState(false);
  return (
    <form
      aria-label="Assign the job"
      className="mb-4 flex flex-wrap items-end gap-3 print:hidden"
      onSubmit={(e) => {
        e.preventDefault();
        setSaved(false);
        update.mutate(
          { id: job.id, builderId: builderId || null, dueDate: dueDate || null },
          { onSuccess: () => setSaved(true) },
        );
      }}
    >
      <label className="text-sm">
        Builder
        <select
          className="ml-1 rounded border border-rule bg-white"
          value={builderId}
          onChange={(e) => setBuilderId(e.target.value)}
        >
          <option value="">not set</option>
          {staff.map((u) => (
            <option key={u.id} value={u.id}>
              {u.name}
            </option>
          ))}
        </select>
      </label>
      <label className="text-sm">
        Due
        <input
          type="date"
          className="ml-1 rounded border border-rule bg-white px-1"
          value={dueDate}
          onChange={(e) => setDueDate(e.target.value)}
        />
      </label>
      <Button type="submit" variant="quiet" disabled={update.isPending}>
        Save
      </Button>
      {saved ? (
        <span role="status" className="text-sm text-sage">
          Saved.
        </span>
      ) : null}
      {update.isError ? <Notice tone="error">{update.error.message}</Notice> : null}
    </form>
  );
}
