/**
 * Every API operation as the reference documents it: method, Express path, who may call it, and the zod
 * schemas of its query, body and answer — the same schemas the routers parse with. A spec compares this list
 * with the routes Express actually has, so a new route without an entry here fails the build.
 */
export type { Access, Operation } from './operation';
import type { Operation } from './operation';
import { ACCOUNT_OPERATIONS } from './operations-accounts';
import { CLUB_OPERATIONS } from './operations-club';
import { SQUAD_OPERATIONS } from './operations-squads';

/** The documented operations (the reference page lists them in this order), one file per area of the API. */
export const OPERATIONS: readonly Operation[] = [...ACCOUNT_OPERATIONS, ...SQUAD_OPERATIONS, ...CLUB_OPERATIONS];
