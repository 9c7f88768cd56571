import { randomUUID } from 'node:crypto';
import type { Role, StageKey, TimelineEvent } from '@benchwright/contracts';
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

/**
 * Stage news in the client's words: what is happening to their piece, not where the card sits on the board
 * ("Your piece is being cut", not "Moved to Cutting"). Keyed by the fixed stage keys, so a renamed column does not
 * change what the client reads.
 */
export const STAGE_NEWS: Record<StageKey, string> = {
  material: 'The material for your piece is being gathered.',
  cutting: 'Your piece is being cut.',
  casework: 'The cases of your piece are being put together.',
  drawers_doors: 'The drawers and doors of your piece are being made.',
  finish: 'Your piece is being finished.',
  ready: 'Your piece is ready.',
  delivered: 'Your piece has been delivered.',
};

/** What the client reads instead of the stored message, where the shop's wording is not theirs. */
const CLIENT_WORDS: Partial<Record<EventKind, (e: StoredEvent) => string>> = {
  requested: () => 'You asked for an estimate.',
  deposit_paid: (e) => e.message.replace(/; the job is on the board\.$/, '; your piece is booked into the shop.'),
  stage: (e) => (e.stageKey ? STAGE_NEWS[e.stageKey] : e.message),
  progress_photo: () => 'A photo from the shop.',
};

/** Adds a line to the project's timeline (in the caller's transaction). */
export function addEvent(
  tx: Tx,
  projectId: string,
  kind: EventKind,
  message: string,
  actorId: string | null = null,
  about: { stageKey?: StageKey; uploadId?: string } = {},
): void {
  tx.insert(projectEvents)
    .values({
      id: randomUUID(),
      projectId,
      kind,
      message,
      actorId,
      stageKey: about.stageKey ?? null,
      uploadId: about.uploadId ?? null,
    })
    .run();
}

/** A stored event as the timeline reads it: `by` is the actor's name where there is one. */
export interface StoredEvent {
  id: string;
  kind: string;
  message: string;
  by: string | null;
  createdAt: Date;
  stageKey?: StageKey | null;
  uploadId?: string | null;
}

/**
 * What `viewer` may see of a project's timeline, in order. An unknown kind is the owner's alone. The client reads
 * stage news in their own words, with the photos taken in a stage under its news (`photos`). Example:
 * `timelineFor({ role: 'builder' }, events)` has no amounts and no comments.
 */
export function timelineFor(viewer: { role: Role }, events: StoredEvent[]): TimelineEvent[] {
  const out: TimelineEvent[] = [];
  // the client's latest stage news, which the photos of that stage go under
  let news: TimelineEvent | null = null;
  for (const e of events) {
    const rule = (SEEN_BY as Record<string, { client: boolean; builder: boolean | string } | undefined>)[e.kind];
    const shown = viewer.role === 'owner' ? true : rule ? rule[viewer.role] : false;
    if (shown === false) continue;
    const photo = e.kind === 'progress_photo' && e.uploadId ? e.uploadId : null;
    if (viewer.role === 'client' && photo && news && news.stage === e.stageKey) {
      (news.photos ??= []).push(photo);
      continue;
    }
    const words = viewer.role === 'client' ? CLIENT_WORDS[e.kind as EventKind] : undefined;
    const event: TimelineEvent = {
      id: e.id,
      kind: e.kind,
      message: typeof shown === 'string' ? shown : words ? words(e) : e.message,
      by: e.kind === 'comment' ? e.by : null,
      at: e.createdAt.toISOString(),
      ...(e.stageKey ? { stage: e.stageKey } : {}),
      ...(photo ? { photos: [photo] } : {}),
    };
    if (viewer.role === 'client' && e.kind === 'stage') news = event;
    out.push(event);
  }
  return out;
}
