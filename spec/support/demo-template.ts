/**
 * A database file holding the migrated demo, built once and copied for every app or server a run starts.
 * Generating the demo flies every repetition through the flight model (a few seconds of CPU), and dozens of
 * specs each want a fresh copy: copying the finished file gives each the same rows at a file copy's cost.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase, type Db } from '../../api/db/client';
import { seedDemo, type SeedOptions } from '../../seed/scenario';

/** Builds the template in a temp folder removed when the process exits; `more` adds rows after the demo. */
export function buildDemoTemplate(name: string, options: SeedOptions, more: (db: Db) => void = () => undefined): string {
  const dir = mkdtempSync(join(tmpdir(), `loftline-${name}-template-`));
  const path = join(dir, 'template.db');
  const db = openDatabase(path);
  seedDemo(db, options);
  more(db);
  // Everything into the main file, so one file copy is the whole database.
  db.$client.pragma('wal_checkpoint(TRUNCATE)');
  db.$client.close();
  process.once('exit', () => rmSync(dir, { recursive: true, force: true }));
  return path;
}
