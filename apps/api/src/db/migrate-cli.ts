import { applyMigrations, migrationLevel, openDb } from './client';
import { loadEnv } from '../env';

const db = openDb(loadEnv().DATABASE_PATH);
applyMigrations(db);
console.log(`migrations applied: ${migrationLevel(db)}`);
db.$client.close();
