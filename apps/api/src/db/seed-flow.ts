import { eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from './client';
import { jobs, projects, users } from './schema';
import { toUser } from '../modules/auth/auth.service';
import type { EstimatesService } from '../modules/estimates/estimates.service';
import type { JobsService } from '../modules/jobs/jobs.service';
import type { PaymentsService } from '../modules/payments/payments.service';

interface Services {
  estimates: EstimatesService;
  payments: PaymentsService;
  jobs: JobsService;
}

const userBy = (db: Db, email: string) => toUser(db.select().from(users).where(eq(users.email, email)).get()!);
const projectOf = (db: Db, clientId: string) =>
  db.select().from(projects).where(eq(projects.clientId, clientId)).get()!;

/**
 * The demo's money, through the real services (DESIGN.md section 8):
 * Priya's bench estimate sent (PDF stored, mail queued), Tomasz's bookcase
 * accepted with its deposit paid through the Stripe stand-in and its job in
 * Casework, the guild's cabinets left as a request. Idempotent: each step is
 * skipped once done. Needs the API listening (the stand-in's webhook comes
 * back to it) and the stand-in running.
 */
export async function seedDemoFlow(db: Db, services: Services, log: Pick<Logger, 'info' | 'warn'>): Promise<void> {
  const owner = userBy(db, 'maren@fernhill.example');
  const priya = userBy(db, 'priya@example.com');
  const tomasz = userBy(db, 'tomasz@example.com');

  let p = projectOf(db, priya.id);
  if (p.status === 'requested') {
    const e = await services.estimates.createRevision(owner, p.id, 'engine');
    await services.estimates.send(owner, e.id);
    log.info("demo: Priya's bench estimate sent");
  }

  p = projectOf(db, tomasz.id);
  if (p.status === 'requested') {
    const e = await services.estimates.createRevision(owner, p.id, 'engine');
    await services.estimates.send(owner, e.id);
    services.estimates.accept(tomasz, e.id, {
      acceptedName: 'Tomasz Wierzbicki',
      ip: '127.0.0.1',
      userAgent: 'demo seed',
    });
    p = projectOf(db, tomasz.id);
  }
  if (p.status === 'accepted') {
    const estimateId = db.$client
      .prepare("select id from estimates where project_id = ? and status = 'accepted'")
      .get(p.id) as { id: string };
    const { url } = await services.payments.depositCheckout(tomasz, estimateId.id);
    const paid = await fetch(url, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({
        card_number: '4242 4242 4242 4242',
        exp: '12/34',
        cvc: '123',
        name: 'Tomasz Wierzbicki',
      }),
    });
    if (paid.status !== 303) throw new Error(`the Stripe stand-in did not take the demo payment (${paid.status})`);
    for (let i = 0; i < 200 && projectOf(db, tomasz.id).status !== 'deposit_paid'; i++)
      await new Promise((r) => setTimeout(r, 100));
    if (projectOf(db, tomasz.id).status !== 'deposit_paid')
      throw new Error("the deposit webhook for Tomasz's bookcase did not arrive");
    log.info("demo: Tomasz's deposit paid through the Stripe stand-in");
  }
  const job = db.select().from(jobs).where(eq(jobs.projectId, p.id)).get();
  if (job && job.stageKey === 'material') {
    services.jobs.update(owner, job.id, { stageKey: 'casework', builderId: userBy(db, 'idris@fernhill.example').id });
    log.info("demo: Tomasz's bookcase is in Casework");
  }
}
