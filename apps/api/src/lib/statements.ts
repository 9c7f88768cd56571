import type Database from 'better-sqlite3';

const statements = new WeakMap<Database.Database, Map<string, Database.Statement>>();
const built = new WeakMap<object, Map<string, unknown>>();

/**
 * The statement for `sql`, prepared once per connection and reused. SQLite compiles the SQL on every prepare, which
 * was a seventh of the API's time per read in the profile (`pnpm bench:api reads`); a better-sqlite3 statement can
 * be run again and again. The SQL text is the key, so build it from a bounded set of pieces (placeholders for
 * values, never the values themselves).
 */
export function stmt(client: Database.Database, sql: string): Database.Statement {
  let cache = statements.get(client);
  if (!cache) statements.set(client, (cache = new Map()));
  let s = cache.get(sql);
  if (!s) cache.set(sql, (s = client.prepare(sql)));
  return s;
}

/**
 * A Drizzle query built and prepared once per database (`.prepare()` with `sql.placeholder`s) and kept under
 * `key`: Drizzle otherwise builds the SQL text and prepares it again on every call.
 */
export function preparedOnce<T>(db: object, key: string, build: () => T): T {
  let cache = built.get(db);
  if (!cache) built.set(db, (cache = new Map()));
  if (!cache.has(key)) cache.set(key, build());
  return cache.get(key) as T;
}
