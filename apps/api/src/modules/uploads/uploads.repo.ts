import { asc, eq, sql } from 'drizzle-orm';
import type { UploadKind, UploadSummary } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { uploads, users } from '../../db/schema';
import { preparedOnce } from '../../lib/statements';

/** A project's files as its response lists them, in the order they were added (no storage paths). */
export function listUploads(db: Pick<Db, 'select'>, projectId: string): UploadSummary[] {
  const query = preparedOnce(db, 'uploads of a project', () =>
    db
      .select({
        id: uploads.id,
        name: uploads.fileName,
        kind: uploads.kind,
        mimeType: uploads.mimeType,
        sizeBytes: uploads.sizeBytes,
        stageKey: uploads.stageKey,
        createdAt: uploads.createdAt,
        byId: users.id,
        byName: users.name,
      })
      .from(uploads)
      .innerJoin(users, eq(users.id, uploads.uploaderId))
      .where(eq(uploads.projectId, sql.placeholder('projectId')))
      // rowid: the insertion order, for files added within the same millisecond
      .orderBy(asc(uploads.createdAt), sql`uploads.rowid`)
      .prepare(),
  );
  return query.all({ projectId }).map((u) => ({
    id: u.id,
    name: u.name,
    kind: u.kind as UploadKind,
    mimeType: u.mimeType,
    sizeBytes: u.sizeBytes,
    by: { id: u.byId, name: u.byName },
    stageKey: u.stageKey,
    at: u.createdAt.toISOString(),
  }));
}
