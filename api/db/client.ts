/**
 * Opens the SQLite database with the pragmas Loftline relies on and applies the committed
 * drizzle-kit migrations, so every start-up (and every test's temp database) has the schema.
 */
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import * as schema from './schema';
import { cachedStatement } from './statements';

/** The typed Drizzle handle used across the server. */
export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

const migrationsFolder = resolve(dirname(fileURLToPath(import.meta.url)), '../../drizzle');

/** Opens (creating if needed) the database file, sets WAL, foreign keys and a busy timeout, migrates. */
export function openDatabase(path: string): Db {
  if (path !== ':memory:') mkdirSync(dirname(path), { recursive: true });
  const sqlite = new Database(path);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('synchronous = NORMAL');
  const db = drizzle(sqlite, { schema });
  migrate(db, { migrationsFolder });
  return db;
}

/** Hands out the next `change_seq`; call inside the write transaction that uses it. */
export function nextChangeSeq(db: Db): number {
  const row = cachedStatement(
    db.$client,
    `INSERT INTO change_counter (id, last_seq) VALUES (1, 1)
     ON CONFLICT(id) DO UPDATE SET last_seq = last_seq + 1 RETURNING last_seq`,
  ).get() as { last_seq: number };
  return row.last_seq;
}
