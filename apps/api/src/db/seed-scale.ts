// `pnpm db:seed --scale N`: a shop some years in, for measuring the lists. N projects (invented clients of the
// demo shop, 200 of them at N = 10,000: N / 50, at least 1), 10 timeline events each, every project status, the
// estimates, deposits and jobs each status implies; the jobs still in the shop only among the newest 120. One transaction of prepared statements: seconds, not minutes.
import { randomUUID } from 'node:crypto';
import { PROJECT_STATUSES, isInShop, type EstimateStatus, type ProjectStatus } from '@benchwright/contracts';
import { designs, type DesignSlug } from '@benchwright/pricing';
import { hashPassword } from '../auth/password';
import type { Db } from './client';
import { DEMO_PASSWORD, seedShop } from './seed';

const FIRST = ['Ada', 'Bram', 'Cato', 'Delia', 'Esme', 'Fenn', 'Greta', 'Hollis', 'Ines', 'Jory', 'Kit', 'Lorna'];
const LAST = ['Ashby', 'Birchall', 'Coldwell', 'Dunmore', 'Elmsworth', 'Fairleigh', 'Garrow', 'Hartwell', 'Ivesdale'];
const NOTES = [
  'A bench for the back of the garage, with a vise end.',
  'Shelves for the study, painted to match the trim.',
  'Cabinets for the laundry room under the window.',
  'A bookcase for the hall; the floor slopes a little.',
  'Storage for the school workshop, on casters.',
  'Two cabinets for the studio, one with doors.',
];
const SLUGS = Object.keys(designs) as DesignSlug[];
const STAGE_OF: Partial<Record<ProjectStatus, string>> = {
  deposit_paid: 'material',
  in_production: 'casework',
  ready: 'ready',
  delivered: 'delivered',
  closed: 'delivered',
};
/** the latest revision's status for a project in each status (none while requested) */
const ESTIMATE_OF: Record<ProjectStatus, EstimateStatus | null> = {
  requested: null,
  estimating: 'draft',
  estimate_sent: 'sent',
  accepted: 'accepted',
  deposit_paid: 'accepted',
  in_production: 'accepted',
  ready: 'accepted',
  delivered: 'accepted',
  closed: 'accepted',
  declined: 'sent',
  expired: 'expired',
  cancelled: null,
};
const EVENTS_PER_PROJECT = 10;
/** the newest projects among which jobs are still in the shop (a quarter of them: some 30 open jobs) */
const OPEN_JOBS_WINDOW = 120;
const IN_SHOP_NOW = new Set<ProjectStatus>(['deposit_paid', 'in_production', 'ready']);

/** Adds `count` projects and their clients; returns the clients' e-mail addresses (password: the demo's). */
export async function seedScale(db: Db, count: number): Promise<{ clients: string[] }> {
  seedShop(db);
  const hash = await hashPassword(DEMO_PASSWORD);
  const c = db.$client;
  const clientCount = Math.max(1, Math.round(count / 50));
  const insUser = c.prepare(
    `INSERT INTO users (id, email, name, role, password_hash, email_verified_at, created_at) VALUES (?, ?, ?, 'client', ?, ?, ?)`,
  );
  const insProject = c.prepare(
    `INSERT INTO projects (id, client_id, status, notes, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?)`,
  );
  const insItem = c.prepare(
    `INSERT INTO project_items (id, project_id, position, spec, quantity) VALUES (?, ?, ?, ?, ?)`,
  );
  const insEvent = c.prepare(
    `INSERT INTO project_events (id, project_id, kind, message, actor_id, created_at) VALUES (?, ?, ?, ?, ?, ?)`,
  );
  const insEstimate = c.prepare(
    `INSERT INTO estimates (id, project_id, revision, status, subtotal_cents, tax_cents, total_cents, deposit_cents,
       balance_cents, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
  );
  const insPayment = c.prepare(
    `INSERT INTO payments (id, project_id, estimate_id, kind, status, amount_cents, created_at, updated_at)
     VALUES (?, ?, ?, ?, 'paid', ?, ?, ?)`,
  );
  const insJob = c.prepare(
    `INSERT INTO jobs (id, project_id, stage_key, position, hours_budget, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?)`,
  );
  const specs = Object.fromEntries(SLUGS.map((s) => [s, JSON.stringify(designs[s].defaults)]));
  const budget = JSON.stringify({ material: 1, cutting: 4, casework: 8, drawers_doors: 4, finish: 5 });
  const tag = randomUUID().slice(0, 6);
  const clients: { id: string; email: string }[] = [];
  const start = Date.now() - 3 * 365 * 86_400_000;
  const span = 3 * 365 * 86_400_000 - 86_400_000;
  c.transaction(() => {
    for (let i = 0; i < clientCount; i++) {
      const id = randomUUID();
      const email = `client-${tag}-${i + 1}@scale.example`;
      const name = `${FIRST[i % FIRST.length]} ${LAST[Math.floor(i / FIRST.length) % LAST.length]} ${i + 1}`;
      insUser.run(id, email, name, hash, start, start);
      clients.push({ id, email });
    }
    for (let i = 0; i < count; i++) {
      const id = randomUUID();
      const client = clients[i % clientCount]!;
      // every status, but only the newest jobs are still in the shop: the older ones were delivered and paid
      const cycled = PROJECT_STATUSES[i % PROJECT_STATUSES.length]!;
      const status = IN_SHOP_NOW.has(cycled) && i < count - OPEN_JOBS_WINDOW ? 'closed' : cycled;
      const created = start + Math.floor((span * i) / count);
      const updated = created + ((i * 7919) % 30) * 86_400_000;
      insProject.run(id, client.id, status, `${NOTES[i % NOTES.length]} (no. ${i + 1})`, created, updated);
      const items = 1 + (i % 3);
      for (let k = 0; k < items; k++)
        insItem.run(randomUUID(), id, k, specs[SLUGS[(i + k) % SLUGS.length]!]!, 1 + ((i + k) % 2));
      for (let e = 0; e < EVENTS_PER_PROJECT; e++)
        insEvent.run(
          randomUUID(),
          id,
          e === 0 ? 'requested' : 'comment',
          `Note ${e + 1} on this request.`,
          client.id,
          created + e * 3_600_000,
        );
      const est = ESTIMATE_OF[status];
      if (!est) continue;
      const total = 80_000 + ((i * 104_729) % 900_000);
      const deposit = Math.round(total / 2);
      const estimateId = randomUUID();
      insEstimate.run(
        estimateId,
        id,
        1,
        est,
        Math.round(total / 1.08),
        total - Math.round(total / 1.08),
        total,
        deposit,
        total - deposit,
        created,
        updated,
      );
      if (isInShop(status) || status === 'closed') {
        insPayment.run(randomUUID(), id, estimateId, 'deposit', deposit, updated, updated);
        if (status === 'closed')
          insPayment.run(randomUUID(), id, estimateId, 'balance', total - deposit, updated, updated);
        insJob.run(randomUUID(), id, STAGE_OF[status]!, i % 50, budget, updated, updated);
      }
    }
  })();
  return { clients: clients.map((x) => x.email) };
}
