/**
 * Loftline's local fake of the weather service: a small HTTP server on a loopback port serving the
 * subset of the Open-Meteo forecast API that `OpenMeteoClient` calls (`GET /v1/forecast` with
 * `current=` variables), so `npm start` prefills session conditions without any account or signal,
 * and the tests run against a real HTTP exchange.
 *
 * Conditions are deterministic per coordinate (a hash of latitude and longitude picks them), can be
 * pinned for one coordinate, and the fake can simulate an outage: `timeout` never answers, `error`
 * answers 500. Tests drive it through the returned object; by hand, `POST /__fake/control` with
 * `{ "mode": "timeout" }` or `{ "pin": { "latitude": …, "longitude": …, "windSpeedKmh": 21.6 } }`.
 */
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo, Socket } from 'node:net';
import { isaAtmosphere } from '../../shared/flight/atmosphere';
import { SeededRandom } from '../../shared/flight/random';
import { CURRENT_VARIABLES } from './open-meteo-client';

/** How the fake answers forecast requests. */
export type FakeWeatherMode = 'normal' | 'timeout' | 'error';

/** Current values as the service reports them (its own units: °C, %, hPa, km/h, degrees the wind comes from). */
export interface FakeCurrent {
  temperatureC: number;
  relativeHumidityPct: number;
  surfacePressureHpa: number;
  windSpeedKmh: number;
  windFromDeg: number;
}

/** Pinned values for one coordinate (whatever is not given keeps the coordinate's own values). */
export interface FakePin extends Partial<FakeCurrent> {
  latitude: number;
  longitude: number;
}

/** A running fake weather service. */
export interface FakeWeather {
  port: number;
  /** Base URL to give the client (`WEATHER_URL`). */
  url: string;
  /** Forecast requests received so far (every mode counts). */
  readonly calls: number;
  setMode(mode: FakeWeatherMode): void;
  pin(pin: FakePin): void;
  clearPins(): void;
  close(): Promise<void>;
}

/** The deterministic conditions of a coordinate at an elevation, before pins. */
export function fakeConditionsAt(latitude: number, longitude: number, elevationM: number): FakeCurrent {
  const stream = new SeededRandom(hash(`${latitude.toFixed(4)},${longitude.toFixed(4)}`));
  const random = (): number => stream.uniform();
  const isaHpa = isaAtmosphere(Math.min(5000, Math.max(-500, elevationM))).pressurePa / 100;
  const round = (v: number, places: number): number => Math.round(v * 10 ** places) / 10 ** places;
  return {
    temperatureC: round(4 + random() * 18, 1),
    relativeHumidityPct: Math.round(45 + random() * 50),
    surfacePressureHpa: round(isaHpa - 12 + random() * 24, 1),
    windSpeedKmh: round(random() * 30, 1),
    windFromDeg: Math.floor(random() * 360),
  };
}

/** Starts the fake on `port` (0 = any free port) on 127.0.0.1. */
export async function startFakeWeather(port = 0, options: { mode?: FakeWeatherMode } = {}): Promise<FakeWeather> {
  let mode: FakeWeatherMode = options.mode ?? 'normal';
  let calls = 0;
  const pins: FakePin[] = [];
  const sockets = new Set<Socket>();
  const pinFor = (lat: number, lon: number): FakePin | undefined =>
    pins.find((p) => Math.abs(p.latitude - lat) < 1e-4 && Math.abs(p.longitude - lon) < 1e-4);

  const forecast = (req: IncomingMessage, res: ServerResponse, query: URLSearchParams): void => {
    calls++;
    if (mode === 'timeout') return; // Holds the request open; `close()` drops it.
    if (mode === 'error') return send(res, 500, { error: true, reason: 'Simulated failure of the fake weather service' });
    const latitude = Number(query.get('latitude'));
    const longitude = Number(query.get('longitude'));
    if (!query.has('latitude') || !Number.isFinite(latitude) || Math.abs(latitude) > 90) {
      return send(res, 400, { error: true, reason: 'Latitude must be in range of -90 to 90°.' });
    }
    if (!query.has('longitude') || !Number.isFinite(longitude) || Math.abs(longitude) > 180) {
      return send(res, 400, { error: true, reason: 'Longitude must be in range of -180 to 180°.' });
    }
    const requested = (query.get('current') ?? '').split(',').filter(Boolean);
    const unknown = requested.filter((v) => !(CURRENT_VARIABLES as readonly string[]).includes(v));
    if (unknown.length) return send(res, 400, { error: true, reason: `Unknown current variable ${unknown.join(', ')}` });
    const windUnit = query.get('wind_speed_unit') ?? 'kmh';
    if (windUnit !== 'kmh' && windUnit !== 'ms') return send(res, 400, { error: true, reason: 'wind_speed_unit must be kmh or ms (fake)' });
    const elevationM = query.has('elevation') ? Number(query.get('elevation')) : 0;
    const values = {
      ...fakeConditionsAt(latitude, longitude, Number.isFinite(elevationM) ? elevationM : 0),
      ...pinFor(latitude, longitude),
    };
    // The service's "current" values are for the latest quarter hour.
    const quarterS = Math.floor(Date.now() / 900_000) * 900;
    const unixTime = query.get('timeformat') === 'unixtime';
    const all: Record<string, number> = {
      temperature_2m: values.temperatureC,
      relative_humidity_2m: values.relativeHumidityPct,
      surface_pressure: values.surfacePressureHpa,
      wind_speed_10m: windUnit === 'ms' ? Math.round((values.windSpeedKmh / 3.6) * 100) / 100 : values.windSpeedKmh,
      wind_direction_10m: values.windFromDeg,
    };
    const units: Record<string, string> = {
      temperature_2m: '°C',
      relative_humidity_2m: '%',
      surface_pressure: 'hPa',
      wind_speed_10m: windUnit === 'ms' ? 'm/s' : 'km/h',
      wind_direction_10m: '°',
    };
    const current: Record<string, number | string> = {
      time: unixTime ? quarterS : new Date(quarterS * 1000).toISOString().slice(0, 16),
      interval: 900,
    };
    const currentUnits: Record<string, string> = { time: unixTime ? 'unixtime' : 'iso8601', interval: 'seconds' };
    for (const name of requested) {
      current[name] = all[name]!;
      currentUnits[name] = units[name]!;
    }
    send(res, 200, {
      latitude,
      longitude,
      generationtime_ms: 0.1,
      utc_offset_seconds: 0,
      timezone: 'GMT',
      timezone_abbreviation: 'GMT',
      elevation: elevationM,
      current_units: currentUnits,
      current,
    });
  };

  const control = async (req: IncomingMessage, res: ServerResponse): Promise<void> => {
    let body: { mode?: unknown; pin?: FakePin; clearPins?: unknown };
    try {
      body = JSON.parse(await readBody(req)) as typeof body;
    } catch {
      return send(res, 400, { error: true, reason: 'Body must be JSON' });
    }
    if (body.mode !== undefined) {
      if (body.mode !== 'normal' && body.mode !== 'timeout' && body.mode !== 'error') {
        return send(res, 400, { error: true, reason: 'mode must be normal, timeout or error' });
      }
      mode = body.mode;
    }
    if (body.clearPins === true) pins.length = 0;
    if (body.pin) {
      if (typeof body.pin.latitude !== 'number' || typeof body.pin.longitude !== 'number') {
        return send(res, 400, { error: true, reason: 'pin needs latitude and longitude' });
      }
      pins.unshift(body.pin);
    }
    send(res, 200, { mode, pins, calls });
  };

  const server = createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    if (req.method === 'GET' && url.pathname === '/v1/forecast') return forecast(req, res, url.searchParams);
    if (req.method === 'POST' && url.pathname === '/__fake/control') return void control(req, res);
    send(res, 404, { error: true, reason: 'Not found' });
  });
  server.on('connection', (socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((done, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => done());
  });
  const actual = (server.address() as AddressInfo).port;
  return {
    port: actual,
    url: `http://127.0.0.1:${actual}`,
    get calls() {
      return calls;
    },
    setMode: (next) => {
      mode = next;
    },
    pin: (p) => {
      pins.unshift(p);
    },
    clearPins: () => {
      pins.length = 0;
    },
    close: () =>
      new Promise<void>((done) => {
        for (const socket of sockets) socket.destroy();
        server.close(() => done());
      }),
  };
}

function send(res: ServerResponse, status: number, body: unknown): void {
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8' });
  res.end(JSON.stringify(body));
}

function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((done, reject) => {
    let text = '';
    req.setEncoding('utf8');
    req.on('data', (chunk: string) => {
      text += chunk;
      if (text.length > 10_000) req.destroy();
    });
    req.on('end', () => done(text));
    req.on('error', reject);
  });
}

/** FNV-1a, 32 bits: a stable number from a coordinate's text. */
function hash(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}
