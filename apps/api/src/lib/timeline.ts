import { randomUUID } from 'node:crypto';
import type { Role, TimelineEvent } from '@benchwright/contracts';
import type { Db } from '../db/client';
import { projectEvents } from '../db/schema';

type Tx = Pick<Db, 'insert'>;

/**
 * Every kind of timeline event, and who besides the owner sees it (the owner
 * sees everything). The client: their request, each sent estimate, their
 * acceptance, their payments and refunds, stage news and the conversation;
 * not drafts, not who asked for a refund, not the shop's own bookkeeping. The
 * builder: what the job needs, never money nor the client's conversation with
 * the owner; a string replaces the stored message for them.
 */
const SEEN_BY = {
  requested: { client: true, builder: true },
  estimate_draft: { client: false, builder: false },
  estimate_sent: { client: true, builder: false },
  estimate_expired: { client: true, builder: false },
  estimate_accepted: { client: true, builder: false },
  estimate_withdrawn: { client: true, builder: false },
  deposit_paid: { client: true, builder: 'Accepted as a job and put on the board.' },
  deposit_unmatched: { client: false, builder: false },
  balance_paid: { client: true, builder: false },
  refund: { client: true, builder: false },
  refund_requested: { client: false, builder: false },
  stage: { client: true, builder: true },
  assigned: { client: false, builder: true },
  hours: { client: false, builder: true },
  comment: { client: true, builder: false },
  payment_mismatch: { client: false, builder: false },
  relayout: { client: false, builder: true },
  upload: { client: true, builder: true },
  progress_photo: { client: true, builder: true },
} as const satisfies Record<string, { client: boolean; builder: boolean | string }>;
export type EventKind = keyof typeof SEEN_BY;

/** Adds a line to the project's timeline (in the caller's transaction). */
export function addEvent(
  tx: Tx,
  projectId: string,
  kind: EventKind,
  message: string,
  actorId: string | null = null,
): void {
  tx.insert(projectEvents).values({ id: randomUUID(), projectId, kind, message, actorId }).run();
}

/** A stored event as the timeline reads it: `by` is the actor's name where there is one. */
export interface StoredEvent {
  id: string;
  kind: string;
  message: string;
  by: string | null;
  createdAt: Date;
}

/**
 * What `viewer` may see of a project's timeline, in order. An unknown kind is
 * the owner's alone. Example: `timelineFor({ role: 'builder' }, events)` has
 * no amounts and no comments.
 */
export function timelineFor(viewer: { role: Role }, events: StoredEvent[]): TimelineEvent[] {
  return events.flatMap((e) => {
    const rule = (SEEN_BY as Record<string, { client: boolean; builder: boolean | string } | undefined>)[e.kind];
    const shown = viewer.role === 'owner' ? true : rule ? rule[viewer.role] : false;
    if (shown === false) return [];
    return [
      {
        id: e.id,
        kind: e.kind,
        message: typeof shown === 'string' ? shown : e.message,
        by: e.kind === 'comment' ? e.by : null,
        at: e.createdAt.toISOString(),
      },
    ];
  });
}
