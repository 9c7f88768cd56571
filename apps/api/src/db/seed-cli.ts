import { applyMigrations, openDb } from './client';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from './seed';
import { loadEnv } from '../env';

const db = openDb(loadEnv().DATABASE_PATH);
applyMigrations(db);
await seedDemo(db);
console.log(`demo data seeded; sign in as ${DEMO_USERS.map((u) => u.email).join(', ')} with ${DEMO_PASSWORD}`);
db.$client.close();
