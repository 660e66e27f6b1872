/**
 * Drawing kicks from a fitted profile: one seeded stream shared by envelopes, reach curves and set-piece
 * checks, so the same profile and seed always give the same kicks. Speeds come in two kinds: *aimed*
 * at a target distance (the aimed-speed model: the speed the target needs, capped by the ceiling, times
 * the fitted error) or, where no target applies, the player's usual ball (`meanSpeedMs`).
 */

import type { AimedSpeedFit } from './aimed-speed';
import type { KickProfile } from './profile-types';
import { SeededRandom } from './random';
import { requireFinite, requireInHalfOpen, requireInRange, requireInteger } from './validate';

/** One sampled launch: predictive draws (parameter uncertainty included) for speed and aim. */
export interface SampledLaunch {
  speed: number;
  elevationDeg: number;
  azimuthDeg: number;
  backspinRps: number;
  sidespinRps: number;
}

/** One sampled kick apart from its speed, plus the standard normal draws its speed is made from. */
export interface LaunchNoise {
  launch: Omit<SampledLaunch, 'speed'>;
  zSpeed: number;
  zCeiling: number;
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
  return { ...p, aimedSpeed: aimedSpeedOf(p) };
}

/** The profile's mean launch apart from speed (what a player intends). */
export function meanLaunchOf(p: KickProfile): { elevationDeg: number; backspinRps: number; sidespinRps: number } {
  return { elevationDeg: p.elevationDeg, backspinRps: p.backspinRps, sidespinRps: p.sidespinRps };
}

/** Predictive spread of ln speed: the fitted spread widened by the uncertainty of the mean offset. */
export function predictiveSpeedLogSd(p: KickProfile): number {
  return Math.hypot(p.aimedSpeed.offsetLogSd, p.aimedSpeed.offsetLogMeanSe);
}

/**
 * Draw `samples` kicks' launch noise with a seeded stream. Per sample, in this order: speed, elevation,
 * azimuth, backspin, sidespin, ceiling.
 */
export function drawLaunchNoise(p: KickProfile, samples: number, seed: number): LaunchNoise[] {
  requireInteger('samples', samples, 1, 200000);
  requireFinite('seed', seed);
  const rng = new SeededRandom(seed);
  const sdAim = Math.hypot(p.sdAzimuthDeg, p.meanAzimuthSeDeg);
  const out: LaunchNoise[] = [];
  for (let i = 0; i < samples; i++) {
    const zSpeed = rng.normal();
    const launch = {
      elevationDeg: clamp(p.elevationDeg + p.sdElevationDeg * rng.normal(), 0.5, 89.5),
      azimuthDeg: clamp(p.meanAzimuthDeg + sdAim * rng.normal(), -45, 45),
      backspinRps: clamp(p.backspinRps + p.sdBackspinRps * rng.normal(), -30, 30),
      sidespinRps: clamp(p.sidespinRps + p.sdSidespinRps * rng.normal(), -30, 30),
    };
    out.push({ launch, zSpeed, zCeiling: rng.normal() });
  }
  return out;
}

/** Launches of the player's usual ball (`meanSpeedMs` ± its predictive spread): set pieces, where no target applies. */
export function sampleLaunches(given: KickProfile, samples: number, seed: number): SampledLaunch[] {
  const p = checkedProfile(given);
  const sdSpeed = Math.hypot(p.sdSpeedMs, p.meanSpeedSeMs);
  return drawLaunchNoise(p, samples, seed).map((n) => ({ ...n.launch, speed: clamp(p.meanSpeedMs + sdSpeed * n.zSpeed, 1, 60) }));
}
