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
import { FEET, MEASURED_SOURCES, OUTCOMES, TECHNIQUES } from '../vocabulary';

/** Most mutations one push may carry. */
export const MAX_PUSH_MUTATIONS = 500;
/** Most changes one pull returns (default 500). */
export const MAX_PULL_LIMIT = 2000;

export { MEASURED_SOURCES, OUTCOMES, TECHNIQUES, type MeasuredSource, type Outcome, type Technique } from '../vocabulary';
export const SYNC_ENTITIES = ['training_session', 'drill', 'kick'] as const;
export type SyncEntity = (typeof SYNC_ENTITIES)[number];

// IFAB Laws of the Game, Law 1: the touchline is at most 120 m, so no kick carries further on a pitch.
const MAX_PITCH_LENGTH_M = 120;

/**
 * Stopwatch readings a kick may carry, s. Below 0.2 s is a double tap, not a flight; no kick stays up
 * 10 s (a 60 m goal kick lands in about 4–5 s). Common practice, no standard.
 */
export const HANG_TIME_RANGE_S: readonly [number, number] = [0.2, 10];

/** One bound of the model's domain for a measured value. */
export interface DomainRange {
  min: number;
  /** Whether `min` itself is outside (a carry of 0 m is not a flight). */
  minExclusive: boolean;
  max: number;
  unit: string;
}

/**
 * The flight model's domain for the measured values of a kick: what the profile fit can use (its input
 * checks, `prepareKick` in shared/flight: carry in (0, 150] m, lateral in [−60, 60] m, speed in (0, 60] m/s,
 * launch angle in (0, 90] °, measured spin in [0, 30] rev/s — a device reports the total rate, the logged
 * steps give its direction). Sync and both imports refuse values outside it, so a stored kick never breaks
 * a profile; the bounds below are the fit's, tightened where the trade knows better (pitch length, kick speed).
 */
export const KICK_DOMAIN = {
  // IFAB Laws of the Game, Law 1: the touchline is at most 120 m, so no kick carries further on a pitch.
  carryM: { min: 0, minExclusive: true, max: MAX_PITCH_LENGTH_M, unit: 'm' },
  lateralM: { min: -60, minExclusive: false, max: 60, unit: 'm' },
  // Maximal instep kicks reach about 35 m/s (Andersen & Dörge 2011); 45 m/s leaves headroom.
  measuredSpeedMs: { min: 0, minExclusive: true, max: 45, unit: 'm/s' },
  launchAngleDeg: { min: 0, minExclusive: true, max: 90, unit: '°' },
  measuredSpinRps: { min: 0, minExclusive: false, max: 30, unit: 'rev/s' },
} as const satisfies Record<string, DomainRange>;

/** Whether `value` lies in the domain range. */
export function inDomain(range: DomainRange, value: number): boolean {
  return Number.isFinite(value) && (range.minExclusive ? value > range.min : value >= range.min) && value <= range.max;
}

/** The domain range in words, e.g. "more than 0 and at most 120 m". */
export function domainWords(range: DomainRange): string {
  return `${range.minExclusive ? 'more than' : 'at least'} ${range.min} and at most ${range.max} ${range.unit}`;
}

const domainNumber = (name: keyof typeof KICK_DOMAIN) => {
  const r: DomainRange = KICK_DOMAIN[name];
  return z.number({ error: `${name} must be a number` }).refine((v) => inDomain(r, v), { error: `${name} must be ${domainWords(r)}` });
};

/**
 * A UUID, normalised to lower case: ids that differ only in case are the same id (RFC 9562 §4: UUIDs
 * compare case-insensitively), so a replay in capitals can never make a second kick.
 */
const uuid = (name: string) => z.uuid({ error: `${name} must be a UUID` }).transform((s) => s.toLowerCase());

/** Earliest and latest instants a synced date-time may hold (Loftline's data begins well after 2000). */
export const DATE_TIME_BOUNDS = { min: '2000-01-01T00:00:00.000Z', max: '2100-01-01T00:00:00.000Z' } as const;

/**
 * An ISO 8601 date-time with an offset, within DATE_TIME_BOUNDS, stored as UTC (`toISOString()`): every
 * stored instant has one form, so comparing them as text (SQLite) orders them in time.
 */
const isoDateTime = (name: string) =>
  z.iso
    .datetime({ offset: true, error: `${name} must be an ISO 8601 date-time` })
    .refine(
      (s) => {
        const t = Date.parse(s);
        return t >= Date.parse(DATE_TIME_BOUNDS.min) && t < Date.parse(DATE_TIME_BOUNDS.max);
      },
      { error: `${name} must be between the years 2000 and 2099` },
    )
    .transform((s) => new Date(s).toISOString());
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

/**
 * Bounds of a video track as synced: frames of up to 8K pixels (a tap may fall a little outside the
 * frame's edge when zoomed), clips of up to ten minutes, and the solver's own limits on taps and
 * calibration distances (shared/flight/video-track.ts). Common practice, no standard.
 */
export const VIDEO_TRACK_DOMAIN = {
  px: { min: -1000, max: 9000 },
  frameSizePx: { min: 16, max: 8192 },
  timeS: { min: 0, max: 600 },
  alongM: { min: -50, max: 200 },
  points: { min: 5, max: 400 },
  /** The solver's signed backspin (− = topspin), rev/s: the flight model's own spin limit. */
  backspinRps: { min: -30, max: 30 },
} as const;

const pixel = (name: string) => num(name, VIDEO_TRACK_DOMAIN.px.min, VIDEO_TRACK_DOMAIN.px.max, 'px');
const trackMark = (name: string) =>
  z.strictObject(
    {
      xPx: pixel(`${name}.xPx`),
      yPx: pixel(`${name}.yPx`),
      alongM: num(`${name}.alongM`, VIDEO_TRACK_DOMAIN.alongM.min, VIDEO_TRACK_DOMAIN.alongM.max, 'm'),
    },
    { error: `${name} must be an object with xPx, yPx and alongM` },
  );
const nonNegative = (name: string, unit: string) =>
  z
    .number({ error: `${name} must be a number` })
    .min(0, { error: `${name} must be at least 0 ${unit}` })
    .max(1000, { error: `${name} must be at most 1000 ${unit}` });

/**
 * The taps, ground marks and fit behind a video measurement, kept with the kick so the measurement can be
 * checked and solved again (the video itself never leaves the phone). Pixels are of the video's own frame
 * (`frameWidthPx` × `frameHeightPx`), image y downward; times on the video's clock.
 */
export const videoTrackSchema = z.strictObject(
  {
    frameWidthPx: num('videoTrack.frameWidthPx', VIDEO_TRACK_DOMAIN.frameSizePx.min, VIDEO_TRACK_DOMAIN.frameSizePx.max, 'px'),
    frameHeightPx: num('videoTrack.frameHeightPx', VIDEO_TRACK_DOMAIN.frameSizePx.min, VIDEO_TRACK_DOMAIN.frameSizePx.max, 'px'),
    points: z
      .array(
        z.strictObject({
          tS: num('videoTrack.points.tS', VIDEO_TRACK_DOMAIN.timeS.min, VIDEO_TRACK_DOMAIN.timeS.max, 's'),
          xPx: pixel('videoTrack.points.xPx'),
          yPx: pixel('videoTrack.points.yPx'),
        }),
        { error: 'videoTrack.points must be an array' },
      )
      .min(VIDEO_TRACK_DOMAIN.points.min, { error: `videoTrack.points must hold at least ${VIDEO_TRACK_DOMAIN.points.min} taps` })
      .max(VIDEO_TRACK_DOMAIN.points.max, { error: `videoTrack.points must hold at most ${VIDEO_TRACK_DOMAIN.points.max} taps` }),
    calibration: z.strictObject(
      { a: trackMark('videoTrack.calibration.a'), b: trackMark('videoTrack.calibration.b') },
      { error: 'videoTrack.calibration must be an object with a and b' },
    ),
    /** The fit's signed backspin (− = topspin); `measuredSpinRps` holds its size. */
    backspinRps: num('videoTrack.backspinRps', VIDEO_TRACK_DOMAIN.backspinRps.min, VIDEO_TRACK_DOMAIN.backspinRps.max, 'rev/s'),
    contactTimeS: num('videoTrack.contactTimeS', -VIDEO_TRACK_DOMAIN.timeS.max, VIDEO_TRACK_DOMAIN.timeS.max, 's'),
    rmsResidualPx: nonNegative('videoTrack.rmsResidualPx', 'px'),
    /** One standard deviation of each measured value, from the fit's covariance. */
    uncertainty: z.strictObject(
      {
        speedMs: nonNegative('videoTrack.uncertainty.speedMs', 'm/s'),
        elevationDeg: nonNegative('videoTrack.uncertainty.elevationDeg', '°'),
        backspinRps: nonNegative('videoTrack.uncertainty.backspinRps', 'rev/s'),
      },
      { error: 'videoTrack.uncertainty must be an object with speedMs, elevationDeg and backspinRps' },
    ),
  },
  { error: 'videoTrack must be an object' },
);
export type VideoTrack = z.infer<typeof videoTrackSchema>;

/** A kick as it is synced. Unknown fields are refused (a typo must not vanish silently). */
export const kickDataSchema = z
  .strictObject({
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
    // The model's domain (KICK_DOMAIN): a value the fit cannot use is refused here, not discovered by a profile.
    carryM: domainNumber('carryM').nullish(),
    lateralM: domainNumber('lateralM').nullish(),
    measuredSpeedMs: domainNumber('measuredSpeedMs').nullish(),
    launchAngleDeg: domainNumber('launchAngleDeg').nullish(),
    measuredSpinRps: domainNumber('measuredSpinRps').nullish(),
    // Pitchside stopwatch reading, contact to first bounce, uncorrected (HANG_TIME_RANGE_S).
    hangTimeS: num('hangTimeS', HANG_TIME_RANGE_S[0], HANG_TIME_RANGE_S[1], 's').nullish(),
    /** Where the measured values came from (absent from older clients: the server keeps what it has). */
    measuredSource: z.enum(MEASURED_SOURCES, { error: `measuredSource must be one of ${MEASURED_SOURCES.join(', ')}` }).nullish(),
    /** The taps and fit of a video measurement (only with measuredSource 'video'). */
    videoTrack: videoTrackSchema.nullish(),
    recordedAt: isoDateTime('recordedAt'),
    updatedAt: isoDateTime('updatedAt').optional(),
    /** Server-derived (pulled rows carry it, so an edited pulled kick sends it back); ignored on push. */
    stillAirCarryM: z.number({ error: 'stillAirCarryM must be a number' }).nullish(),
  })
  .superRefine((k, ctx) => {
    // A video measurement is the track and its fit together: one without the other cannot be checked.
    if (k.measuredSource === 'video') {
      if (!k.videoTrack)
        ctx.addIssue({ code: 'custom', path: ['videoTrack'], message: 'videoTrack is required when measuredSource is video' });
      for (const f of ['measuredSpeedMs', 'launchAngleDeg', 'measuredSpinRps'] as const) {
        if (k[f] === null || k[f] === undefined)
          ctx.addIssue({ code: 'custom', path: [f], message: `${f} is required when measuredSource is video` });
      }
      if (
        k.videoTrack &&
        k.measuredSpinRps !== null &&
        k.measuredSpinRps !== undefined &&
        Math.abs(Math.abs(k.videoTrack.backspinRps) - k.measuredSpinRps) > 0.05
      )
        ctx.addIssue({ code: 'custom', path: ['measuredSpinRps'], message: 'measuredSpinRps must be the size of videoTrack.backspinRps' });
    } else if (k.videoTrack) {
      ctx.addIssue({ code: 'custom', path: ['measuredSource'], message: 'measuredSource must be video when a videoTrack is given' });
    }
  });
export type KickData = z.infer<typeof kickDataSchema>;

/** The session values whose source is recorded (`conditionsSource` takes no other key). */
export const CONDITION_FIELDS = [
  'temperatureC',
  'altitudeM',
  'relativeHumidityPct',
  'pressureHpa',
  'windSpeedMs',
  'windFromDeg',
  'ballSize',
] as const;
const conditionSource = z.enum(['coach', 'ground', 'weather', 'default'], {
  error: 'each conditionsSource value must be coach, ground, weather or default',
});

/** A training session and its conditions as it is synced. Unknown fields are refused. */
export const sessionDataSchema = z.strictObject({
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
  conditionsSource: z
    .strictObject(
      Object.fromEntries(CONDITION_FIELDS.map((f) => [f, conditionSource.optional()])) as Record<
        (typeof CONDITION_FIELDS)[number],
        z.ZodOptional<typeof conditionSource>
      >,
    )
    .nullish(),
  /** The training ground (absent from older clients' pushes: the server then keeps what it has). */
  groundId: uuid('groundId').nullish(),
  /** When the weather service measured the values whose source is 'weather'. */
  conditionsObservedAt: isoDateTime('conditionsObservedAt').nullish(),
  notes: z.string().max(2000, { error: 'notes must be at most 2000 characters' }).nullish(),
  updatedAt: isoDateTime('updatedAt').optional(),
});
export type SessionData = z.infer<typeof sessionDataSchema>;

/** A drill as it is synced. Unknown fields are refused. */
export const drillDataSchema = z.strictObject({
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

/** `data` of a delete: only the id counts (the device may send the whole row). */
export const deleteDataSchema = z.object({ id: uuid('id') });

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
  deviceId: z
    .string({ error: 'deviceId is required' })
    .min(1, { error: 'deviceId is required' })
    .max(100, { error: 'deviceId must be at most 100 characters' }),
  mutations: z
    .array(z.unknown(), { error: 'mutations must be an array' })
    .max(MAX_PUSH_MUTATIONS, { error: `at most ${MAX_PUSH_MUTATIONS} mutations per push` }),
});

/** How the server answered one mutation. */
export const MUTATION_STATUSES = ['applied', 'duplicate', 'conflict', 'rejected'] as const;
export type MutationStatus = (typeof MUTATION_STATUSES)[number];

/** A synced row as the server sends it: the entity's data plus its bookkeeping. */
export const syncRowSchema = z
  .looseObject({ id: z.string(), version: z.number().int(), updatedAt: z.string(), deletedAt: z.string().nullable() })
  .meta({ id: 'SyncRow', description: "The entity's fields (as in the push payloads) plus its bookkeeping" });
export type SyncRow = z.infer<typeof syncRowSchema>;

/** The server's answer for one mutation. */
export const mutationResultSchema = z
  .object({
    id: z.string(),
    status: z.enum(MUTATION_STATUSES),
    error: z
      .object({ code: z.string(), message: z.string(), fields: z.array(z.object({ field: z.string(), message: z.string() })).optional() })
      .optional(),
    /** For `conflict`: the server's row as it stands (the server wins). */
    current: syncRowSchema.optional(),
  })
  .meta({ id: 'MutationResult' });
export type MutationResult = z.infer<typeof mutationResultSchema>;

/** Answer of `POST /api/sync/push`. */
export const pushResponseSchema = z
  .object({
    results: z.array(mutationResultSchema),
    /** The server's latest change sequence after this push (the client still pulls from its own cursor). */
    cursor: z.number().int(),
  })
  .meta({ id: 'PushResponse' });
export type PushResponse = z.infer<typeof pushResponseSchema>;

/** One change in a pull. */
export const syncChangeSchema = z
  .object({ entity: z.enum(SYNC_ENTITIES), changeSeq: z.number().int(), data: syncRowSchema })
  .meta({ id: 'SyncChange' });
export type SyncChange = z.infer<typeof syncChangeSchema>;

/** Answer of `GET /api/sync/pull`. */
export const pullResponseSchema = z
  .object({ changes: z.array(syncChangeSchema), cursor: z.number().int(), hasMore: z.boolean() })
  .meta({ id: 'PullResponse' });
export type PullResponse = z.infer<typeof pullResponseSchema>;

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
