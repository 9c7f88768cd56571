import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { eq } from 'drizzle-orm';
import { ProjectsResponse } from '@benchwright/contracts';
import { signPayload } from '@benchwright/stripe-fake';
import { expect } from 'vitest';
import { estimates, payments } from '../src/db/schema';
import { testApp, type TestApp } from './helpers';

export const WEBHOOK_SECRET = 'whsec_lifecycle_test';

/** The real app on a fresh database, PDFs in a temporary folder, webhooks signed with a secret of the test's own. */
export const lifecycleApp = () =>
  testApp({ PDF_DIR: mkdtempSync(join(tmpdir(), 'bw-lifecycle-')), STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET });

/** Tomasz's project with revision 1 sent and revision 2 started as a draft. */
export async function twoRevisions(t?: TestApp) {
  t ??= await lifecycleApp();
  const owner = await t.signIn('maren@fernhill.example');
  const tomasz = await t.signIn('tomasz@example.com');
  const projectId: string = ProjectsResponse.parse((await tomasz.get('/api/projects')).body).projects[0]!.id;
  const r1 = (await owner.post(`/api/projects/${projectId}/estimates`).send({})).body.estimate;
  expect((await owner.post(`/api/estimates/${r1.id}/send`)).status).toBe(200);
  const r2 = (await owner.post(`/api/projects/${projectId}/estimates`).send({ source: 'copy' })).body.estimate;
  expect(r2).toMatchObject({ revision: 2, status: 'draft' });
  return { t, owner, tomasz, projectId, r1, r2 };
}

/**
 * A deposit checkout for `estimateId` as the payments service records it, then
 * the card processor's signed `checkout.session.completed` for it, delivered
 * to the webhook as Stripe would.
 */
export async function payDeposit(t: TestApp, estimateId: string) {
  const est = t.db.select().from(estimates).where(eq(estimates.id, estimateId)).get()!;
  const paymentId = randomUUID();
  const sessionId = `cs_test_${paymentId.slice(0, 8)}`;
  t.db
    .insert(payments)
    .values({
      id: paymentId,
      projectId: est.projectId,
      estimateId,
      kind: 'deposit',
      amountCents: est.depositCents,
      stripeSessionId: sessionId,
    })
    .run();
  const meta = { projectId: est.projectId, estimateId, kind: 'deposit', paymentId };
  const payload = JSON.stringify({
    id: `evt_${paymentId}`,
    object: 'event',
    type: 'checkout.session.completed',
    data: {
      object: {
        id: sessionId,
        object: 'checkout.session',
        payment_status: 'paid',
        status: 'complete',
        amount_total: est.depositCents,
        currency: 'usd',
        metadata: meta,
        payment_intent: `pi_${paymentId.slice(0, 8)}`,
      },
    },
  });
  const r = await t
    .agent()
    .post('/api/webhooks/stripe')
    .set('Content-Type', 'application/json')
    .set('Stripe-Signature', signPayload(payload, WEBHOOK_SECRET))
    .send(payload);
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  return paymentId;
}

/** Every key anywhere in a JSON value. */
export function keysOf(v: unknown): string[] {
  if (Array.isArray(v)) return v.flatMap(keysOf);
  if (v && typeof v === 'object') return Object.entries(v).flatMap(([k, x]) => [k, ...keysOf(x)]);
  return [];
}
