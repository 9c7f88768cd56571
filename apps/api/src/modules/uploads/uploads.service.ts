import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { rm, writeFile } from 'node:fs/promises';
import { isAbsolute, relative, resolve } from 'node:path';
import { count, eq } from 'drizzle-orm';
import { UPLOADS_PER_PROJECT, type StageKey, type UploadSummary, type User } from '@benchwright/contracts';
import type { Db } from '../../db/client';
import { jobs, stages, uploads } from '../../db/schema';
import { Conflict, Forbidden, Invalid, NotFound } from '../../lib/errors';
import { addEvent } from '../../lib/timeline';
import type { ProjectsService } from '../projects/projects.service';
import { listUploads } from './uploads.repo';
import { displayName, processUpload } from './uploads.files';

export interface StoredFile {
  /** absolute path inside the uploads folder */
  path: string;
  mimeType: string;
  name: string;
  kind: 'image' | 'pdf';
}

/**
 * Files attached to projects. Who may see a project is the projects service's rule (`get` answers 404 for what
 * the viewer may not see), so the same rule covers attaching, listing and serving.
 */
export function createUploadsService({ db, dir, projects }: { db: Db; dir: string; projects: ProjectsService }) {
  let made = false;
  /** A stored relative path back to an absolute one, refused if it would leave the uploads folder. */
  function inDir(rel: string): string {
    const abs = resolve(dir, rel);
    const r = relative(dir, abs);
    if (!r || r.startsWith('..') || isAbsolute(r)) throw new NotFound('The file');
    return abs;
  }
  function visibleUpload(viewer: User, id: string) {
    const row = db.select().from(uploads).where(eq(uploads.id, id)).get();
    if (!row) throw new NotFound('The file');
    try {
      projects.get(viewer, row.projectId);
    } catch (e) {
      if (e instanceof NotFound) throw new NotFound('The file');
      throw e;
    }
    return row;
  }
  const filesOf = (projectId: string) =>
    db.select({ n: count() }).from(uploads).where(eq(uploads.projectId, projectId)).get()!.n;

  return {
    /** Throws 404 before any byte is read when the viewer may not see the project, 409 when it is full. */
    assertCanAttach(viewer: User, projectId: string): void {
      projects.get(viewer, projectId);
      if (filesOf(projectId) >= UPLOADS_PER_PROJECT)
        throw new Conflict(`A project holds at most ${UPLOADS_PER_PROJECT} files; remove one before adding another.`);
    },

    async attach(
      viewer: User,
      projectId: string,
      file: { buffer: Buffer; originalname: string } | undefined,
      purpose: 'attachment' | 'progress',
    ): Promise<UploadSummary> {
      projects.get(viewer, projectId);
      if (!file) throw new Invalid('Attach a file.', [{ path: 'file', message: 'choose a file to attach' }]);
      let stageKey: StageKey | null = null;
      let stageLabel = '';
      if (purpose === 'progress') {
        if (viewer.role === 'client') throw new Forbidden('Progress photos come from the shop.');
        const job = db
          .select({ stageKey: jobs.stageKey, label: stages.label })
          .from(jobs)
          .innerJoin(stages, eq(stages.key, jobs.stageKey))
          .where(eq(jobs.projectId, projectId))
          .get();
        if (!job) throw new Conflict('This project has no job on the board yet, so there is no stage to show.');
        stageKey = job.stageKey;
        stageLabel = job.label;
      }
      const processed = await processUpload(file.buffer);
      if (purpose === 'progress' && processed.kind !== 'image')
        throw new Invalid('A progress photo is a photo (JPEG, PNG or WebP).', [{ path: 'file', message: 'a photo' }]);
      const name = displayName(file.originalname);
      if (!made) {
        mkdirSync(dir, { recursive: true, mode: 0o750 });
        made = true;
      }
      const id = randomUUID();
      // random names: nothing the client sent becomes part of a path
      const storagePath = `${randomUUID()}${processed.ext}`;
      const thumbnailPath = processed.thumbnail ? `${randomUUID()}.webp` : null;
      const written: string[] = [];
      try {
        await writeFile(inDir(storagePath), processed.data, { flag: 'wx', mode: 0o640 });
        written.push(storagePath);
        if (thumbnailPath && processed.thumbnail) {
          await writeFile(inDir(thumbnailPath), processed.thumbnail, { flag: 'wx', mode: 0o640 });
          written.push(thumbnailPath);
        }
        // the count is checked again inside the (synchronous) transaction, so two uploads at once cannot make 31
        db.transaction((tx) => {
          const n = tx.select({ n: count() }).from(uploads).where(eq(uploads.projectId, projectId)).get()!.n;
          if (n >= UPLOADS_PER_PROJECT)
            throw new Conflict(
              `A project holds at most ${UPLOADS_PER_PROJECT} files; remove one before adding another.`,
            );
          tx.insert(uploads)
            .values({
              id,
              projectId,
              uploaderId: viewer.id,
              fileName: name,
              mimeType: processed.mimeType,
              kind: processed.kind,
              sizeBytes: processed.data.length,
              storagePath,
              thumbnailPath,
              stageKey,
            })
            .run();
          if (stageKey)
            addEvent(tx, projectId, 'progress_photo', `A photo from the ${stageLabel} stage.`, viewer.id, {
              stageKey,
              uploadId: id,
            });
          else
            addEvent(
              tx,
              projectId,
              'upload',
              `${viewer.name} attached ${processed.kind === 'pdf' ? 'a PDF' : 'a picture'}: ${name}.`,
              viewer.id,
            );
        });
      } catch (e) {
        await Promise.all(written.map((p) => rm(inDir(p), { force: true })));
        throw e;
      }
      return listUploads(db, projectId).find((u) => u.id === id)!;
    },

    /** The file or its thumbnail, for whoever may see its project; everyone else 404. */
    file(viewer: User, id: string, which: 'file' | 'thumbnail'): StoredFile {
      const row = visibleUpload(viewer, id);
      if (which === 'thumbnail') {
        if (!row.thumbnailPath) throw new NotFound('A thumbnail of that file');
        return { path: inDir(row.thumbnailPath), mimeType: 'image/webp', name: row.fileName, kind: 'image' };
      }
      return { path: inDir(row.storagePath), mimeType: row.mimeType, name: row.fileName, kind: row.kind };
    },

    /** By its uploader or the owner; the row goes first, then the bytes. */
    async remove(viewer: User, id: string): Promise<void> {
      const row = visibleUpload(viewer, id);
      if (viewer.role !== 'owner' && row.uploaderId !== viewer.id)
        throw new Forbidden('Only whoever attached a file, or the owner, may remove it.');
      db.delete(uploads).where(eq(uploads.id, id)).run();
      await Promise.all(
        [row.storagePath, row.thumbnailPath].filter((p): p is string => !!p).map((p) => rm(inDir(p), { force: true })),
      );
    },
  };
}
export type UploadsService = ReturnType<typeof createUploadsService>;
