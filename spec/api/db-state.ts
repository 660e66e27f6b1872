/**
 * What "the database is unchanged" means in specs: the row count and a SHA-256 over every row
 * of every table (in rowid order), plus SQLite's own count of rows written on a connection.
 */
import type Database from 'better-sqlite3';
import { createHash } from 'node:crypto';

/** Row count and checksum per table. */
export type DatabaseDigest = Record<string, { rows: number; sha256: string }>;

/** Digests every table listed in `sqlite_master` (migrations bookkeeping included). */
export function databaseDigest(sqlite: Database.Database): DatabaseDigest {
  const tables = sqlite.prepare("SELECT name, sql FROM sqlite_master WHERE type = 'table' ORDER BY name").all() as {
    name: string;
    sql: string;
  }[];
  const out: DatabaseDigest = {};
  for (const { name, sql } of tables) {
    // WITHOUT ROWID tables have no rowid; their primary key orders them instead (SQLite documentation, "WITHOUT ROWID Tables").
    const order = /WITHOUT\s+ROWID/i.test(sql) ? '1' : 'rowid';
    const hash = createHash('sha256');
    let rows = 0;
    for (const row of sqlite
      .prepare(`SELECT * FROM "${name.replaceAll('"', '""')}" ORDER BY ${order}`)
      .raw()
      .iterate()) {
      hash.update(
        JSON.stringify(row, (_k, v: unknown) => (Buffer.isBuffer(v) ? v.toString('base64') : typeof v === 'bigint' ? v.toString() : v)),
      );
      hash.update('\n');
      rows++;
    }
    out[name] = { rows, sha256: hash.digest('hex') };
  }
  return out;
}

/** Rows inserted, updated or deleted through this connection since it opened (SQLite documentation, total_changes()). */
export function totalChanges(sqlite: Database.Database): number {
  return (sqlite.prepare('SELECT total_changes() AS n').get() as { n: number }).n;
}
