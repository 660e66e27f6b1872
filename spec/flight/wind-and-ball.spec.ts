import {
  COACH_WIND_HEIGHT_M,
  GOFF_CARRE_RE_CENTRE,
  GRASS_ROUGHNESS_LENGTH_M,
  simulateKick,
  WEATHER_WIND_HEIGHT_M,
  WIND_PROFILE_MIN_HEIGHT_M,
  windHeightFactor,
  type KickInput,
} from '../../shared/flight';

describe('wind with its reference height (logarithmic profile over grass)', () => {
  it('uses the open-grass roughness length and standard heights', () => {
    // Davenport classification revised by Wieringa (WMO-No. 8 annex; Stull's table): "open", grass, z₀ = 0.03 m.
    expect(GRASS_ROUGHNESS_LENGTH_M).toBe(0.03);
    // WMO-No. 8: surface wind is measured 10 m above open ground.
    expect(WEATHER_WIND_HEIGHT_M).toBe(10);
    // Common practice: a coach judges the wind where they feel it, at head height.
    expect(COACH_WIND_HEIGHT_M).toBeCloseTo(1.8, 9);
  });

  it('scales a 10 m wind to head height as the log law says', () => {
    // Logarithmic profile u(z)/u(10) = ln(z/z₀)/ln(10/z₀); by calculator ln(60)/ln(333.3) = 4.094/5.809 = 0.705.
    expect(windHeightFactor(1.8, 10)).toBeCloseTo(0.705, 3);
    // And 2 m against 10 m: ln(66.67)/ln(333.3) = 4.1997/5.8091 = 0.7230 (by calculator).
    expect(windHeightFactor(2, 10)).toBeCloseTo(0.723, 3);
    expect(windHeightFactor(10, 10)).toBe(1);
    // The usual 1/7 power law over open land (common practice) gives (0.18)^(1/7) = 0.783: the same story within 10 %.
    expect(Math.abs(windHeightFactor(1.8, 10) / Math.pow(0.18, 1 / 7) - 1)).toBeLessThan(0.11);
  });

  it('is the log law itself above the blend height, to within 1.1 % from 0.5 m and 0.1 % from 1 m', () => {
    // First principles: u(z)/u(z_ref) = ln(z/z₀)/ln(z_ref/z₀) (Stull 1988, §9.7), checked against the formula.
    const law = (z: number, ref: number): number => Math.log(z / GRASS_ROUGHNESS_LENGTH_M) / Math.log(ref / GRASS_ROUGHNESS_LENGTH_M);
    for (const ref of [WEATHER_WIND_HEIGHT_M, COACH_WIND_HEIGHT_M]) {
      for (let z = 0.5; z <= 30; z += 0.1) {
        const tolerance = z >= 1 ? 1e-3 : 0.011;
        expect(Math.abs(windHeightFactor(z, ref) / law(z, ref) - 1)).toBeLessThan(tolerance);
      }
    }
  });

  it('grows with height and stays finite and positive at the grass', () => {
    // First principles: wind speed grows with height in the surface layer; the floor keeps it finite at z → 0.
    let last = windHeightFactor(0, 10);
    expect(last).toBeGreaterThan(0);
    // Held near its value at z_min = 10 z₀ (common practice): ln(10)/ln(333.3) ≈ 0.40.
    expect(last).toBeCloseTo(Math.log(WIND_PROFILE_MIN_HEIGHT_M / GRASS_ROUGHNESS_LENGTH_M) / Math.log(10 / 0.03), 2);
    for (let z = 0.05; z <= 30; z += 0.05) {
      const f = windHeightFactor(z, 10);
      expect(f).toBeGreaterThan(last);
      last = f;
    }
  });

  const driven: KickInput = { speed: 26, elevationDeg: 12 };
  const carry = (k: KickInput): number => simulateKick(k).carryM;

  it('lets a 10 m weather wind cost a low driven ball less than the same wind at ball height', () => {
    // First principles: a ball flying below 10 m meets a weaker wind than the anemometer's.
    const still = carry(driven);
    const uniform = carry({ ...driven, wind: { speedMs: 6, fromDeg: 0 } });
    const weather = carry({ ...driven, wind: { speedMs: 6, fromDeg: 0, referenceHeightM: WEATHER_WIND_HEIGHT_M } });
    const coach = carry({ ...driven, wind: { speedMs: 6, fromDeg: 0, referenceHeightM: COACH_WIND_HEIGHT_M } });
    expect(uniform).toBeLessThan(coach);
    expect(coach).toBeLessThan(weather);
    expect(weather).toBeLessThan(still);
    // The headwind's cost shrinks by roughly the height factor of the ball's typical height (~1–3 m: 0.45–0.65).
    const ratio = (still - weather) / (still - uniform);
    expect(ratio).toBeGreaterThan(0.35);
    expect(ratio).toBeLessThan(0.75);
  });

  it('gives the same flight for one wind profile described at two heights', () => {
    // First principles: 6 m/s at 10 m is 6 × 0.705 m/s at 1.8 m on the same profile.
    const at10 = simulateKick({ ...driven, wind: { speedMs: 6, fromDeg: 40, referenceHeightM: 10 } });
    const at18 = simulateKick({ ...driven, wind: { speedMs: 6 * windHeightFactor(1.8, 10), fromDeg: 40, referenceHeightM: 1.8 } });
    expect(at18.carryM).toBeCloseTo(at10.carryM, 6);
    expect(at18.landing.y).toBeCloseTo(at10.landing.y, 6);
  });

  it('rejects a reference height out of range naming the field', () => {
    expect(() => simulateKick({ ...driven, wind: { speedMs: 6, fromDeg: 0, referenceHeightM: 0 } })).toThrowError(
      RangeError,
      /wind\.referenceHeightM/,
    );
  });
});

describe('drag-crisis Reynolds number of the ball', () => {
  const slow: KickInput = { speed: 16, elevationDeg: 30 };

  it('changes nothing at the default crisis', () => {
    // Goff & Carré 2010 (Eur. J. Phys. 31:775) fit's own crisis centre is the default.
    expect(simulateKick({ ...slow, aero: { dragCrisisRe: GOFF_CARRE_RE_CENTRE } }).carryM).toBe(simulateKick(slow).carryM);
  });

  it('shortens a slow kick for a ball whose crisis comes later', () => {
    // Asai et al. 2007 (Sports Engineering 10:101): footballs' critical Re spans 2.2–3.0 × 10⁵; a later crisis keeps a
    // 16 m/s ball (Re ≈ 2.4 × 10⁵) in high drag for longer, so it carries less.
    const early = simulateKick({ ...slow, aero: { dragCrisisRe: 1.7e5 } }).carryM;
    const late = simulateKick({ ...slow, aero: { dragCrisisRe: 2.6e5 } }).carryM;
    expect(late).toBeLessThan(early - 1);
  });

  it('rejects an implausible crisis naming the field', () => {
    expect(() => simulateKick({ ...slow, aero: { dragCrisisRe: 5e4 } })).toThrowError(RangeError, /aero\.dragCrisisRe/);
  });
});
