import { Router } from 'express';
import type { MailService } from './mail.service';

/** Mounted behind requireRole('owner'). */
export function mailRoutes(service: MailService): Router {
  const r = Router();
  r.get('/failed', (_req, res) => {
    res.json({ mails: service.failed() });
  });
  r.post('/:id/retry', (req, res) => {
    res.status(202).json({ mail: service.retry(req.params.id) });
  });
  return r;
}
