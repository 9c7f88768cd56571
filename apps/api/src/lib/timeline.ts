import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { projectEvents, projects, PROJECT_STATUS } from '../db/schema';

type Tx = Pick<Db, 'insert' | 'update'>;
export type ProjectStatus = (typeof PROJECT_STATUS)[number];

/** Adds a line to the project's timeline (in the caller's transaction). */
export function addEvent(
  tx: Tx,
  projectId: string,
  kind: string,
  message: string,
  actorId: string | null = null,
): void {
  tx.insert(projectEvents).values({ id: randomUUID(), projectId, kind, message, actorId }).run();
}

export function setStatus(tx: Tx, projectId: string, status: ProjectStatus): void {
  tx.update(projects).set({ status, updatedAt: new Date() }).where(eq(projects.id, projectId)).run();
}
