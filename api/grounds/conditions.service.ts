/**
 * Conditions at a ground for Pitchside's session start: asks the weather service, converts to the
 * flight model's units and the ground's kicking direction, and caches each ground's answer in the
 * database for ten minutes (so API replicas share it and a squad of phones costs one call). It never
 * throws for the service's sake: a timeout or failure answers `{ source: 'unavailable' }` and the
 * coach's taps stay the source.
 */
import { eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { GroundConditions, MeasuredConditions } from '../../shared/schemas/grounds';
import { normaliseDeg, relativeWindFromDeg } from '../../shared/weather';
import type { Db } from '../db/client';
import { groundConditions } from '../db/schema';
import type { Scope } from '../scope/scope';
import { WeatherUnavailable, type WeatherQuery, type WeatherSource } from '../weather/open-meteo-client';
import { groundRow } from './grounds.service';

type CacheRow = typeof groundConditions.$inferSelect;

// Limits a session row accepts (shared/schemas/sync.ts): a reading outside them would make the
// session unsavable on the phone, so it is reported as unusable instead of prefilled.
const SESSION_LIMITS = { temperatureC: [-30, 50], relativeHumidityPct: [0, 100], pressureHpa: [500, 1100], windSpeedMs: [0, 40] } as const;

/** Settings of the conditions service. */
export interface ConditionsSettings {
  /** How long an answer is reused for the same ground, seconds. */
  cacheTtlS: number;
  /** Why there is no service, when `weather` is null (shown to the coach and admin). */
  noServiceReason: string;
}

/** Answers `GET /api/grounds/:id/conditions`. */
export class GroundConditionsService {
  /** Requests already on their way to the service, per ground, so simultaneous starts share one call. */
  private readonly inFlight = new Map<string, Promise<CacheRow>>();

  constructor(
    private readonly db: Db,
    private readonly weather: WeatherSource | null,
    private readonly settings: ConditionsSettings,
    private readonly logger?: Logger,
  ) {}

  /** Conditions at one of the caller's club's grounds (NotFound for any other). */
  async forGround(scope: Scope, groundId: string, now: Date = new Date()): Promise<GroundConditions> {
    const ground = groundRow(this.db, scope, groundId);
    if (ground.latitude === null || ground.longitude === null) {
      return {
        source: 'unavailable',
        groundId,
        reason: 'The ground has no coordinates yet; an admin can add them in Club admin → Grounds',
      };
    }
    if (!this.weather) return { source: 'unavailable', groundId, reason: this.settings.noServiceReason };
    const position = { latitude: ground.latitude, longitude: ground.longitude };
    const cached = this.db.select().from(groundConditions).where(eq(groundConditions.groundId, groundId)).get();
    const fresh =
      cached &&
      cached.latitude === position.latitude &&
      cached.longitude === position.longitude &&
      now.getTime() - Date.parse(cached.fetchedAt) < this.settings.cacheTtlS * 1000 &&
      Date.parse(cached.fetchedAt) <= now.getTime();
    let row: CacheRow;
    if (fresh) {
      row = cached;
    } else {
      try {
        row = await this.refresh(groundId, { ...position, elevationM: ground.altitudeM }, now);
      } catch (err) {
        if (!(err instanceof WeatherUnavailable)) throw err;
        this.logger?.warn({ groundId, reason: err.message }, 'weather service unavailable; Pitchside keeps the coach’s taps');
        return { source: 'unavailable', groundId, reason: err.message };
      }
    }
    const outside = Object.entries(SESSION_LIMITS).find(([key, [min, max]]) => {
      const v = row[key as keyof typeof SESSION_LIMITS];
      return v < min || v > max;
    });
    if (outside)
      return { source: 'unavailable', groundId, reason: `The weather service's ${outside[0]} is outside what a session records` };
    const answer: MeasuredConditions = {
      source: 'weather',
      groundId,
      observedAt: row.observedAt,
      fetchedAt: row.fetchedAt,
      temperatureC: row.temperatureC,
      relativeHumidityPct: row.relativeHumidityPct,
      pressureHpa: row.pressureHpa,
      windSpeedMs: round(row.windSpeedMs, 3),
      windFromBearingDeg: row.windFromBearingDeg,
      windFromDeg: normaliseDeg(round(relativeWindFromDeg(row.windFromBearingDeg, ground.kickingBearingDeg), 3)),
      altitudeM: ground.altitudeM,
    };
    return answer;
  }

  /** Asks the service and stores the answer; simultaneous callers for one ground share the call and the row. */
  private refresh(groundId: string, query: WeatherQuery, now: Date): Promise<CacheRow> {
    let pending = this.inFlight.get(groundId);
    if (!pending) {
      const weather = this.weather;
      if (!weather) return Promise.reject(new WeatherUnavailable(this.settings.noServiceReason));
      pending = weather
        .current(query)
        .then((observation) => {
          const row: CacheRow = {
            groundId,
            latitude: query.latitude,
            longitude: query.longitude,
            fetchedAt: now.toISOString(),
            ...observation,
          };
          this.db.insert(groundConditions).values(row).onConflictDoUpdate({ target: groundConditions.groundId, set: row }).run();
          return row;
        })
        .finally(() => this.inFlight.delete(groundId));
      this.inFlight.set(groundId, pending);
    }
    return pending;
  }
}

/** Rounded to `places` decimals: km/h → m/s leaves float dust (21.6 km/h → 6.000000000000001 m/s). */
function round(value: number, places: number): number {
  const f = 10 ** places;
  return Math.round(value * f) / f;
}
