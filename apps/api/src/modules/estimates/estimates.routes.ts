import { Router } from 'express';
import {
  AcceptEstimateBody,
  CreateEstimateBody,
  UpdateEstimateBody,
  WithdrawEstimateBody,
} from '@benchwright/contracts';
import { Forbidden, parse } from '../../lib/errors';
import { currentUser } from '../../middleware/session';
import type { PaymentsService } from '../payments/payments.service';
import type { EstimatesService } from './estimates.service';

/** Mounted behind requireRole('owner', 'client'): the owner edits and sends; a client sees, accepts, pays. */
export function estimatesRoutes(service: EstimatesService, payments: PaymentsService): Router {
  const r = Router();
  const owner = (res: Parameters<typeof currentUser>[0]) => {
    const u = currentUser(res);
    if (u.role !== 'owner') throw new Forbidden();
    return u;
  };
  const client = (res: Parameters<typeof currentUser>[0]) => {
    const u = currentUser(res);
    if (u.role !== 'client') throw new Forbidden("Only the project's client can do this.");
    return u;
  };
  r.get('/:id', (req, res) => {
    res.json({ estimate: service.get(currentUser(res), req.params.id) });
  });
  r.patch('/:id', (req, res) => {
    const u = owner(res);
    res.json({ estimate: service.update(u, req.params.id, parse(UpdateEstimateBody, req.body)) });
  });
  r.post('/:id/send', async (req, res) => {
    const u = owner(res);
    res.json({ estimate: await service.send(u, req.params.id) });
  });
  r.get('/:id/pdf', (req, res) => {
    const { path, filename } = service.pdfPath(currentUser(res), req.params.id);
    // the client's own estimate: never kept by a shared cache
    res
      .type('application/pdf')
      .attachment(filename)
      .sendFile(path, { cacheControl: false, headers: { 'Cache-Control': 'private, no-store' } });
  });
  r.post('/:id/accept', (req, res) => {
    const u = client(res);
    const { acceptedName } = parse(AcceptEstimateBody, req.body);
    res.json({
      estimate: service.accept(u, req.params.id, {
        acceptedName,
        ip: req.ip ?? '',
        userAgent: req.get('user-agent') ?? '',
      }),
    });
  });
  /** The owner takes back an accepted revision, with a reason, while no deposit is paid (409 otherwise). */
  r.post('/:id/withdraw', async (req, res) => {
    const u = owner(res);
    const { reason } = parse(WithdrawEstimateBody, req.body);
    // 404 and "not accepted" before anything is asked of the card processor
    if (service.get(u, req.params.id).status === 'accepted') await payments.closeDepositCheckouts(req.params.id);
    res.json({ estimate: service.withdraw(u, req.params.id, reason) });
  });
  r.post('/:id/deposit-checkout', async (req, res) => {
    res.json(await payments.depositCheckout(client(res), req.params.id));
  });
  return r;
}

/** POST /api/projects/:id/estimates (owner) and /balance-checkout (client), beside the project routes. */
export function projectMoneyRoutes(service: EstimatesService, payments: PaymentsService): Router {
  const r = Router();
  r.post('/:id/estimates', async (req, res) => {
    const u = currentUser(res);
    if (u.role !== 'owner') throw new Forbidden();
    const { source } = parse(CreateEstimateBody, req.body ?? {});
    res.status(201).json({ estimate: await service.createRevision(u, req.params.id, source) });
  });
  r.post('/:id/balance-checkout', async (req, res) => {
    const u = currentUser(res);
    if (u.role !== 'client') throw new Forbidden("Only the project's client can pay.");
    res.json(await payments.balanceCheckout(u, req.params.id));
  });
  return r;
}
