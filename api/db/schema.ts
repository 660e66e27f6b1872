/**
 * The one Drizzle schema module for Loftline's SQLite database (docs/design.md §5).
 *
 * Conventions: camelCase keys over snake_case columns; timestamps are ISO 8601 UTC text
 * (sortable, readable in a SQL shell, and what the sync payloads carry). Rows a client can
 * create (sessions, drills, kicks) have a client-generated UUID v4 key, `updated_at`,
 * `deleted_at` (tombstone), a per-row `version` for optimistic concurrency and a
 * server-assigned, strictly increasing `change_seq` that the pull cursor follows.
 */
import { DEFAULT_REP_LIMIT_PER_SESSION } from '../../shared/schemas/club';
import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { FEET, MEASURED_SOURCES, OUTCOMES, TECHNIQUES } from '../../shared/vocabulary';

const createdAt = () =>
  text('created_at')
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`);
const updatedAt = () =>
  text('updated_at')
    .notNull()
    .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`);

/** A club (or academy). Every other row hangs off one, and every query is scoped by it. */
export const clubs = sqliteTable('clubs', {
  id: text('id').primaryKey(),
  name: text('name').notNull(),
  timezone: text('timezone').notNull().default('Europe/London'),
  /** Repetitions per player per session above which Pitchside shows the kicking-load caution. */
  repLimitPerSession: integer('rep_limit_per_session').notNull().default(DEFAULT_REP_LIMIT_PER_SESSION),
  /** Weekday (0 = Sunday … 6 = Saturday) and local time (HH:MM, club time zone) of the weekly digests. */
  digestWeekday: integer('digest_weekday').notNull().default(1),
  digestTime: text('digest_time').notNull().default('07:00'),
  /** Optional club-tuned spin-step rates (JSON), overriding the flight model's defaults. */
  spinStepsJson: text('spin_steps_json'),
  /**
   * Hang-time stopwatch: mean of (tapped time − true flight time), seconds, and its spread. Two human
   * taps add reaction delays (common practice: about 0.2 s in all); a club can calibrate both from video.
   */
  timingBiasS: real('timing_bias_s').notNull().default(0.2),
  timingSdS: real('timing_sd_s').notNull().default(0.08),
  /**
   * Reynolds number at the centre of the drag crisis of the club's balls; null = the flight model's
   * default (the Goff & Carré 2010 ball). Balls differ (Asai et al. 2007: critical Re 2.2–3.0 × 10⁵).
   */
  dragCrisisRe: real('drag_crisis_re'),
  /** The unit the club's screens, charts, exports and mail show distances in ('m' or 'yd'); storage stays metres. */
  distanceUnit: text('distance_unit', { enum: ['m', 'yd'] })
    .notNull()
    .default('m'),
  /** BCP 47 tag for the club's numbers, dates and times (decimal mark, clock, first day of the week). */
  locale: text('locale').notNull().default('en-GB'),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

/** Where a club trains: used to prefill altitude and to turn compass wind into head/tail wind. */
export const trainingGrounds = sqliteTable(
  'training_grounds',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    name: text('name').notNull(),
    latitude: real('latitude'),
    longitude: real('longitude'),
    altitudeM: real('altitude_m').notNull().default(0),
    /** Compass bearing (degrees from north) of the main kicking direction on this ground. */
    kickingBearingDeg: real('kicking_bearing_deg').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('training_grounds_club_idx').on(t.clubId)],
);

/**
 * The last answer of the weather service for a ground, so replicas of the API share one cache and a
 * squad of phones starting sessions together costs one call. The coordinates asked about are kept:
 * an answer for a ground whose position has since been corrected is not reused.
 */
export const groundConditions = sqliteTable('ground_conditions', {
  groundId: text('ground_id')
    .primaryKey()
    .references(() => trainingGrounds.id),
  latitude: real('latitude').notNull(),
  longitude: real('longitude').notNull(),
  fetchedAt: text('fetched_at').notNull(),
  observedAt: text('observed_at').notNull(),
  temperatureC: real('temperature_c').notNull(),
  relativeHumidityPct: real('relative_humidity_pct').notNull(),
  pressureHpa: real('pressure_hpa').notNull(),
  windSpeedMs: real('wind_speed_ms').notNull(),
  /** Compass bearing the wind blows from (WMO convention), not relative to the kicking direction. */
  windFromBearingDeg: real('wind_from_bearing_deg').notNull(),
});

/** Accounts. `role` is one of docs/design.md §2's five roles. */
export const users = sqliteTable(
  'users',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    email: text('email').notNull(),
    displayName: text('display_name').notNull(),
    role: text('role', { enum: ['admin', 'head_coach', 'assistant_coach', 'player', 'guardian'] }).notNull(),
    passwordHash: text('password_hash'),
    disabledAt: text('disabled_at'),
    invitedAt: text('invited_at'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('users_email_uq').on(t.email), index('users_club_idx').on(t.clubId)],
);

/** Refresh tokens, stored as SHA-256 hashes; rotation keeps a family so reuse can revoke it. */
export const refreshTokens = sqliteTable(
  'refresh_tokens',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    familyId: text('family_id').notNull(),
    tokenHash: text('token_hash').notNull(),
    /**
     * When the family ends whatever its rotations (sign-in + 90 days), copied to each rotated token.
     * Null only on rows written before the column existed; those fall back to `expires_at`.
     */
    familyExpiresAt: text('family_expires_at'),
    createdAt: createdAt(),
    expiresAt: text('expires_at').notNull(),
    revokedAt: text('revoked_at'),
    replacedById: text('replaced_by_id'),
  },
  (t) => [uniqueIndex('refresh_tokens_hash_uq').on(t.tokenHash), index('refresh_tokens_family_idx').on(t.familyId)],
);

/** A squad (age group team) with the ball size it trains with. */
export const squads = sqliteTable(
  'squads',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    name: text('name').notNull(),
    ageGroup: text('age_group').notNull(),
    ballSize: integer('ball_size').notNull().default(5),
    groundId: text('ground_id').references(() => trainingGrounds.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    deletedAt: text('deleted_at'),
  },
  (t) => [index('squads_club_idx').on(t.clubId)],
);

/** Which staff work with which squad (head coaches and assistant coaches). */
export const squadStaff = sqliteTable(
  'squad_staff',
  {
    squadId: text('squad_id')
      .notNull()
      .references(() => squads.id),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.squadId, t.userId] }), index('squad_staff_user_idx').on(t.userId)],
);

/** A player on a squad; `userId` links the player's own account when they have one. */
export const players = sqliteTable(
  'players',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    squadId: text('squad_id')
      .notNull()
      .references(() => squads.id),
    userId: text('user_id').references(() => users.id),
    displayName: text('display_name').notNull(),
    shirtNumber: integer('shirt_number'),
    dominantFoot: text('dominant_foot', { enum: FEET }).notNull().default('right'),
    birthDate: text('birth_date'),
    /** An adult player's own opt-in to Family digests about them (docs/design.md §10: none for adults otherwise). */
    digestSelfOptIn: integer('digest_self_opt_in', { mode: 'boolean' }).notNull().default(false),
    /** When the player was erased on request: an erased row never comes back (a roster import creates a new one). */
    erasedAt: text('erased_at'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    deletedAt: text('deleted_at'),
  },
  (t) => [index('players_squad_idx').on(t.squadId), index('players_club_idx').on(t.clubId), uniqueIndex('players_user_uq').on(t.userId)],
);

/** Guardian ↔ player links with the consent record a Family digest requires. */
export const guardianLinks = sqliteTable(
  'guardian_links',
  {
    id: text('id').primaryKey(),
    guardianUserId: text('guardian_user_id')
      .notNull()
      .references(() => users.id),
    playerId: text('player_id')
      .notNull()
      .references(() => players.id),
    relationship: text('relationship').notNull().default('guardian'),
    consentAt: text('consent_at'),
    consentRecordedBy: text('consent_recorded_by').references(() => users.id),
    /** Version of the consent text the guardian agreed to. */
    consentTextVersion: text('consent_text_version'),
    consentWithdrawnAt: text('consent_withdrawn_at'),
    digestOptIn: integer('digest_opt_in', { mode: 'boolean' }).notNull().default(false),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex('guardian_links_pair_uq').on(t.guardianUserId, t.playerId), index('guardian_links_player_idx').on(t.playerId)],
);

/** A training session and its conditions (client-created, synced). */
export const trainingSessions = sqliteTable(
  'training_sessions',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    squadId: text('squad_id')
      .notNull()
      .references(() => squads.id),
    groundId: text('ground_id').references(() => trainingGrounds.id),
    startedAt: text('started_at').notNull(),
    endedAt: text('ended_at'),
    temperatureC: real('temperature_c'),
    altitudeM: real('altitude_m'),
    relativeHumidityPct: real('relative_humidity_pct'),
    pressureHpa: real('pressure_hpa'),
    windSpeedMs: real('wind_speed_ms'),
    /** Wind direction relative to the main kicking direction: 0 = headwind, 90 = from the left, 180 = tailwind. */
    windFromDeg: real('wind_from_deg'),
    ballSize: integer('ball_size').notNull().default(5),
    /** JSON map of condition field → where it came from ('coach', 'ground', 'weather', 'default'). */
    conditionsSourceJson: text('conditions_source_json'),
    /** When the weather service measured the values whose source is 'weather' (ISO 8601 UTC); null when none is. */
    conditionsObservedAt: text('conditions_observed_at'),
    notes: text('notes'),
    recordedBy: text('recorded_by').references(() => users.id),
    deviceId: text('device_id'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    deletedAt: text('deleted_at'),
    version: integer('version').notNull().default(1),
    changeSeq: integer('change_seq').notNull(),
  },
  (t) => [
    index('training_sessions_squad_started_idx').on(t.squadId, t.startedAt),
    index('training_sessions_club_seq_idx').on(t.clubId, t.changeSeq),
  ],
);

/** A drill within a session: technique, target and default spin (client-created, synced). */
export const drills = sqliteTable(
  'drills',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    sessionId: text('session_id')
      .notNull()
      .references(() => trainingSessions.id),
    technique: text('technique', { enum: TECHNIQUES }).notNull(),
    targetDistanceM: real('target_distance_m').notNull(),
    targetRadiusM: real('target_radius_m').notNull(),
    lateralOffsetM: real('lateral_offset_m').notNull().default(0),
    backspinStep: integer('backspin_step').notNull().default(0),
    sidespinStep: integer('sidespin_step').notNull().default(0),
    label: text('label'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    deletedAt: text('deleted_at'),
    version: integer('version').notNull().default(1),
    changeSeq: integer('change_seq').notNull(),
  },
  (t) => [index('drills_session_idx').on(t.sessionId), index('drills_club_seq_idx').on(t.clubId, t.changeSeq)],
);

/** One kicking repetition (client-created, synced). */
export const kicks = sqliteTable(
  'kicks',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    sessionId: text('session_id')
      .notNull()
      .references(() => trainingSessions.id),
    drillId: text('drill_id').references(() => drills.id),
    playerId: text('player_id')
      .notNull()
      .references(() => players.id),
    technique: text('technique', { enum: TECHNIQUES }).notNull(),
    foot: text('foot', { enum: FEET }).notNull(),
    /** −3..3, + = backspin (docs/design.md §3 seven-step scale). */
    backspinStep: integer('backspin_step').notNull().default(0),
    /** −2..2, + = curls left (docs/design.md §3 five-step scale). */
    sidespinStep: integer('sidespin_step').notNull().default(0),
    targetDistanceM: real('target_distance_m').notNull(),
    targetRadiusM: real('target_radius_m').notNull(),
    outcome: text('outcome', { enum: OUTCOMES }).notNull(),
    carryM: real('carry_m'),
    /** `carry_m` normalised through the flight model to still air at ISA sea level, 15 °C (server-computed). */
    stillAirCarryM: real('still_air_carry_m'),
    /** Landing offset from the aim line, metres, + = the kicker's left (docs/design.md §6 y axis). */
    lateralM: real('lateral_m'),
    measuredSpeedMs: real('measured_speed_ms'),
    launchAngleDeg: real('launch_angle_deg'),
    measuredSpinRps: real('measured_spin_rps'),
    /** Hang time as tapped on the Pitchside stopwatch (foot contact → first bounce), seconds, uncorrected. */
    hangTimeS: real('hang_time_s'),
    /** Where the measured speed, angle and spin came from: 'device' (an import) or 'video' (a solved phone track). */
    measuredSource: text('measured_source', { enum: MEASURED_SOURCES }),
    /** A video measurement's taps, ground marks and fit (shared/schemas/sync.ts `videoTrackSchema`), JSON. */
    videoTrackJson: text('video_track_json'),
    recordedAt: text('recorded_at').notNull(),
    recordedBy: text('recorded_by').references(() => users.id),
    deviceId: text('device_id'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    deletedAt: text('deleted_at'),
    version: integer('version').notNull().default(1),
    changeSeq: integer('change_seq').notNull(),
  },
  (t) => [
    index('kicks_player_recorded_idx').on(t.playerId, t.recordedAt),
    index('kicks_session_idx').on(t.sessionId),
    index('kicks_club_seq_idx').on(t.clubId, t.changeSeq),
    index('kicks_player_technique_seq_idx').on(t.playerId, t.technique, t.changeSeq),
    // The still-air refresher's work list: without it each tick scans the whole table (200 ms at 1M kicks).
    index('kicks_still_air_pending_idx')
      .on(t.changeSeq)
      .where(sql`carry_m IS NOT NULL AND still_air_carry_m IS NULL`),
  ],
);

/**
 * Cached launch profile per player and technique (fitProfile + a standard-conditions envelope),
 * recomputed when the player's kicks of that technique change (`kicks_seq` falls behind).
 */
export const playerProfiles = sqliteTable(
  'player_profiles',
  {
    playerId: text('player_id')
      .notNull()
      .references(() => players.id),
    technique: text('technique', { enum: TECHNIQUES }).notNull(),
    /** Highest kick change_seq the cached profile saw. */
    kicksSeq: integer('kicks_seq').notNull(),
    repetitions: integer('repetitions').notNull(),
    profileJson: text('profile_json'),
    /** Landing cloud at standard conditions (JSON `{ xM, yM }`), for hit probabilities and calibration. */
    cloudJson: text('cloud_json'),
    /** Hit probability by target distance and radius at standard conditions (JSON `ReachCurve`). */
    reachCurveJson: text('reach_curve_json'),
    reliableReachM: real('reliable_reach_m'),
    reachRadiusM: real('reach_radius_m').notNull(),
    /** Version of the profile model that wrote the row; rows of an older model are recomputed. */
    modelVersion: integer('model_version').notNull().default(1),
    /** Stored kicks the fit left out because the model cannot use them (outside its domain), reported with the profile. */
    skippedKicks: integer('skipped_kicks').notNull().default(0),
    computedAt: text('computed_at').notNull(),
  },
  (t) => [primaryKey({ columns: [t.playerId, t.technique] })],
);

/** Sync idempotency: each mutation id is applied at most once; replays are acknowledged. */
export const appliedMutations = sqliteTable(
  'applied_mutations',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    deviceId: text('device_id'),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    status: text('status').notNull(),
    appliedAt: createdAt(),
  },
  (t) => [index('applied_mutations_user_idx').on(t.userId)],
);

/** The single server-wide counter that hands out `change_seq` values. */
export const changeCounter = sqliteTable('change_counter', {
  id: integer('id').primaryKey(),
  lastSeq: integer('last_seq').notNull().default(0),
});

/** Uploaded CSV files (roster and measured-kick imports) awaiting preview and commit. */
export const uploads = sqliteTable(
  'uploads',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    uploadedBy: text('uploaded_by')
      .notNull()
      .references(() => users.id),
    kind: text('kind', { enum: ['roster', 'measured_kicks'] }).notNull(),
    filename: text('filename').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    /** SHA-256 of the file (plus, for kicks, the mapping): the same upload is recognised and not applied twice. */
    contentHash: text('content_hash'),
    /** What the commit did (JSON), returned again when the same file comes back. */
    summaryJson: text('summary_json'),
    content: text('content').notNull(),
    status: text('status', { enum: ['uploaded', 'previewed', 'committed', 'failed'] })
      .notNull()
      .default('uploaded'),
    error: text('error'),
    createdAt: createdAt(),
    committedAt: text('committed_at'),
  },
  (t) => [index('uploads_club_idx').on(t.clubId), index('uploads_hash_idx').on(t.clubId, t.kind, t.contentHash)],
);

/** Every outgoing e-mail, written before sending so a crash never loses or doubles one. */
export const mailOutbox = sqliteTable(
  'mail_outbox',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id').references(() => clubs.id),
    kind: text('kind', { enum: ['invite', 'password_reset', 'family_digest', 'squad_week'] }).notNull(),
    /** Idempotency key, e.g. `family_digest:<linkId>:<weekStart>`: a job run twice sends once. */
    dedupeKey: text('dedupe_key').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body'),
    /** Extra headers (JSON), e.g. List-Unsubscribe. */
    headersJson: text('headers_json'),
    /** Inline attachments (JSON: filename, cid, contentType, base64 content). */
    attachmentsJson: text('attachments_json'),
    status: text('status', { enum: ['queued', 'sent', 'failed'] })
      .notNull()
      .default('queued'),
    attempts: integer('attempts').notNull().default(0),
    lastError: text('last_error'),
    nextAttemptAt: text('next_attempt_at'),
    createdAt: createdAt(),
    sentAt: text('sent_at'),
  },
  (t) => [uniqueIndex('mail_outbox_dedupe_uq').on(t.dedupeKey), index('mail_outbox_status_idx').on(t.status)],
);

/** One row per scheduled digest run, so a job that fires twice does its work once. */
export const digestRuns = sqliteTable(
  'digest_runs',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id')
      .notNull()
      .references(() => clubs.id),
    kind: text('kind', { enum: ['family_digest', 'squad_week'] }).notNull(),
    periodStart: text('period_start').notNull(),
    status: text('status', { enum: ['running', 'done', 'failed'] })
      .notNull()
      .default('running'),
    sentCount: integer('sent_count').notNull().default(0),
    startedAt: createdAt(),
    finishedAt: text('finished_at'),
  },
  (t) => [uniqueIndex('digest_runs_period_uq').on(t.clubId, t.kind, t.periodStart)],
);

/** Who did what, for safeguarding and data-protection questions. */
export const auditLog = sqliteTable(
  'audit_log',
  {
    id: text('id').primaryKey(),
    clubId: text('club_id').references(() => clubs.id),
    userId: text('user_id').references(() => users.id),
    action: text('action').notNull(),
    entity: text('entity'),
    entityId: text('entity_id'),
    detailJson: text('detail_json'),
    at: createdAt(),
  },
  (t) => [index('audit_log_club_at_idx').on(t.clubId, t.at)],
);

/** Single-use account tokens (invites: 7 days; password resets: 1 hour), stored as hashes. */
export const accountTokens = sqliteTable(
  'account_tokens',
  {
    id: text('id').primaryKey(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id),
    kind: text('kind', { enum: ['invite', 'reset'] }).notNull(),
    tokenHash: text('token_hash').notNull(),
    expiresAt: text('expires_at').notNull(),
    usedAt: text('used_at'),
    createdBy: text('created_by').references(() => users.id),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('account_tokens_hash_uq').on(t.tokenHash), index('account_tokens_user_idx').on(t.userId)],
);

/** Messages the local fake SMTP server received (development, tests and the demo only). */
export const capturedMail = sqliteTable(
  'captured_mail',
  {
    id: text('id').primaryKey(),
    fromAddress: text('from_address').notNull(),
    toJson: text('to_json').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body'),
    headersJson: text('headers_json').notNull(),
    attachmentCount: integer('attachment_count').notNull().default(0),
    receivedAt: text('received_at')
      .notNull()
      .default(sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`),
  },
  (t) => [index('captured_mail_received_idx').on(t.receivedAt)],
);
