/**
 * Air density and viscosity for the flight model: the ISO 2533 standard atmosphere, the CIPM-2007
 * moist-air equation and Sutherland's law. Density sets drag and lift; viscosity sets the Reynolds
 * number, and with it where the drag crisis falls.
 */

import { STANDARD_GRAVITY_MS2 } from './constants';
import type { AirSpec } from './types';
import { LIMITS, requireInRange } from './validate';

// ISO 2533 standard atmosphere, sea-level values and troposphere lapse rate.
const ISA_P0_PA = 101325; // ISO 2533
const ISA_T0_K = 288.15; // ISO 2533
const ISA_LAPSE_K_PER_M = -0.0065; // ISO 2533, troposphere
const ISA_R_J_PER_KG_K = 287.05287; // ISO 2533 specific gas constant of dry air
const ISA_EARTH_RADIUS_M = 6356766; // ISO 2533, for geopotential altitude
const ISA_PRESSURE_EXPONENT = -STANDARD_GRAVITY_MS2 / (ISA_R_J_PER_KG_K * ISA_LAPSE_K_PER_M);

// Sutherland's law in the ISO 2533 form μ = β T^1.5 / (T + S).
const SUTHERLAND_BETA = 1.458e-6; // ISO 2533, kg/(m·s·K^0.5)
const SUTHERLAND_S_K = 110.4; // ISO 2533, K

// CIPM-2007 (Picard, Davis, Gläser & Fujii 2008, Metrologia 45:149).
const CIPM_R = 8.314472; // J/(mol·K), CIPM-2007
const CIPM_MA = 28.96546e-3; // kg/mol, dry air with x_CO2 = 0.0004, CIPM-2007
const CIPM_MV = 18.01528e-3; // kg/mol, water, CIPM-2007
const PSV_A = 1.2378847e-5; // K⁻², saturation vapour pressure, CIPM-2007
const PSV_B = -1.9121316e-2; // K⁻¹
const PSV_C = 33.93711047;
const PSV_D = -6.3431645e3; // K
const ENH_ALPHA = 1.00062; // enhancement factor, CIPM-2007
const ENH_BETA = 3.14e-8; // Pa⁻¹
const ENH_GAMMA = 5.6e-7; // K⁻²
const Z_A0 = 1.58123e-6; // compressibility factor constants, CIPM-2007
const Z_A1 = -2.9331e-8;
const Z_A2 = 1.1043e-10;
const Z_B0 = 5.707e-6;
const Z_B1 = -2.051e-8;
const Z_C0 = 1.9898e-4;
const Z_C1 = -2.376e-6;
const Z_D = 1.83e-11;
const Z_E = -0.765e-8;

/** ISA state at an altitude (troposphere). */
export interface IsaState {
  temperatureK: number;
  pressurePa: number;
  densityKgM3: number;
}

/**
 * ISO 2533 standard atmosphere at a geometric altitude `altitudeM` above sea level (troposphere).
 * Training grounds store altitude, not pressure, so this is the usual route to air density. The
 * standard's formulas are in geopotential altitude H = r₀z/(r₀ + z), r₀ = 6 356 766 m (ISO 2533).
 */
export function isaAtmosphere(altitudeM: number): IsaState {
  requireInRange('air.altitudeM', altitudeM, LIMITS.altitudeM[0], LIMITS.altitudeM[1], 'm');
  const geopotentialM = (ISA_EARTH_RADIUS_M * altitudeM) / (ISA_EARTH_RADIUS_M + altitudeM);
  const temperatureK = ISA_T0_K + ISA_LAPSE_K_PER_M * geopotentialM;
  const pressurePa = ISA_P0_PA * Math.pow(temperatureK / ISA_T0_K, ISA_PRESSURE_EXPONENT);
  return { temperatureK, pressurePa, densityKgM3: pressurePa / (ISA_R_J_PER_KG_K * temperatureK) };
}

/** Dynamic viscosity of air by Sutherland's law (ISO 2533 constants), Pa·s; sets the Reynolds number. */
export function sutherlandViscosityPaS(temperatureK: number): number {
  return (SUTHERLAND_BETA * Math.pow(temperatureK, 1.5)) / (temperatureK + SUTHERLAND_S_K);
}

/** Saturation vapour pressure over water, Pa (CIPM-2007); needed to turn humidity into a mole fraction. */
export function saturationVapourPressurePa(temperatureK: number): number {
  return Math.exp(PSV_A * temperatureK * temperatureK + PSV_B * temperatureK + PSV_C + PSV_D / temperatureK);
}

/**
 * Density of moist air by the CIPM-2007 equation (x_CO2 = 0.0004), kg/m³. Humid air is lighter than dry
 * air, so a humid evening lengthens carry slightly.
 */
export function moistAirDensityCipm2007(pressurePa: number, temperatureK: number, relativeHumidityPct: number): number {
  const t = temperatureK - 273.15;
  const enhancement = ENH_ALPHA + ENH_BETA * pressurePa + ENH_GAMMA * t * t;
  const xv = ((relativeHumidityPct / 100) * enhancement * saturationVapourPressurePa(temperatureK)) / pressurePa;
  const pt = pressurePa / temperatureK;
  const z =
    1 - pt * (Z_A0 + Z_A1 * t + Z_A2 * t * t + (Z_B0 + Z_B1 * t) * xv + (Z_C0 + Z_C1 * t) * xv * xv) + pt * pt * (Z_D + Z_E * xv * xv);
  return ((pressurePa * CIPM_MA) / (z * CIPM_R * temperatureK)) * (1 - xv * (1 - CIPM_MV / CIPM_MA));
}

/** Resolved air: what the right-hand side needs. */
export interface AirState {
  densityKgM3: number;
  temperatureK: number;
  pressurePa: number;
  dynamicViscosityPaS: number;
  kinematicViscosityM2S: number;
}

/**
 * Resolve an air spec. A given density wins. With only an altitude (or nothing) the ISA density is
 * used as defined by ISO 2533. With a temperature, pressure or humidity the CIPM-2007 equation is
 * used, missing values taken from the ISA at the altitude and humidity defaulting to 0 %. (The two
 * routes differ by the real-gas compressibility, ≤ 0.05 %, about 1 cm of carry.)
 */
export function resolveAir(air: AirSpec | undefined): AirState {
  const spec = air ?? {};
  const altitudeM = spec.altitudeM ?? 0;
  const isa = isaAtmosphere(altitudeM);
  const temperatureK =
    spec.temperatureC === undefined
      ? isa.temperatureK
      : requireInRange('air.temperatureC', spec.temperatureC, LIMITS.temperatureC[0], LIMITS.temperatureC[1], '°C') + 273.15;
  const pressurePa =
    spec.pressureHpa === undefined
      ? isa.pressurePa
      : requireInRange('air.pressureHpa', spec.pressureHpa, LIMITS.pressureHpa[0], LIMITS.pressureHpa[1], 'hPa') * 100;
  const humidity =
    spec.relativeHumidityPct === undefined ? undefined : requireInRange('air.relativeHumidityPct', spec.relativeHumidityPct, 0, 100, '%');
  let densityKgM3: number;
  if (spec.densityKgM3 !== undefined) {
    densityKgM3 = requireInRange('air.densityKgM3', spec.densityKgM3, LIMITS.densityKgM3[0], LIMITS.densityKgM3[1], 'kg/m³');
  } else if (spec.temperatureC === undefined && spec.pressureHpa === undefined && humidity === undefined) {
    densityKgM3 = isa.densityKgM3;
  } else {
    densityKgM3 = moistAirDensityCipm2007(pressurePa, temperatureK, humidity ?? 0);
    requireInRange('air (resulting density)', densityKgM3, LIMITS.densityKgM3[0], LIMITS.densityKgM3[1], 'kg/m³');
  }
  const dynamicViscosityPaS = sutherlandViscosityPaS(temperatureK);
  return {
    densityKgM3,
    temperatureK,
    pressurePa,
    dynamicViscosityPaS,
    kinematicViscosityM2S: dynamicViscosityPaS / densityKgM3,
  };
}

/** Air density in kg/m³ for an air spec (see `resolveAir` for the rules); `{}` = ISA sea level. */
export function airDensity(air: AirSpec = {}): number {
  return resolveAir(air).densityKgM3;
}

/** Kinematic viscosity of the ISA at sea level, m²/s: the reference of the drag-crisis fit. */
export const ISA_SEA_LEVEL_KINEMATIC_VISCOSITY_M2S = sutherlandViscosityPaS(ISA_T0_K) / isaAtmosphere(0).densityKgM3;
