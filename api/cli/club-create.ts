/**
 * `npm run club:create -- --name "<club>" --admin <e-mail> [--admin-name "<name>"] [--timezone <IANA zone>]`:
 * creates a club and its administrator in the configured database (`LOFTLINE_DB`) and prints a one-time
 * invite link (valid 7 days) with which the administrator sets a password. Safe with the server running
 * (SQLite WAL); the link uses `LOFTLINE_PUBLIC_URL`.
 */
import { parseArgs } from 'node:util';
import { ConfigError, loadConfig } from '../config';
import { createClub } from '../club/club-setup';
import { openDatabase } from '../db/client';
import { HttpError } from '../errors';

const USAGE = `Usage: npm run club:create -- --name "<club>" --admin <e-mail> [--admin-name "<name>"] [--timezone <IANA zone>]

Creates a club and its administrator, and prints a one-time link (valid 7 days) for the administrator
to set a password. The link starts with LOFTLINE_PUBLIC_URL; the database is LOFTLINE_DB.`;

function main(): number {
  let args;
  try {
    args = parseArgs({
      options: {
        name: { type: 'string' },
        admin: { type: 'string' },
        'admin-name': { type: 'string' },
        timezone: { type: 'string' },
        help: { type: 'boolean' },
      },
      strict: true,
    }).values;
  } catch (err) {
    console.error(`${err instanceof Error ? err.message : String(err)}\n\n${USAGE}`);
    return 2;
  }
  if (args.help) {
    console.log(USAGE);
    return 0;
  }
  const config = loadConfig();
  const db = openDatabase(config.dbPath);
  try {
    const club = createClub(db, config.publicUrl, {
      name: args.name ?? '',
      adminEmail: args.admin ?? '',
      ...(args['admin-name'] ? { adminName: args['admin-name'] } : {}),
      ...(args.timezone ? { timezone: args.timezone } : {}),
    });
    console.log(`Created the club "${args.name?.trim()}" with administrator ${club.adminEmail}.`);
    console.log(`Send this one-time link to the administrator to set a password (valid until ${club.expiresAt}):`);
    console.log(`\n  ${club.inviteLink}\n`);
    if (config.env === 'production' && !process.env['LOFTLINE_PUBLIC_URL']) {
      console.warn('LOFTLINE_PUBLIC_URL is not set: the link points at localhost; replace the address with the server’s public one.');
    }
    return 0;
  } catch (err) {
    if (err instanceof HttpError) {
      const fields = err.fields?.map((f) => `  ${f.field}: ${f.message}`).join('\n') ?? '';
      console.error(`${err.message}${fields ? `\n${fields}` : ''}\n\n${USAGE}`);
      return 1;
    }
    throw err;
  } finally {
    db.$client.close();
  }
}

try {
  process.exitCode = main();
} catch (err) {
  console.error(err instanceof ConfigError ? err.message : err);
  process.exitCode = 1;
}
