import { Router, type Response } from 'express';
import multer from 'multer';
import { UPLOAD_MAX_BYTES, UploadFields } from '@benchwright/contracts';
import { Invalid, NotFound, parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { StoredFile, UploadsService } from './uploads.service';

/**
 * `POST /api/projects/:id/uploads` (multipart, one file in `file`, optional `purpose`). Mounted under /api/projects
 * behind requireRole('client', 'owner', 'builder'); who may see the project is checked before a byte is read.
 */
export function projectUploadsRoutes(service: UploadsService): Router {
  const r = Router();
  // in memory: the file is at most 15 MB and is re-encoded before anything is written to disk
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 4, fieldSize: 200, parts: 6 },
    // browsers send the file name as raw UTF-8
    defParamCharset: 'utf8',
  });
  const single = upload.single('file');
  r.post(
    '/:id/uploads',
    (req, res, next) => {
      service.assertCanAttach(currentUser(res), String(req.params.id));
      next();
    },
    // multer's own limits reach the error handler as MulterErrors (413 for size); busboy's parse errors are bad input
    (req, res, next) =>
      single(req, res, (err?: unknown) =>
        next(
          err && !(err instanceof multer.MulterError)
            ? new Invalid('The upload could not be read; send the file as multipart form data in the field `file`.')
            : err,
        ),
      ),
    async (req, res) => {
      const { purpose } = parse(UploadFields, req.body ?? {});
      const created = await service.attach(currentUser(res), String(req.params.id), req.file, purpose);
      res.status(201).json({ upload: created });
    },
  );
  return r;
}

function send(res: Response, file: StoredFile): Promise<void> {
  // a PDF is downloaded, never shown in the API's origin; images are shown. res.attachment() would set the type
  // from the uploaded name's extension, so the type read from the bytes is set after it.
  if (file.kind === 'pdf') res.attachment(file.name);
  else res.set('Content-Disposition', 'inline');
  res.set({
    'Content-Type': file.mimeType,
    'X-Content-Type-Options': 'nosniff',
    // the client's own photos: never kept by a shared cache
    'Cache-Control': 'private, no-store',
  });
  return new Promise((resolve, reject) =>
    res.sendFile(file.path, { cacheControl: false, lastModified: false, dotfiles: 'deny' }, (err) => {
      if (!err) return resolve();
      // the row is there but the bytes are not (a restore without the uploads folder): not found, not bad input
      const missing =
        (err as { status?: number; code?: string }).status === 404 || (err as { code?: string }).code === 'ENOENT';
      // the error answer is JSON, not the file's type
      if (!res.headersSent) for (const h of ['Content-Type', 'Content-Disposition']) res.removeHeader(h);
      reject(missing && !res.headersSent ? new NotFound('The file') : err);
    }),
  );
}

/** `/api/uploads/:id`: mounted behind requireRole('client', 'owner', 'builder'); visibility in the service. */
export function uploadsRoutes(service: UploadsService): Router {
  const r = Router();
  r.get('/:id', (req, res) => send(res, service.file(currentUser(res), req.params.id, 'file')));
  r.get('/:id/thumbnail', (req, res) => send(res, service.file(currentUser(res), req.params.id, 'thumbnail')));
  r.delete('/:id', async (req, res) => {
    await service.remove(currentUser(res), req.params.id);
    res.status(204).end();
  });
  return r;
}
