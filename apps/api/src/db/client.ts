import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

export const MIGRATIONS_DIR = resolve(dirname(fileURLToPath(import.meta.url)), '../../../../drizzle');

/**
 * Opens SQLite (WAL, foreign keys on) through Drizzle; ':memory:' for tests. With WAL, `synchronous = NORMAL` syncs
 * at checkpoints rather than on every commit: a commit stays atomic and the file consistent, and only the last
 * commits before a power loss can be lost (SQLite's documented trade-off for WAL). A 32 MB page cache, the file
 * memory-mapped for reads, and temporary sorts in memory keep the list pages off the disk.
 */
export function openDb(path: string): Db {
  if (path !== ':memory:') mkdirSync(dirname(resolve(path)), { recursive: true });
  const sqlite = new Database(path);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('synchronous = NORMAL');
  sqlite.pragma('cache_size = -32000');
  sqlite.pragma('mmap_size = 268435456');
  sqlite.pragma('temp_store = MEMORY');
  return drizzle(sqlite, { schema, casing: 'snake_case' }) as Db;
}

/** Applies the committed migrations in drizzle/. */
export function applyMigrations(db: Db): void {
  migrate(db, { migrationsFolder: MIGRATIONS_DIR });
}

/** How many migrations have been applied. */
export function migrationLevel(db: Db): number {
  try {
    const row = db.$client.prepare('select count(*) as n from __drizzle_migrations').get() as { n: number };
    return row.n;
  } catch {
    return 0;
  }
}

/** What a transaction callback receives; services that write inside one take this. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
