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
  // A season of a large academy is a few hundred MB: a 64 MiB page cache and memory-mapped reads keep
  // the kicks indexes' hot pages in memory (the default cache is 2 MB), which random UUID keys need.
  sqlite.pragma('cache_size = -65536');
  sqlite.pragma('mmap_size = 268435456');
  const db = drizzle(sqlite, { schema });
  migrate(db, { migrationsFolder });
  return db;
}

/** Sequence blocks open on a connection (see `withChangeSeqBlock`). */
const openBlocks = new WeakMap<Database.Database, { last: number; start: number }>();

/**
 * Runs `fn` with change sequences handed out from memory and the counter written once at the end — for a
 * batch of hundreds of writes (a sync push), where one counter update per row is a measurable share of
 * the time. Call inside the write transaction: the write lock keeps the block exclusive, and if `fn`
 * throws the transaction rolls back and the counter is left alone.
 */
export function withChangeSeqBlock<T>(db: Db, fn: () => T): T {
  const sqlite = db.$client;
  if (openBlocks.has(sqlite)) return fn();
  const current =
    (cachedStatement(sqlite, 'SELECT last_seq AS s FROM change_counter WHERE id = 1').get() as { s: number } | undefined)?.s ?? 0;
  const block = { last: current, start: current };
  openBlocks.set(sqlite, block);
  try {
    const result = fn();
    if (block.last !== block.start) {
      cachedStatement(
        sqlite,
        'INSERT INTO change_counter (id, last_seq) VALUES (1, ?) ON CONFLICT(id) DO UPDATE SET last_seq = excluded.last_seq',
      ).run(block.last);
    }
    return result;
  } finally {
    openBlocks.delete(sqlite);
  }
}

/** Hands out the next `change_seq`; call inside the write transaction that uses it. */
export function nextChangeSeq(db: Db): number {
  const block = openBlocks.get(db.$client);
  if (block) return ++block.last;
  const row = cachedStatement(
    db.$client,
    `INSERT INTO change_counter (id, last_seq) VALUES (1, 1)
     ON CONFLICT(id) DO UPDATE SET last_seq = last_seq + 1 RETURNING last_seq`,
  ).get() as { last_seq: number };
  return row.last_seq;
}
