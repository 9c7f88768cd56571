import express, { Router } from 'express';
import { ConfirmPaymentBody, PaymentsQuery, RefundBody } from '@benchwright/contracts';
import { parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { PaymentsService } from './payments.service';

/** Mounted behind requireRole('owner'). */
export function paymentsRoutes(service: PaymentsService): Router {
  const r = Router();
  r.get('/', (req, res) => {
    res.json(service.list(parse(PaymentsQuery, req.query)));
  });
  r.post('/:id/refund', async (req, res) => {
    const { amountCents } = parse(RefundBody, req.body ?? {});
    res.status(202).json({ refund: await service.refund(currentUser(res), req.params.id, amountCents) });
  });
  return r;
}

/**
 * POST /api/payments/confirm `{ sessionId }`: the portal calls it on the return from Checkout; the session is
 * asked of Stripe and recorded if paid. Mounted behind requireRole('client'); the payment must be the client's (404).
 */
export function paymentConfirmRoute(service: PaymentsService): Router {
  const r = Router();
  r.post('/', async (req, res) => {
    const { sessionId } = parse(ConfirmPaymentBody, req.body ?? {});
    res.json({ payment: await service.confirm(currentUser(res), sessionId) });
  });
  return r;
}

/** Stripe's webhook: the raw body (the signature covers its bytes), mounted before JSON parsing and the origin check. */
export function webhookRoute(service: PaymentsService): Router {
  const r = Router();
  r.post('/', express.raw({ type: () => true, limit: '1mb' }), async (req, res) => {
    const raw = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    const out = await service.handleWebhook(raw, req.get('stripe-signature'));
    res.json({ received: true, duplicate: out.duplicate });
  });
  return r;
}
