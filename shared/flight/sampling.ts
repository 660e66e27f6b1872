/**
 * Drawing kicks from a fitted profile: one seeded stream shared by envelopes, reach curves and set-piece
 * checks, so the same profile and seed always give the same kicks. Speeds come in two kinds: *aimed*
 * at a target distance (the aimed-speed model: the speed the target needs, capped by the ceiling, times
 * the fitted error) or, where no target applies, the player's usual ball (`meanSpeedMs`).
 *
 * Every sample draws its own launch elevation, backspin and sidespin around the profile's means with the
 * profile's spreads (`sdElevationDeg`: the spread the fit assumed and scaled, or measured;
 * `sdBackspinRps`, `sdSidespinRps`: the player's own, with the coach's eye taken out, profile-spin.ts), its aim from the predictive aim spread, and its ceiling from the one-sided
 * posterior: a normal in ln speed truncated below at `aimedSpeed.ceilingFloorMs` (what the player has
 * demonstrably reached) and above at the speed cap. No speed exceeds `speedCapMs`. Set pieces
 * (`sampleLaunches`) get the same launch draws, so a chosen kick is flown with the player's own spreads.
 */

import type { AimedSpeedFit } from './aimed-speed';
import { LAUNCH_SPEED_CAP_MS } from './profile-priors';
import type { KickProfile } from './profile-types';
import { SeededRandom } from './random';
import { normalCdf, normalQuantile } from './stats';
import { requireFinite, requireInHalfOpen, requireInRange, requireInteger } from './validate';

/** One sampled launch: predictive draws (parameter uncertainty included) for speed and aim. */
export interface SampledLaunch {
  speed: number;
  elevationDeg: number;
  azimuthDeg: number;
  backspinRps: number;
  sidespinRps: number;
}

/** One sampled kick apart from its speed, plus the draws its speed is made from. */
export interface LaunchNoise {
  /** The kick's own launch (elevation, aim, spins): drawn around the profile's means with its spreads. */
  launch: Omit<SampledLaunch, 'speed'>;
  /** Standard normal draw of the speed error. */
  zSpeed: number;
  /** ln of this sample's ceiling, m/s, drawn from the one-sided posterior. */
  lnCeiling: number;
}

/** The physiological cap of a profile (profiles cached before it existed: the adult cap). */
export function speedCapOf(p: KickProfile): number {
  const cap = (p as Partial<KickProfile>).speedCapMs;
  return typeof cap === 'number' && cap > 0 ? cap : LAUNCH_SPEED_CAP_MS[5];
}

function clamp(v: number, lo: number, hi: number): number {
  return v < lo ? lo : v > hi ? hi : v;
}

/**
 * The aimed-speed part of a profile; profiles cached before it existed get the equivalent of their
 * absolute speed figures (no ceiling to speak of, a spread proportional to the mean).
 */
function aimedSpeedOf(p: KickProfile): AimedSpeedFit {
  const a = (p as Partial<KickProfile>).aimedSpeed;
  if (a === undefined || a === null) {
    return {
      offsetLogMean: 0,
      offsetLogSd: p.sdSpeedMs / p.meanSpeedMs,
      offsetLogMeanSe: p.meanSpeedSeMs / p.meanSpeedMs,
      offsetLogSdSe: 0,
      ceilingMs: 60,
      ceilingLogSe: 0,
      typicalTargetM: 30,
    };
  }
  if (typeof a !== 'object') throw new RangeError('profile.aimedSpeed must be an object');
  return {
    offsetLogMean: requireInRange('profile.aimedSpeed.offsetLogMean', a.offsetLogMean, -2, 2),
    offsetLogSd: requireInRange('profile.aimedSpeed.offsetLogSd', a.offsetLogSd, 0, 2),
    offsetLogMeanSe: requireInRange('profile.aimedSpeed.offsetLogMeanSe', a.offsetLogMeanSe, 0, 2),
    offsetLogSdSe: requireInRange('profile.aimedSpeed.offsetLogSdSe', a.offsetLogSdSe, 0, 2),
    ceilingMs: requireInRange('profile.aimedSpeed.ceilingMs', a.ceilingMs, 1, 70, 'm/s'),
    ceilingLogSe: requireInRange('profile.aimedSpeed.ceilingLogSe', a.ceilingLogSe, 0, 2),
    ceilingFloorMs: requireInRange('profile.aimedSpeed.ceilingFloorMs', a.ceilingFloorMs ?? 0, 0, 70, 'm/s'),
    typicalTargetM: requireInHalfOpen('profile.aimedSpeed.typicalTargetM', a.typicalTargetM, 0, 200, 'm'),
  };
}

/** Validate the parts of a profile the Monte Carlo uses (it may have come through JSON); fills `aimedSpeed`. */
export function checkedProfile(p: KickProfile): KickProfile {
  if (p === null || typeof p !== 'object') throw new RangeError('profile must be an object');
  requireInHalfOpen('profile.meanSpeedMs', p.meanSpeedMs, 0, 60, 'm/s');
  requireInRange('profile.sdSpeedMs', p.sdSpeedMs, 0, 30, 'm/s');
  requireInRange('profile.meanSpeedSeMs', p.meanSpeedSeMs, 0, 30, 'm/s');
  requireInRange('profile.meanAzimuthDeg', p.meanAzimuthDeg, -45, 45, '°');
  requireInRange('profile.sdAzimuthDeg', p.sdAzimuthDeg, 0, 30, '°');
  requireInRange('profile.meanAzimuthSeDeg', p.meanAzimuthSeDeg, 0, 30, '°');
  requireInHalfOpen('profile.elevationDeg', p.elevationDeg, 0, 90, '°');
  requireInRange('profile.sdElevationDeg', p.sdElevationDeg, 0, 30, '°');
  requireInRange('profile.backspinRps', p.backspinRps, -30, 30, 'rev/s');
  requireInRange('profile.sidespinRps', p.sidespinRps, -30, 30, 'rev/s');
  requireInRange('profile.sdBackspinRps', p.sdBackspinRps, 0, 30, 'rev/s');
  requireInRange('profile.sdSidespinRps', p.sdSidespinRps, 0, 30, 'rev/s');
  // Profiles cached by older model versions lack the version-3 fields: fill neutral values.
  const old = p as Partial<KickProfile>;
  return {
    ...p,
    aimedSpeed: aimedSpeedOf(p),
    elevationSdSource: old.elevationSdSource ?? 'prior',
    launchNoiseScale: old.launchNoiseScale ?? 1,
    speedCapMs: speedCapOf(p),
    longestTargetM: old.longestTargetM ?? 0,
    warnings: Array.isArray(old.warnings) ? old.warnings : [],
  };
}

/** The profile's mean launch apart from speed (what a player intends). */
export function meanLaunchOf(p: KickProfile): { elevationDeg: number; backspinRps: number; sidespinRps: number } {
  return { elevationDeg: p.elevationDeg, backspinRps: p.backspinRps, sidespinRps: p.sidespinRps };
}

/** Predictive spread of ln speed: the fitted spread widened by the uncertainty of the mean offset. */
export function predictiveSpeedLogSd(p: KickProfile): number {
  return Math.hypot(p.aimedSpeed.offsetLogSd, p.aimedSpeed.offsetLogMeanSe);
}

/** Draws of a sample's launch are kept within this many spreads of the mean (a 1-in-1,000 kick is still a kick). */
const MAX_LAUNCH_Z = 3;

/**
 * Draw `samples` kicks' launch noise with a seeded stream. Per sample, in this order: speed, elevation,
 * azimuth, backspin, sidespin (normals), ceiling (a uniform, inverted through the truncated normal).
 */
export function drawLaunchNoise(p: KickProfile, samples: number, seed: number): LaunchNoise[] {
  requireInteger('samples', samples, 1, 200000);
  requireFinite('seed', seed);
  const rng = new SeededRandom(seed);
  const sdAim = Math.hypot(p.sdAzimuthDeg, p.meanAzimuthSeDeg);
  const a = p.aimedSpeed;
  const lnC = Math.log(a.ceilingMs);
  const lnCap = Math.log(speedCapOf(p));
  const floor = Math.min(a.ceilingFloorMs ?? 0, a.ceilingMs);
  // One-sided posterior of the ceiling: N(ln c, se²) truncated to [ln floor, ln cap].
  const [pLo, pHi] =
    a.ceilingLogSe > 0
      ? [floor > 0 ? normalCdf((Math.log(floor) - lnC) / a.ceilingLogSe) : 0, normalCdf((lnCap - lnC) / a.ceilingLogSe)]
      : [0, 1];
  const z = (): number => clamp(rng.normal(), -MAX_LAUNCH_Z, MAX_LAUNCH_Z);
  const out: LaunchNoise[] = [];
  for (let i = 0; i < samples; i++) {
    const zSpeed = rng.normal();
    const launch = {
      elevationDeg: clamp(p.elevationDeg + p.sdElevationDeg * z(), 0.5, 89.5),
      azimuthDeg: clamp(p.meanAzimuthDeg + sdAim * rng.normal(), -45, 45),
      backspinRps: clamp(p.backspinRps + p.sdBackspinRps * z(), -30, 30),
      sidespinRps: clamp(p.sidespinRps + p.sdSidespinRps * z(), -30, 30),
    };
    const u = pLo + (pHi - pLo) * rng.uniform();
    const lnCeiling = a.ceilingLogSe > 0 && pHi > pLo ? Math.min(lnCap, lnC + a.ceilingLogSe * normalQuantile(u)) : Math.min(lnC, lnCap);
    out.push({ launch, zSpeed, lnCeiling });
  }
  return out;
}

/** Launches of the player's usual ball (`meanSpeedMs` ± its predictive spread): set pieces, where no target applies. */
export function sampleLaunches(given: KickProfile, samples: number, seed: number): SampledLaunch[] {
  const p = checkedProfile(given);
  const sdSpeed = Math.hypot(p.sdSpeedMs, p.meanSpeedSeMs);
  const cap = speedCapOf(p);
  return drawLaunchNoise(p, samples, seed).map((n) => ({ ...n.launch, speed: clamp(p.meanSpeedMs + sdSpeed * n.zSpeed, 1, cap) }));
}
