/**
 * The sync contract (docs/design.md §5), one definition for the client and the server.
 *
 *  - The client writes to IndexedDB and its outbox first; `POST /api/sync/push` sends outbox
 *    mutations in batches of at most `MAX_PUSH_MUTATIONS`, each with its own UUID.
 *  - The server applies each mutation id at most once: a replay answers `duplicate` and
 *    changes nothing. Edits carry the `baseVersion` they were made on; a stale one answers
 *    `conflict` with the server's row (the server wins, the client shows what changed).
 *  - Invalid data answers `rejected` with the field errors; the rest of the batch still applies.
 *  - `GET /api/sync/pull?since=<cursor>` returns changes (tombstones included) in `changeSeq`
 *    order; the client keeps `cursor` and asks again while `hasMore`.
 */
import * as z from 'zod';
import { FEET, OUTCOMES, TECHNIQUES } from '../vocabulary';

/** Most mutations one push may carry. */
export const MAX_PUSH_MUTATIONS = 500;
/** Most changes one pull returns (default 500). */
export const MAX_PULL_LIMIT = 2000;

export { OUTCOMES, TECHNIQUES, type Outcome, type Technique } from '../vocabulary';
export const SYNC_ENTITIES = ['training_session', 'drill', 'kick'] as const;
export type SyncEntity = (typeof SYNC_ENTITIES)[number];

// IFAB Laws of the Game, Law 1: the touchline is at most 120 m, so no kick carries further on a pitch.
const MAX_PITCH_LENGTH_M = 120;

/**
 * Stopwatch readings a kick may carry, s. Below 0.2 s is a double tap, not a flight; no kick stays up
 * 10 s (a 60 m goal kick lands in about 4–5 s). Common practice, no standard.
 */
export const HANG_TIME_RANGE_S: readonly [number, number] = [0.2, 10];

const uuid = (name: string) => z.uuid({ error: `${name} must be a UUID` });
const isoDateTime = (name: string) => z.iso.datetime({ offset: true, error: `${name} must be an ISO 8601 date-time` });
const num = (name: string, min: number, max: number, unit: string) =>
  z
    .number({ error: `${name} must be a number` })
    .min(min, { error: `${name} must be at least ${min} ${unit}` })
    .max(max, { error: `${name} must be at most ${max} ${unit}` });
const step = (name: string, limit: number) =>
  z
    .number({ error: `${name} must be a whole number from −${limit} to ${limit}` })
    .int({ error: `${name} must be a whole number` })
    .min(-limit, { error: `${name} must be at least −${limit}` })
    .max(limit, { error: `${name} must be at most ${limit}` });

/** A kick as it is synced. */
export const kickDataSchema = z.object({
  id: uuid('id'),
  sessionId: uuid('sessionId'),
  drillId: uuid('drillId').nullish(),
  playerId: uuid('playerId'),
  technique: z.enum(TECHNIQUES, { error: `technique must be one of ${TECHNIQUES.join(', ')}` }),
  foot: z.enum(FEET, { error: 'foot must be left or right' }),
  backspinStep: step('backspinStep', 3),
  sidespinStep: step('sidespinStep', 2),
  targetDistanceM: num('targetDistanceM', 1, MAX_PITCH_LENGTH_M, 'm'),
  targetRadiusM: num('targetRadiusM', 0.25, 30, 'm'),
  outcome: z.enum(OUTCOMES, { error: `outcome must be one of ${OUTCOMES.join(', ')}` }),
  carryM: num('carryM', 0, MAX_PITCH_LENGTH_M, 'm').nullish(),
  lateralM: num('lateralM', -75, 75, 'm').nullish(),
  // Maximal instep kicks reach about 35 m/s (Andersen & Dörge 2011); 45 m/s leaves headroom.
  measuredSpeedMs: num('measuredSpeedMs', 0, 45, 'm/s').nullish(),
  launchAngleDeg: num('launchAngleDeg', -10, 90, '°').nullish(),
  measuredSpinRps: num('measuredSpinRps', -30, 30, 'rev/s').nullish(),
  // Pitchside stopwatch reading, contact to first bounce, uncorrected (HANG_TIME_RANGE_S).
  hangTimeS: num('hangTimeS', HANG_TIME_RANGE_S[0], HANG_TIME_RANGE_S[1], 's').nullish(),
  recordedAt: isoDateTime('recordedAt'),
  updatedAt: isoDateTime('updatedAt').optional(),
});
export type KickData = z.infer<typeof kickDataSchema>;

/** A training session and its conditions as it is synced. */
export const sessionDataSchema = z.object({
  id: uuid('id'),
  squadId: uuid('squadId'),
  startedAt: isoDateTime('startedAt'),
  endedAt: isoDateTime('endedAt').nullish(),
  temperatureC: num('temperatureC', -30, 50, '°C').nullish(),
  altitudeM: num('altitudeM', -500, 5000, 'm').nullish(),
  relativeHumidityPct: num('relativeHumidityPct', 0, 100, '%').nullish(),
  pressureHpa: num('pressureHpa', 500, 1100, 'hPa').nullish(),
  windSpeedMs: num('windSpeedMs', 0, 40, 'm/s').nullish(),
  windFromDeg: num('windFromDeg', 0, 360, '°').nullish(),
  ballSize: z.union([z.literal(3), z.literal(4), z.literal(5)], { error: 'ballSize must be 3, 4 or 5' }),
  conditionsSource: z.record(z.string(), z.enum(['coach', 'ground', 'weather', 'default'])).nullish(),
  /** The training ground (absent from older clients' pushes: the server then keeps what it has). */
  groundId: uuid('groundId').nullish(),
  /** When the weather service measured the values whose source is 'weather'. */
  conditionsObservedAt: isoDateTime('conditionsObservedAt').nullish(),
  notes: z.string().max(2000, { error: 'notes must be at most 2000 characters' }).nullish(),
  updatedAt: isoDateTime('updatedAt').optional(),
});
export type SessionData = z.infer<typeof sessionDataSchema>;

/** A drill as it is synced. */
export const drillDataSchema = z.object({
  id: uuid('id'),
  sessionId: uuid('sessionId'),
  technique: z.enum(TECHNIQUES, { error: `technique must be one of ${TECHNIQUES.join(', ')}` }),
  targetDistanceM: num('targetDistanceM', 1, MAX_PITCH_LENGTH_M, 'm'),
  targetRadiusM: num('targetRadiusM', 0.25, 30, 'm'),
  lateralOffsetM: num('lateralOffsetM', -75, 75, 'm').nullish(),
  backspinStep: step('backspinStep', 3).nullish(),
  sidespinStep: step('sidespinStep', 2).nullish(),
  label: z.string().max(120, { error: 'label must be at most 120 characters' }).nullish(),
  updatedAt: isoDateTime('updatedAt').optional(),
});
export type DrillData = z.infer<typeof drillDataSchema>;

/** The schema for each entity's `data`. */
export const ENTITY_SCHEMAS = {
  training_session: sessionDataSchema,
  drill: drillDataSchema,
  kick: kickDataSchema,
} as const;

/** One mutation in a push (the data is validated per entity after this envelope). */
export const mutationSchema = z.object({
  id: uuid('id'),
  entity: z.enum(SYNC_ENTITIES, { error: `entity must be one of ${SYNC_ENTITIES.join(', ')}` }),
  op: z.enum(['upsert', 'delete'], { error: 'op must be upsert or delete' }),
  data: z.record(z.string(), z.unknown(), { error: 'data must be an object' }),
  baseVersion: z.number().int().min(1, { error: 'baseVersion must be a positive whole number' }).optional(),
});
export type Mutation = z.infer<typeof mutationSchema>;

/** Body of `POST /api/sync/push`. */
export const pushRequestSchema = z.strictObject({
  deviceId: z.string({ error: 'deviceId is required' }).min(1, { error: 'deviceId is required' }).max(100),
  mutations: z
    .array(z.unknown(), { error: 'mutations must be an array' })
    .max(MAX_PUSH_MUTATIONS, { error: `at most ${MAX_PUSH_MUTATIONS} mutations per push` }),
});

/** How the server answered one mutation. */
export type MutationStatus = 'applied' | 'duplicate' | 'conflict' | 'rejected';

/** The server's answer for one mutation. */
export interface MutationResult {
  id: string;
  status: MutationStatus;
  error?: { code: string; message: string; fields?: { field: string; message: string }[] };
  /** For `conflict`: the server's row as it stands (the server wins). */
  current?: SyncRow;
}

/** A synced row as the server sends it: the entity's data plus its bookkeeping. */
export type SyncRow = Record<string, unknown> & { id: string; version: number; updatedAt: string; deletedAt: string | null };

/** Answer of `POST /api/sync/push`. */
export interface PushResponse {
  results: MutationResult[];
  /** The server's latest change sequence after this push (the client still pulls from its own cursor). */
  cursor: number;
}

/** One change in a pull. */
export interface SyncChange {
  entity: SyncEntity;
  changeSeq: number;
  data: SyncRow;
}

/** Answer of `GET /api/sync/pull`. */
export interface PullResponse {
  changes: SyncChange[];
  cursor: number;
  hasMore: boolean;
}

/**
 * Which part of the data a pull covers. Without `part`, every change after `since`. A new device
 * first pulls `part=recent&from=<date>`: only sessions started at or after `from` (with their drills
 * and kicks), and the last page's cursor is the club's latest change, so pulling on from it misses
 * nothing new. What it skipped is in `part=history&upTo=<that cursor>` — every row as it stood up to
 * that change, older sessions included — fetched on demand with a cursor of its own; the device keeps
 * any copy it already has (it is as new or newer).
 */
export const PULL_PARTS = ['recent', 'history'] as const;
export type PullPart = (typeof PULL_PARTS)[number];

/** Query of `GET /api/sync/pull`. */
export const pullQuerySchema = z
  .object({
    since: z.coerce.number({ error: 'since must be a number' }).int().min(0, { error: 'since must be 0 or more' }).default(0),
    limit: z.coerce
      .number({ error: 'limit must be a number' })
      .int()
      .min(1, { error: 'limit must be at least 1' })
      .max(MAX_PULL_LIMIT, { error: `limit must be at most ${MAX_PULL_LIMIT}` })
      .default(500),
    part: z.enum(PULL_PARTS, { error: 'part must be recent or history' }).optional(),
    from: isoDateTime('from').optional(),
    upTo: z.coerce.number({ error: 'upTo must be a number' }).int().min(0, { error: 'upTo must be 0 or more' }).optional(),
  })
  .superRefine((q, ctx) => {
    if (q.part === 'recent' && q.from === undefined)
      ctx.addIssue({ code: 'custom', path: ['from'], message: 'from is required with part=recent' });
    if (q.part === 'history' && q.upTo === undefined)
      ctx.addIssue({ code: 'custom', path: ['upTo'], message: 'upTo is required with part=history' });
  });

/** The part of a pull beyond `since`/`limit` (see `pullQuerySchema`). */
export type PullWindow = { part: 'recent'; from: string } | { part: 'history'; upTo: number };
