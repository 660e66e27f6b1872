/**
 * The demo scenario's outcome model.
 *
 * This is deliberately NOT a flight simulation: it is a statistical model of what coaches log
 * pitch-side. Each player has, per technique, a "true" reach, a systematic carry bias and a
 * spread of carry and lateral landing error around the target; those improve (or, for one
 * player, worsen) over the eight weeks so the Player file and Squad week show trends. A rep
 * draws a landing point from that model, nudged a little by the session's wind, and the logged
 * outcome is derived from the landing point the way a coach would call it. The flight model in
 * `shared/flight/` then has realistic-looking, imperfect logs to fit.
 */
import type { Prng } from './prng';
import type { ProgressProfile, SquadKey } from './roster';

/** Kicking techniques a drill can practise (the schema's enum). */
export type Technique = 'driven' | 'lofted' | 'chipped' | 'curled';

/** A repetition's logged outcome (DESIGN §3). */
export type Outcome = 'on_target' | 'short' | 'long' | 'left' | 'right' | 'blocked' | 'over';

/** All techniques, in a fixed order (iteration order matters for determinism). */
export const TECHNIQUES: readonly Technique[] = ['driven', 'lofted', 'chipped', 'curled'];

/** Sensible drill target distances (metres) per squad and technique. */
export const TARGET_RANGE_M: Record<SquadKey, Record<Technique, [number, number]>> = {
  u14: { driven: [18, 28], lofted: [25, 38], chipped: [12, 18], curled: [16, 24] },
  u16: { driven: [20, 32], lofted: [28, 44], chipped: [12, 20], curled: [18, 26] },
  first: { driven: [22, 35], lofted: [30, 50], chipped: [14, 22], curled: [18, 28] },
};

/** Typical comfortable maximum carry (metres) per squad and technique in week one. */
const NOMINAL_REACH_M: Record<SquadKey, Record<Technique, number>> = {
  u14: { driven: 29, lofted: 39, chipped: 20, curled: 25 },
  u16: { driven: 33, lofted: 45, chipped: 22, curled: 27 },
  first: { driven: 37, lofted: 52, chipped: 24, curled: 30 },
};

/** Carry and lateral spread as a fraction of the target distance, for an average adult. */
const BASE_SPREAD_FRAC: Record<Technique, { carry: number; lateral: number }> = {
  driven: { carry: 0.085, lateral: 0.06 },
  lofted: { carry: 0.095, lateral: 0.07 },
  chipped: { carry: 0.12, lateral: 0.075 },
  curled: { carry: 0.09, lateral: 0.095 },
};

/** Younger players are less consistent. */
const SQUAD_SPREAD_FACTOR: Record<SquadKey, number> = { u14: 1.3, u16: 1.15, first: 1 };

/**
 * Metres of carry lost per m/s of headwind for a 30 m kick; higher, longer flights sit in the
 * wind longer. Crosswind drift uses 60 % of the same figure.
 */
const WIND_CARRY_M_PER_MS: Record<Technique, number> = { driven: 0.2, lofted: 0.45, chipped: 0.35, curled: 0.3 };

/** Default launch elevation by technique (DESIGN §6, common coaching practice). */
export const DEFAULT_ELEVATION_DEG: Record<Technique, number> = { driven: 12, curled: 18, lofted: 32, chipped: 48 };

/** Default backspin-step rates in rev/s (DESIGN §6), index = step + 3 (step −3 … +3, + = backspin). */
const BACKSPIN_RPS = [-10, -6, -3, 0, 3, 6, 10];
/** Default sidespin-step rates in rev/s (DESIGN §6), index = |step| (0, 1, 2). */
const SIDESPIN_RPS = [0, 4, 8];

/** One player's model for one technique at week one, and how it changes by week eight. */
export interface TechniqueSkill {
  reachStartM: number;
  /** Fractional change of reach over the eight weeks (+0.06 = 6 % further). */
  reachGainFrac: number;
  /** Mean carry error as a fraction of the target (negative = tends to land short). */
  carryBiasFrac: number;
  carrySpreadFrac: number;
  /** Systematic lateral pull as a fraction of the target (+ = to the kicker's left). */
  lateralBiasFrac: number;
  lateralSpreadFrac: number;
  /** Share of bias (and 70 % of that share of spread) removed by week eight; negative = regresses. */
  improvement: number;
}

/** A player's kicking model, per technique. */
export type PlayerSkill = Record<Technique, TechniqueSkill>;

/** Draws a player's skill: squad norms, one ability factor, and their progress profile. */
export function drawPlayerSkill(prng: Prng, squad: SquadKey, progress: ProgressProfile): PlayerSkill {
  const ability = Math.max(-2, Math.min(2, prng.normal())); // one player-wide talent factor
  const youth = squad !== 'first';
  const improvementBase =
    progress === 'strong'
      ? prng.uniform(0.65, 0.8)
      : progress === 'regressing'
        ? prng.uniform(-0.65, -0.5)
        : youth
          ? prng.uniform(0.3, 0.55)
          : prng.uniform(0.15, 0.4);
  const gainBase =
    progress === 'strong'
      ? prng.uniform(0.1, 0.14)
      : progress === 'regressing'
        ? prng.uniform(-0.1, -0.07)
        : youth
          ? prng.uniform(0.03, 0.07)
          : prng.uniform(0.01, 0.04);
  const spreadFactor = SQUAD_SPREAD_FACTOR[squad] * (1 - 0.08 * ability);
  const skill = {} as PlayerSkill;
  for (const technique of TECHNIQUES) {
    const base = BASE_SPREAD_FRAC[technique];
    skill[technique] = {
      reachStartM: NOMINAL_REACH_M[squad][technique] * (1 + 0.05 * ability + prng.normal(0, 0.03)),
      reachGainFrac: gainBase + prng.normal(0, 0.01),
      carryBiasFrac: prng.normal(-0.035, 0.03),
      carrySpreadFrac: base.carry * spreadFactor * prng.uniform(0.9, 1.1),
      lateralBiasFrac: prng.normal(0, 0.025),
      lateralSpreadFrac: base.lateral * spreadFactor * prng.uniform(0.9, 1.1),
      improvement: improvementBase + prng.normal(0, 0.04),
    };
  }
  return skill;
}

/** What one repetition is aimed at, and in which conditions. */
export interface RepContext {
  technique: Technique;
  targetDistanceM: number;
  /** 0 at the start of the first week … 1 at the end of the eighth. */
  progress: number;
  /** Kicked with the weaker foot: shorter and wilder. */
  weakFoot: boolean;
  windSpeedMs: number;
  /** Relative to the kicking direction: 0 = headwind, 90 = from the left, 180 = tailwind. */
  windFromDeg: number;
}

/** Where the ball actually came down, relative to the kicker and the target line. */
export interface Landing {
  carryM: number;
  /** + = to the kicker's left of the target line (DESIGN §6 axes: y to the left). */
  lateralM: number;
}

/** Smooth version of max(0, x) with width `w`: how much of a too-far target is out of reach. */
function softPlus(x: number, w: number): number {
  return w * Math.log1p(Math.exp(x / w));
}

/** Draws the true landing point of one repetition from the player's model. */
export function drawLanding(prng: Prng, skill: TechniqueSkill, rep: RepContext): Landing {
  const target = rep.targetDistanceM;
  const learned = skill.improvement * rep.progress;
  const reach = skill.reachStartM * (1 + skill.reachGainFrac * rep.progress);
  const footCarry = rep.weakFoot ? 0.92 : 1;
  const footSpread = rep.weakFoot ? 1.35 : 1;
  // A target near or beyond the player's reach pulls the mean short and widens the spread.
  const shortfall = 0.8 * softPlus(target - reach, 2);
  const strain = 1 + 0.6 * Math.max(0, target / reach - 0.85);
  const windRad = (rep.windFromDeg * Math.PI) / 180;
  const windScale = (WIND_CARRY_M_PER_MS[rep.technique] * target) / 30;
  const headwindMs = rep.windSpeedMs * Math.cos(windRad);
  const fromLeftMs = rep.windSpeedMs * Math.sin(windRad);
  const meanCarry = (target * (1 + skill.carryBiasFrac * (1 - learned)) - shortfall) * footCarry - windScale * headwindMs;
  const carrySd = target * skill.carrySpreadFrac * (1 - 0.7 * learned) * footSpread * strain;
  const meanLateral = target * skill.lateralBiasFrac * (1 - learned) - 0.6 * windScale * fromLeftMs;
  const lateralSd = target * skill.lateralSpreadFrac * (1 - 0.7 * learned) * footSpread * strain;
  return {
    carryM: Math.max(2, prng.normal(meanCarry, carrySd)),
    lateralM: prng.normal(meanLateral, lateralSd),
  };
}

/** Rounds to the nearest half unit — 0.5 m is what a coach pacing out a landing spot resolves (never −0). */
export function roundToHalf(x: number): number {
  const r = Math.round(x * 2) / 2;
  return r === 0 ? 0 : r;
}

/**
 * The outcome a coach calls for a landing point: on target when the landing lies within the
 * target radius (distance in the plane), otherwise the dominant miss direction — short/long
 * when the carry error is at least as large as the lateral error, else left/right.
 */
export function classifyLanding(landing: Landing, targetDistanceM: number, targetRadiusM: number): Outcome {
  const carryErrorM = landing.carryM - targetDistanceM;
  if (Math.hypot(carryErrorM, landing.lateralM) <= targetRadiusM) return 'on_target';
  if (Math.abs(carryErrorM) >= Math.abs(landing.lateralM)) return carryErrorM < 0 ? 'short' : 'long';
  return landing.lateralM > 0 ? 'left' : 'right';
}

/**
 * For free-kick style drills (a wall and a bar in play): whether this rep hit the wall or
 * cleared the bar instead of landing near the target. Driven balls hit the wall more often,
 * curled balls that would have gone long sail over the bar.
 */
export function setPieceOutcome(prng: Prng, technique: Technique, landed: Outcome): Outcome | null {
  if (technique !== 'curled' && technique !== 'driven') return null;
  if (prng.chance(technique === 'driven' ? 0.09 : 0.06)) return 'blocked';
  if (landed === 'long' && prng.chance(technique === 'curled' ? 0.6 : 0.3)) return 'over';
  return null;
}

/** What a ball-measuring device reports at launch. */
export interface LaunchMeasurement {
  speedMs: number;
  launchAngleDeg: number;
  spinRps: number;
}

/** Highest launch speed the demo reports: hard instep kicks rarely exceed this (DESIGN §6). */
const MAX_PLAUSIBLE_SPEED_MS = 32;

/** Launch speed (m/s) that carries `carryM` at `angleDeg`: no-drag range formula × a drag factor. */
function speedForCarry(carryM: number, angleDeg: number): number {
  const dragFactor = 1 + carryM * (0.005 + 0.00005 * angleDeg);
  return Math.sqrt((9.81 * carryM) / Math.sin((2 * angleDeg * Math.PI) / 180)) * dragFactor;
}

/**
 * Launch values consistent with the carry: the no-drag range formula solved for speed, scaled
 * up by a drag factor that grows with carry and elevation (fitted offline to a simple
 * quadratic-drag trajectory; an approximation, not the app's flight model). A long driven
 * ball would need an implausible speed at 12°, so — as players do — the elevation rises
 * until the speed is plausible. Spin is the total of the logged spin steps' default rates
 * with device noise. Short chips honestly come out slower (about 10–16 m/s).
 */
export function measureLaunch(
  prng: Prng,
  technique: Technique,
  carryM: number,
  backspinStep: number,
  sidespinStep: number,
): LaunchMeasurement {
  let angleDeg = DEFAULT_ELEVATION_DEG[technique] + Math.max(-4, Math.min(4, prng.normal(0, 2)));
  while (angleDeg < 45 && speedForCarry(carryM, angleDeg) > MAX_PLAUSIBLE_SPEED_MS) angleDeg += 1;
  const speedMs = speedForCarry(carryM, angleDeg) * (1 + Math.max(-0.05, Math.min(0.05, prng.normal(0, 0.025))));
  const back = BACKSPIN_RPS[backspinStep + 3] ?? 0;
  const side = SIDESPIN_RPS[Math.abs(sidespinStep)] ?? 0;
  const spinRps = Math.max(0.3, Math.hypot(back, side) + prng.normal(0, 1.2));
  return {
    speedMs: Math.round(speedMs * 10) / 10,
    launchAngleDeg: Math.round(angleDeg * 10) / 10,
    spinRps: Math.round(spinRps * 10) / 10,
  };
}
