/**
 * Prepared statements, compiled once per connection and reused. Hot paths (sync push, change
 * sequence, normalised carry) go through here: preparing SQL on every call cost more than
 * running it.
 */
import type Database from 'better-sqlite3';

const caches = new WeakMap<Database.Database, Map<string, Database.Statement>>();

/** The prepared statement for `sql` on this connection (compiled on first use). */
export function cachedStatement(sqlite: Database.Database, sql: string): Database.Statement {
  let cache = caches.get(sqlite);
  if (!cache) {
    cache = new Map();
    caches.set(sqlite, cache);
  }
  let stmt = cache.get(sql);
  if (!stmt) {
    stmt = sqlite.prepare(sql);
    cache.set(sql, stmt);
  }
  return stmt;
}
