import { rmSync } from 'node:fs';
import { applyMigrations, openDb } from './client';
import { seedDemo } from './seed';
import { loadEnv } from '../env';

const env = loadEnv();
for (const suffix of ['', '-wal', '-shm']) rmSync(`${env.DATABASE_PATH}${suffix}`, { force: true });
rmSync(env.UPLOADS_DIR, { recursive: true, force: true });
const db = openDb(env.DATABASE_PATH);
applyMigrations(db);
await seedDemo(db);
console.log(`reset ${env.DATABASE_PATH}: migrations applied and demo data seeded`);
db.$client.close();
