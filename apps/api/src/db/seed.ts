import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { demoPriceBook, demoSettings, designs, toMm, type BuildSpec } from '@benchwright/pricing';
import { hashPassword } from '../auth/password';
import type { Db } from './client';
import { projectEvents, projectItems, projects, shopSettings, stages, users } from './schema';
import { latestVersion, saveDocument } from '../lib/price-book';
import { movePriceBookDocument } from './price-book-move';

export const DEMO_PASSWORD = 'bench-demo-2026';

export const DEMO_USERS = [
  { email: 'maren@fernhill.example', name: 'Maren Holt', role: 'owner' },
  { email: 'idris@fernhill.example', name: 'Idris Kane', role: 'builder' },
  { email: 'priya@example.com', name: 'Priya Natarajan', role: 'client' },
  { email: 'tomasz@example.com', name: 'Tomasz Wierzbicki', role: 'client' },
  { email: 'guild@example.com', name: "Alder Cross Makers' Guild", role: 'client' },
] as const;

export const STAGES = [
  ['material', 'Material'],
  ['cutting', 'Cutting'],
  ['casework', 'Casework'],
  ['drawers_doors', 'Drawers & doors'],
  ['finish', 'Finish'],
  ['ready', 'Ready'],
  ['delivered', 'Delivered'],
] as const;

/** The shop's own rows: settings, price book, stages. Idempotent. */
export function seedShop(db: Db): void {
  movePriceBookDocument(db);
  db.transaction((tx) => {
    if (!tx.select().from(shopSettings).where(eq(shopSettings.id, 1)).get()) {
      tx.insert(shopSettings)
        .values({
          id: 1,
          shopName: 'Fernhill Joinery',
          address: '14 Mill Lane, Alder Cross',
          email: 'shop@fernhill.example',
          phone: '555-0142',
          settings: demoSettings,
        })
        .run();
    }
    if (!latestVersion(tx)) saveDocument(tx, demoPriceBook, 'The demo price book.');
    STAGES.forEach(([key, label], position) =>
      tx.insert(stages).values({ key, label, position }).onConflictDoNothing().run(),
    );
  });
}

/**
 * The invented demo scenario (DESIGN.md section 8): the five demo users and
 * the three clients' requests. Idempotent: run it as often as you like.
 */
export async function seedDemo(db: Db): Promise<void> {
  seedShop(db);
  const hash = await hashPassword(DEMO_PASSWORD);
  const ids: Record<string, string> = {};
  db.transaction((tx) => {
    for (const u of DEMO_USERS) {
      const found = tx.select().from(users).where(eq(users.email, u.email)).get();
      const id = found?.id ?? randomUUID();
      ids[u.email] = id;
      if (!found) {
        tx.insert(users)
          .values({
            id,
            email: u.email,
            name: u.name,
            role: u.role,
            passwordHash: hash,
            emailVerifiedAt: new Date(),
          })
          .run();
      }
    }
    const bench: BuildSpec = { ...designs['assembly-bench'].defaults };
    const walnutBookcase: BuildSpec = {
      ...designs.bookcase.defaults,
      widthMm: toMm(30),
      trim: { lumberId: 'walnut-4-4', widthMm: toMm(1.5), thicknessMm: toMm(0.75) },
    };
    const wallCabinet: BuildSpec = { ...designs['wall-cabinet'].defaults };
    const requests: [string, string, BuildSpec, number][] = [
      [
        'priya@example.com',
        'A rolling assembly bench with drawers, about six feet long, for the garage shop.',
        bench,
        1,
      ],
      ['tomasz@example.com', 'A bookcase for the study with walnut face trim.', walnutBookcase, 1],
      ['guild@example.com', "Two wall cabinets for the guild's tool room, to match.", wallCabinet, 2],
    ];
    for (const [email, notes, spec, quantity] of requests) {
      const clientId = ids[email];
      if (!clientId) throw new Error(`the demo request's client ${email} is not a demo user`);
      if (tx.select({ id: projects.id }).from(projects).where(eq(projects.clientId, clientId)).get()) continue;
      const id = randomUUID();
      tx.insert(projects).values({ id, clientId, notes }).run();
      tx.insert(projectItems).values({ id: randomUUID(), projectId: id, position: 0, spec, quantity }).run();
      tx.insert(projectEvents)
        .values({
          id: randomUUID(),
          projectId: id,
          kind: 'requested',
          message: 'Estimate requested.',
          actorId: clientId,
        })
        .run();
    }
  });
}
