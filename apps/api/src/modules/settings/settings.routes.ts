import { Router } from 'express';
import multer from 'multer';
import { LOGO_MAX_BYTES, UpdateSettingsBody } from '@benchwright/contracts';
import { Invalid, NotFound, parse } from '../../lib/errors';
import type { SettingsService } from './settings.service';

/** `GET /api/settings/logo`: public (the portal's header and the mail show it), served only as the stored PNG. */
export function logoRoute(service: SettingsService): Router {
  const r = Router();
  r.get('/', (_req, res, next) => {
    const file = service.logoFile();
    res.set({
      'Content-Type': 'image/png',
      'Content-Disposition': 'inline',
      'X-Content-Type-Options': 'nosniff',
      // the same for everyone; revalidated, so a new logo shows at once
      'Cache-Control': 'public, no-cache',
    });
    res.sendFile(file, { cacheControl: false, dotfiles: 'deny' }, (err) => {
      if (!err) return;
      if (!res.headersSent)
        for (const h of ['Content-Type', 'Content-Disposition', 'Cache-Control']) res.removeHeader(h);
      next(res.headersSent ? err : new NotFound('The logo'));
    });
  });
  return r;
}

/** `/api/settings`: mounted behind requireRole('owner'). */
export function settingsRoutes(service: SettingsService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ settings: service.view() });
  });
  r.patch('/', (req, res) => {
    const body = parse(UpdateSettingsBody, req.body);
    res.json({ settings: service.update(body) });
  });
  // in memory: at most LOGO_MAX_BYTES, converted before anything is written (413 above, through the error handler)
  const single = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: LOGO_MAX_BYTES, files: 1, fields: 0, parts: 1 },
  }).single('file');
  r.post(
    '/logo',
    (req, res, next) =>
      single(req, res, (err?: unknown) =>
        next(
          err && !(err instanceof multer.MulterError)
            ? new Invalid('The upload could not be read; send the logo as multipart form data in the field `file`.')
            : err,
        ),
      ),
    async (req, res) => {
      if (!req.file) throw new Invalid('Choose a logo file to upload (the field `file`).');
      res.status(201).json({ settings: await service.setLogo(req.file.buffer) });
    },
  );
  return r;
}
