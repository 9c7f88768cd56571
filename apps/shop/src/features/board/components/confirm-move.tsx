import { useEffect, useRef } from 'react';
import { Button } from '@benchwright/ui';
import type { Job, Stage, StageKey } from '../api/jobs';

/** Stages whose entry has effects outside the shop: asked about before the move is sent, whichever way it is made. */
export const CONFIRMED_STAGES: ReadonlySet<StageKey> = new Set<StageKey>(['ready', 'delivered']);

const why: Partial<Record<StageKey, (client: string) => string>> = {
  ready: (client) => `The piece is finished. Moving the job here e-mails ${client} to ask for the balance.`,
  delivered: (client) => `Moving the job here records that ${client} has received the piece.`,
};

/**
 * Asks before a move to Ready or Delivered. The platform's modal <dialog> (focus kept inside, Escape cancels)
 * rather than a package: it is all this needs.
 */
export function ConfirmMove({
  job,
  to,
  onConfirm,
  onCancel,
}: {
  job: Job;
  to: Stage;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal();
    return () => d?.close();
  }, []);
  const titleId = `confirm-move-${job.id}`;
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      className="m-auto max-w-md rounded border border-rule bg-white p-5 shadow-lg backdrop:bg-ink/40"
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
    >
      <h2 id={titleId} className="mb-2 text-lg font-semibold">
        Move {job.clientName} to {to.label}?
      </h2>
      <p className="mb-4">{why[to.key]?.(job.clientName)}</p>
      <div className="flex justify-end gap-3">
        <Button variant="quiet" autoFocus onClick={onCancel}>
          Cancel
        </Button>
        <Button onClick={onConfirm}>Move to {to.label}</Button>
      </div>
    </dialog>
  );
}
