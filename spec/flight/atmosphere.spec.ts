import { airDensity, isaAtmosphere, moistAirDensityCipm2007, sutherlandViscosityPaS } from '../../shared/flight';

describe('air', () => {
  const isaTable: [number, number, number][] = [
    // [geometric altitude m, density kg/m³, pressure Pa]
    // ISO 2533 standard atmosphere table, sea level (from memory).
    [0, 1.225, 101325],
    // ISO 2533 standard atmosphere table, 500 m (from memory).
    [500, 1.1673, 95461],
    // ISO 2533 standard atmosphere table, 1000 m (from memory).
    [1000, 1.1117, 89876],
    // ISO 2533 standard atmosphere table, 2000 m (from memory).
    [2000, 1.0066, 79501],
    // ISO 2533 standard atmosphere table, 3000 m (from memory).
    [3000, 0.90925, 70121],
  ];
  for (const [h, rho, p] of isaTable) {
    it(`gives the ISA state at ${h} m`, () => {
      // ISO 2533 standard atmosphere table (row above, from memory), density to its printed precision.
      expect(Math.abs(airDensity({ altitudeM: h }) - rho)).toBeLessThan(6e-5);
      // ISO 2533 standard atmosphere table (row above, from memory), pressure to 1 Pa.
      expect(Math.abs(isaAtmosphere(h).pressurePa - p)).toBeLessThan(1);
    });
  }

  it('defaults to the ISA at sea level', () => {
    // ISO 2533 standard atmosphere: ρ₀ = 1.225 kg/m³.
    expect(airDensity({})).toBeCloseTo(1.225, 6);
    expect(airDensity()).toBeCloseTo(1.225, 6);
  });

  const oimlCases: [number, number, number][] = [
    [20, 1013.25, 50],
    [15, 980, 80],
    [25, 1030, 30],
  ];
  for (const [t, p, rh] of oimlCases) {
    it(`gives moist-air density at ${t} °C, ${p} hPa, ${rh} % that agrees with the OIML approximation`, () => {
      // OIML R 111-1 (2004) eq. E.3-1 approximation to the CIPM formula, stated good to 2e-4 relative near lab conditions (from memory).
      const oiml = (0.34848 * p - 0.009 * rh * Math.exp(0.061 * t)) / (273.15 + t);
      const ours = airDensity({ temperatureC: t, pressureHpa: p, relativeHumidityPct: rh });
      expect(Math.abs(ours / oiml - 1)).toBeLessThan(3e-4);
      // Consistency, not a reference: airDensity takes the CIPM-2007 route when humidity is given.
      expect(ours).toBe(moistAirDensityCipm2007(p * 100, t + 273.15, rh));
    });
  }

  it('makes humid air lighter than dry air at the same temperature and pressure', () => {
    // Avogadro's law: water vapour (18 g/mol) displaces heavier dry air (29 g/mol); any physics text.
    const dry = airDensity({ temperatureC: 25, pressureHpa: 1013.25, relativeHumidityPct: 0 });
    const humid = airDensity({ temperatureC: 25, pressureHpa: 1013.25, relativeHumidityPct: 90 });
    expect(humid).toBeLessThan(dry);
  });

  it('uses a given density as is', () => {
    expect(airDensity({ densityKgM3: 1.1, altitudeM: 2000 })).toBe(1.1);
  });

  it('gives Sutherland viscosity at 15 °C', () => {
    // ISO 2533 standard atmosphere table: μ = 1.7894e-5 Pa·s at sea level, 15 °C (from memory).
    expect(Math.abs(sutherlandViscosityPaS(288.15) - 1.7894e-5)).toBeLessThan(5e-10);
  });
});
