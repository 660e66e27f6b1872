/**
 * Weather-service conversions (shared/weather.ts) and the Open-Meteo client against Loftline's local
 * fake over real HTTP. Hand-computed cases: compass bearings run clockwise from north, the flight
 * model's relative directions counter-clockwise from the target (docs/design.md §6: y to the kicker's left).
 */
import { resolveConditions } from '../../shared/flight/model';
import { kmhToMs, relativeWindFromDeg, relativeWindName, windComponents } from '../../shared/weather';
import { fakeConditionsAt, startFakeWeather, type FakeWeather } from '../../api/weather/fake-weather';
import { observationOf, OpenMeteoClient, WeatherUnavailable } from '../../api/weather/open-meteo-client';

describe('weather conversions', () => {
  it('converts km/h to m/s exactly', () => {
    // SI: 1 km/h = 1000 m / 3600 s, so 36 km/h = 10 m/s and 21.6 km/h = 6 m/s.
    expect(kmhToMs(36)).toBe(10);
    expect(kmhToMs(21.6)).toBeCloseTo(6, 12);
    expect(kmhToMs(0)).toBe(0);
  });

  // WMO convention (WMO-No. 8): the bearing the wind comes from, clockwise from north.
  // Relative: 0 = headwind, 90 = from the kicker's left, 180 = tailwind, 270 = from the right.
  const cases: { what: string; windFrom: number; kicking: number; relative: number; name: string; head: number; left: number }[] = [
    // Kicking east, the kicker's left is north: a north wind crosses from the left.
    { what: 'north wind, kicking east', windFrom: 0, kicking: 90, relative: 90, name: 'from_left', head: 0, left: 6 },
    // Kicking north into a north wind: straight in the kicker's face.
    { what: 'north wind, kicking north', windFrom: 0, kicking: 0, relative: 0, name: 'headwind', head: 6, left: 0 },
    // Kicking south with a north wind behind.
    { what: 'north wind, kicking south', windFrom: 0, kicking: 180, relative: 180, name: 'tailwind', head: -6, left: 0 },
    // Kicking west, the kicker's right is north: a north wind crosses from the right.
    { what: 'north wind, kicking west', windFrom: 0, kicking: 270, relative: 270, name: 'from_right', head: 0, left: -6 },
    // Kicking east, the right is south: a south wind comes from the right.
    { what: 'south wind, kicking east', windFrom: 180, kicking: 90, relative: 270, name: 'from_right', head: 0, left: -6 },
    // Kicking south-west (225°), wind from the north-west (315°): 90° to the kicker's right.
    { what: 'north-west wind, kicking south-west', windFrom: 315, kicking: 225, relative: 270, name: 'from_right', head: 0, left: -6 },
    // Kicking north-east (45°), wind from the north (0°): 45° off the nose, on the left.
    {
      what: 'north wind, kicking north-east',
      windFrom: 0,
      kicking: 45,
      relative: 45,
      name: 'from_left',
      head: 6 * Math.SQRT1_2,
      left: 6 * Math.SQRT1_2,
    },
    // Kicking 350°, wind from 10°: 20° off the nose, on the right (crosses north without a jump).
    {
      what: 'wind from 10°, kicking 350°',
      windFrom: 10,
      kicking: 350,
      relative: 340,
      name: 'headwind',
      head: 6 * Math.cos((20 * Math.PI) / 180),
      left: -6 * Math.sin((20 * Math.PI) / 180),
    },
  ];

  for (const c of cases) {
    it(`turns a ${c.what} into ${c.name.replace('_', ' ')} (${c.relative}°)`, () => {
      const relative = relativeWindFromDeg(c.windFrom, c.kicking);
      expect(relative).toBeCloseTo(c.relative, 9);
      expect(relativeWindName(relative)).toBe(c.name as ReturnType<typeof relativeWindName>);
      const parts = windComponents(6, relative);
      expect(parts.headwindMs).toBeCloseTo(c.head, 9);
      expect(parts.fromLeftMs).toBeCloseTo(c.left, 9);
    });
  }

  it('agrees with the flight model’s own wind vector', () => {
    // A wind from the kicker's left blows towards −y (the right), against +x for a headwind.
    const fromLeft = resolveConditions({ wind: { speedMs: 6, fromDeg: relativeWindFromDeg(0, 90) } });
    expect(fromLeft.windYMs).toBeCloseTo(-6, 9);
    expect(fromLeft.windXMs).toBeCloseTo(0, 9);
    const head = resolveConditions({ wind: { speedMs: 6, fromDeg: relativeWindFromDeg(205, 205) } });
    expect(head.windXMs).toBeCloseTo(-6, 9);
  });
});

describe('OpenMeteoClient against the local fake weather service', () => {
  let fake: FakeWeather;
  beforeAll(async () => {
    fake = await startFakeWeather(0);
  });
  afterAll(async () => {
    await fake.close();
  });
  beforeEach(() => {
    fake.setMode('normal');
    fake.clearPins();
  });

  it('gives the same conditions for the same coordinate and different ones elsewhere', async () => {
    const client = new OpenMeteoClient(fake.url, { apiKey: null, timeoutMs: 2000 });
    const a = await client.current({ latitude: 52.7713, longitude: -1.5528, elevationM: 88 });
    const b = await client.current({ latitude: 52.7713, longitude: -1.5528, elevationM: 88 });
    const elsewhere = await client.current({ latitude: 48.1, longitude: 11.6, elevationM: 520 });
    expect(b).toEqual(a);
    expect(elsewhere.windFromBearingDeg === a.windFromBearingDeg && elsewhere.temperatureC === a.temperatureC).toBeFalse();
    const raw = fakeConditionsAt(52.7713, -1.5528, 88);
    expect(a.windSpeedMs).toBeCloseTo(raw.windSpeedKmh / 3.6, 9);
    expect(a.pressureHpa).toBe(raw.surfacePressureHpa);
    // ISO 2533: about 1002.7 hPa at 88 m; the fake stays within ±12 hPa of the standard atmosphere.
    expect(Math.abs(a.pressureHpa - 1002.7)).toBeLessThan(12.5);
    expect(Date.parse(a.observedAt) % 900_000).toBe(0);
  });

  it('serves a pinned wind, converted from km/h', async () => {
    fake.pin({ latitude: 52.7713, longitude: -1.5528, windSpeedKmh: 21.6, windFromDeg: 205 });
    const client = new OpenMeteoClient(fake.url, { apiKey: null, timeoutMs: 2000 });
    const obs = await client.current({ latitude: 52.7713, longitude: -1.5528, elevationM: 88 });
    expect(obs.windSpeedMs).toBeCloseTo(6, 9);
    expect(obs.windFromBearingDeg).toBe(205);
  });

  it('gives up after the timeout when the service hangs', async () => {
    fake.setMode('timeout');
    const client = new OpenMeteoClient(fake.url, { apiKey: null, timeoutMs: 300 });
    const started = Date.now();
    await expectAsync(client.current({ latitude: 1, longitude: 2, elevationM: 0 })).toBeRejectedWithError(
      WeatherUnavailable,
      /within 0.3 s/,
    );
    expect(Date.now() - started).toBeLessThan(1500);
  });

  it('reports the service’s own error reason', async () => {
    fake.setMode('error');
    const client = new OpenMeteoClient(fake.url, { apiKey: null, timeoutMs: 2000 });
    await expectAsync(client.current({ latitude: 1, longitude: 2, elevationM: 0 })).toBeRejectedWithError(
      WeatherUnavailable,
      /500: Simulated failure/,
    );
  });

  it('reports a service that cannot be reached', async () => {
    const client = new OpenMeteoClient('http://127.0.0.1:9', { apiKey: null, timeoutMs: 2000 });
    await expectAsync(client.current({ latitude: 1, longitude: 2, elevationM: 0 })).toBeRejectedWithError(
      WeatherUnavailable,
      /could not be reached/,
    );
  });

  it('can be switched by its control endpoint', async () => {
    const res = await fetch(`${fake.url}/__fake/control`, { method: 'POST', body: JSON.stringify({ mode: 'error' }) });
    expect(res.status).toBe(200);
    const client = new OpenMeteoClient(fake.url, { apiKey: null, timeoutMs: 2000 });
    await expectAsync(client.current({ latitude: 1, longitude: 2, elevationM: 0 })).toBeRejectedWithError(WeatherUnavailable);
    const bad = await fetch(`${fake.url}/__fake/control`, { method: 'POST', body: JSON.stringify({ mode: 'sideways' }) });
    expect(bad.status).toBe(400);
  });
});

describe('observationOf (the service’s answer in Loftline’s units)', () => {
  const answer = (units: Record<string, string>, current: Record<string, unknown>, offset = 0) => ({
    utc_offset_seconds: offset,
    current_units: {
      temperature_2m: '°C',
      relative_humidity_2m: '%',
      surface_pressure: 'hPa',
      wind_speed_10m: 'km/h',
      wind_direction_10m: '°',
      ...units,
    },
    current: {
      time: 1763467200,
      temperature_2m: 9.4,
      relative_humidity_2m: 81,
      surface_pressure: 1002.1,
      wind_speed_10m: 18,
      wind_direction_10m: 360,
      ...current,
    },
  });

  it('converts km/h, keeps hPa and reads north as 0°', () => {
    const obs = observationOf(answer({}, {}));
    expect(obs).toEqual({
      observedAt: '2025-11-18T12:00:00.000Z',
      temperatureC: 9.4,
      relativeHumidityPct: 81,
      pressureHpa: 1002.1,
      windSpeedMs: 5,
      windFromBearingDeg: 0,
    });
  });

  it('reads local ISO times with the offset the service reports', () => {
    expect(observationOf(answer({}, { time: '2025-11-18T13:00' }, 3600)).observedAt).toBe('2025-11-18T12:00:00.000Z');
  });

  it('refuses units it does not know and values that are missing', () => {
    expect(() => observationOf(answer({ wind_speed_10m: 'kn' }, {}))).toThrowError(WeatherUnavailable, /wind speed unit kn/);
    expect(() => observationOf(answer({ temperature_2m: '°F' }, {}))).toThrowError(WeatherUnavailable, /temperature unit/);
    expect(() => observationOf(answer({}, { surface_pressure: null }))).toThrowError(WeatherUnavailable, /surface_pressure/);
  });
});
