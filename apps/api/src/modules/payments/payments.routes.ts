import express, { Router } from 'express';
import { RefundBody } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { PaymentsService } from './payments.service';

/** Mounted behind requireRole('owner'). */
export function paymentsRoutes(service: PaymentsService): Router {
  const r = Router();
  r.get('/', (_req, res) => {
    res.json({ payments: service.list() });
  });
  r.post('/:id/refund', async (req, res) => {
    const { amountCents } = parse(RefundBody, req.body ?? {});
    res.status(202).json({ refund: await service.refund(currentUser(res), req.params.id, amountCents) });
  });
  return r;
}

/** Stripe's webhook: the raw body (the signature covers its bytes), mounted before JSON parsing and the origin check. */
export function webhookRoute(service: PaymentsService): Router {
  const r = Router();
  r.post('/', express.raw({ type: () => true, limit: '1mb' }), (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const out = service.handleWebhook(raw, req.get('stripe-signature'));
    res.json({ received: true, duplicate: out.duplicate });
  });
  return r;
}
