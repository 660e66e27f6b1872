/**
 * Launch profiles per player and technique, fitted with the shared flight model and cached in
 * `player_profiles` until new kicks arrive. Single requests compute on demand; lists (Squad
 * week, planner ranking) answer from the cache and let a background refresher catch up in
 * small slices so the event loop is never blocked for long.
 */
import { Worker } from 'node:worker_threads';
import {
  CURVE_SAMPLES,
  fitProfile,
  reachCurve,
  reachWarnings,
  reliableReachM,
  type KickProfile,
  type ReachCurve,
} from '../../shared/flight/index';
import type { ProfileEntry } from '../../shared/schemas/analysis';
import type { Technique } from '../../shared/schemas/sync';
import type { Db } from '../db/client';
import { playerProfiles } from '../db/schema';
import { cachedStatement } from '../db/statements';
import { heldOutCalibration, type HeldOutCalibration } from './calibration';
import { usableKicks } from './usable-kicks';
import { loggedKickOf, standardConditions, type SessionConditions, type StoredKick } from './flight-inputs';

/** Monte Carlo samples of the cached standard-conditions reach curve (the client draws with the same). */
export const PROFILE_ENVELOPE_SAMPLES = CURVE_SAMPLES;
/** Fixed seed: the same kicks always give the same cached numbers. */
export const PROFILE_ENVELOPE_SEED = 20_260_101;
/**
 * Version of the profile model. 2: launch speed relative to the speed each target needs, with a
 * ceiling, and reach curves per distance (rows of version 1 pooled every target into one speed spread).
 * 3: launch angle and spin uncertainty integrated into the fit and drawn by sampling, a physiological
 * speed cap, a one-sided ceiling posterior, priors by ball size, and warnings. 4: the coach's eye taken
 * out of logged spin (profile-spin.ts), speed read against the usual launch, aim read against the usual
 * ball's aim-off with its unknown turn as per-observation variance, and a speed-spread prior about need.
 * 5: launch noise drawn by Latin hypercube (sampling.ts), so cached reach curves lose their seed's luck;
 * the launch shift's curvature variance scaled by λ⁴ in the speed fit (profile-speed-fit.ts).
 */
export const PROFILE_MODEL_VERSION = 5;
/** Target radius used for reliable reach when a player's logs give none (common practice). */
export const DEFAULT_REACH_RADIUS_M = 3;

type CachedRow = typeof playerProfiles.$inferSelect;

/** A session's ball size as the priors know it (anything else is treated as 5, as `ballOf` does). */
function squadBallSize(size: number): 3 | 4 | 5 {
  return size === 3 || size === 4 ? size : 5;
}

/**
 * How long the API must have been quiet before the refresher fits another profile, ms. A fit holds the
 * event loop for tens of milliseconds; under load the refits wait (lists answer `pending`) so pushes
 * and queries keep their latency.
 */
export const REFRESH_IDLE_MS = 150;
/** Rest of the worker between fits while requests are coming in, ms. */
const WORKER_REST_MS = 250;
/** Held-out calibrations kept in memory (oldest dropped first); each is refitted when the player's kicks change. */
const MAX_CALIBRATIONS = 5000;
/** Queue keys of held-out calibrations start with this (profile keys are `player|technique`). */
const CALIBRATION_KEY = 'cal|';

/** A job of the refresher: a profile fit, or a week's held-out calibration. */
export type RefreshJob =
  | { kind: 'profile'; playerId: string; technique: Technique }
  | { kind: 'calibration'; playerId: string; technique: Technique; weekStart: string };

/** A computed held-out calibration, valid while the player's kicks of the technique stay at `kicksSeq`. */
export interface CalibrationResult {
  key: string;
  kicksSeq: number;
  value: HeldOutCalibration;
}

function jobOf(key: string): RefreshJob {
  if (key.startsWith(CALIBRATION_KEY)) {
    const [, playerId, technique, weekStart] = key.split('|') as [string, string, Technique, string];
    return { kind: 'calibration', playerId, technique, weekStart };
  }
  const [playerId, technique] = key.split('|') as [string, Technique];
  return { kind: 'profile', playerId, technique };
}

/** Computes, caches and serves launch profiles. */
export class ProfileCache {
  private readonly queue = new Set<string>();
  private timer: NodeJS.Immediate | null = null;
  private wait: NodeJS.Timeout | null = null;
  private running = false;
  private lastRequestAt = Number.NEGATIVE_INFINITY;
  private worker: Worker | null = null;
  private inFlight = false;
  private readonly calibrations = new Map<string, { kicksSeq: number; value: HeldOutCalibration }>();

  /** `workerDbPath`: fit in a worker thread on its own connection to this file (the server's way). */
  constructor(
    private readonly db: Db,
    private readonly workerDbPath: string | null = null,
  ) {}

  /** The highest change_seq among a player's kicks of one technique (tombstones included: a void changes the fit). */
  private kicksSeq(playerId: string, technique: Technique): number {
    const row = cachedStatement(this.db.$client, 'SELECT MAX(change_seq) AS s FROM kicks WHERE player_id = ? AND technique = ?').get(
      playerId,
      technique,
    ) as {
      s: number | null;
    };
    return row.s ?? 0;
  }

  private cached(playerId: string, technique: Technique): CachedRow | undefined {
    // A prepared statement: Squad week reads ~100 of these per request, and building the query each time cost more than the read.
    return cachedStatement(
      this.db.$client,
      `SELECT player_id AS playerId, technique, kicks_seq AS kicksSeq, repetitions, profile_json AS profileJson, cloud_json AS cloudJson,
              reach_curve_json AS reachCurveJson, reliable_reach_m AS reliableReachM, reach_radius_m AS reachRadiusM,
              model_version AS modelVersion, skipped_kicks AS skippedKicks, computed_at AS computedAt
         FROM player_profiles WHERE player_id = ? AND technique = ?`,
    ).get(playerId, technique) as CachedRow | undefined;
  }

  /** Whether the cache is missing or behind the player's kicks. */
  isStale(playerId: string, technique: Technique): boolean {
    const row = this.cached(playerId, technique);
    return !row || row.modelVersion < PROFILE_MODEL_VERSION || row.kicksSeq < this.kicksSeq(playerId, technique);
  }

  /** The stopwatch calibration of the player's club (timed repetitions are solved with it). */
  private timingOf(playerId: string): { biasS: number; sdS: number } {
    const row = this.db.$client
      .prepare('SELECT c.timing_bias_s AS biasS, c.timing_sd_s AS sdS FROM players p JOIN clubs c ON c.id = p.club_id WHERE p.id = ?')
      .get(playerId) as { biasS: number; sdS: number } | undefined;
    return row ?? { biasS: 0.2, sdS: 0.08 };
  }

  /**
   * The held-out calibration of a player's technique for a week, or 'pending' while the refresher
   * computes it (queued here). Cached until the player's kicks of that technique change.
   */
  calibration(playerId: string, technique: Technique, weekStart: string): HeldOutCalibration | 'pending' {
    const key = `${CALIBRATION_KEY}${playerId}|${technique}|${weekStart}`;
    const hit = this.calibrations.get(key);
    if (hit && hit.kicksSeq === this.kicksSeq(playerId, technique)) return hit.value;
    this.enqueueKey(key);
    return 'pending';
  }

  /** Computes a held-out calibration now (the refresher's job; also the worker's). */
  computeCalibration(playerId: string, technique: Technique, weekStart: string): CalibrationResult {
    const kicksSeq = this.kicksSeq(playerId, technique);
    const value = heldOutCalibration(this.db, playerId, technique, weekStart, this.timingOf(playerId));
    return { key: `${CALIBRATION_KEY}${playerId}|${technique}|${weekStart}`, kicksSeq, value };
  }

  /** Keeps a computed calibration. */
  storeCalibration(result: CalibrationResult): void {
    this.calibrations.delete(result.key);
    this.calibrations.set(result.key, { kicksSeq: result.kicksSeq, value: result.value });
    if (this.calibrations.size > MAX_CALIBRATIONS) this.calibrations.delete(this.calibrations.keys().next().value!);
  }

  /** Runs one refresher job in this thread. */
  runJob(job: RefreshJob): CalibrationResult | null {
    if (job.kind === 'calibration') return this.computeCalibration(job.playerId, job.technique, job.weekStart);
    if (this.isStale(job.playerId, job.technique)) this.compute(job.playerId, job.technique);
    return null;
  }

  /** Fits and stores one profile now. */
  compute(playerId: string, technique: Technique): CachedRow {
    const seq = this.kicksSeq(playerId, technique);
    const stored = this.db.$client
      .prepare(
        `SELECT k.technique, k.outcome, k.target_distance_m AS targetDistanceM, k.target_radius_m AS targetRadiusM,
                k.backspin_step AS backspinStep, k.sidespin_step AS sidespinStep, k.carry_m AS carryM, k.lateral_m AS lateralM,
                k.measured_speed_ms AS measuredSpeedMs, k.launch_angle_deg AS launchAngleDeg, k.measured_spin_rps AS measuredSpinRps, k.measured_source AS measuredSource,
                k.hang_time_s AS hangTimeS, s.temperature_c AS temperatureC, s.altitude_m AS altitudeM, s.relative_humidity_pct AS relativeHumidityPct,
                s.pressure_hpa AS pressureHpa, s.wind_speed_ms AS windSpeedMs, s.wind_from_deg AS windFromDeg, s.ball_size AS ballSize,
                s.conditions_source_json AS conditionsSourceJson, (SELECT c.drag_crisis_re FROM clubs c WHERE c.id = s.club_id) AS dragCrisisRe
           FROM kicks k JOIN training_sessions s ON s.id = k.session_id
          WHERE k.player_id = ? AND k.technique = ? AND k.deleted_at IS NULL AND s.deleted_at IS NULL
          ORDER BY k.recorded_at DESC LIMIT 400`,
      )
      .all(playerId, technique) as (StoredKick & SessionConditions)[];
    // Rows outside the model's domain are skipped and reported, never allowed to fail the whole profile.
    const { usable: rows, skipped } = usableKicks(stored);
    let skippedKicks = skipped;
    const radii = rows.map((r) => r.targetRadiusM).sort((a, b) => a - b);
    const reachRadiusM = radii.length ? radii[Math.floor(radii.length / 2)]! : DEFAULT_REACH_RADIUS_M;
    let profile: KickProfile | null = null;
    let curve: ReachCurve | null = null;
    let reach: number | null = null;
    if (rows.length > 0) {
      try {
        const ballSize = squadBallSize(rows[0]!.ballSize);
        const fitted = fitProfile(
          rows.map((r) => loggedKickOf(r, r)),
          undefined,
          { timing: this.timingOf(playerId), ballSize },
        );
        curve = reachCurve(fitted, standardConditions(ballSize, rows[0]!.dragCrisisRe), {
          samples: PROFILE_ENVELOPE_SAMPLES,
          seed: PROFILE_ENVELOPE_SEED,
        });
        reach = reliableReachM(curve, reachRadiusM);
        // Reach beyond the longest distance drilled is the model's and the prior's, not the logs': say so.
        profile = { ...fitted, warnings: reachWarnings(fitted, reach) };
      } catch (err) {
        // The model refused input these checks did not foresee: answer "no profile, N kicks skipped", not a 500.
        if (!(err instanceof RangeError)) throw err;
        profile = null;
        curve = null;
        reach = null;
        skippedKicks = stored.length;
      }
    }
    const row: CachedRow = {
      playerId,
      technique,
      kicksSeq: seq,
      repetitions: profile?.repetitions ?? 0,
      profileJson: profile ? JSON.stringify(profile) : null,
      cloudJson: null,
      reachCurveJson: curve ? JSON.stringify(curve) : null,
      reliableReachM: reach,
      modelVersion: PROFILE_MODEL_VERSION,
      reachRadiusM,
      skippedKicks,
      computedAt: new Date().toISOString(),
    };
    this.db
      .insert(playerProfiles)
      .values(row)
      .onConflictDoUpdate({ target: [playerProfiles.playerId, playerProfiles.technique], set: row })
      .run();
    return row;
  }

  /** The profile entry, computed now if stale (one fit: a fraction of a second). */
  get(playerId: string, technique: Technique): ProfileEntry {
    const row = this.isStale(playerId, technique) ? this.compute(playerId, technique) : this.cached(playerId, technique)!;
    return toEntry(row, false);
  }

  /** The cached entry without computing; stale or missing ones are queued for the refresher. */
  peek(playerId: string, technique: Technique): ProfileEntry {
    const row = this.cached(playerId, technique);
    const stale = !row || row.modelVersion < PROFILE_MODEL_VERSION || row.kicksSeq < this.kicksSeq(playerId, technique);
    if (stale) this.enqueue(playerId, technique);
    if (!row) {
      return {
        playerId,
        technique,
        profile: null,
        repetitions: 0,
        reliableReachM: null,
        reachRadiusM: DEFAULT_REACH_RADIUS_M,
        computedAt: null,
        pending: true,
        skippedKicks: 0,
      };
    }
    return toEntry(row, stale);
  }

  /** The cached reach curve (standard conditions) of the current model, if any. */
  curve(playerId: string, technique: Technique): ReachCurve | null {
    const row = this.cached(playerId, technique);
    return row?.reachCurveJson && row.modelVersion >= PROFILE_MODEL_VERSION ? (JSON.parse(row.reachCurveJson) as ReachCurve) : null;
  }

  /** Queues a recomputation for the background refresher. */
  enqueue(playerId: string, technique: Technique): void {
    this.enqueueKey(`${playerId}|${technique}`);
  }

  private enqueueKey(key: string): void {
    this.queue.add(key);
    if (this.running) this.schedule();
  }

  /** Queues every stale player × technique that has kicks. */
  enqueueAllStale(): number {
    const pairs = this.db.$client
      .prepare(
        `SELECT k.player_id AS playerId, k.technique AS technique, MAX(k.change_seq) AS s, p.kicks_seq AS cached
           FROM kicks k LEFT JOIN player_profiles p ON p.player_id = k.player_id AND p.technique = k.technique
          GROUP BY k.player_id, k.technique HAVING cached IS NULL OR cached < s OR MAX(p.model_version) < ${PROFILE_MODEL_VERSION}`,
      )
      .all() as { playerId: string; technique: Technique }[];
    for (const p of pairs) this.queue.add(`${p.playerId}|${p.technique}`);
    if (this.running) this.schedule();
    return pairs.length;
  }

  /**
   * Starts the background refresher: in a worker thread when a database file was given (one fit at a
   * time, off the API's event loop), else one fit per quiet event-loop turn.
   */
  start(): void {
    this.running = true;
    if (this.workerDbPath && this.workerDbPath !== ':memory:' && !this.worker) this.startWorker(this.workerDbPath);
    this.enqueueAllStale();
    this.schedule();
  }

  private startWorker(dbPath: string): void {
    const worker = new Worker(new URL('./profile-worker-boot.mjs', import.meta.url), { workerData: { dbPath } });
    worker.unref();
    worker.on('message', (reply: { ok: boolean; calibration?: CalibrationResult | null }) => {
      this.inFlight = false;
      if (reply.calibration) this.storeCalibration(reply.calibration);
      // Under API load the worker rests between fits, leaving the other core to the requests.
      if (performance.now() - this.lastRequestAt < REFRESH_IDLE_MS) {
        this.wait ??= setTimeout(() => {
          this.wait = null;
          this.schedule();
        }, WORKER_REST_MS);
        this.wait.unref();
      } else this.schedule();
    });
    const fallBack = (): void => {
      // Without the worker the refresher carries on in-process rather than leave profiles stale.
      if (this.worker !== worker) return;
      this.worker = null;
      this.inFlight = false;
      this.schedule();
    };
    worker.on('error', fallBack);
    worker.on('exit', fallBack);
    this.worker = worker;
  }

  /** Stops the refresher. */
  stop(): void {
    this.running = false;
    const worker = this.worker;
    this.worker = null;
    if (worker) void worker.terminate();
    if (this.timer) clearImmediate(this.timer);
    if (this.wait) clearTimeout(this.wait);
    this.timer = null;
    this.wait = null;
  }

  /** Notes API traffic: the refresher waits until the API has been quiet for REFRESH_IDLE_MS. */
  noteRequest(): void {
    this.lastRequestAt = performance.now();
  }

  /** Number of queued recomputations. */
  get queued(): number {
    return this.queue.size;
  }

  private schedule(): void {
    if (this.worker) {
      if (this.inFlight || this.wait || !this.running) return;
      const next = this.queue.values().next();
      if (next.done) return;
      this.queue.delete(next.value);
      this.inFlight = true;
      this.worker.postMessage(jobOf(next.value));
      return;
    }
    if (this.timer || this.wait || !this.running || this.queue.size === 0) return;
    const quietFor = performance.now() - this.lastRequestAt;
    if (quietFor < REFRESH_IDLE_MS) {
      this.wait = setTimeout(() => {
        this.wait = null;
        this.schedule();
      }, REFRESH_IDLE_MS - quietFor);
      this.wait.unref();
      return;
    }
    this.timer = setImmediate(() => {
      this.timer = null;
      const next = this.queue.values().next();
      if (!next.done) {
        this.queue.delete(next.value);
        try {
          const calibration = this.runJob(jobOf(next.value));
          if (calibration) this.storeCalibration(calibration);
        } catch {
          // A profile that cannot be fitted stays stale; the next change queues it again.
        }
      }
      this.schedule();
    });
  }
}

function toEntry(row: CachedRow, pending: boolean): ProfileEntry {
  return {
    playerId: row.playerId,
    technique: row.technique,
    profile: row.profileJson ? (JSON.parse(row.profileJson) as KickProfile) : null,
    repetitions: row.repetitions,
    reliableReachM: row.reliableReachM,
    reachRadiusM: row.reachRadiusM,
    computedAt: row.computedAt,
    pending,
    skippedKicks: row.skippedKicks,
  };
}
