/**
 * Current conditions at a coordinate from an Open-Meteo-compatible forecast API (its documented
 * HTTP API: `GET /v1/forecast?latitude=…&longitude=…&current=…`; there is no official npm client).
 * The base URL comes from `WEATHER_URL`, so the hosted service, a self-hosted instance, a commercial
 * (keyed) endpoint or Loftline's local fake are all configured the same way. Node's own `fetch`,
 * with a hard timeout: a session start never waits on the weather.
 */
import * as z from 'zod';
import { kmhToMs, normaliseDeg } from '../../shared/weather';

/** What the service measured, in Loftline's units (°C, %, hPa, m/s, compass degrees the wind comes from). */
export interface WeatherObservation {
  /** When the values apply, ISO 8601 UTC. */
  observedAt: string;
  temperatureC: number;
  relativeHumidityPct: number;
  /** Pressure at the surface (the ground's own altitude), hPa. */
  pressureHpa: number;
  windSpeedMs: number;
  /** WMO convention: the compass bearing the wind blows from, clockwise from north. */
  windFromBearingDeg: number;
}

/** Where to ask. `elevationM` is the ground's altitude, so surface pressure is for the pitch, not the model's grid cell. */
export interface WeatherQuery {
  latitude: number;
  longitude: number;
  elevationM: number;
}

/** Anything that answers current conditions (the Open-Meteo client is the one implementation). */
export interface WeatherSource {
  current(query: WeatherQuery): Promise<WeatherObservation>;
}

/** The service did not give a usable answer; the message says why in plain words. */
export class WeatherUnavailable extends Error {}

/** The variables Loftline asks for (Open-Meteo's names). */
export const CURRENT_VARIABLES = [
  'temperature_2m',
  'relative_humidity_2m',
  'surface_pressure',
  'wind_speed_10m',
  'wind_direction_10m',
] as const;

const value = z.number({ error: 'missing or not a number' });
const responseSchema = z.object({
  utc_offset_seconds: z.number().default(0),
  current_units: z.object({
    temperature_2m: z.string(),
    relative_humidity_2m: z.string(),
    surface_pressure: z.string(),
    wind_speed_10m: z.string(),
    wind_direction_10m: z.string(),
  }),
  current: z.object({
    time: z.union([z.number(), z.string()]),
    temperature_2m: value,
    relative_humidity_2m: value,
    surface_pressure: value,
    wind_speed_10m: value,
    wind_direction_10m: value,
  }),
});

/** Client of the forecast API's "current" conditions. */
export class OpenMeteoClient implements WeatherSource {
  constructor(
    private readonly baseUrl: string,
    private readonly options: { apiKey: string | null; timeoutMs: number },
  ) {}

  /** Current conditions at a coordinate; throws `WeatherUnavailable` on timeout, HTTP errors or an unusable answer. */
  async current(query: WeatherQuery): Promise<WeatherObservation> {
    const url = new URL('/v1/forecast', this.baseUrl + '/');
    url.searchParams.set('latitude', query.latitude.toFixed(5));
    url.searchParams.set('longitude', query.longitude.toFixed(5));
    url.searchParams.set('elevation', String(Math.round(query.elevationM)));
    url.searchParams.set('current', CURRENT_VARIABLES.join(','));
    url.searchParams.set('wind_speed_unit', 'kmh');
    url.searchParams.set('temperature_unit', 'celsius');
    url.searchParams.set('timeformat', 'unixtime');
    if (this.options.apiKey) url.searchParams.set('apikey', this.options.apiKey);
    let response: Response;
    try {
      response = await fetch(url, { signal: AbortSignal.timeout(this.options.timeoutMs), headers: { accept: 'application/json' } });
    } catch (err) {
      const timedOut = err instanceof Error && (err.name === 'TimeoutError' || err.name === 'AbortError');
      throw new WeatherUnavailable(
        timedOut
          ? `The weather service did not answer within ${this.options.timeoutMs / 1000} s`
          : 'The weather service could not be reached',
      );
    }
    let body: unknown;
    try {
      body = await response.json();
    } catch {
      throw new WeatherUnavailable(`The weather service answered ${response.status} without usable data`);
    }
    if (!response.ok) {
      const reason = body && typeof body === 'object' && 'reason' in body && typeof body.reason === 'string' ? `: ${body.reason}` : '';
      throw new WeatherUnavailable(`The weather service answered ${response.status}${reason}`);
    }
    return observationOf(body);
  }
}

/** Converts an Open-Meteo "current" answer to Loftline's units, refusing units it does not know. */
export function observationOf(body: unknown): WeatherObservation {
  const parsed = responseSchema.safeParse(body);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new WeatherUnavailable(
      `The weather service's answer is not usable (${first ? `${first.path.join('.')}: ${first.message}` : 'unknown shape'})`,
    );
  }
  const { current, current_units: units, utc_offset_seconds: offsetS } = parsed.data;
  if (units.temperature_2m !== '°C') throw new WeatherUnavailable(`Unexpected temperature unit ${units.temperature_2m}`);
  if (units.relative_humidity_2m !== '%') throw new WeatherUnavailable(`Unexpected humidity unit ${units.relative_humidity_2m}`);
  if (units.surface_pressure !== 'hPa') throw new WeatherUnavailable(`Unexpected pressure unit ${units.surface_pressure}`);
  if (units.wind_direction_10m !== '°') throw new WeatherUnavailable(`Unexpected wind direction unit ${units.wind_direction_10m}`);
  // Exact conversion: 1 km/h = 1000 m / 3600 s.
  const speedMs =
    units.wind_speed_10m === 'km/h' ? kmhToMs(current.wind_speed_10m) : units.wind_speed_10m === 'm/s' ? current.wind_speed_10m : null;
  if (speedMs === null) throw new WeatherUnavailable(`Unexpected wind speed unit ${units.wind_speed_10m}`);
  return {
    observedAt: observedAtOf(current.time, offsetS),
    temperatureC: current.temperature_2m,
    relativeHumidityPct: Math.min(100, Math.max(0, current.relative_humidity_2m)),
    pressureHpa: current.surface_pressure,
    windSpeedMs: Math.max(0, speedMs),
    // WMO convention, as the service reports it: degrees clockwise from north, the direction the wind comes from.
    windFromBearingDeg: normaliseDeg(current.wind_direction_10m),
  };
}

/** The service's time: unix seconds, or local ISO time without a zone (then shifted by the UTC offset it reports). */
function observedAtOf(time: number | string, utcOffsetS: number): string {
  const ms = typeof time === 'number' ? time * 1000 : Date.parse(`${time.length === 16 ? `${time}:00` : time}Z`) - utcOffsetS * 1000;
  if (!Number.isFinite(ms)) throw new WeatherUnavailable(`The weather service's time ${String(time)} is not a time`);
  return new Date(ms).toISOString();
}
