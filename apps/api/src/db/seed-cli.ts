import { applyMigrations, openDb } from './client';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from './seed';
import { seedScale } from './seed-scale';
import { loadEnv } from '../env';

// `pnpm db:seed` (the demo) or `pnpm db:seed --scale 10000` (the demo and 10,000 more projects)
const at = process.argv.indexOf('--scale');
const scale = at >= 0 ? Number(process.argv[at + 1]) : 0;
if (at >= 0 && !(Number.isInteger(scale) && scale > 0 && scale <= 1_000_000)) {
  console.error('usage: pnpm db:seed [--scale N]   (N projects, 1 to 1000000)');
  process.exit(2);
}
const db = openDb(loadEnv().DATABASE_PATH);
applyMigrations(db);
await seedDemo(db);
console.log(`demo data seeded; sign in as ${DEMO_USERS.map((u) => u.email).join(', ')} with ${DEMO_PASSWORD}`);
if (scale) {
  const t0 = performance.now();
  const { clients } = await seedScale(db, scale);
  console.log(
    `${scale} projects for ${clients.length} clients seeded in ${((performance.now() - t0) / 1000).toFixed(1)} s (clients sign in as ${clients[0]} and so on)`,
  );
}
db.$client.close();
