/**
 * `npm run db:backup [FILE]` writes a consistent copy of the live database while the server keeps
 * writing: `VACUUM INTO` copies one read transaction's snapshot (WAL lets writers go on). The
 * page-by-page online backup API restarts whenever another connection writes, so under steady
 * load it may never finish; it is used for in-process copies (`backupOnConnection`), where the
 * writer's own changes do not restart it. `npm run db:restore FILE` checks a copy and puts it
 * back (stop the server first).
 */
import Database from 'better-sqlite3';
import { copyFileSync, existsSync, mkdirSync, rmSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { ConfigError, loadConfig } from '../config';

/** Backs `dbPath` up to `target` (online, consistent) and returns the target path. */
export async function backupDatabase(dbPath: string, target: string): Promise<string> {
  mkdirSync(dirname(target), { recursive: true });
  rmSync(target, { force: true });
  const db = new Database(dbPath, { fileMustExist: true });
  try {
    db.pragma('busy_timeout = 5000');
    db.prepare('VACUUM INTO ?').run(target);
  } finally {
    db.close();
  }
  return target;
}

/** Copies through the server's own connection with better-sqlite3's online backup API. */
export async function backupOnConnection(db: Database.Database, target: string): Promise<string> {
  mkdirSync(dirname(target), { recursive: true });
  await db.backup(target);
  return target;
}

/** Checks a backup's integrity, then replaces `dbPath` with it (WAL and SHM files removed). */
export function restoreDatabase(backup: string, dbPath: string): void {
  const check = new Database(backup, { readonly: true, fileMustExist: true });
  try {
    const result = check.pragma('integrity_check', { simple: true });
    if (result !== 'ok') throw new Error(`The backup fails SQLite's integrity check: ${String(result)}`);
  } finally {
    check.close();
  }
  mkdirSync(dirname(dbPath), { recursive: true });
  for (const suffix of ['-wal', '-shm']) rmSync(dbPath + suffix, { force: true });
  copyFileSync(backup, dbPath);
}

async function main(): Promise<void> {
  const [command, file] = process.argv.slice(2);
  const config = loadConfig();
  if (command === 'backup') {
    const target = resolve(file ?? `data/backups/loftline-${new Date().toISOString().replace(/[:.]/g, '-')}.db`);
    console.log(`Backed up ${config.dbPath} to ${await backupDatabase(config.dbPath, target)}`);
  } else if (command === 'restore') {
    if (!file || !existsSync(file))
      throw new ConfigError('Usage: npm run db:restore -- FILE (an existing backup file). Stop the server first.');
    restoreDatabase(resolve(file), config.dbPath);
    console.log(`Restored ${config.dbPath} from ${resolve(file)}`);
  } else {
    throw new ConfigError('Usage: db-backup.ts backup [FILE] | restore FILE');
  }
}

if (process.argv[1] && resolve(process.argv[1]) === resolve(new URL(import.meta.url).pathname)) {
  main().catch((err: unknown) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  });
}
