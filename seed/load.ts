/**
 * `npm run seed` — loads the demo academy into the configured database.
 *
 *   npm run seed              seeds only if the database is empty (safe to run any time)
 *   npm run seed -- --reset   deletes the database file and reloads the demo from scratch
 *
 * `--reset` is destructive, so before deleting anything it checks that every file it would
 * remove is a regular file (not a symlink or directory) in the configured data directory, and
 * that the database file really is an SQLite database. Stop a running server first: deleting
 * the file under an open connection leaves that server writing to a removed file.
 */
import { closeSync, lstatSync, openSync, readSync, realpathSync, rmSync, type Stats } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { loadConfig } from '../api/config';
import { openDatabase } from '../api/db/client';
import { demoPeriod, DEMO_ACCOUNTS, DEMO_CLUB_NAME, DEMO_PASSWORD, isDatabaseEmpty, seedDemo, type SeedSummary } from './scenario';

const USAGE = `Usage: npm run seed [-- --reset]

Loads the Kestrel Vale Athletic Academy demo into the database (LOFTLINE_DB, default data/loftline.db).
  (no flag)   load only if the database is empty
  --reset     delete the database file (and its -wal/-shm), recreate it and load the demo
  --help      show this text`;

/** Bytes every SQLite 3 database file starts with. */
const SQLITE_HEADER = 'SQLite format 3\u0000';

/** `lstat`, or null when the file does not exist. */
function lstatOrNull(path: string): Stats | null {
  try {
    return lstatSync(path);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw err;
  }
}

function hasSqliteHeader(path: string): boolean {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(SQLITE_HEADER.length);
    const read = readSync(fd, buf, 0, buf.length, 0);
    return read === buf.length && buf.toString('latin1') === SQLITE_HEADER;
  } finally {
    closeSync(fd);
  }
}

/**
 * Deletes the database and its WAL/shared-memory/journal files after checking all of them;
 * nothing is deleted if any check fails. Returns the paths removed.
 */
function removeDatabaseFiles(dbPath: string): string[] {
  const parent = lstatOrNull(dirname(dbPath));
  if (!parent) return []; // no data directory yet: nothing to delete
  const dataDir = realpathSync(dirname(dbPath));
  const dbFile = join(dataDir, basename(dbPath));
  const toRemove: string[] = [];
  for (const suffix of ['', '-wal', '-shm', '-journal']) {
    const file = dbFile + suffix;
    const stats = lstatOrNull(file);
    if (!stats) continue;
    if (!stats.isFile()) throw new Error(`${file} is not a regular file; refusing to delete it.`);
    if (suffix === '' && stats.size > 0 && !hasSqliteHeader(file)) {
      throw new Error(`${file} is not an SQLite database; refusing to delete it. Check LOFTLINE_DB.`);
    }
    toRemove.push(file);
  }
  for (const file of toRemove) rmSync(file);
  return toRemove;
}

function printSummary(dbPath: string, summary: SeedSummary, now: Date): void {
  const period = demoPeriod(now);
  const lastDay = new Date(period.periodEnd.getTime() - 86_400_000);
  console.log(`Loaded the ${DEMO_CLUB_NAME} demo into ${dbPath}`);
  console.log(`  training weeks: ${period.firstWeekStart.toISOString().slice(0, 10)} to ${lastDay.toISOString().slice(0, 10)} (UTC)`);
  const width = Math.max(...Object.keys(summary).map((k) => k.length));
  for (const [table, count] of Object.entries(summary)) console.log(`  ${table.padEnd(width)}  ${count}`);
  console.log(`\nDemo accounts (password: ${DEMO_PASSWORD})`);
  for (const [role, email] of Object.entries(DEMO_ACCOUNTS)) console.log(`  ${role.padEnd(16)} ${email}`);
  console.log('Every other seeded account (further staff, players, guardians) uses the same password.');
}

function main(argv: readonly string[]): number {
  const unknown = argv.filter((a) => a !== '--reset' && a !== '--help');
  if (argv.includes('--help') || unknown.length > 0) {
    if (unknown.length > 0) console.error(`Unknown option(s): ${unknown.join(' ')}\n`);
    console.log(USAGE);
    return unknown.length > 0 ? 2 : 0;
  }
  const reset = argv.includes('--reset');
  const config = loadConfig();
  if (config.env === 'production') {
    console.error(
      'NODE_ENV is production: the demo club and its published password are never loaded into a production database. ' +
        'Create your club with npm run club:create -- --name "<club>" --admin <e-mail>.',
    );
    return 1;
  }
  const dbPath = config.dbPath;
  if (dbPath === ':memory:') {
    console.error('LOFTLINE_DB is ":memory:"; an in-memory database vanishes when this script ends, so there is nothing to seed.');
    return 1;
  }

  if (reset) {
    const removed = removeDatabaseFiles(dbPath);
    console.log(removed.length > 0 ? `Deleted ${removed.join(', ')}` : `No database at ${dbPath} yet; creating it.`);
  }

  const db = openDatabase(dbPath);
  try {
    if (!isDatabaseEmpty(db)) {
      console.log(`The database at ${dbPath} already has data; nothing was loaded.`);
      console.log('To replace it with the demo scenario (this deletes everything in it), stop the server and run:');
      console.log('  npm run seed -- --reset');
      return 0;
    }
    const now = new Date();
    const started = performance.now();
    const summary = seedDemo(db, { now });
    printSummary(dbPath, summary, now);
    console.log(`\nDone in ${((performance.now() - started) / 1000).toFixed(1)} s.`);
    return 0;
  } finally {
    db.$client.close();
  }
}

try {
  process.exitCode = main(process.argv.slice(2));
} catch (err) {
  console.error(err instanceof Error ? err.message : String(err));
  process.exitCode = 1;
}
